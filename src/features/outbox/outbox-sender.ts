import type { HoleDto, PhotoDto } from '@shared/api';
import type { HoleCreateInput } from '@shared/schemas/hole';
import { isApiError } from '@/lib/api-client';
import { newClientId } from '@/features/holes/utils/client-id';
import { isUnsent, listOutbox, updateHole, type OutboxHole, type OutboxPhoto } from './outbox-store';

/** How the sender reaches the server (the real API in the app; stand-ins in unit tests). */
export interface OutboxTransport {
  createHole(projectId: number, input: HoleCreateInput): Promise<HoleDto>;
  /** Upload one photo with its client id (a resend with the same id answers the photo already kept). */
  uploadPhoto(projectId: number, holeId: number, file: File, photo: { clientId: string; takenAt: string; caption?: string }): Promise<PhotoDto[]>;
  listPhotos(projectId: number, holeId: number): Promise<PhotoDto[]>;
}

export interface SendResult {
  sent: number;
  refused: number;
  /** True when the sender stopped because the server could not be reached (or the session ended). */
  stopped: boolean;
}

/** The server's own words for a refusal, with the fields it named. */
function reasonOf(error: unknown): string {
  if (!isApiError(error)) return error instanceof Error ? error.message : String(error);
  const fields = error.fieldErrors.map((f) => `${f.path}: ${f.message}`);
  const head = error.problem.detail ?? error.problem.title;
  return fields.length > 0 ? `${head} (${fields.join('; ')})` : head;
}

/** No connection, a server in trouble, or a session to renew: keep the record and try later. */
function isTransient(error: unknown): boolean {
  if (!isApiError(error)) return true;
  return error.status === 0 || error.status === 401 || error.status === 408 || error.status === 429 || error.status >= 500;
}

let running: Promise<SendResult> | null = null;

/**
 * Send every unsent record, oldest first: the hole (by its client id, so a replay answers with
 * the record already kept; a hole on a new unidentified line carries `newLine` and the server
 * makes both in one request), then its photos one by one, each with its own client id. Stops at the first failure that is the
 * connection's fault, leaving that record and the ones after it for the next try; a record the
 * server refuses is marked with the reason and the rest go on. One run at a time.
 */
export function sendOutbox(transport: OutboxTransport): Promise<SendResult> {
  running ??= run(transport).finally(() => {
    running = null;
  });
  return running;
}

async function run(transport: OutboxTransport): Promise<SendResult> {
  const result: SendResult = { sent: 0, refused: 0, stopped: false };
  for (const hole of await listOutbox()) {
    if (!isUnsent(hole) || hole.status === 'refused') continue;
    const ok = await sendOne(transport, hole, result);
    if (!ok) {
      result.stopped = true;
      break;
    }
  }
  return result;
}

async function sendOne(transport: OutboxTransport, hole: OutboxHole, result: SendResult): Promise<boolean> {
  let holeId = hole.holeId;
  if (holeId == null) {
    await updateHole(hole.clientId, (h) => {
      h.status = 'sending';
    });
    try {
      const saved = await transport.createHole(hole.projectId, hole.input);
      holeId = saved.id;
      await updateHole(hole.clientId, (h) => {
        h.holeId = saved.id;
        h.status = 'sent';
        delete h.reason;
      });
      result.sent++;
    } catch (error) {
      const transient = isTransient(error);
      await updateHole(hole.clientId, (h) => {
        h.status = transient ? 'local' : 'refused';
        if (!transient) h.reason = reasonOf(error);
      });
      if (!transient) result.refused++;
      return !transient;
    }
  }
  for (const kept of hole.photos) {
    if (kept.status === 'sent' || kept.status === 'refused') continue;
    try {
      let photo = kept;
      if (!photo.clientId) {
        // Kept by an earlier version, without a client id. One left "sending" may have arrived
        // with its answer lost, and the server cannot know it by an id it never had: look for it
        // by its capture time first (the old rule; its times are a millisecond apart per photo).
        if (photo.status === 'sending') {
          const there = await transport.listPhotos(hole.projectId, holeId);
          if (there.some((p) => p.takenAt != null && Date.parse(p.takenAt) === Date.parse(photo.takenAt))) {
            await setPhoto(hole.clientId, photo.key, 'sent');
            continue;
          }
        }
        photo = await giveClientId(hole.clientId, photo);
      }
      await setPhoto(hole.clientId, photo.key, 'sending');
      const file = new File([photo.data], photo.name, { type: photo.type });
      // Resending a photo whose answer was lost is harmless: the server answers the one it kept.
      await transport.uploadPhoto(hole.projectId, holeId, file, { clientId: photo.clientId!, takenAt: photo.takenAt, caption: photo.caption });
      await setPhoto(hole.clientId, photo.key, 'sent');
    } catch (error) {
      if (isTransient(error)) {
        // Left "sending": the next try sends it again with the same client id.
        return false;
      }
      await setPhoto(hole.clientId, kept.key, 'refused', reasonOf(error));
      result.refused++;
    }
  }
  return true;
}

/** Give a photo kept without a client id its id, stored before the first send that carries it. */
async function giveClientId(holeClientId: string, photo: OutboxPhoto): Promise<OutboxPhoto> {
  const clientId = newClientId();
  await updateHole(holeClientId, (h) => {
    const p = h.photos.find((x) => x.key === photo.key);
    if (p && !p.clientId) p.clientId = clientId;
  });
  return { ...photo, clientId };
}

function setPhoto(clientId: string, key: string, status: OutboxHole['status'], reason?: string) {
  return updateHole(clientId, (h) => {
    const p = h.photos.find((x) => x.key === key);
    if (!p) return;
    p.status = status;
    if (reason) p.reason = reason;
    else delete p.reason;
  });
}
