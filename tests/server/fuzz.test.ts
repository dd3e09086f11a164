/**
 * Hostile input against every write endpoint: at least 1,000 malformed requests each (wrong
 * types, missing and extra fields, huge strings, NaN/Infinity, broken geometry, `__proto__`
 * keys, SQL and HTML metacharacters, non-object bodies), generated with fast-check.
 * Every answer must be a 4xx problem without internals (previews may answer 200 with the
 * problems they found), the server must stay up, and nothing may be written. Each write route needs a valid template below: a new route without one fails.
 */
import type { AddressInfo } from 'node:net';
import type { Server } from 'node:http';
import { randomUUID } from 'node:crypto';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import fc from 'fast-check';
import type { RouteMeta } from '@server/http/api-router';
import { fillRoute, makeFixtures, makeTestApp, tableCounts, type Fixtures, type TestContext } from './helpers';

const RUNS = Number(process.env.FUZZ_RUNS ?? 1000);

/** A valid body for each write route; the fuzzer corrupts it. */
const TEMPLATES: Record<string, (f: Fixtures) => Record<string, unknown>> = {
  'post /api/auth/login': () => ({ email: 'admin@test.example.com', password: 'x' }),
  'post /api/users/': () => ({ email: `u${randomUUID()}@test.example.com`, name: 'N', role: 'field', password: 'long enough password' }),
  'patch /api/users/:userId': () => ({ name: 'Renamed', version: 1 }),
  'post /api/projects/': () => ({ name: 'P', client: 'C', crsCode: 'EPSG:26914', crsProj4: '+proj=utm +zone=14 +ellps=GRS80 +units=m +no_defs', unit: 'm', verticalDatum: 'NAVD 88', stationStyle: '1000' }),
  'patch /api/projects/:projectId': () => ({ name: 'Renamed', version: 1 }),
  'post /api/projects/:projectId/members': (f) => ({ userId: f.hole.createdBy!.id }),
  'post /api/projects/:projectId/bores': () => ({
    name: 'B2', method: 'hdd', alignment: [[3000000, 13800100], [3000200, 13800100]], beginStation: 0,
    profile: [{ station: 0, elevation: 90 }, { station: 200, elevation: 90 }], groundProfile: [], casingOd: 1,
    toleranceHorizontal: 1, toleranceVertical: 1, minCover: 3,
  }),
  'patch /api/projects/:projectId/bores/:boreId': () => ({ casingOd: 2, version: 1 }),
  'post /api/projects/:projectId/pits': (f) => ({ boreId: f.bore.id, kind: 'receiving', footprint: [[0, 0], [1, 0], [1, 1]], bottomElevation: 70 }),
  'patch /api/projects/:projectId/pits/:pitId': () => ({ bottomElevation: 71, version: 1 }),
  'post /api/projects/:projectId/lines/': () => ({
    label: 'F', owner: 'O', kind: 'gas', shape: 'round', diameter: 0.5, status: 'active', qualityLevel: 'B',
    path: [[3000050, 13799900], [3000050, 13800100]], recordDepth: 4,
  }),
  'patch /api/projects/:projectId/lines/:lineId': () => ({ recordDepth: 5, version: 1 }),
  // The richer of the two create forms: a hole with a line on no record (newLine), which writes two records.
  'post /api/projects/:projectId/holes': () => ({
    clientId: randomUUID(), number: 'TH-F', newLine: { label: 'Unidentified pipe' }, positionSource: 'grid', easting: 3000100, northing: 13800020,
    depthToTop: 4, measuredSize: 0.5, direction: 'N 83° E',
  }),
  'patch /api/projects/:projectId/holes/:holeId': () => ({ notes: 'n', version: 1 }),
  'put /api/projects/:projectId/holes/:holeId/survey': () => ({ surveyedTopElevation: 90, version: 1 }),
  'post /api/projects/:projectId/holes/:holeId/review': () => ({ decision: 'send_back', reason: 'r', version: 1 }),
  'post /api/projects/:projectId/rules/': () => ({ kind: 'gas', vertical: 1, horizontal: 1 }),
  'patch /api/projects/:projectId/rules/:ruleId': () => ({ vertical: 2, version: 1 }),
  'patch /api/projects/:projectId/conflicts/:conflictId/status': () => ({ status: 'in_review', reason: 'r', version: 1 }),
  'patch /api/projects/:projectId/conflicts/:conflictId': () => ({ notes: 'n', version: 1 }),
  'patch /api/projects/:projectId/conflicts/:conflictId/assignment': (f) => ({ assigneeId: f.hole.createdBy!.id, dueDate: '2027-03-04', version: 1 }),
  'post /api/projects/:projectId/conflicts/:conflictId/comments': () => ({ text: 'Owner called back.' }),
  'patch /api/projects/:projectId/photos/:photoId': () => ({ caption: 'Exposed with rod and tape' }),
  'post /api/projects/:projectId/survey-imports/preview': () => ({ csv: 'point,northing,easting,elevation,description\nTH-1,13800010,3000100,86.0,TOP', fileName: 's.csv' }),
  'post /api/projects/:projectId/survey-imports/commit': () => ({ csv: 'point,northing,easting,elevation,description\nTH-1,13800010,3000100,86.0,TOP', fileName: 's.csv' }),
  'post /api/projects/:projectId/stakeout/marks': (f) => ({ key: `crossing:${f.bore.id}:${f.line.id}`, note: 'n' }),
  'post /api/projects/:projectId/mail/owners': () => ({ mode: 'preview' }),
  'post /api/projects/:projectId/exports/bundle': () => ({ photos: false }),
  'post /api/projects/:projectId/imports/lines/preview': () => ({ format: 'csv', content: 'point,northing,easting,elevation,description\n1,13800000,3000000,90,GAS\n2,13800050,3000000,90,GAS' }),
  'post /api/projects/:projectId/imports/lines/commit': () => ({ format: 'csv', content: 'point,northing,easting,elevation,description\n1,13800000,3000000,90,GAS\n2,13800050,3000000,90,GAS' }),
};

