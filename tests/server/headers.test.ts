import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import { makeTestApp, type TestContext } from './helpers';

let ctx: TestContext;
beforeAll(async () => {
  ctx = await makeTestApp();
});
afterAll(() => ctx.close());

describe('security headers and error bodies', () => {
  it('when any response goes out, then helmet headers with a same-origin content security policy are set and x-powered-by is not', async () => {
    const res = await request(ctx.app).get('/api/health');
    expect(res.headers['x-powered-by']).toBeUndefined();
    const csp = String(res.headers['content-security-policy']);
    const directives = Object.fromEntries(csp.split(';').map((d) => d.trim().split(/\s+/)).map(([k, ...v]) => [k, v]));
    // Only our own origin (tiles, fonts and API included); images may also be data:/blob: (thumbnails, map canvas).
    expect(directives['default-src']).toEqual(["'self'"]);
    expect(directives['connect-src']).toEqual(["'self'"]);
    expect(directives['script-src']).toEqual(["'self'"]);
    expect(directives['img-src']).toEqual(["'self'", 'data:', 'blob:']);
    expect(directives['object-src']).toEqual(["'none'"]);
    expect(directives['frame-ancestors']).toEqual(["'self'"]);
    expect(res.headers['x-content-type-options']).toBe('nosniff');
    expect(res.headers['strict-transport-security']).toBeDefined();
  });

  it('when a route does not exist or a record is missing, then a problem body with no stack text', async () => {
    for (const url of ['/api/nowhere', '/api/projects/999999/lines']) {
      const res = await request(ctx.app).get(url).set('Cookie', ctx.cookie('admin'));
      expect(res.status).toBe(404);
      expect(res.headers['content-type']).toMatch(/application\/problem\+json/);
      expect(JSON.stringify(res.body)).not.toMatch(/\bat\s+\S+\s+\(|node_modules|\.ts:\d+/);
    }
  });
});
