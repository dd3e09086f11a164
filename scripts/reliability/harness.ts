/**
 * Shared pieces of the reliability scripts: a real server process on a fresh data folder,
 * signed-in API clients, and small helpers. Everything stays on loopback.
 */
import { spawn, type ChildProcess } from 'node:child_process';
import { mkdtempSync } from 'node:fs';
import { createServer } from 'node:net';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { openDatabase } from '../../server/db';
import { seedDemo } from '../../server/seed/seeder';
import { DiskStorage } from '../../server/storage/storage';
import { DEMO_USERS } from '../../seeds/demo';

export interface ServerHandle {
  url: string;
  child: ChildProcess;
}

export async function freePort(): Promise<number> {
  return new Promise((resolve, reject) => {
    const s = createServer();
    s.once('error', reject);
    s.listen(0, '127.0.0.1', () => {
      const port = (s.address() as { port: number }).port;
      s.close(() => resolve(port));
    });
  });
}

/** A data folder holding the demo scenario (without photos). */
export async function prepareDataDir(): Promise<string> {
  const dataDir = mkdtempSync(join(tmpdir(), 'tl-rel-'));
  const orm = await openDatabase(join(dataDir, 'threadline.sqlite'));
  await seedDemo(orm.em, new DiskStorage(join(dataDir, 'files')), { photos: false });
  await orm.close();
  return dataDir;
}

/** Start `server/index.ts` as a child process and wait until /api/health answers. */
export async function startServer(dataDir: string, port: number): Promise<ServerHandle> {
  // One process (node with tsx's loader), so SIGKILL hits the server itself, not a wrapper.
  const child = spawn(process.execPath, ['--import', 'tsx', 'server/index.ts'], {
    env: { ...process.env, DATA_DIR: dataDir, PORT: String(port), HOST: '127.0.0.1', LOG_LEVEL: 'warn', SEED_DEMO: 'false', NODE_ENV: 'development' },
    stdio: ['ignore', 'ignore', 'inherit'],
  });
  child.on('exit', (code, signal) => {
    if (code !== 0 && signal !== 'SIGKILL' && signal !== 'SIGTERM') console.error(`server exited: code ${code}, signal ${signal}`);
  });
  const url = `http://127.0.0.1:${port}`;
  const deadline = Date.now() + 30_000;
  while (Date.now() < deadline) {
    try {
      if ((await fetch(`${url}/api/health`)).ok) return { url, child };
    } catch {
      // not up yet
    }
    await new Promise((r) => setTimeout(r, 100));
  }
  child.kill('SIGKILL');
  throw new Error('server did not start within 30 s');
}

/** Resolves when the process has exited (also when it already had). */
export function exited(child: ChildProcess): Promise<void> {
  if (child.exitCode !== null || child.signalCode !== null) return Promise.resolve();
  return new Promise((r) => child.once('exit', () => r()));
}

export async function stopServer(server: ServerHandle, signal: NodeJS.Signals = 'SIGTERM'): Promise<void> {
  const done = exited(server.child);
  server.child.kill(signal);
  await done;
}

/** A signed-in API client (cookie session) for a demo role. */
export class Client {
  private cookie = '';
  constructor(private readonly url: string) {}

  /** The session cookie, for requests built by hand (multipart uploads). */
  get sessionCookie(): string {
    return this.cookie;
  }

  async signIn(role: string): Promise<void> {
    const user = DEMO_USERS.find((u) => u.role === role && u.active !== false)!;
    const res = await fetch(`${this.url}/api/auth/login`, { method: 'POST', headers: { 'content-type': 'application/json' }, body: JSON.stringify({ email: user.email, password: user.password }) });
    if (!res.ok) throw new Error(`sign-in failed: ${res.status}`);
    this.cookie = (res.headers.get('set-cookie') ?? '').split(';')[0]!;
  }

  async call(method: string, path: string, body?: unknown): Promise<{ status: number; body: any }> {
    const res = await fetch(`${this.url}${path}`, {
      method,
      headers: { cookie: this.cookie, ...(body === undefined ? {} : { 'content-type': 'application/json' }) },
      body: body === undefined ? undefined : JSON.stringify(body),
    });
    const text = await res.text();
    return { status: res.status, body: text ? JSON.parse(text) : null };
  }
}

/** Deterministic pseudo-random numbers (mulberry32) so a failing run can be repeated. */
export function prng(seed: number): () => number {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}
