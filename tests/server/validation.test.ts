import { randomUUID } from 'node:crypto';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import { Bore, Project, User, UtilityLine } from '@server/entities';
import { makeFixtures, makeTestApp, tableCounts, type Fixtures, type TestContext } from './helpers';

let ctx: TestContext;
let f: Fixtures;
beforeAll(async () => {
  ctx = await makeTestApp();
  f = await makeFixtures(ctx);
});
afterAll(() => ctx.close());

const base = () => `/api/projects/${f.project.id}`;

const validLine = () => ({
  label: 'G-9',
  owner: 'Test gas company',
  kind: 'gas',
  shape: 'round',
  diameter: 0.5,
  status: 'active',
  qualityLevel: 'B',
  path: [
    [3000050, 13799900],
    [3000050, 13800100],
  ],
  recordDepth: 4,
});

/** Each case: who sends what where, and the field paths the 400 must name. */
const cases: { name: string; url: () => string; method: 'post' | 'patch' | 'put'; body: () => unknown; paths: string[] }[] = [
  { name: 'a line with one vertex', url: () => `${base()}/lines`, method: 'post', body: () => ({ ...validLine(), path: [[1, 2]] }), paths: ['path'] },
  { name: 'a line with a NaN-like coordinate (string)', url: () => `${base()}/lines`, method: 'post', body: () => ({ ...validLine(), path: [[1, 'x'], [2, 3]] }), paths: ['path.0.1'] },
  { name: 'a round line without a diameter', url: () => `${base()}/lines`, method: 'post', body: () => ({ ...validLine(), diameter: undefined }), paths: ['diameter'] },
  { name: 'a box line without width and height', url: () => `${base()}/lines`, method: 'post', body: () => ({ ...validLine(), shape: 'box' }), paths: ['width', 'height'] },
  { name: 'an unknown kind and an extra field', url: () => `${base()}/lines`, method: 'post', body: () => ({ ...validLine(), kind: 'lava', colour: 'red' }), paths: ['kind', '(body)'] },
  { name: 'a negative record depth', url: () => `${base()}/lines`, method: 'post', body: () => ({ ...validLine(), recordDepth: -1 }), paths: ['recordDepth'] },
  {
    name: 'a bore whose profile stations go backwards',
    url: () => `${base()}/bores`,
    method: 'post',
    body: () => ({
      name: 'B',
      method: 'auger_bore',
      alignment: [[0, 0], [100, 0]],
      beginStation: 0,
      profile: [{ station: 50, elevation: 1 }, { station: 10, elevation: 1 }],
      groundProfile: [],
      casingOd: 2,
      toleranceHorizontal: 1,
      toleranceVertical: 1,
      minCover: 3,
    }),
    paths: ['profile.1.station'],
  },
  {
    name: 'a hole by station with no station, offset or bore',
    url: () => `${base()}/holes`,
    method: 'post',
    body: () => ({ clientId: randomUUID(), number: 'TH-9', lineId: f.line.id, positionSource: 'station' }),
    paths: ['boreId', 'station', 'offset'],
  },
  {
    name: 'a hole with a bad client id and a string depth',
    url: () => `${base()}/holes`,
    method: 'post',
    body: () => ({ clientId: 'abc', number: 'TH-9', lineId: f.line.id, positionSource: 'grid', easting: 1, northing: 2, depthToTop: '4 ft' }),
    paths: ['clientId', 'depthToTop'],
  },
  {
    // Physically impossible (common practice: a line's bottom is below its top).
    name: 'a hole whose line bottom is shallower than its top',
    url: () => `${base()}/holes`,
    method: 'post',
    body: () => ({ clientId: randomUUID(), number: 'TH-9', lineId: f.line.id, positionSource: 'grid', easting: 1, northing: 2, depthToTop: 6.1, depthToBottom: 4.42 }),
    paths: ['depthToBottom'],
  },
  {
    name: 'a station/offset hole with an offset but no side',
    url: () => `${base()}/holes`,
    method: 'post',
    body: () => ({ clientId: randomUUID(), number: 'TH-9', lineId: f.line.id, positionSource: 'station', boreId: f.bore.id, station: 1100, offset: 2.5 }),
    paths: ['offsetSide'],
  },
  {
    name: 'a phone fix without its accuracy',
    url: () => `${base()}/holes`,
    method: 'post',
    body: () => ({ clientId: randomUUID(), number: 'TH-9', lineId: f.line.id, positionSource: 'gps', easting: 1, northing: 2 }),
    paths: ['gpsAccuracy'],
  },
  {
    name: 'a hole on a line of no project of mine',
    url: () => `${base()}/holes`,
    method: 'post',
    body: () => ({ clientId: randomUUID(), number: 'TH-9', lineId: 999999, positionSource: 'grid', easting: 1, northing: 2 }),
    paths: ['lineId'],
  },
  {
    name: 'a phone fix worse than the project limit',
    url: () => `${base()}/holes`,
    method: 'post',
    body: () => ({ clientId: randomUUID(), number: 'TH-9', lineId: f.line.id, positionSource: 'gps', easting: 1, northing: 2, gpsAccuracy: 80 }),
    paths: ['gpsAccuracy'],
  },
  { name: 'a project with an unknown unit', url: () => '/api/projects', method: 'post', body: () => ({ name: 'X', client: 'Y', crsCode: 'EPSG:2278', crsProj4: '+proj=longlat', unit: 'furlong', verticalDatum: 'NAVD 88', stationStyle: '100' }), paths: ['unit'] },
  // EPSG:2278 (Texas South Central) is in US survey feet (EPSG registry; the catalogue's entry).
  { name: 'a project in metres on a US-survey-foot CRS', url: () => '/api/projects', method: 'post', body: () => ({ name: 'X', client: 'Y', crsCode: 'EPSG:2278', crsProj4: '+proj=lcc +lat_0=27.8333333333333 +lon_0=-99 +lat_1=30.2833333333333 +lat_2=28.3833333333333 +x_0=600000 +y_0=4000000 +ellps=GRS80 +units=us-ft +no_defs', unit: 'm', verticalDatum: 'NAVD 88', stationStyle: '1000' }), paths: ['unit'] },
  // EPSG:26914 (NAD83 / UTM zone 14N) is in metres (EPSG registry).
  { name: 'a UTM code with a definition in feet', url: () => '/api/projects', method: 'post', body: () => ({ name: 'X', client: 'Y', crsCode: 'EPSG:26914', crsProj4: '+proj=utm +zone=14 +ellps=GRS80 +units=us-ft +no_defs', unit: 'm', verticalDatum: 'NAVD 88', stationStyle: '1000' }), paths: ['crsProj4'] },
  { name: 'a project with a proj4 string proj4 cannot read', url: () => '/api/projects', method: 'post', body: () => ({ name: 'X', client: 'Y', crsCode: 'CUSTOM', crsProj4: '+proj=nonsense +units=m', unit: 'm', verticalDatum: 'NAVD 88', stationStyle: '1000' }), paths: ['crsProj4'] },
  { name: 'a survey with no version', url: () => `${base()}/holes/${f.hole.id}/survey`, method: 'put', body: () => ({ surveyedTopElevation: 95 }), paths: ['version'] },
  { name: 'a review sent back without a reason', url: () => `${base()}/holes/${f.hole.id}/review`, method: 'post', body: () => ({ decision: 'send_back', version: 1 }), paths: ['reason'] },
  { name: 'a user with a short password and a bad e-mail', url: () => '/api/users', method: 'post', body: () => ({ email: 'not-an-email', name: 'A', role: 'field', password: 'short' }), paths: ['email', 'password'] },
];

