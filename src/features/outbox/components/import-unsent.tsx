import { useRef, useState } from 'react';
import { useQueryClient } from '@tanstack/react-query';
import { importUnsentFile } from '../import-unsent';
import { sendOutbox } from '../outbox-sender';
import { apiTransport } from '../use-outbox';

/**
 * The office side of "Export unsent": read a phone's file of unsent records into this browser's
 * outbox and send them now. Client-made ids make a second import, or records the server already
 * has, harmless.
 */
export function ImportUnsentButton() {
  const input = useRef<HTMLInputElement>(null);
  const queryClient = useQueryClient();
  const [message, setMessage] = useState<{ tone: 'ok' | 'error'; text: string } | null>(null);
  const [busy, setBusy] = useState(false);

  async function onFile(file: File) {
    setBusy(true);
    setMessage(null);
    try {
      const { added, inFile } = await importUnsentFile(await file.text());
      const result = await sendOutbox(apiTransport);
      await queryClient.invalidateQueries();
      const refused = result.refused > 0 ? ` ${result.refused} refused: see the list under the header count.` : '';
      const waiting = result.stopped ? ' The server could not be reached: they will be sent when it can.' : '';
      setMessage({ tone: result.refused > 0 || result.stopped ? 'error' : 'ok', text: `${inFile} record${inFile === 1 ? '' : 's'} in the file, ${added} new here; ${result.sent} sent.${refused}${waiting}` });
    } catch (err) {
      setMessage({ tone: 'error', text: err instanceof Error ? err.message : 'The file could not be read.' });
    } finally {
      setBusy(false);
      if (input.current) input.current.value = '';
    }
  }

  return (
    <div className="flex flex-col items-end gap-1">
      <label className="inline-flex min-h-11 cursor-pointer items-center rounded-md border border-ink-300 bg-white px-3 text-sm font-medium text-ink-800 hover:bg-ink-50">
        {busy ? 'Importing…' : 'Import unsent records'}
        <input
          ref={input}
          type="file"
          accept="application/json,.json"
          className="sr-only"
          disabled={busy}
          aria-label="Import unsent records (a file exported from a phone)"
          onChange={(e) => {
            const file = e.target.files?.[0];
            if (file) void onFile(file);
          }}
        />
      </label>
      {message && (
        <p role="status" className={message.tone === 'ok' ? 'text-sm text-ok-700' : 'text-sm text-danger-700'}>
          {message.text}
        </p>
      )}
    </div>
  );
}
