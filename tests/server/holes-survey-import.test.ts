/**
 * The surveyor's point file (SPEC §6: CSV with `point, northing, easting, elevation,
 * description`): shots matched to test holes by number (and line label when one excavation
 * exposed several lines), a preview that writes nothing, and an all-or-nothing commit whose
 * surveyed tops win over ground − depth in the clearance engine.
 */
import { randomUUID } from 'node:crypto';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { HoleDto, SurveyImportResultDto } from '@shared/api';
import { ActivityEntry, Conflict, Project, TestHole, User, UtilityLine } from '@server/entities';
import { makeFixtures, makeTestApp, tableCounts, type Fixtures, type TestContext } from './helpers';

let ctx: TestContext;
beforeAll(async () => {
  ctx = await makeTestApp();
});
afterAll(() => ctx.close());

interface Scene {
  f: Fixtures;
  th2water: number;
  th2gas: number;
  th3: number;
}

/**
 * The fixture project (TH-1 on water line W-1, dug: ground 100, depth 14 US ft) plus TH-2, one
 * excavation exposing W-1 and gas line G-1 (two records sharing the number), and TH-3, reviewed.
 */
async function scene(): Promise<Scene> {
  const f = await makeFixtures(ctx);
  const em = ctx.orm.em.fork();
  const project = f.project;
  const water = await em.findOneOrFail(UtilityLine, f.line.id);
  const gas = new UtilityLine(em.getReference(Project, project.id), 'G-1', 'Test gas company', 'gas', [
    [3000000, 13800040],
    [3000250, 13800040],
  ]);
  gas.diameter = 0.5;
  em.persist(gas);
  const mk = (line: UtilityLine, number: string, status: TestHole['status'], e: number, n: number) => {
    const h = new TestHole(em.getReference(Project, project.id), line, randomUUID(), number, e, n);
    h.status = status;
    h.groundElevation = 100;
    h.depthToTop = 9;
    h.createdBy = em.getReference(User, ctx.users.field.id);
    em.persist(h);
    return h;
  };
  const a = mk(water, 'TH-2', 'dug', 3000100, 13800040);
  const b = mk(gas, 'TH-2', 'dug', 3000100, 13800040);
  const c = mk(water, 'TH-3', 'reviewed', 3000100, 13800060);
  await em.flush();
  return { f, th2water: a.id, th2gas: b.id, th3: c.id };
}

const CSV_MIXED = [
  'Point,NORTHING,Easting,Elevation,Description,Code', // row 1: header (any case, extra column)
  'TH-1,13800010.12,3000100.05,86.40,TOP,PIPE', // row 2: match, top of W-1
  'TH-1,,,100.20,gnd,', // row 3: match, ground
  'TH-2,13800040.00,3000101.00,90.10,TOP G-1,', // row 4: match by label
  'TH-2,13800040.00,3000101.00,91.00,TOP,', // row 5: ambiguous (two lines)
  'TH-9,13800000,3000000,90,TOP,', // row 6: no such hole
  'TH-3,13800060,3000100,88,TOP,', // row 7: reviewed, locked
  'TH-1,13800010,3000100,8x6,TOP W-1,', // row 8: elevation not a number
  'TH-1,29.7601,-95.3701,86,TOP,', // row 9: latitude/longitude, not grid
  'TH-2,13800040,3000101,90.0,TOP X-9,', // row 10: no line with that label
].join('\n');

const CSV_GOOD = CSV_MIXED.split('\n').slice(0, 4).join('\r\n');

function post(f: Fixtures, what: 'preview' | 'commit', csv: string, role: 'surveyor' | 'admin' | 'field' | 'designer' = 'surveyor') {
  return request(ctx.app).post(`/api/projects/${f.project.id}/survey-imports/${what}`).set('Cookie', ctx.cookie(role)).send({ csv, fileName: 'pothole-shots-1103.csv' });
}

async function hole(f: Fixtures, id: number): Promise<HoleDto> {
  return (await request(ctx.app).get(`/api/projects/${f.project.id}/holes/${id}`).set('Cookie', ctx.cookie('viewer'))).body as HoleDto;
}