describe('malformed bodies', () => {
  it.each(cases)('when the body is $name, then 400 names the fields and nothing is written', async (c) => {
    const before = await tableCounts(ctx.orm);
    const res = await request(ctx.app)[c.method](c.url()).set('Cookie', ctx.cookie('admin')).send(c.body() as object);
    expect(res.status).toBe(400);
    expect(res.headers['content-type']).toMatch(/application\/problem\+json/);
    const paths = (res.body.errors as { path: string }[]).map((e) => e.path);
    for (const p of c.paths) expect(paths).toContain(p);
    expect(await tableCounts(ctx.orm)).toEqual(before);
  });

  it('when the body is not JSON, then 400 without internals', async () => {
    const res = await request(ctx.app)
      .post(`${base()}/lines`)
      .set('Cookie', ctx.cookie('admin'))
      .set('Content-Type', 'application/json')
      .send('{"label": ');
    expect(res.status).toBe(400);
    expect(JSON.stringify(res.body)).not.toMatch(/at .*\.js|node_modules|SyntaxError/);
  });

  it('when the JSON body is one byte over the limit, then 413', async () => {
    const limit = 1024 * 1024;
    const prefix = '{"label":"';
    const suffix = '"}';
    const body = prefix + 'x'.repeat(limit + 1 - prefix.length - suffix.length) + suffix;
    expect(Buffer.byteLength(body)).toBe(limit + 1);
    const res = await request(ctx.app).post(`${base()}/lines`).set('Cookie', ctx.cookie('admin')).set('Content-Type', 'application/json').send(body);
    expect(res.status).toBe(413);
    const exact = prefix + 'x'.repeat(limit - prefix.length - suffix.length) + suffix;
    const ok = await request(ctx.app).post(`${base()}/lines`).set('Cookie', ctx.cookie('admin')).set('Content-Type', 'application/json').send(exact);
    expect(ok.status).toBe(400); // parsed, then refused by the schema (label too long), not 413
  });
});

