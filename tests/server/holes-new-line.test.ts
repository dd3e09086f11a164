/**
 * A line on no record, logged with the hole that exposed it (issue 7 follow-up): the crew sends
 * the hole with `newLine` instead of `lineId`, and the server makes the unidentified line and the
 * hole in one transaction, each with its activity entry, then recomputes the clearances. Field
 * crews may do this through the hole create (their own permission) though POST /lines stays
 * closed to them; a replay of the hole's client id, one after another or at once, makes one hole
 * and one line. Photos sent with a client id are kept once per hole however often they are sent.
 *
 * Sources: a crew that exposes an unmarked line logs it on the spot — common practice (that is
 * the point of potholing). Quality level A is the level of a line exposed and measured at a test
 * hole: ASCE/UESI 38-22 §3 (from memory). A replayed POST must not repeat its effect: RFC 9110
 * §9.2.2, made safe here by the client-made key. The stub length (5 m each side, 32.8 US ft in all)
 * is our own drawing rule; 1 US survey foot = 1200/3937 m (NIST SP 811, and shared/units.ts).
 */
import { randomUUID } from 'node:crypto';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { ActivityDto, HoleDto, LineDto, PhotoDto } from '@shared/api';
import type { Role } from '@shared/domain';
import { ActivityEntry, Photo, TestHole, UtilityLine } from '@server/entities';
import { thumbnails } from '@server/modules/holes/photo-queue';
import { plainPng } from './exif-fixture';
import { makeFixtures, makeTestApp, tableCounts, type Fixtures, type TestContext } from './helpers';

let ctx: TestContext;
beforeAll(async () => {
  ctx = await makeTestApp();
});
afterAll(async () => {
  await thumbnails.idle();
  await ctx.close();
});

const api = (f: Fixtures, path: string) => `/api/projects/${f.project.id}${path}`;

/** A hole exposing a 10-inch (0.833 ft) clay pipe running due east, on no record. */
function newLineBody(number = `TH-N${Math.floor(Math.random() * 1e6)}`): Record<string, unknown> {
  return {
    clientId: randomUUID(),
    number,
    newLine: { label: 'Unidentified 10-in clay pipe' },
    positionSource: 'grid',
    easting: 3000150,
    northing: 13800030,
    groundElevation: 100,
    depthToTop: 6.5,
    measuredSize: 0.833,
    material: 'Vitrified clay',
    direction: 'E-W',
  };
}

function post(f: Fixtures, body: Record<string, unknown>, role: Role = 'field') {
  return request(ctx.app).post(api(f, '/holes')).set('Cookie', ctx.cookie(role)).send(body);
}

async function linesNamed(f: Fixtures, label: string): Promise<UtilityLine[]> {
  return ctx.orm.em.fork().find(UtilityLine, { project: f.project.id, label });
}

