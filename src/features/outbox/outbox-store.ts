import { openDB, type DBSchema, type IDBPDatabase } from 'idb';
import type { HoleCreateInput } from '@shared/schemas/hole';
import { newClientId } from '@/features/holes/utils/client-id';

/**
 * The outbox: test holes and photos made on this phone that the server has not yet kept, stored
 * in IndexedDB so they survive a reload, a closed tab or a flat battery. Each hole keeps its
 * client-made id, so sending it twice can never make two records (the server answers a replay
 * with the record it already has).
 */

/** Where a record stands, as the crew sees it. */
export type OutboxStatus = 'local' | 'sending' | 'sent' | 'refused';

export interface OutboxPhoto {
  /** Local key of the photo within its hole. */
  key: string;
  name: string;
  type: string;
  /** The file's bytes (kept as an ArrayBuffer: every browser stores it in IndexedDB). */
  data: ArrayBuffer;
  /**
   * Id made on this phone when the photo was picked, sent with the upload: the server keeps one
   * photo per id and hole, so a resend after a lost answer is harmless. Missing only on photos
   * kept by an earlier version of the app (or read from its export file); those are recognised
   * by `takenAt` instead (see outbox-sender.ts).
   */
  clientId?: string;
  /** ISO time the photo was taken or chosen. */
  takenAt: string;
  caption?: string;
  status: OutboxStatus;
  reason?: string;
}

/** What the coordinates and depths of a kept hole mean (for the export header). */
export interface OutboxProjectRef {
  id: number;
  name: string;
  crsCode: string;
  unit: string;
  verticalDatum: string;
}

export interface OutboxHole {
  clientId: string;
  projectId: number;
  project: OutboxProjectRef;
  /** Order of making: sent oldest first. */
  seq: number;
  /** The hole number the crew gave (TH-7), for the lists. */
  number: string;
  input: HoleCreateInput;
  madeAt: string;
  status: OutboxStatus;
  /** Why the server refused it (its own words), when it did. */
  reason?: string;
  /** The server's id once the hole is kept. */
  holeId?: number;
  photos: OutboxPhoto[];
}

interface OutboxDb extends DBSchema {
  holes: { key: string; value: OutboxHole; indexes: { seq: number } };
}

const DB_NAME = 'threadline-outbox';
let dbPromise: Promise<IDBPDatabase<OutboxDb>> | null = null;

function db(): Promise<IDBPDatabase<OutboxDb>> {
  dbPromise ??= openDB<OutboxDb>(DB_NAME, 1, {
    upgrade(database) {
      const store = database.createObjectStore('holes', { keyPath: 'clientId' });
      store.createIndex('seq', 'seq');
    },
  });
  return dbPromise;
}

type Listener = () => void;
const listeners = new Set<Listener>();

/** Called after every change to the outbox (the header count and lists re-read it). */
export function subscribeOutbox(listener: Listener): () => void {
  listeners.add(listener);
  return () => listeners.delete(listener);
}

function changed(): void {
  for (const l of listeners) l();
}

/** Every record, oldest first. */
export async function listOutbox(): Promise<OutboxHole[]> {
  return (await db()).getAllFromIndex('holes', 'seq');
}

export async function getOutboxHole(clientId: string): Promise<OutboxHole | undefined> {
  return (await db()).get('holes', clientId);
}

/** True while the record (or one of its photos) is not yet kept by the server. */
export function isUnsent(hole: OutboxHole): boolean {
  return hole.status !== 'sent' || hole.photos.some((p) => p.status !== 'sent');
}

/** Keep a new hole on this phone. Keeping the same client id twice keeps one record. */
export async function keepHole(project: OutboxProjectRef, input: HoleCreateInput): Promise<OutboxHole> {
  const d = await db();
  const tx = d.transaction('holes', 'readwrite');
  const existing = await tx.store.get(input.clientId);
  if (existing) {
    await tx.done;
    return existing;
  }
  const last = await tx.store.index('seq').openCursor(null, 'prev');
  const record: OutboxHole = {
    clientId: input.clientId,
    projectId: project.id,
    project: { id: project.id, name: project.name, crsCode: project.crsCode, unit: project.unit, verticalDatum: project.verticalDatum },
    seq: (last?.value.seq ?? 0) + 1,
    number: input.number,
    input,
    madeAt: new Date().toISOString(),
    status: 'local',
    photos: [],
  };
  await tx.store.put(record);
  await tx.done;
  changed();
  return record;
}

/** Add photos to a kept hole (read into memory first: a File may not outlive its input). */
export async function keepPhotos(clientId: string, files: readonly File[], caption?: string): Promise<void> {
  const read = await Promise.all(files.map(async (f) => ({ name: f.name, type: f.type || 'image/jpeg', data: await f.arrayBuffer() })));
  await updateHole(clientId, (hole) => {
    const base = Date.now();
    read.forEach((f, i) => {
      hole.photos.push({
        key: `${base}-${hole.photos.length}`,
        ...f,
        clientId: newClientId(),
        takenAt: new Date(base + i).toISOString(),
        caption: caption?.trim() || undefined,
        status: 'local',
      });
    });
  });
}

/** Change one record in a single transaction. */
export async function updateHole(clientId: string, change: (hole: OutboxHole) => void): Promise<OutboxHole | undefined> {
  const d = await db();
  const tx = d.transaction('holes', 'readwrite');
  const hole = await tx.store.get(clientId);
  if (hole) {
    change(hole);
    await tx.store.put(hole);
  }
  await tx.done;
  changed();
  return hole;
}

/** Forget records the server has kept in full (and only those). */
export async function clearSent(): Promise<void> {
  const d = await db();
  const tx = d.transaction('holes', 'readwrite');
  for (const hole of await tx.store.getAll()) if (!isUnsent(hole)) await tx.store.delete(hole.clientId);
  await tx.done;
  changed();
}

/** Forget one record (the crew chose to drop a refused hole). */
export async function dropHole(clientId: string): Promise<void> {
  await (await db()).delete('holes', clientId);
  changed();
}

/**
 * Put records read from an exported file into this browser's outbox (the office sends them on).
 * A record whose client id is already here is left as it is, so importing a file twice adds nothing.
 * Returns how many records were added.
 */
export async function importRecords(records: readonly Omit<OutboxHole, 'seq'>[]): Promise<number> {
  const d = await db();
  const tx = d.transaction('holes', 'readwrite');
  const last = await tx.store.index('seq').openCursor(null, 'prev');
  let seq = last?.value.seq ?? 0;
  let added = 0;
  for (const record of records) {
    if (await tx.store.get(record.clientId)) continue;
    await tx.store.put({ ...record, seq: ++seq });
    added++;
  }
  await tx.done;
  changed();
  return added;
}