describe('writes that succeed', () => {
  it('when a designer adds a line, then 201, the activity log has the values, and a stale edit gets 409 with the current record', async () => {
    const created = await request(ctx.app).post(`${base()}/lines`).set('Cookie', ctx.cookie('designer')).send(validLine());
    expect(created.status).toBe(201);
    expect(created.body.version).toBe(1);
    const edit = await request(ctx.app)
      .patch(`${base()}/lines/${created.body.id}`)
      .set('Cookie', ctx.cookie('designer'))
      .send({ recordDepth: 5.5, version: 1 });
    expect(edit.status).toBe(200);
    expect(edit.body.version).toBe(2);
    const stale = await request(ctx.app)
      .patch(`${base()}/lines/${created.body.id}`)
      .set('Cookie', ctx.cookie('admin'))
      .send({ recordDepth: 6, version: 1 });
    expect(stale.status).toBe(409);
    expect(stale.body.current.recordDepth).toBe(5.5);
    const log = await request(ctx.app).get(`${base()}/activity`).set('Cookie', ctx.cookie('viewer'));
    const entry = log.body.items.find((a: { entity: string; action: string; entityId: number }) => a.entity === 'line' && a.action === 'update' && a.entityId === created.body.id);
    expect(entry.changes.recordDepth).toEqual({ before: 4, after: 5.5 });
    expect(entry.userName).toBe('Test designer');
  });

  it('when a field crew retries the same hole, then one record exists', async () => {
    const body = { clientId: randomUUID(), number: 'TH-77', lineId: f.line.id, positionSource: 'grid', easting: 3000100, northing: 13800020, groundElevation: 100, depthToTop: 4.2 };
    const first = await request(ctx.app).post(`${base()}/holes`).set('Cookie', ctx.cookie('field')).send(body);
    const second = await request(ctx.app).post(`${base()}/holes`).set('Cookie', ctx.cookie('field')).send(body);
    expect(first.status).toBe(201);
    expect(second.status).toBe(200);
    expect(second.body.id).toBe(first.body.id);
    expect(first.body.status).toBe('dug');
    const list = await request(ctx.app).get(`${base()}/holes`).set('Cookie', ctx.cookie('viewer'));
    expect(list.body.filter((h: { number: string }) => h.number === 'TH-77')).toHaveLength(1);
  });

  it('when a hole is reviewed, then it is locked until reopened with a reason', async () => {
    const hole = await request(ctx.app).get(`${base()}/holes/${f.hole.id}`).set('Cookie', ctx.cookie('designer'));
    const accepted = await request(ctx.app).post(`${base()}/holes/${f.hole.id}/review`).set('Cookie', ctx.cookie('designer')).send({ decision: 'accept', version: hole.body.version });
    expect(accepted.status).toBe(200);
    expect(accepted.body.status).toBe('reviewed');
    const edit = await request(ctx.app).patch(`${base()}/holes/${f.hole.id}`).set('Cookie', ctx.cookie('field')).send({ notes: 'late change', version: accepted.body.version });
    expect(edit.status).toBe(409);
    expect(edit.body.code).toBe('locked');
    const reopened = await request(ctx.app).post(`${base()}/holes/${f.hole.id}/review`).set('Cookie', ctx.cookie('designer')).send({ decision: 'reopen', reason: 'depth looks wrong', version: accepted.body.version });
    expect(reopened.status).toBe(200);
    expect(reopened.body.status).toBe('dug');
    expect(reopened.body.reviewNote).toBe('depth looks wrong');
  });
});