describe('a field crew logs a hole on a line on no record', () => {
  it('when a field crew sends the hole with newLine, then 201, the line is unidentified, owner unknown, QL-A, sized and drawn through the hole, and both are in the activity log', async () => {
    const f = await makeFixtures(ctx);
    const body = newLineBody('TH-N1');
    const res = await post(f, body);
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    const hole = res.body as HoleDto;
    expect(hole.clientId).toBe(body.clientId);
    expect(hole.status).toBe('dug'); // a depth was logged

    const line = (await request(ctx.app).get(api(f, `/lines/${hole.lineId}`)).set('Cookie', ctx.cookie('viewer'))).body as LineDto;
    expect(line).toMatchObject({ label: 'Unidentified 10-in clay pipe', kind: 'unknown', owner: 'Unknown', status: 'unknown', qualityLevel: 'A', shape: 'round', diameter: 0.833, material: 'Vitrified clay', recordDepth: 6.5 });
    // E-W runs along azimuth 90°: the stub lies on the hole's northing, 5 m = 16.404 US ft each side.
    const half = 5 / (1200 / 3937);
    expect(line.path).toHaveLength(2);
    expect(line.path[0]![0]).toBeCloseTo(3000150 - half, 3);
    expect(line.path[1]![0]).toBeCloseTo(3000150 + half, 3);
    expect(line.path[0]![1]).toBeCloseTo(13800030, 3);
    expect(line.path[1]![1]).toBeCloseTo(13800030, 3);
    expect(line.notes).toMatch(/Found at test hole TH-N1/);

    const em = ctx.orm.em.fork();
    const lineLog = await em.find(ActivityEntry, { project: f.project.id, entity: 'line', entityId: line.id }, { populate: ['user'] });
    expect(lineLog.map((a) => [a.action, a.user?.role])).toEqual([['create', 'field']]);
    expect(lineLog[0]!.changes.qualityLevel).toEqual({ before: null, after: 'A' });
    const holeLog = (await request(ctx.app).get(api(f, `/holes/${hole.id}/activity`)).set('Cookie', ctx.cookie('viewer'))).body as ActivityDto[];
    expect(holeLog.map((a) => a.action)).toEqual(['create']);
    expect(holeLog[0]!.changes.lineId).toEqual({ before: null, after: line.id });
  });

  it('when the new line crosses the bore, then the clearance register has it at once (recomputed after the write)', async () => {
    const f = await makeFixtures(ctx);
    // Runs N-S through x = 3000150, across the bore (y = 13800000) at the bore's depth.
    const body = { ...newLineBody('TH-N2'), northing: 13800005, direction: 'N', groundElevation: 90, depthToTop: 5.5 };
    const res = await post(f, body);
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    const report = await request(ctx.app).get(api(f, '/clearances')).set('Cookie', ctx.cookie('viewer'));
    expect(report.status).toBe(200);
    expect(JSON.stringify(report.body)).toContain(`"lineId":${(res.body as HoleDto).lineId}`);
  });

  it('when a field crew sends the same line to POST /lines, then 403: only the hole create may add a line for them', async () => {
    const f = await makeFixtures(ctx);
    const res = await request(ctx.app)
      .post(api(f, '/lines'))
      .set('Cookie', ctx.cookie('field'))
      .send({ label: 'X', owner: 'Unknown', kind: 'unknown', shape: 'round', diameter: 1, status: 'unknown', qualityLevel: 'A', path: [[0, 0], [1, 1]], recordDepth: 1 });
    expect(res.status).toBe(403);
  });

  it('when the same hole with newLine is sent again, one after another and then at once, then one hole and one line, and the replays answer 200 with the same hole', async () => {
    const f = await makeFixtures(ctx);
    const body = newLineBody('TH-N3');
    const first = await post(f, body);
    expect(first.status).toBe(201);
    const again = await post(f, body);
    expect(again.status).toBe(200);
    expect(again.body.id).toBe(first.body.id);
    const together = await Promise.all([1, 2, 3].map(() => post(f, body)));
    for (const r of together) {
      expect(r.status).toBe(200);
      expect(r.body.id).toBe(first.body.id);
    }
    expect(await ctx.orm.em.fork().count(TestHole, { project: f.project.id, clientId: body.clientId as string })).toBe(1);
    expect(await linesNamed(f, 'Unidentified 10-in clay pipe')).toHaveLength(1);
  });

  it('when the first sends of a hole with newLine arrive at once (no record yet), then one hole and one line, and every answer is that hole', async () => {
    const f = await makeFixtures(ctx);
    const body = newLineBody('TH-N4');
    const before = await tableCounts(ctx.orm);
    const answers = await Promise.all([1, 2, 3, 4].map(() => post(f, body)));
    const ids = new Set(answers.map((r) => r.body.id as number));
    expect(answers.map((r) => r.status).sort()).toEqual([200, 200, 200, 201]);
    expect(ids.size).toBe(1);
    const after = await tableCounts(ctx.orm);
    expect(after.test_holes! - before.test_holes!).toBe(1);
    expect(after.utility_lines! - before.utility_lines!).toBe(1);
    expect(await linesNamed(f, 'Unidentified 10-in clay pipe')).toHaveLength(1);
  });
});

