/**
 * Lost updates (npm run test:lost-updates): 8 clients edit the same 50 lines for a minute
 * (LOST_UPDATES_SECONDS), each sending the version it last saw. Every answer must be 2xx or
 * 409 (never 5xx), and each line's final version must equal 1 + the number of edits that
 * were answered 200: no edit is silently overwritten.
 */
import { Client, freePort, prepareDataDir, prng, startServer, stopServer } from './harness';

const SECONDS = Number(process.env.LOST_UPDATES_SECONDS ?? 60);
const CLIENTS = 8;
const RECORDS = 50;
const rnd = prng(42);

const dataDir = await prepareDataDir();
const server = await startServer(dataDir, await freePort());
process.on('exit', () => server.child.kill('SIGKILL'));
const admin = new Client(server.url);
await admin.signIn('designer');
const projectId = ((await admin.call('GET', '/api/projects')).body as { id: number }[])[0]!.id;
const ids: number[] = [];
for (let i = 0; i < RECORDS; i++) {
  const res = await admin.call('POST', `/api/projects/${projectId}/lines`, {
    label: `shared-${i}`, owner: 'Lost-update test', kind: 'communications', shape: 'round', diameter: 0.2, status: 'active',
    qualityLevel: 'D', recordDepth: 3, path: [[3001000 + i * 10, 13801000], [3001000 + i * 10, 13801050]],
  });
  if (res.status !== 201) throw new Error(`setup failed: ${res.status}`);
  ids.push(res.body.id);
}

const successes = new Map<number, number>(ids.map((id) => [id, 0]));
const statuses = new Map<number, number>();
const deadline = Date.now() + SECONDS * 1000;
let sent = 0;
await Promise.all(
  Array.from({ length: CLIENTS }, async () => {
    const client = new Client(server.url);
    await client.signIn('designer');
    const seen = new Map<number, number>(ids.map((id) => [id, 1]));
    while (Date.now() < deadline) {
      const id = ids[Math.floor(rnd() * ids.length)]!;
      // Every edit sends a value never sent before: an edit that changes nothing (rightly) leaves
      // the version alone, which would look like a lost update here.
      const res = await client.call('PATCH', `/api/projects/${projectId}/lines/${id}`, { recordDepth: 3 + ++sent / 1000, version: seen.get(id) });
      statuses.set(res.status, (statuses.get(res.status) ?? 0) + 1);
      if (res.status === 200) {
        successes.set(id, successes.get(id)! + 1);
        seen.set(id, res.body.version);
      } else if (res.status === 409) {
        seen.set(id, res.body.current.version); // read the current record, as a person would
      }
    }
  }),
);

const lines = (await admin.call('GET', `/api/projects/${projectId}/lines`)).body as { id: number; version: number }[];
let mismatches = 0;
for (const id of ids) {
  const line = lines.find((l) => l.id === id)!;
  if (line.version !== 1 + successes.get(id)!) {
    mismatches++;
    console.log(`line ${id}: version ${line.version}, but 1 + ${successes.get(id)} successful edits`);
  }
}
await stopServer(server);
const bad = [...statuses.keys()].filter((s) => s !== 200 && s !== 409);
const total = [...statuses.values()].reduce((a, b) => a + b, 0);
console.log(`${CLIENTS} clients × ${SECONDS} s on ${RECORDS} shared lines: ${total} edits sent; answers ${JSON.stringify(Object.fromEntries(statuses))}`);
console.log(`final versions equal 1 + successful edits on ${RECORDS - mismatches} of ${RECORDS} lines`);
const ok = bad.length === 0 && mismatches === 0;
console.log(`lost-updates: ${ok ? 1 : 0} passed, ${ok ? 0 : 1} failed`);
process.exit(ok ? 0 : 1);
