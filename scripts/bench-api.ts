/**
 * API load figures (part of `npm run bench`): throughput and p99 latency of the clearance
 * route and the map's data routes under 10 concurrent clients on loopback, beside a bare
 * Express route serving the same bytes in the same run — the ratio is the figure.
 * Bounded: each route runs for BENCH_API_SECONDS (default 5) seconds.
 */
import type { AddressInfo } from 'node:net';
import type { Server } from 'node:http';
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import express from 'express';
import { createApp } from '../server/app';
import { testConfig } from '../server/config';
import { openDatabase } from '../server/db';
import { signSession } from '../server/http/session';
import { seedDemo } from '../server/seed/seeder';
import { DiskStorage } from '../server/storage/storage';
import { User } from '../server/entities';

const SECONDS = Number(process.env.BENCH_API_SECONDS ?? 5);
const CONCURRENCY = 10;

interface LoadResult {
  requests: number;
  perSecond: number;
  p50: number;
  p99: number;
  errors: number;
}

async function listen(app: express.Express): Promise<{ server: Server; url: string }> {
  const server = app.listen(0, '127.0.0.1');
  await new Promise<void>((r) => server.once('listening', () => r()));
  return { server, url: `http://127.0.0.1:${(server.address() as AddressInfo).port}` };
}

async function load(url: string, headers: Record<string, string>): Promise<LoadResult> {
  const latencies: number[] = [];
  let errors = 0;
  const deadline = performance.now() + SECONDS * 1000;
  await Promise.all(
    Array.from({ length: CONCURRENCY }, async () => {
      while (performance.now() < deadline) {
        const t = performance.now();
        const res = await fetch(url, { headers });
        await res.arrayBuffer();
        if (!res.ok) errors++;
        latencies.push(performance.now() - t);
      }
    }),
  );
  latencies.sort((a, b) => a - b);
  const pick = (q: number) => latencies[Math.min(latencies.length - 1, Math.floor(q * latencies.length))]!;
  return { requests: latencies.length, perSecond: latencies.length / SECONDS, p50: pick(0.5), p99: pick(0.99), errors };
}

/** Run the API load benchmark and print its figures. */
export async function printApiBench(): Promise<void> {
  const dataDir = mkdtempSync(join(tmpdir(), 'tl-bench-api-'));
  const config = testConfig({ dataDir, databasePath: join(dataDir, 'threadline.sqlite'), logLevel: 'silent' });
  const orm = await openDatabase(config.databasePath);
  await seedDemo(orm.em, new DiskStorage(join(dataDir, 'files')), { photos: false });
  const designer = await orm.em.fork().findOneOrFail(User, { role: 'designer' });
  const cookie = `tl_session=${signSession(config, designer.id)}`;
  const api = await listen(createApp({ orm, config, storage: new DiskStorage(join(dataDir, 'files')) }));
  const projects = (await (await fetch(`${api.url}/api/projects`, { headers: { cookie } })).json()) as { id: number; name: string }[];
  const project = projects.find((p) => p.name.startsWith('Tallowmere'))!;
  const routes = ['clearances', 'lines', 'holes', 'bores'].map((r) => `/api/projects/${project.id}/${r}`);

  // The same bytes from a bare Express route: what routing and HTTP alone cost here.
  const bodies = new Map<string, Buffer>();
  for (const r of routes) bodies.set(r, Buffer.from(await (await fetch(api.url + r, { headers: { cookie } })).arrayBuffer()));
  const bareApp = express();
  bareApp.get('/bare/{*path}', (req, res) => {
    res.type('application/json').send(bodies.get(req.path.slice('/bare'.length)));
  });
  const bare = await listen(bareApp);

  console.log(`${CONCURRENCY} concurrent clients, ${SECONDS} s per route, loopback; demo road project`);
  console.log('route                         bytes   req/s  p50 ms  p99 ms | bare req/s  p99 ms | ratio');
  for (const r of routes) {
    const real = await load(api.url + r, { cookie });
    const baseline = await load(`${bare.url}/bare${r}`, {});
    const name = r.replace(`/api/projects/${project.id}`, '/api/projects/:id');
    console.log(
      `${name.padEnd(28)} ${String(bodies.get(r)!.length).padStart(6)} ${real.perSecond.toFixed(0).padStart(7)} ${real.p50.toFixed(1).padStart(7)} ${real.p99.toFixed(1).padStart(7)} | ${baseline.perSecond.toFixed(0).padStart(10)} ${baseline.p99.toFixed(1).padStart(7)} | ${(baseline.perSecond / real.perSecond).toFixed(1)}× slower than bare${real.errors + baseline.errors > 0 ? `  (${real.errors + baseline.errors} errors!)` : ''}`,
    );
  }
  await new Promise((r) => api.server.close(r));
  await new Promise((r) => bare.server.close(r));
  await orm.close();
  rmSync(dataDir, { recursive: true, force: true });
}