describe('refused creates write nothing', () => {
  it('when a body carries both lineId and newLine, then 400 naming newLine', async () => {
    const f = await makeFixtures(ctx);
    const before = await tableCounts(ctx.orm);
    const res = await post(f, { ...newLineBody(), lineId: f.line.id });
    expect(res.status).toBe(400);
    expect(res.body.errors).toEqual([expect.objectContaining({ path: 'newLine' })]);
    expect(await tableCounts(ctx.orm)).toEqual(before);
  });

  it('when a body carries neither lineId nor newLine, then 400 naming lineId', async () => {
    const f = await makeFixtures(ctx);
    const { newLine: _n, ...body } = newLineBody();
    const before = await tableCounts(ctx.orm);
    const res = await post(f, body);
    expect(res.status).toBe(400);
    expect(res.body.errors).toEqual([expect.objectContaining({ path: 'lineId' })]);
    expect(await tableCounts(ctx.orm)).toEqual(before);
  });

  it('when a new line has no readable direction, depth or size, then 400 naming each and nothing is made', async () => {
    const f = await makeFixtures(ctx);
    const before = await tableCounts(ctx.orm);
    const res = await post(f, { ...newLineBody(), direction: 'along the fence', depthToTop: null, measuredSize: null });
    expect(res.status).toBe(400);
    expect((res.body.errors as { path: string }[]).map((e) => e.path).sort()).toEqual(['depthToTop', 'direction', 'measuredSize']);
    expect(await tableCounts(ctx.orm)).toEqual(before);
  });

  it('when a viewer sends a hole with newLine, then 403 and nothing is made', async () => {
    const f = await makeFixtures(ctx);
    const before = await tableCounts(ctx.orm);
    const res = await post(f, newLineBody(), 'viewer');
    expect(res.status).toBe(403);
    expect(await tableCounts(ctx.orm)).toEqual(before);
  });

  it('when the hole cannot be placed (station off the bore), then 400 and no line is left behind', async () => {
    const f = await makeFixtures(ctx);
    const before = await tableCounts(ctx.orm);
    const { easting: _e, northing: _n, ...rest } = newLineBody();
    const res = await post(f, { ...rest, positionSource: 'station', boreId: 999999, station: 1100, offset: 0 });
    expect(res.status).toBe(400);
    expect(await tableCounts(ctx.orm)).toEqual(before);
  });
});