const META = ["'; DROP TABLE users;--", '<script>alert(1)</script>', '" OR 1=1 --', '../../etc/passwd', '\u0000', '12+3x.4', '+-1+00'];

/** One malformed body: a raw JSON text, guaranteed invalid for the template's schema. */
function malformed(template: Record<string, unknown>): fc.Arbitrary<string> {
  const keys = Object.keys(template);
  const key = fc.constantFrom(...keys);
  const otherType = (v: unknown): fc.Arbitrary<unknown> => {
    const options: fc.Arbitrary<unknown>[] = [];
    if (typeof v !== 'string') options.push(fc.string({ maxLength: 20 }), fc.constantFrom(...META));
    // (NaN and ±Infinity would serialise as null, a valid value for nullable fields: they are sent as raw tokens below.)
    if (typeof v !== 'number') options.push(fc.double({ noNaN: true, noDefaultInfinity: true }), fc.integer());
    if (typeof v !== 'boolean') options.push(fc.boolean());
    if (!Array.isArray(v)) options.push(fc.array(fc.integer(), { maxLength: 3 }));
    if (typeof v !== 'object' || v === null || Array.isArray(v)) options.push(fc.dictionary(fc.string({ maxLength: 5 }), fc.integer(), { maxKeys: 2 }));
    return fc.oneof(...options);
  };
  const replace = (k: string, value: unknown) => JSON.stringify({ ...template, [k]: value });
  return fc.oneof(
    // a field of the wrong type (SQL and HTML metacharacters among the strings)
    key.chain((k) => otherType(template[k]).map((v) => replace(k, v))),
    // a required-or-not field removed and an unknown one added
    fc.tuple(key, fc.string({ minLength: 1, maxLength: 12 }).filter((s) => !keys.includes(s) && s !== '__proto__'), fc.jsonValue()).map(([k, extra, v]) => {
      const body: Record<string, unknown> = { ...template, [extra]: v };
      delete body[k];
      return JSON.stringify(body);
    }),
    // a `__proto__` key (prototype pollution attempt)
    fc.constant(`{"__proto__":{"role":"admin","isAdmin":true},${JSON.stringify(template).slice(1)}`),
    // numbers JSON cannot carry, as raw tokens
    fc.tuple(key, fc.constantFrom('NaN', 'Infinity', '-Infinity', '1e999', '-1e999')).map(([k, token]) => JSON.stringify({ ...template, [k]: '__TOKEN__' }).replace('"__TOKEN__"', token)),
    // a huge string
    key.map((k) => replace(k, 'x'.repeat(300_000))),
    // broken geometry: every array field gets a degenerate or non-numeric shape
    fc.constantFrom<unknown>([], [[1]], [[1, 'a']], [[null, null]], [[1, 2, 3, 4]], 'LINESTRING(0 0, 1 1)', { type: 'LineString' }).map((g) => {
      const arrays = keys.filter((k) => Array.isArray(template[k]));
      return arrays.length > 0 ? JSON.stringify({ ...template, ...Object.fromEntries(arrays.map((k) => [k, g])) }) : JSON.stringify([template]);
    }),
    // not an object at all
    fc.oneof(fc.integer(), fc.string(), fc.array(fc.jsonValue(), { maxLength: 3 }), fc.constant(null)).map((v) => JSON.stringify(v)),
    // not JSON (filtered: "{" + "}" is `{}`, valid JSON and a valid body where every field is optional)
    fc
      .string({ maxLength: 40 })
      .map((s) => `{${s}`)
      .filter((text) => {
        try {
          JSON.parse(text);
          return false;
        } catch {
          return true;
        }
      }),
  );
}

