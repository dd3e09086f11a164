import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import type { ClearancesDto, StakeMarkDto, StakeoutDto, StakePointDto } from '@shared/api';
import { Bore, TestHole, UtilityLine } from '@server/entities';
import { recomputeConflicts } from '@server/modules/clearances/clearance.service';
import { stakePointName } from '@server/modules/stakeout/stakeout.service';
import { makeFixtures, makeTestApp, type Fixtures, type TestContext } from './helpers';

let ctx: TestContext;
beforeAll(async () => {
  ctx = await makeTestApp();
});
afterAll(() => ctx.close());

type Role = Parameters<TestContext['cookie']>[0];
const get = (url: string, role: Role = 'viewer') => request(ctx.app).get(url).set('Cookie', ctx.cookie(role));
const post = (url: string, body: object, role: Role = 'surveyor') => request(ctx.app).post(url).set('Cookie', ctx.cookie(role)).send(body);

describe('the stake-out list of the fixture, worked by hand', () => {
  let f: Fixtures;
  let list: StakeoutDto;
  let clearances: ClearancesDto;
  beforeAll(async () => {
    f = await makeFixtures(ctx);
    // Give the bore a ground profile (100.00 at 10+00 falling to 98.00 at 12+50) and add a gas
    // line G-1 with no test hole crossing at E 3,000,200, so it needs a suggested hole.
    const em = ctx.orm.em.fork();
    const bore = await em.findOneOrFail(Bore, f.bore.id);
    bore.groundProfile = [
      { station: 1000, elevation: 100 },
      { station: 1250, elevation: 98 },
    ];
    const gas = new UtilityLine(bore.project, 'G-1', 'Test gas company', 'gas', [
      [3000200, 13799900],
      [3000200, 13800100],
    ]);
    gas.diameter = 0.5;
    gas.recordDepth = 4;
    em.persist(gas);
    await em.flush();
    await recomputeConflicts(em, bore.project, null);
    await em.flush();
    list = (await get(`/api/projects/${f.project.id}/stakeout`)).body as StakeoutDto;
    clearances = (await get(`/api/projects/${f.project.id}/clearances`)).body as ClearancesDto;
  });

  const point = (key: string): StakePointDto => {
    const p = list.points.find((x) => x.key === key);
    if (!p) throw new Error(`no point ${key} in ${list.points.map((x) => x.key).join(', ')}`);
    return p;
  };

  it('carries the project frame: grid, unit and vertical datum', () => {
    expect(list).toMatchObject({ crsCode: 'EPSG:2278', unit: 'usft', verticalDatum: 'NAVD 88', stationStyle: '100' });
  });

  it('lists the confirmed crossing of W-1 at 11+00, E 3,000,100, N 13,800,000, top of line 86.00', () => {
    // Hand-worked: the bore runs due east along N 13,800,000 from E 3,000,000 (10+00); W-1 runs
    // north along E 3,000,100, so it crosses at E 3,000,100 / N 13,800,000, station 11+00, on the
    // alignment (offset 0). TH-1 (10 ft north, within the 10 ft verification distance) gives top
    // 100.0 − 14.0 = 86.00, held flat to the crossing.
    const p = point(`crossing:${f.bore.id}:${f.line.id}`);
    expect(p.kind).toBe('crossing');
    expect(p.easting).toBeCloseTo(3000100, 6);
    expect(p.northing).toBeCloseTo(13800000, 6);
    expect(p.station).toBeCloseTo(1100, 6);
    expect(p.offset).toBeCloseTo(0, 6);
    expect(p.elevation).toBeCloseTo(86, 6);
    expect(p.elevationRef).toBe('line_top');
    expect(p.holes).toEqual(['TH-1']);
    expect(p.name).toBe(`X${f.bore.id}-${f.line.id}`);
    // …and it is the point the clearance report gives for that crossing.
    const line = clearances.report.bores[0]!.lines.find((l) => l.lineId === f.line.id)!;
    const q = line.points.find((x) => x.kind === 'crossing')!;
    expect([p.easting, p.northing, p.station, p.elevation]).toEqual([q.easting, q.northing, q.station, q.lineTop]);
  });

  it('lists a suggested test hole where G-1 crosses unverified: 12+00, ground 98.40 from the profile', () => {
    // Station 10+00 + 200 = 12+00; ground 100 − 2 × 200/250 = 98.40 (linear between profile points).
    const p = point(`suggested:${f.bore.id}:${list.points.find((x) => x.lineLabel === 'G-1')!.lineId}:crossing`);
    expect(p.kind).toBe('suggested_hole');
    expect(p.easting).toBeCloseTo(3000200, 6);
    expect(p.northing).toBeCloseTo(13800000, 6);
    expect(p.station).toBeCloseTo(1200, 6);
    expect(p.elevation).toBeCloseTo(98.4, 6);
    expect(p.elevationRef).toBe('ground');
    const suggested = clearances.report.bores[0]!.suggestedHoles;
    expect(suggested.map((s) => [s.easting, s.northing])).toEqual([[p.easting, p.northing]]);
    // G-1 is not verified, so it has no confirmed crossing point.
    expect(list.points.filter((x) => x.kind === 'crossing').map((x) => x.lineLabel)).toEqual(['W-1']);
  });

  it('lists the four launch-pit corners with station, offset and side, at the pit bottom 80.00', () => {
    // Footprint E 2,999,980–3,000,000 × N 13,799,990–13,800,010. Looking up-station (east), south
    // is right: N 13,799,990 → 10 R, N 13,800,010 → 10 L. E 3,000,000 is 10+00; E 2,999,980 lies
    // 20 ft before the start, station 9+80 on the extended first segment.
    const corners = [1, 2, 3, 4].map((i) => point(`pit:${f.pit.id}:${i}`));
    expect(corners.map((c) => [c.easting, c.northing])).toEqual([
      [2999980, 13799990],
      [3000000, 13799990],
      [3000000, 13800010],
      [2999980, 13800010],
    ]);
    expect(corners.map((c) => Math.round(c.station * 1000) / 1000)).toEqual([980, 1000, 1000, 980]);
    expect(corners.map((c) => `${Math.round(c.offset * 1000) / 1000} ${c.side}`)).toEqual(['10 R', '10 R', '10 L', '10 L']);
    expect(corners.map((c) => c.beyond)).toEqual(['start', null, null, 'start']);
    for (const c of corners) {
      expect(c.elevation).toBe(80);
      expect(c.elevationRef).toBe('pit_bottom');
    }
    expect(list.points).toHaveLength(1 + 1 + 4);
  });

  it('names every point from its key, as the point file and DXF do: X<bore>-<line>, SH<bore>-<line>, P<pit>-<corner>, all different', () => {
    const gas = list.points.find((x) => x.lineLabel === 'G-1')!.lineId!;
    expect(list.points.map((p) => p.name)).toEqual([`X${f.bore.id}-${f.line.id}`, `SH${f.bore.id}-${gas}`, ...[1, 2, 3, 4].map((c) => `P${f.pit.id}-${c}`)]);
    expect(list.points.map((p) => p.name)).toEqual(list.points.map((p) => stakePointName(p.key)));
    expect(point(`pit:${f.pit.id}:1`).description).toBe('Pit corner 1 of 4 launch pit of Bore 1; pit bottom 80.00 US ft');
  });

  it('when filtered by another bore, then the list is empty; a bad bore id names the parameter', async () => {
    expect(((await get(`/api/projects/${f.project.id}/stakeout?boreId=999999`)).body as StakeoutDto).points).toEqual([]);
    const bad = await get(`/api/projects/${f.project.id}/stakeout?boreId=abc`);
    expect(bad.status).toBe(400);
    expect(bad.body.errors[0].path).toBe('query.boreId');
  });
});

