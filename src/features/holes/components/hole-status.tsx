import { HOLE_STATUSES, type ClearanceStatus, type HoleStatus } from '@shared/domain';
import { cn } from '@/components/ui/cn';
import { Badge } from '@/components/ui/states';
import { CLEARANCE_LABELS, CLEARANCE_MEANINGS, HOLE_STATUS_LABELS, HOLE_STATUS_MEANINGS } from '../utils/labels';

const HOLE_STATUS_TONES: Record<HoleStatus, string> = {
  planned: 'bg-ink-100 text-ink-700',
  dug: 'bg-caution-100 text-caution-800',
  surveyed: 'bg-brand-100 text-brand-800',
  reviewed: 'bg-ok-100 text-ok-700',
};

/** A hole's status as a small chip; reviewed holes carry a lock. */
export function HoleStatusBadge({ status }: { status: HoleStatus }) {
  return (
    <Badge className={HOLE_STATUS_TONES[status]} title={HOLE_STATUS_MEANINGS[status]}>
      {status === 'reviewed' && <LockIcon className="mr-1 size-3" />}
      {HOLE_STATUS_LABELS[status]}
    </Badge>
  );
}

export function LockIcon({ className }: { className?: string }) {
  return (
    <svg aria-hidden viewBox="0 0 16 16" className={cn('fill-current', className)}>
      <path d="M8 1a3.5 3.5 0 0 0-3.5 3.5V7H4a1 1 0 0 0-1 1v6a1 1 0 0 0 1 1h8a1 1 0 0 0 1-1V8a1 1 0 0 0-1-1h-.5V4.5A3.5 3.5 0 0 0 8 1Zm2 6H6V4.5a2 2 0 1 1 4 0V7Z" />
    </svg>
  );
}

/** The workflow planned → dug → surveyed → reviewed, with the current step marked. */
export function HoleStatusSteps({ status }: { status: HoleStatus }) {
  const current = HOLE_STATUSES.indexOf(status);
  return (
    <ol aria-label="Workflow" className="flex flex-wrap items-center gap-1 text-xs">
      {HOLE_STATUSES.map((s, i) => (
        <li key={s} className="flex items-center gap-1" aria-current={i === current ? 'step' : undefined}>
          {i > 0 && (
            <span aria-hidden className="text-ink-400">
              →
            </span>
          )}
          <span
            title={HOLE_STATUS_MEANINGS[s]}
            className={cn(
              'inline-flex min-h-7 items-center rounded-full border px-2.5 font-medium',
              i === current ? cn(HOLE_STATUS_TONES[s], 'border-transparent ring-2 ring-brand-500') : i < current ? 'border-ink-200 bg-white text-ink-600' : 'border-dashed border-ink-300 bg-white text-ink-400',
            )}
          >
            {s === 'reviewed' && i === current && <LockIcon className="mr-1 size-3" />}
            {HOLE_STATUS_LABELS[s]}
            {i < current && <span className="sr-only"> (done)</span>}
            {i === current && <span className="sr-only"> (current)</span>}
          </span>
        </li>
      ))}
    </ol>
  );
}

const CLEARANCE_TONES: Record<ClearanceStatus, string> = {
  overlap: 'bg-danger-600 text-white',
  conflict: 'bg-danger-100 text-danger-800',
  marginal: 'bg-caution-100 text-caution-800',
  unverified: 'bg-ink-100 text-ink-700',
  clear: 'bg-ok-100 text-ok-700',
};

/** A clearance status chip with its meaning as the tooltip. */
export function ClearanceBadge({ status, detail }: { status: ClearanceStatus; detail?: string }) {
  return (
    <Badge className={CLEARANCE_TONES[status]} title={`${CLEARANCE_LABELS[status]}: ${CLEARANCE_MEANINGS[status]}${detail ? ` (${detail})` : ''}`}>
      {CLEARANCE_LABELS[status]}
    </Badge>
  );
}