describe('survey import preview', () => {
  it('reports matches with their changes, and each kind of mismatch with its row number, and writes nothing', async () => {
    const s = await scene();
    const before = await tableCounts(ctx.orm);
    const res = await post(s.f, 'preview', CSV_MIXED);
    expect(res.status, JSON.stringify(res.body)).toBe(200);
    const body = res.body as SurveyImportResultDto;
    expect(body.rows.map((r) => [r.row, r.outcome])).toEqual([
      [2, 'match'],
      [3, 'match'],
      [4, 'match'],
      [5, 'ambiguous'],
      [6, 'no_hole'],
      [7, 'locked'],
      [8, 'invalid'],
      [9, 'invalid'],
      [10, 'no_hole'],
    ]);
    expect(body).toMatchObject({ matched: 3, problems: 6, holesChanged: 2, committed: false });
    const [top, ground, byLabel] = body.rows;
    expect(top).toMatchObject({ shot: 'top', holeId: s.f.hole.id, holeNumber: 'TH-1', lineLabel: 'W-1', northing: 13800010.12, easting: 3000100.05, elevation: 86.4 });
    expect(top!.changes).toEqual({
      surveyedTopElevation: { before: null, after: 86.4 },
      surveyedEasting: { before: null, after: 3000100.05 },
      surveyedNorthing: { before: null, after: 13800010.12 },
    });
    expect(ground).toMatchObject({ shot: 'ground', holeId: s.f.hole.id, changes: { surveyedGroundElevation: { before: null, after: 100.2 } } });
    expect(byLabel).toMatchObject({ holeId: s.th2gas, lineLabel: 'G-1' });
    expect(body.rows[3]!.message).toMatch(/W-1, G-1.*TOP W-1/);
    expect(body.rows[5]!.message).toMatch(/reviewed and locked/);
    expect(body.rows[6]!.message).toMatch(/elevation "8x6" is not a number/);
    expect(body.rows[7]!.message).toMatch(/look like latitude and longitude.*EPSG:2278 grid, US survey feet/);
    expect(body.rows[8]!.message).toMatch(/no line labelled "X-9"/);
    expect(await tableCounts(ctx.orm)).toEqual(before);
    expect((await hole(s.f, s.f.hole.id)).surveyedTopElevation).toBeNull();
  });

  it('when a column is missing, then 400 naming it; a header with no shots is refused too', async () => {
    const s = await scene();
    const missing = await post(s.f, 'preview', 'point,northing,easting,elev,description\nTH-1,1,2,3,TOP');
    expect(missing.status).toBe(400);
    expect(missing.body.detail).toMatch(/"elevation"/);
    expect(missing.body.errors).toEqual([{ path: 'csv', message: expect.stringContaining('missing column "elevation"') }]);
    const empty = await post(s.f, 'preview', 'point,northing,easting,elevation,description\n\n');
    expect(empty.status).toBe(400);
    expect(empty.body.code).toBe('no_shots');
    const noBody = await post(s.f, 'preview', '');
    expect(noBody.status).toBe(400);
    expect(noBody.body.errors[0].path).toBe('csv');
  });

  it('only the surveyor (and admin) may import', async () => {
    const s = await scene();
    expect((await post(s.f, 'preview', CSV_GOOD, 'field')).status).toBe(403);
    expect((await post(s.f, 'commit', CSV_GOOD, 'designer')).status).toBe(403);
    expect((await post(s.f, 'preview', CSV_GOOD, 'admin')).status).toBe(200);
  });
});

