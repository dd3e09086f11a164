import { Badge } from '@/components/ui/states';
import { cn } from '@/components/ui/cn';
import type { OutboxStatus } from '../outbox-store';

const TEXT: Record<OutboxStatus, string> = {
  local: 'On this phone only',
  sending: 'Sending',
  sent: 'Sent',
  refused: 'Refused',
};

const TONE: Record<OutboxStatus, string> = {
  local: 'bg-caution-100 text-caution-900',
  sending: 'bg-brand-100 text-brand-900',
  sent: 'bg-ok-100 text-ok-700',
  refused: 'bg-danger-100 text-danger-900',
};

/** A record's honest state: "sent" only once the server answered that it kept it. */
export function OutboxStatusBadge({ status, reason }: { status: OutboxStatus; reason?: string }) {
  return (
    <Badge className={cn(TONE[status], status === 'refused' && 'whitespace-normal')} title={reason}>
      {status === 'refused' && reason ? `Refused (${reason})` : TEXT[status]}
    </Badge>
  );
}
