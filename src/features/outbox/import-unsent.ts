import { z } from 'zod';
import { holeCreateSchema } from '@shared/schemas/hole';
import { importRecords, type OutboxHole } from './outbox-store';

const photoSchema = z.object({
  name: z.string().max(300),
  type: z.string().max(100),
  /** Absent in files written before photos had client ids. */
  clientId: z.uuid().nullish(),
  takenAt: z.iso.datetime({ offset: true }),
  caption: z.string().max(300).nullable(),
  status: z.enum(['local', 'sending', 'sent', 'refused']),
  reason: z.string().nullable(),
  base64: z.string(),
});

/** The file written by "Export unsent" (export-unsent.ts), version 1. */
const unsentFileSchema = z.object({
  format: z.literal('threadline-unsent-records', { error: 'this is not a file of unsent records from Threadline' }),
  version: z.literal(1, { error: 'this file was written by another version of Threadline' }),
  holes: z.array(
    z.object({
      projectId: z.number().int().positive(),
      project: z.string(),
      crs: z.string(),
      unit: z.string(),
      verticalDatum: z.string(),
      clientId: z.uuid(),
      number: z.string(),
      madeAt: z.string(),
      status: z.enum(['local', 'sending', 'sent', 'refused']),
      reason: z.string().nullable(),
      holeId: z.number().int().positive().nullable(),
      body: holeCreateSchema,
      photos: z.array(photoSchema),
    }),
  ),
});

function bytes(base64: string): ArrayBuffer {
  const text = atob(base64);
  const out = new Uint8Array(text.length);
  for (let i = 0; i < text.length; i++) out[i] = text.charCodeAt(i);
  return out.buffer;
}

/**
 * Read an exported file of unsent records back into this browser's outbox, from where they are
 * sent with the signed-in person's session. Client-made ids make it harmless to import a file
 * twice or to send records the server already has. Throws an Error naming what is wrong.
 */
export async function importUnsentFile(text: string): Promise<{ added: number; inFile: number }> {
  let json: unknown;
  try {
    json = JSON.parse(text);
  } catch {
    throw new Error('The file is not JSON: choose a file made by "Export unsent".');
  }
  const parsed = unsentFileSchema.safeParse(json);
  if (!parsed.success) {
    const issue = parsed.error.issues[0]!;
    throw new Error(`The file cannot be imported: ${issue.path.join('.') || 'file'} ${issue.message}.`);
  }
  const records: Omit<OutboxHole, 'seq'>[] = parsed.data.holes.map((h) => ({
    clientId: h.clientId,
    projectId: h.projectId,
    project: { id: h.projectId, name: h.project, crsCode: h.crs, unit: h.unit, verticalDatum: h.verticalDatum },
    number: h.number,
    input: h.body,
    madeAt: h.madeAt,
    // A refused record is tried again here: the office may have what the phone lacked.
    status: h.status === 'refused' ? 'local' : h.status,
    ...(h.holeId ? { holeId: h.holeId } : {}),
    photos: h.photos.map((p, i) => ({
      key: `imported-${i}-${p.takenAt}`,
      name: p.name,
      type: p.type,
      data: bytes(p.base64),
      ...(p.clientId ? { clientId: p.clientId } : {}),
      takenAt: p.takenAt,
      ...(p.caption ? { caption: p.caption } : {}),
      // Not known to be sent: 'sending' says it may already be there. With its client id the
      // server answers the photo it kept; an older file's photo without one is looked for by its
      // capture time first. Either way a file imported twice never makes a second copy.
      status: p.status === 'sent' ? 'sent' : 'sending',
    })),
  }));
  return { added: await importRecords(records), inFile: records.length };
}