describe('survey import commit', () => {
  it('when any row is not a match, then 400 with an error per bad row and nothing is written', async () => {
    const s = await scene();
    const before = await tableCounts(ctx.orm);
    const res = await post(s.f, 'commit', CSV_MIXED);
    expect(res.status).toBe(400);
    expect(res.body.code).toBe('import_refused');
    expect(res.body.detail).toBe('6 of 9 rows cannot be imported; nothing was written.');
    expect(res.body.errors.map((e: { path: string }) => e.path)).toEqual(['row 5', 'row 6', 'row 7', 'row 8', 'row 9', 'row 10']);
    expect(res.body.errors[3].message).toMatch(/^invalid: elevation "8x6"/);
    expect(await tableCounts(ctx.orm)).toEqual(before);
    const th1 = await hole(s.f, s.f.hole.id);
    expect(th1).toMatchObject({ status: 'dug', surveyedTopElevation: null, version: s.f.hole.version });
  });

  it('row numbers count the header as row 1 and blank lines in between', async () => {
    const s = await scene();
    const res = await post(s.f, 'commit', 'point,northing,easting,elevation,description\nTH-1,13800010,3000100,86.4,TOP\n\nTH-7,13800010,3000100,86.4,TOP\n');
    expect(res.status).toBe(400);
    expect(res.body.errors).toEqual([{ path: 'row 4', message: 'no hole: no test hole numbered TH-7 in this project' }]);
  });

  it('when every row matches, one transaction updates the holes, marks them surveyed, logs each, and the clearance uses the surveyed top', async () => {
    const s = await scene();
    const em = ctx.orm.em.fork();
    expect((await em.findOneOrFail(Conflict, { project: s.f.project.id, line: s.f.line.id })).figures.lineTop).toBe(86); // ground 100 − depth 14
    const res = await post(s.f, 'commit', CSV_GOOD);
    expect(res.status, JSON.stringify(res.body)).toBe(200);
    expect(res.body).toMatchObject({ matched: 3, problems: 0, holesChanged: 2, committed: true });

    const th1 = await hole(s.f, s.f.hole.id);
    expect(th1).toMatchObject({ status: 'surveyed', surveyedTopElevation: 86.4, surveyedEasting: 3000100.05, surveyedNorthing: 13800010.12, surveyedGroundElevation: 100.2, version: s.f.hole.version + 1 });
    expect(await hole(s.f, s.th2gas)).toMatchObject({ status: 'surveyed', surveyedTopElevation: 90.1 });
    // A hole the file does not change keeps its version (a crew's open edit of it is not made stale).
    expect(await hole(s.f, s.th2water)).toMatchObject({ status: 'dug', surveyedTopElevation: null, version: 1 });

    const entries = await ctx.orm.em.fork().find(ActivityEntry, { project: s.f.project.id, action: 'survey-import' }, { orderBy: { entityId: 'asc' } });
    expect(entries.map((e) => e.entityId)).toEqual([s.f.hole.id, s.th2gas]);
    expect(entries[0]!.changes.status).toEqual({ before: 'dug', after: 'surveyed' });
    expect(entries[0]!.changes.surveyedTopElevation).toEqual({ before: null, after: 86.4 });
    expect(entries[0]!.changes.importFile).toEqual({ before: null, after: 'pothole-shots-1103.csv' });

    // Surveyed values win over ground − depth (SPEC §4.4): the conflict's line top is now 86.40.
    const conflict = await ctx.orm.em.fork().findOneOrFail(Conflict, { project: s.f.project.id, line: s.f.line.id });
    expect(conflict.figures.lineTop).toBeCloseTo(86.4, 9);

    // The same file again changes nothing and logs nothing.
    const again = await post(s.f, 'commit', CSV_GOOD);
    expect(again.body).toMatchObject({ matched: 3, holesChanged: 0, committed: true });
    expect(again.body.rows[0].message).toMatch(/no change/);
    expect(await ctx.orm.em.fork().count(ActivityEntry, { project: s.f.project.id, action: 'survey-import' })).toBe(2);
  });

  it('a second TOP shot for the same hole in one file is refused with the row of the first', async () => {
    const s = await scene();
    const res = await post(s.f, 'commit', 'point,northing,easting,elevation,description\nTH-1,13800010,3000100,86.4,TOP\nTH-1,13800010,3000100,86.5,TOP');
    expect(res.status).toBe(400);
    expect(res.body.errors).toEqual([{ path: 'row 3', message: 'invalid: test hole TH-1 (W-1) already has a TOP shot in row 2' }]);
  });
});