describe('stakePointName', () => {
  it('gives each form of key its own name, a later crossing or nearest-point hole its own suffix', () => {
    const keys = ['crossing:1:2', 'crossing:1:2:2', 'crossing:12:3', 'suggested:1:2:crossing', 'suggested:1:2:crossing:2', 'suggested:1:2:closest_point', 'suggested:1:2:closest_point:2', 'pit:1:2', 'pit:12:3'];
    const names = keys.map(stakePointName);
    expect(names).toEqual(['X1-2', 'X1-2-2', 'X12-3', 'SH1-2', 'SH1-2-2', 'SH1-2N', 'SH1-2N-2', 'P1-2', 'P12-3']);
    expect(new Set(names).size).toBe(keys.length);
    // Five-digit ids still fit a 16-character point name (common practice for data collectors).
    expect(stakePointName('suggested:99999:99999:closest_point:2')).toHaveLength(16);
    expect(() => stakePointName('hole:1')).toThrow();
  });
});

describe('marking points staked', () => {
  let f: Fixtures;
  let key: string;
  beforeAll(async () => {
    f = await makeFixtures(ctx);
    key = `crossing:${f.bore.id}:${f.line.id}`;
  });

  it('when the surveyor marks the crossing staked, then the list shows when and by whom', async () => {
    const stakedAt = new Date(Math.floor(Date.now() / 60_000) * 60_000 - 2 * 86_400_000).toISOString(); // two days ago
    const res = await post(`/api/projects/${f.project.id}/stakeout/marks`, { key, stakedAt, note: 'Lath and paint, offset 5 ft N' });
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    const mark = res.body as StakeMarkDto;
    expect(mark).toMatchObject({ key, kind: 'crossing', stakedAt, stakedByName: 'Test surveyor', note: 'Lath and paint, offset 5 ft N' });
    const p = ((await get(`/api/projects/${f.project.id}/stakeout`)).body as StakeoutDto).points.find((x) => x.key === key)!;
    expect(p.mark?.id).toBe(mark.id);
    expect(p.mark?.stakedByName).toBe('Test surveyor');
    expect(p.movedSinceStaked).toBe(0);
  });

  it('when a crew or reviewer tries to mark, then 403; an unknown key or future time gives 400 on the field', async () => {
    for (const role of ['field', 'viewer', 'designer', 'manager'] as const) expect((await post(`/api/projects/${f.project.id}/stakeout/marks`, { key }, role)).status).toBe(403);
    const unknown = await post(`/api/projects/${f.project.id}/stakeout/marks`, { key: 'crossing:1:999999' });
    expect(unknown.status).toBe(400);
    expect(unknown.body.errors[0].path).toBe('key');
    const future = await post(`/api/projects/${f.project.id}/stakeout/marks`, { key, stakedAt: '2999-01-01T00:00:00Z' });
    expect(future.status).toBe(400);
    expect(future.body.errors[0].path).toBe('stakedAt');
  });

  it('when the line is found 2 ft further east after staking, then the point shows it moved 2.00 ft; staking again resets it', async () => {
    // The line and its test hole are redrawn 2 ft east (say after a survey correction).
    const em = ctx.orm.em.fork();
    const line = await em.findOneOrFail(UtilityLine, f.line.id);
    line.path = [
      [3000102, 13799900],
      [3000102, 13800100],
    ];
    const hole = await em.findOneOrFail(TestHole, f.hole.id);
    hole.easting = 3000102;
    await em.flush();
    await recomputeConflicts(em, line.project, null);
    await em.flush();
    let p = ((await get(`/api/projects/${f.project.id}/stakeout`)).body as StakeoutDto).points.find((x) => x.key === key)!;
    expect(p.easting).toBeCloseTo(3000102, 6);
    expect(p.movedSinceStaked).toBeCloseTo(2, 6);
    const again = await post(`/api/projects/${f.project.id}/stakeout/marks`, { key });
    expect(again.status).toBe(200);
    p = ((await get(`/api/projects/${f.project.id}/stakeout`)).body as StakeoutDto).points.find((x) => x.key === key)!;
    expect(p.movedSinceStaked).toBe(0);
  });

  it('when the mark is removed, then the point is unstaked; a mark of another project is not found', async () => {
    const p = ((await get(`/api/projects/${f.project.id}/stakeout`)).body as StakeoutDto).points.find((x) => x.key === key)!;
    const other = await makeFixtures(ctx);
    expect((await request(ctx.app).delete(`/api/projects/${other.project.id}/stakeout/marks/${p.mark!.id}`).set('Cookie', ctx.cookie('surveyor'))).status).toBe(404);
    expect((await request(ctx.app).delete(`/api/projects/${f.project.id}/stakeout/marks/${p.mark!.id}`).set('Cookie', ctx.cookie('surveyor'))).status).toBe(204);
    const after = ((await get(`/api/projects/${f.project.id}/stakeout`)).body as StakeoutDto).points.find((x) => x.key === key)!;
    expect(after.mark).toBeNull();
    expect(after.movedSinceStaked).toBeNull();
  });
});

describe('a staked point whose line goes', () => {
  it('when the line is moved off the bore after staking, then its mark is listed as no longer on the list', async () => {
    // (A line with test holes can no longer be deleted (409 in_use), so the crossing goes away by
    // moving the line: 500 ft north of the bore it no longer crosses it.)
    const f = await makeFixtures(ctx);
    const key = `crossing:${f.bore.id}:${f.line.id}`;
    expect((await post(`/api/projects/${f.project.id}/stakeout/marks`, { key })).status).toBe(201);
    const line = (await get(`/api/projects/${f.project.id}/lines/${f.line.id}`)).body as { version: number };
    const moved = await request(ctx.app)
      .patch(`/api/projects/${f.project.id}/lines/${f.line.id}`)
      .set('Cookie', ctx.cookie('designer'))
      .send({ path: [[3000100, 13800500], [3000100, 13800700]], version: line.version });
    expect(moved.status).toBe(200);
    const list = (await get(`/api/projects/${f.project.id}/stakeout`)).body as StakeoutDto;
    expect(list.points.find((p) => p.key === key)).toBeUndefined();
    expect(list.orphanMarks.map((m) => m.key)).toEqual([key]);
  });
});
