import { isUnsent, listOutbox, type OutboxHole } from './outbox-store';

function base64(data: ArrayBuffer): string {
  const bytes = new Uint8Array(data);
  let s = '';
  for (let i = 0; i < bytes.length; i += 0x8000) s += String.fromCharCode(...bytes.subarray(i, i + 0x8000));
  return btoa(s);
}

/**
 * The unsent records as one JSON file the office can read or send on: each hole's request body
 * exactly as the API takes it (POST /api/projects/:projectId/holes, with its client id, so
 * sending it again is harmless; a hole on a new unidentified line carries `newLine`, and the line
 * is made with it) and its unsent photos as base64 with their client ids, under a header naming the
 * coordinate system, unit and vertical datum of the values.
 */
export function unsentExport(records: OutboxHole[], exportedAt = new Date()) {
  return {
    format: 'threadline-unsent-records',
    version: 1,
    exportedAt: exportedAt.toISOString(),
    note: 'Test holes kept on a phone and not yet received by the server. Each "body" is the create request for POST /api/projects/{projectId}/holes; its clientId makes a repeat send return the record already made. A hole on a line on no record carries newLine instead of lineId (the line is made with the hole). Each photo is sent to POST /api/projects/{projectId}/holes/{holeId}/photos with its clientId field, so a repeat send keeps one copy.',
    holes: records.filter(isUnsent).map((h) => ({
      projectId: h.projectId,
      project: h.project.name,
      crs: h.project.crsCode,
      unit: h.project.unit,
      verticalDatum: h.project.verticalDatum,
      clientId: h.clientId,
      number: h.number,
      madeAt: h.madeAt,
      status: h.status,
      reason: h.reason ?? null,
      holeId: h.holeId ?? null,
      body: h.input,
      photos: h.photos
        .filter((p) => p.status !== 'sent')
        .map((p) => ({ name: p.name, type: p.type, clientId: p.clientId ?? null, takenAt: p.takenAt, caption: p.caption ?? null, status: p.status, reason: p.reason ?? null, base64: base64(p.data) })),
    })),
  };
}

/** Download the unsent records as threadline-unsent-<time>.json. */
export async function downloadUnsent(): Promise<number> {
  const records = (await listOutbox()).filter(isUnsent);
  const now = new Date();
  const blob = new Blob([JSON.stringify(unsentExport(records, now), null, 2)], { type: 'application/json' });
  const url = URL.createObjectURL(blob);
  const a = document.createElement('a');
  a.href = url;
  a.download = `threadline-unsent-${now.toISOString().slice(0, 16).replace(/[:T]/g, '-')}.json`;
  document.body.append(a);
  a.click();
  a.remove();
  setTimeout(() => URL.revokeObjectURL(url), 10_000);
  return records.length;
}