let ctx: TestContext;
let f: Fixtures;
let server: Server;
let base: string;
beforeAll(async () => {
  ctx = await makeTestApp({ loginMaxAttempts: 1_000_000 });
  f = await makeFixtures(ctx);
  server = ctx.app.listen(0, '127.0.0.1');
  await new Promise<void>((r) => server.once('listening', () => r()));
  base = `http://127.0.0.1:${(server.address() as AddressInfo).port}`;
});
afterAll(async () => {
  await new Promise((r) => server.close(r));
  await ctx.close();
});

function urlOf(path: string): string {
  return fillRoute(path, f, ctx.users.viewer.id);
}

describe('fuzzing every write endpoint', () => {
  it('every write route with a body has a template', () => {
    const routes = (ctx.app.locals.routes as RouteMeta[]).filter((r) => r.hasBody);
    expect(routes.map((r) => `${r.method} ${r.path}`).filter((k) => !(k in TEMPLATES))).toEqual([]);
  });

  it(`when each gets ${RUNS} malformed bodies, then every answer is a 4xx problem, the server stays up and nothing is written`, async () => {
    const before = await tableCounts(ctx.orm);
    const cookie = ctx.cookie('admin');
    const failures: string[] = [];
    const routes = (ctx.app.locals.routes as RouteMeta[]).filter((r) => r.hasBody);
    for (const route of routes) {
      const template = TEMPLATES[`${route.method} ${route.path}`]!(f);
      // Each route's seed is printed with any failure, so the run can be repeated (fc.assert's `seed`).
      const seed = Number(process.env.FUZZ_SEED ?? Math.floor(Math.random() * 2 ** 31));
      const countBefore = failures.length;
      await fc.assert(
        fc.asyncProperty(malformed(template), async (body) => {
          const res = await fetch(base + urlOf(route.path), {
            method: route.method.toUpperCase(),
            headers: { 'content-type': 'application/json', cookie },
            body,
          });
          const text = await res.text();
          // Previews answer 200 with the problems they found (a 300,000-character file is a file);
          // every other route must refuse. Nothing may be written either way (checked below).
          const accepted = route.path.endsWith('/preview') ? res.status < 300 || (res.status >= 400 && res.status < 500) : res.status >= 400 && res.status < 500;
          const ok = accepted && !/node_modules|at [\w.]+ \(|SQLITE_|stack/i.test(text);
          if (!ok && failures.length < 20) failures.push(`${route.method} ${route.path} ${res.status} ${body.slice(0, 120)} → ${text.slice(0, 200)}`);
          return ok;
        }),
        { numRuns: RUNS, endOnFailure: true, seed },
      ).catch((err: unknown) => {
        // A property that threw (e.g. the connection dropped) is a failure too, not a pass.
        if (failures.length === countBefore) failures.push(`${route.method} ${route.path}: ${err instanceof Error ? err.message.split('\n')[0] : String(err)}`);
      });
      if (failures.length > countBefore) failures.push(`  (repeat with FUZZ_SEED=${seed})`);
      const now = await tableCounts(ctx.orm);
      if (JSON.stringify(now) !== JSON.stringify(before)) failures.push(`${route.method} ${route.path} wrote: ${JSON.stringify(Object.fromEntries(Object.entries(now).filter(([t, n]) => before[t] !== n)))} (FUZZ_SEED=${seed})`);
    }
    expect(failures).toEqual([]);
    expect(await tableCounts(ctx.orm)).toEqual(before);
    expect((await fetch(`${base}/api/health`)).status).toBe(200);
    expect(({} as Record<string, unknown>).role).toBeUndefined(); // no prototype pollution
  }, 600_000);
});
