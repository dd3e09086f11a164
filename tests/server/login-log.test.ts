import { Writable } from 'node:stream';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import { pino } from 'pino';
import { createApp } from '@server/app';
import { makeTestApp, type TestContext } from './helpers';

let ctx: TestContext;
const lines: string[] = [];
let app: ReturnType<typeof createApp>;
beforeAll(async () => {
  ctx = await makeTestApp();
  const sink = new Writable({
    write(chunk, _enc, done) {
      lines.push(...String(chunk).split('\n').filter(Boolean));
      done();
    },
  });
  app = createApp({ orm: ctx.orm, config: ctx.config, storage: ctx.storage, logger: pino({ level: 'info' }, sink) });
});
afterAll(() => ctx.close());

describe('failed sign-ins are logged, and a user name cannot forge a log line', () => {
  it('when sign-ins fail, then each failure is one JSON log line naming the e-mail as data', async () => {
    const attempts = ['designer@test.example.com', 'no.such.person@test.example.com'];
    for (const email of attempts) {
      await request(app).post('/api/auth/login').send({ email, password: 'wrong' });
    }
    const failures = lines.map((l) => JSON.parse(l) as { event?: string; email?: string }).filter((l) => l.event === 'login_failed');
    expect(failures.map((f) => f.email)).toEqual(attempts);
    // Every line written is a whole JSON object: nothing an attacker typed can start a new line.
    for (const l of lines) expect(() => JSON.parse(l)).not.toThrow();
  });

  it('when the e-mail carries a newline and a fake log entry, then 400 and no line is forged', async () => {
    const before = lines.length;
    const forged = 'x@test.example.com\n{"level":30,"msg":"admin signed in"}';
    const res = await request(app).post('/api/auth/login').send({ email: forged, password: 'wrong' });
    expect(res.status).toBe(400);
    const added = lines.slice(before).map((l) => JSON.parse(l) as { msg?: string });
    expect(added.some((l) => l.msg === 'admin signed in')).toBe(false);
  });
});
