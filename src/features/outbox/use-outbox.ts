import { useQueryClient } from '@tanstack/react-query';
import { useEffect, useState } from 'react';
import { createHole } from '@/features/holes/api/create-hole';
import { getHolePhotos } from '@/features/holes/api/get-hole-photos';
import { invalidateAfterHoleWrite } from '@/features/holes/api/invalidate';
import { uploadPhotos } from '@/features/holes/api/upload-photos';
import { sendOutbox, type OutboxTransport } from './outbox-sender';
import { isUnsent, listOutbox, subscribeOutbox, type OutboxHole } from './outbox-store';

/** The real API: the same calls the online screens use. */
export const apiTransport: OutboxTransport = {
  createHole,
  uploadPhoto: (projectId, holeId, file, photo) => uploadPhotos(projectId, holeId, [file], { takenAt: photo.takenAt, caption: photo.caption, clientIds: [photo.clientId] }),
  listPhotos: (projectId, holeId) => getHolePhotos(projectId, holeId),
};

/** Every record in the outbox, re-read whenever it changes (null until first read). */
export function useOutbox(): OutboxHole[] | null {
  const [records, setRecords] = useState<OutboxHole[] | null>(null);
  useEffect(() => {
    let live = true;
    const read = () =>
      void listOutbox()
        .then((r) => live && setRecords(r))
        .catch(() => live && setRecords([]));
    read();
    const stop = subscribeOutbox(read);
    return () => {
      live = false;
      stop();
    };
  }, []);
  return records;
}

/** How many records (holes, or holes with photos still to send) the server does not have yet. */
export function useUnsentCount(): number {
  const records = useOutbox();
  return (records ?? []).filter(isUnsent).length;
}

/** Seconds between tries while records wait and the browser says it is online. */
const RETRY_SECONDS = 20;

/**
 * Sends the outbox when the app opens, when the browser comes back online, and every
 * {@link RETRY_SECONDS} while something waits. Mounted once, in the signed-in frame.
 */
export function useOutboxSender(): void {
  const queryClient = useQueryClient();
  useEffect(() => {
    let live = true;
    const attempt = async () => {
      if (!live || !navigator.onLine) return;
      const waiting = (await listOutbox()).some((h) => isUnsent(h) && h.status !== 'refused');
      if (!waiting) return;
      const result = await sendOutbox(apiTransport);
      if (result.sent > 0 || result.refused > 0) await invalidateAfterHoleWrite(queryClient);
    };
    const onOnline = () => void attempt();
    void attempt();
    window.addEventListener('online', onOnline);
    const timer = window.setInterval(() => void attempt(), RETRY_SECONDS * 1000);
    return () => {
      live = false;
      window.removeEventListener('online', onOnline);
      window.clearInterval(timer);
    };
  }, [queryClient]);
}