describe('photos sent with a client id', () => {
  async function png(): Promise<Buffer> {
    return plainPng(24, 16);
  }

  function upload(f: Fixtures, clientIds: string[], files: Buffer[]) {
    let r = request(ctx.app).post(api(f, `/holes/${f.hole.id}/photos`)).set('Cookie', ctx.cookie('field'));
    for (const id of clientIds) r = r.field('clientId', id);
    files.forEach((data, i) => {
      r = r.attach('photos', data, { filename: `p${i}.png`, contentType: 'image/png' });
    });
    return r;
  }

  async function stored(f: Fixtures): Promise<string[]> {
    await thumbnails.idle();
    return ctx.storage.list(`photos/${f.project.id}/`);
  }

  it('when the same photo is uploaded twice with its client id, then one photo row and one set of files, and the resend answers 200 with the kept photo', async () => {
    const f = await makeFixtures(ctx);
    const id = randomUUID();
    const data = await png();
    const first = await upload(f, [id], [data]);
    expect(first.status, JSON.stringify(first.body)).toBe(201);
    const kept = (first.body as PhotoDto[])[0]!;
    expect(kept.clientId).toBe(id);
    const files = await stored(f);
    const again = await upload(f, [id], [data]);
    expect(again.status).toBe(200);
    expect((again.body as PhotoDto[]).map((p) => p.id)).toEqual([kept.id]);
    expect(await ctx.orm.em.fork().count(Photo, { hole: f.hole.id, clientId: id })).toBe(1);
    expect(await stored(f)).toEqual(files);
    // The upload's activity entry was written once.
    const log = await ctx.orm.em.fork().find(ActivityEntry, { entity: 'hole', entityId: f.hole.id, action: 'photo-add' });
    expect(log).toHaveLength(1);
  });

  it('when the same photo is uploaded three times at once, then one photo row and one set of files, every answer names that photo', async () => {
    const f = await makeFixtures(ctx);
    const id = randomUUID();
    const data = await png();
    const keysBefore = await stored(f);
    const answers = await Promise.all([1, 2, 3].map(() => upload(f, [id], [data])));
    for (const r of answers) expect([200, 201], JSON.stringify(r.body)).toContain(r.status);
    expect(answers.filter((r) => r.status === 201)).toHaveLength(1);
    const ids = new Set(answers.map((r) => (r.body as PhotoDto[])[0]!.id));
    expect(ids.size).toBe(1);
    expect(await ctx.orm.em.fork().count(Photo, { hole: f.hole.id, clientId: id })).toBe(1);
    // One original and its thumbnail (a small PNG needs no separate upright copy).
    expect((await stored(f)).filter((k) => !keysBefore.includes(k))).toHaveLength(2);
  });

  it('when an upload mixes a kept photo and a new one, then only the new one is stored and the answer lists both in order', async () => {
    const f = await makeFixtures(ctx);
    const a = randomUUID();
    const b = randomUUID();
    const first = await upload(f, [a], [await png()]);
    expect(first.status).toBe(201);
    const mixed = await upload(f, [a, b], [await png(), await png()]);
    expect(mixed.status).toBe(201);
    expect((mixed.body as PhotoDto[]).map((p) => p.clientId)).toEqual([a, b]);
    expect((mixed.body as PhotoDto[])[0]!.id).toBe((first.body as PhotoDto[])[0]!.id);
    expect(await ctx.orm.em.fork().count(Photo, { hole: f.hole.id, clientId: { $in: [a, b] } })).toBe(2);
  });

  it('when the same client id is used on another hole, then it is a different photo there', async () => {
    const f = await makeFixtures(ctx);
    const other = (await post(f, { ...newLineBody('TH-N9') })).body as HoleDto;
    const id = randomUUID();
    await upload(f, [id], [await png()]).expect(201);
    const there = await request(ctx.app)
      .post(api(f, `/holes/${other.id}/photos`))
      .set('Cookie', ctx.cookie('field'))
      .field('clientId', id)
      .attach('photos', await png(), { filename: 'p.png', contentType: 'image/png' });
    expect(there.status).toBe(201);
    expect(await ctx.orm.em.fork().count(Photo, { clientId: id })).toBe(2);
  });

  it('when photos are uploaded without a client id, then each upload is stored (the office path), as before', async () => {
    const f = await makeFixtures(ctx);
    const data = await png();
    await upload(f, [], [data]).expect(201);
    await upload(f, [], [data]).expect(201);
    expect(await ctx.orm.em.fork().count(Photo, { hole: f.hole.id, clientId: null })).toBe(3); // with the fixture's photo
  });

  it('when the client ids do not match the files (count, duplicates, not a UUID), then 400 naming clientId and nothing is stored', async () => {
    const f = await makeFixtures(ctx);
    const before = { rows: await tableCounts(ctx.orm), keys: await stored(f) };
    const id = randomUUID();
    for (const [ids, files] of [
      [[id, randomUUID()], [await png()]],
      [[id, id], [await png(), await png()]],
      [['not-a-uuid'], [await png()]],
    ] as const) {
      const res = await upload(f, [...ids], [...files]);
      expect(res.status).toBe(400);
      expect((res.body.errors as { path: string }[]).some((e) => e.path.startsWith('clientId'))).toBe(true);
    }
    expect({ rows: await tableCounts(ctx.orm), keys: await stored(f) }).toEqual(before);
  });
});
