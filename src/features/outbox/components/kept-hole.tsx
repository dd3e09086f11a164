import { useEffect, useId, useState } from 'react';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { keepPhotos } from '../outbox-store';
import { useOutbox } from '../use-outbox';
import { OutboxStatusBadge } from './outbox-status';

/**
 * After a hole is kept on the phone (no connection): its state, photos added to it on the phone,
 * and the way on to the next hole. Nothing here says "sent" until the server has answered.
 */
export function KeptHole({ clientId, onNext }: { clientId: string; onNext: () => void }) {
  const hole = (useOutbox() ?? []).find((h) => h.clientId === clientId);
  const inputId = useId();
  const [adding, setAdding] = useState(false);
  const [persist, setPersist] = useState<'kept' | 'refused' | 'unknown'>('unknown');
  useEffect(() => {
    // Ask the browser not to clear the outbox when space runs low.
    if (!navigator.storage?.persist) return;
    void navigator.storage.persist().then((granted) => setPersist(granted ? 'kept' : 'refused'), () => setPersist('refused'));
  }, []);
  if (!hole) return null;
  return (
    <section aria-label={`Test hole ${hole.number} on this phone`} className="space-y-3">
      <Alert tone={hole.status === 'sent' ? 'info' : 'caution'} title={hole.status === 'sent' ? `Test hole ${hole.number} reached the server` : `Test hole ${hole.number} is kept on this phone`}>
        <p>
          {hole.status === 'sent'
            ? 'The server has kept it; its photos follow one by one.'
            : 'There is no connection, so it is saved on this phone and sent by itself when the signal returns. Do not clear the browser’s data until the header shows nothing unsent.'}
        </p>
      </Alert>
      {persist === 'refused' && (
        <Alert tone="caution" title="This browser may clear saved records when space runs low">
          <p>It refused to keep this site’s data for good. Send or export the unsent records (header → unsent → Export unsent) as soon as you can, and add Threadline to the home screen.</p>
        </Alert>
      )}
      <p className="flex items-center gap-2 text-sm">
        Hole: <OutboxStatusBadge status={hole.status} reason={hole.reason} />
      </p>
      <div className="space-y-1">
        <label htmlFor={inputId} className="block text-sm font-medium">
          Add photos to {hole.number}
        </label>
        <input
          id={inputId}
          type="file"
          accept="image/jpeg,image/png"
          capture="environment"
          multiple
          disabled={adding}
          className="block w-full text-sm"
          onChange={(e) => {
            const files = Array.from(e.target.files ?? []);
            e.target.value = '';
            if (files.length === 0) return;
            setAdding(true);
            void keepPhotos(clientId, files).finally(() => setAdding(false));
          }}
        />
      </div>
      {hole.photos.length > 0 && (
        <ul aria-label={`Photos of ${hole.number}`} className="space-y-1 text-sm">
          {hole.photos.map((p) => (
            <li key={p.key} className="flex flex-wrap items-center gap-2">
              <span className="truncate">{p.name}</span>
              <OutboxStatusBadge status={p.status} reason={p.reason} />
            </li>
          ))}
        </ul>
      )}
      <Button onClick={onNext}>Log another hole</Button>
    </section>
  );
}
