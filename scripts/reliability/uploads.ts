/**
 * Uploads under load (npm run test:uploads): 50 photos of about 5 MB sent at once to a real
 * server process. Every one must be stored with its thumbnail, no answer may be 5xx, and the
 * server's resident memory growth must stay under UPLOADS_MAX_GROWTH_MB (default 600 MB, a tripwire):
 * only PHOTO_UPLOAD_CONCURRENCY uploads are read into memory at once, the rest wait unread.
 */
import { randomUUID } from 'node:crypto';
import { readFileSync } from 'node:fs';
import { Jimp } from 'jimp';
import { Client, freePort, prepareDataDir, startServer, stopServer } from './harness';

const COUNT = Number(process.env.UPLOADS_COUNT ?? 50);
const MAX_GROWTH_MB = Number(process.env.UPLOADS_MAX_GROWTH_MB ?? 600);

function rssMb(pid: number): number {
  const status = readFileSync(`/proc/${pid}/status`, 'utf8');
  return Number(/VmRSS:\s+(\d+)/.exec(status)![1]) / 1024;
}

/** A real ~5 MB JPEG: noise compresses badly, which is the point. */
async function fiveMegabyteJpeg(): Promise<Buffer> {
  const w = 2000;
  const h = 1500;
  const data = Buffer.alloc(w * h * 4);
  let seed = 7;
  for (let i = 0; i < data.length; i += 4) {
    seed = (seed * 1103515245 + 12345) >>> 0;
    data[i] = seed & 255;
    data[i + 1] = (seed >>> 8) & 255;
    data[i + 2] = (seed >>> 16) & 255;
    data[i + 3] = 255;
  }
  return Jimp.fromBitmap({ data, width: w, height: h }).getBuffer('image/jpeg', { quality: 92 });
}

const jpeg = await fiveMegabyteJpeg();
const dataDir = await prepareDataDir();
const server = await startServer(dataDir, await freePort());
process.on('exit', () => server.child.kill('SIGKILL'));
const field = new Client(server.url);
await field.signIn('field');
const projectId = ((await field.call('GET', '/api/projects')).body as { id: number }[])[0]!.id;
const lines = (await field.call('GET', `/api/projects/${projectId}/lines`)).body as { id: number; path: [number, number][] }[];
const hole = await field.call('POST', `/api/projects/${projectId}/holes`, {
  clientId: randomUUID(), number: 'TH-LOAD', lineId: lines[0]!.id, positionSource: 'grid',
  easting: lines[0]!.path[0]![0], northing: lines[0]!.path[0]![1], groundElevation: 100, depthToTop: 4,
});
if (hole.status !== 201) throw new Error(`hole not created: ${hole.status} ${JSON.stringify(hole.body)}`);

const rssBefore = rssMb(server.child.pid!);
let peak = rssBefore;
const sampler = setInterval(() => (peak = Math.max(peak, rssMb(server.child.pid!))), 50);
const started = performance.now();
const cookie = field.sessionCookie;
const statuses = await Promise.all(
  Array.from({ length: COUNT }, async (_, i) => {
    const form = new FormData();
    form.append('photos', new Blob([new Uint8Array(jpeg)], { type: 'image/jpeg' }), `load-${i}.jpg`);
    form.append('caption', `load ${i}`);
    const res = await fetch(`${server.url}/api/projects/${projectId}/holes/${hole.body.id}/photos`, { method: 'POST', body: form, headers: { cookie } });
    await res.arrayBuffer();
    return res.status;
  }),
);
const uploadSeconds = (performance.now() - started) / 1000;
const peakUploading = peak;

// Wait for every thumbnail (bounded: 10 minutes).
let photos: { state: string }[] = [];
const deadline = Date.now() + 600_000;
while (Date.now() < deadline) {
  photos = (await field.call('GET', `/api/projects/${projectId}/holes/${hole.body.id}/photos`)).body;
  if (photos.length >= COUNT && photos.every((p) => p.state !== 'processing')) break;
  await new Promise((r) => setTimeout(r, 500));
}
const allSeconds = (performance.now() - started) / 1000;
clearInterval(sampler);
const rssAfter = rssMb(server.child.pid!);
await stopServer(server);

const count = (s: number) => statuses.filter((x) => x === s).length;
const fivexx = statuses.filter((s) => s >= 500).length;
const ready = photos.filter((p) => p.state === 'ready').length;
console.log(`${COUNT} parallel uploads of ${(jpeg.length / 1048576).toFixed(2)} MB: ${count(201)} × 201, ${fivexx} × 5xx, in ${uploadSeconds.toFixed(1)} s; all thumbnails made after ${allSeconds.toFixed(1)} s`);
console.log(`photos ready: ${ready} of ${COUNT}; server RSS ${rssBefore.toFixed(0)} MB before, peak ${peak.toFixed(0)} MB (+${(peak - rssBefore).toFixed(0)} MB; +${(peakUploading - rssBefore).toFixed(0)} MB while the uploads were read), ${rssAfter.toFixed(0)} MB after`);
const ok = count(201) === COUNT && fivexx === 0 && ready === COUNT && peak - rssBefore <= MAX_GROWTH_MB;
console.log(`uploads: ${ok ? 1 : 0} passed, ${ok ? 0 : 1} failed`);
process.exit(ok ? 0 : 1);
