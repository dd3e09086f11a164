import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import jwt from 'jsonwebtoken';
import { makeTestApp, TEST_PASSWORD, type TestContext } from './helpers';
import { SESSION_TOKEN_OPTIONS } from '@server/http/session';
import { User } from '@server/entities';

let ctx: TestContext;
beforeAll(async () => {
  ctx = await makeTestApp();
});
afterAll(() => ctx.close());

function tokenCookie(token: string) {
  return `tl_session=${token}`;
}

describe('sign-in', () => {
  it('when the password is right, then the session cookie is httpOnly, SameSite and expiring, and /me answers', async () => {
    const res = await request(ctx.app).post('/api/auth/login').send({ email: 'designer@test.example.com', password: TEST_PASSWORD });
    expect(res.status).toBe(200);
    expect(res.body.user.role).toBe('designer');
    expect(res.body.user).not.toHaveProperty('passwordHash');
    const cookie = String(res.headers['set-cookie']);
    expect(cookie).toMatch(/tl_session=/);
    expect(cookie).toMatch(/HttpOnly/i);
    expect(cookie).toMatch(/SameSite=Strict/i);
    expect(cookie).toMatch(/Max-Age=43200/);
    const me = await request(ctx.app).get('/api/auth/me').set('Cookie', cookie.split(';')[0]!);
    expect(me.status).toBe(200);
    expect(me.body.user.email).toBe('designer@test.example.com');
  });

  it('when the e-mail is given in another case, then it still signs in', async () => {
    const res = await request(ctx.app).post('/api/auth/login').send({ email: ' Designer@Test.Example.com ', password: TEST_PASSWORD });
    expect(res.status).toBe(200);
  });

  it('when the password is wrong or the user unknown, then 401 with the same message', async () => {
    const wrong = await request(ctx.app).post('/api/auth/login').send({ email: 'designer@test.example.com', password: 'nope' });
    const unknown = await request(ctx.app).post('/api/auth/login').send({ email: 'nobody@test.example.com', password: 'nope' });
    expect(wrong.status).toBe(401);
    expect(unknown.status).toBe(401);
    expect(wrong.body.detail).toBe(unknown.body.detail);
    expect(wrong.headers['content-type']).toMatch(/application\/problem\+json/);
  });

  it('when signing out, then the cookie is cleared', async () => {
    const res = await request(ctx.app).post('/api/auth/logout').set('Cookie', ctx.cookie('viewer'));
    expect(res.status).toBe(204);
    expect(String(res.headers['set-cookie'])).toMatch(/tl_session=;/);
  });

  it('when there is no cookie, then 401', async () => {
    const res = await request(ctx.app).get('/api/auth/me');
    expect(res.status).toBe(401);
    expect(res.body.status).toBe(401);
  });
});

describe('tokens that must be refused (RFC 7519 claims, pinned algorithm)', () => {
  const sign = (payload: object, options: jwt.SignOptions, key = ctx.config.jwtSecret) =>
    jwt.sign(payload, key, { ...SESSION_TOKEN_OPTIONS, subject: String(ctx.users.admin.id), ...options });

  const cases: [string, () => string][] = [
    ['expired', () => sign({}, { expiresIn: -60 })],
    ['not yet valid', () => sign({}, { expiresIn: 3600, notBefore: 600 })],
    ['signed with another key', () => sign({}, { expiresIn: 3600 }, 'x'.repeat(64))],
    ['for another audience', () => sign({}, { expiresIn: 3600, audience: 'someone-else' })],
    ['from another issuer', () => sign({}, { expiresIn: 3600, issuer: 'someone-else' })],
    ['with HS512 instead of HS256', () => sign({}, { expiresIn: 3600, algorithm: 'HS512' })],
    [
      'with alg none',
      () => {
        const enc = (o: object) => Buffer.from(JSON.stringify(o)).toString('base64url');
        const now = Math.floor(Date.now() / 1000);
        return `${enc({ alg: 'none', typ: 'JWT' })}.${enc({ sub: String(ctx.users.admin.id), aud: 'threadline-web', iss: 'threadline', iat: now, exp: now + 3600 })}.`;
      },
    ],
    [
      'with an edited payload',
      () => {
        const good = sign({}, { expiresIn: 3600, subject: String(ctx.users.viewer.id) });
        const [h, , s] = good.split('.');
        const payload = Buffer.from(JSON.stringify({ sub: String(ctx.users.admin.id), aud: 'threadline-web', iss: 'threadline', exp: 9999999999 })).toString('base64url');
        return `${h}.${payload}.${s}`;
      },
    ],
    ['that is garbage', () => 'not.a.token'],
  ];

  it.each(cases)('when the token is %s, then 401', async (_name, make) => {
    const res = await request(ctx.app).get('/api/auth/me').set('Cookie', tokenCookie(make()));
    expect(res.status).toBe(401);
  });

  it('when the user is deactivated, then the token stops working', async () => {
    const em = ctx.orm.em.fork();
    const user = new User('leaver@test.example.com', 'Leaver', 'designer', 'x');
    await em.persistAndFlush(user);
    const token = sign({}, { expiresIn: 3600, subject: String(user.id) });
    expect((await request(ctx.app).get('/api/auth/me').set('Cookie', tokenCookie(token))).status).toBe(200);
    const res = await request(ctx.app)
      .patch(`/api/users/${user.id}`)
      .set('Cookie', ctx.cookie('admin'))
      .send({ active: false, version: user.version });
    expect(res.status).toBe(200);
    expect((await request(ctx.app).get('/api/auth/me').set('Cookie', tokenCookie(token))).status).toBe(401);
  });
});

describe('cross-site requests', () => {
  it('when a state-changing request comes from another origin, then 403', async () => {
    const res = await request(ctx.app)
      .post('/api/auth/logout')
      .set('Cookie', ctx.cookie('viewer'))
      .set('Origin', 'https://evil.example.net');
    expect(res.status).toBe(403);
  });

  it('when it comes from our own origin, then it goes through', async () => {
    const res = await request(ctx.app)
      .post('/api/auth/logout')
      .set('Host', 'threadline.test')
      .set('Origin', 'http://threadline.test')
      .set('Cookie', ctx.cookie('viewer'));
    expect(res.status).toBe(204);
  });

  it('when the browser says cross-site without an origin, then 403', async () => {
    const res = await request(ctx.app).post('/api/auth/logout').set('Sec-Fetch-Site', 'cross-site');
    expect(res.status).toBe(403);
  });
});

describe('login throttling', () => {
  it('when a client fails too often, then 429, and a right password still waits', async () => {
    const throttled = await makeTestApp({ loginMaxAttempts: 3 });
    try {
      const attempt = (password: string) =>
        request(throttled.app).post('/api/auth/login').send({ email: 'field@test.example.com', password });
      for (let i = 0; i < 3; i++) expect((await attempt('wrong')).status).toBe(401);
      expect((await attempt('wrong')).status).toBe(429);
      expect((await attempt(TEST_PASSWORD)).status).toBe(429);
    } finally {
      await throttled.close();
    }
  });
});
