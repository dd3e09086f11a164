/**
 * Crash durability (npm run test:crash): 4 clients create and edit lines for a few seconds, the
 * server is killed with SIGKILL at a random moment, restarted, and every write a client saw
 * acknowledged must be there, with `PRAGMA integrity_check` = ok. 20 cycles by default
 * (CRASH_CYCLES), deterministic seed (CRASH_SEED). Exits non-zero on any loss.
 */
import { join } from 'node:path';
import { MikroORM } from '@mikro-orm/sqlite';
import { ormConfig } from '../../server/mikro-orm.config';
import { Client, exited, freePort, prepareDataDir, prng, startServer, stopServer } from './harness';

const CYCLES = Number(process.env.CRASH_CYCLES ?? 20);
const rnd = prng(Number(process.env.CRASH_SEED ?? 20261201));

/** What the clients saw acknowledged: line id → the recordDepth of its latest acknowledged write. */
const acknowledged = new Map<number, { depth: number; version: number }>();
let creates = 0;
let edits = 0;

async function clientLoop(client: Client, projectId: number, stop: { now: boolean }, clientNo: number): Promise<void> {
  const mine: number[] = [];
  while (!stop.now) {
    try {
      if (mine.length === 0 || rnd() < 0.4) {
        const depth = Math.round(rnd() * 1000) / 100;
        const res = await client.call('POST', `/api/projects/${projectId}/lines`, {
          label: `crash-${clientNo}-${creates}`, owner: 'Reliability test', kind: 'communications', shape: 'round', diameter: 0.2,
          status: 'active', qualityLevel: 'D', recordDepth: depth,
          path: [[3000000 + rnd() * 500, 13800500 + rnd() * 100], [3000100 + rnd() * 500, 13800700 + rnd() * 100]],
        });
        if (res.status === 201) {
          acknowledged.set(res.body.id, { depth, version: res.body.version });
          mine.push(res.body.id);
          creates++;
        }
      } else {
        const id = mine[Math.floor(rnd() * mine.length)]!;
        const last = acknowledged.get(id)!;
        const depth = Math.round(rnd() * 1000) / 100;
        const res = await client.call('PATCH', `/api/projects/${projectId}/lines/${id}`, { recordDepth: depth, version: last.version });
        if (res.status === 200) {
          acknowledged.set(id, { depth, version: res.body.version });
          edits++;
        }
      }
    } catch {
      return; // the server died mid-request: that write was never acknowledged
    }
  }
}

const dataDir = await prepareDataDir();
const dbPath = join(dataDir, 'threadline.sqlite');
let lost = 0;
const running = new Set<import('node:child_process').ChildProcess>();
process.on('exit', () => running.forEach((c) => c.kill('SIGKILL')));
let integrityFailures = 0;
for (let cycle = 1; cycle <= CYCLES; cycle++) {
  const server = await startServer(dataDir, await freePort());
  running.add(server.child);
  const clients = await Promise.all([0, 1, 2, 3].map(async () => {
    const c = new Client(server.url);
    await c.signIn('designer');
    return c;
  }));
  const projects = (await clients[0]!.call('GET', '/api/projects')).body as { id: number }[];
  const projectId = projects[0]!.id;
  const stop = { now: false };
  const loops = clients.map((c, i) => clientLoop(c, projectId, stop, i));
  await new Promise((r) => setTimeout(r, 500 + rnd() * 2500));
  const dead = exited(server.child);
  server.child.kill('SIGKILL');
  stop.now = true;
  await Promise.all(loops);
  await dead;

  // Restart, then check every acknowledged write through the API and the file's integrity.
  const again = await startServer(dataDir, await freePort());
  running.add(again.child);
  const checker = new Client(again.url);
  await checker.signIn('designer');
  const lines = (await checker.call('GET', `/api/projects/${projectId}/lines`)).body as { id: number; recordDepth: number; version: number }[];
  const byId = new Map(lines.map((l) => [l.id, l]));
  let cycleLost = 0;
  for (const [id, ack] of acknowledged) {
    const row = byId.get(id);
    // A later unacknowledged write may have landed (version above), never an earlier state.
    if (!row || row.version < ack.version || (row.version === ack.version && row.recordDepth !== ack.depth)) cycleLost++;
  }
  await stopServer(again);
  const orm = await MikroORM.init(ormConfig(dbPath));
  const [check] = await orm.em.getConnection().execute<{ integrity_check: string }[]>('pragma integrity_check');
  await orm.close();
  if (check?.integrity_check !== 'ok') integrityFailures++;
  lost += cycleLost;
  console.log(`cycle ${String(cycle).padStart(2)}: ${acknowledged.size} acknowledged records, ${cycleLost} lost, integrity ${check?.integrity_check}`);
}
console.log(`\n${CYCLES} kill -9 cycles: ${creates} creates and ${edits} edits acknowledged, ${lost} lost, ${integrityFailures} integrity failures`);
console.log(`crash: ${lost === 0 && integrityFailures === 0 ? 1 : 0} passed, ${lost === 0 && integrityFailures === 0 ? 0 : 1} failed`);
process.exit(lost === 0 && integrityFailures === 0 ? 0 : 1);
