import { useState } from 'react';
import { Button } from '@/components/ui/button';
import { formatDateTime } from '@/lib/format';
import { downloadUnsent } from '../export-unsent';
import { sendOutbox } from '../outbox-sender';
import { clearSent, dropHole, isUnsent, type OutboxHole } from '../outbox-store';
import { apiTransport, useOutbox } from '../use-outbox';
import { OutboxStatusBadge } from './outbox-status';

function photoLine(h: OutboxHole): string | null {
  if (h.photos.length === 0) return null;
  const sent = h.photos.filter((p) => p.status === 'sent').length;
  return `${h.photos.length} photo${h.photos.length === 1 ? '' : 's'}, ${sent} sent`;
}

/** The records made on this phone, each with its honest state, and what can be done with them. */
export function OutboxList({ records }: { records: OutboxHole[] }) {
  if (records.length === 0) return <p className="text-sm text-ink-600">Nothing waiting: every hole made on this phone has reached the server.</p>;
  return (
    <ul aria-label="Records made on this phone" className="divide-y divide-ink-100">
      {records.map((h) => {
        const photos = photoLine(h);
        const photoProblem = h.photos.find((p) => p.status === 'refused');
        return (
          <li key={h.clientId} className="flex flex-wrap items-center gap-2 py-2 text-sm" aria-label={`Test hole ${h.number}`}>
            <span className="font-medium">{h.number}</span>
            <span className="text-ink-600">{h.project.name}</span>
            <OutboxStatusBadge status={h.status} reason={h.reason} />
            {photos && <span className="text-ink-600">{photos}</span>}
            {photoProblem && <OutboxStatusBadge status="refused" reason={`photo ${photoProblem.name}: ${photoProblem.reason ?? ''}`} />}
            <span className="text-xs text-ink-500">made {formatDateTime(h.madeAt)}</span>
            {h.status === 'refused' && (
              <Button size="sm" variant="secondary" onClick={() => void dropHole(h.clientId)}>
                Drop {h.number}
              </Button>
            )}
          </li>
        );
      })}
    </ul>
  );
}

/** Header count of unsent records, opening the list with "Send now" and "Export unsent". */
export function UnsentIndicator() {
  const records = useOutbox() ?? [];
  const unsent = records.filter(isUnsent);
  const [open, setOpen] = useState(false);
  const [busy, setBusy] = useState(false);
  if (records.length === 0) return null;
  return (
    <div className="relative">
      <button
        type="button"
        onClick={() => setOpen(!open)}
        aria-expanded={open}
        className={
          unsent.length > 0
            ? 'inline-flex min-h-11 items-center rounded-md bg-caution-100 px-3 text-sm font-semibold text-caution-900'
            : 'inline-flex min-h-11 items-center rounded-md px-3 text-sm text-brand-100 hover:bg-white/10'
        }
      >
        {unsent.length > 0 ? `${unsent.length} unsent` : 'All sent'}
      </button>
      {open && (
        <section aria-label="Outbox" className="fixed inset-x-2 top-14 z-40 space-y-3 sm:absolute sm:inset-x-auto sm:top-auto sm:right-0 sm:mt-1 sm:w-[28rem] rounded-lg border border-ink-200 bg-white p-3 text-ink-900 shadow-lg">
          <p className="text-sm">
            {unsent.length > 0
              ? `${unsent.length} record${unsent.length === 1 ? ' is' : 's are'} on this phone only. They are sent, oldest first, whenever the connection returns.`
              : 'Everything made on this phone has reached the server.'}
          </p>
          <OutboxList records={records} />
          <div className="flex flex-wrap gap-2">
            {unsent.length > 0 && (
              <Button
                size="sm"
                busy={busy}
                onClick={() => {
                  setBusy(true);
                  void sendOutbox(apiTransport).finally(() => setBusy(false));
                }}
              >
                Send now
              </Button>
            )}
            {unsent.length > 0 && (
              <Button size="sm" variant="secondary" onClick={() => void downloadUnsent()}>
                Export unsent
              </Button>
            )}
            {records.length > unsent.length && (
              <Button size="sm" variant="ghost" onClick={() => void clearSent()}>
                Clear sent
              </Button>
            )}
          </div>
        </section>
      )}
    </div>
  );
}