describe('versions change only on the record written', () => {
  it('when a field crew edits a hole, then the project, its line, the bore and the user keep their versions', async () => {
    const g = await makeFixtures(ctx);
    const versions = async () => {
      const e = ctx.orm.em.fork();
      return {
        project: (await e.findOneOrFail(Project, g.project.id)).version,
        line: (await e.findOneOrFail(UtilityLine, g.line.id)).version,
        bore: (await e.findOneOrFail(Bore, g.bore.id)).version,
        user: (await e.findOneOrFail(User, ctx.users.field.id)).version,
      };
    };
    const before = await versions();
    const hole = await request(ctx.app).get(`/api/projects/${g.project.id}/holes/${g.hole.id}`).set('Cookie', ctx.cookie('field'));
    const res = await request(ctx.app).patch(`/api/projects/${g.project.id}/holes/${g.hole.id}`).set('Cookie', ctx.cookie('field')).send({ notes: 'rod and tape photo taken', version: hole.body.version });
    expect(res.status).toBe(200);
    expect(res.body.version).toBe(hole.body.version + 1);
    expect(await versions()).toEqual(before);
  });
});

describe('the hole list and the hole detail agree', () => {
  it('when a hole is read in the list and on its own, then every field is the same (rows vs entities)', async () => {
    const g = await makeFixtures(ctx);
    const patched = await request(ctx.app)
      .patch(`/api/projects/${g.project.id}/holes/${g.hole.id}`)
      .set('Cookie', ctx.cookie('field'))
      .send({ dugAt: '2026-11-30T14:05:00.000Z', markerSet: true, version: g.hole.version });
    expect(patched.status).toBe(200);
    const list = await request(ctx.app).get(`/api/projects/${g.project.id}/holes`).set('Cookie', ctx.cookie('viewer'));
    const detail = await request(ctx.app).get(`/api/projects/${g.project.id}/holes/${g.hole.id}`).set('Cookie', ctx.cookie('viewer'));
    expect(list.status).toBe(200);
    expect(list.body.find((h: { id: number }) => h.id === g.hole.id)).toEqual(detail.body);
    expect(detail.body.photoCount).toBe(1);
    expect(detail.body.createdById).toBe(ctx.users.field.id);
    expect(typeof detail.body.approximate).toBe('boolean');
    expect(detail.body.dugAt).toBe('2026-11-30T14:05:00.000Z');
    expect(detail.body.markerSet).toBe(true);
  });
});
