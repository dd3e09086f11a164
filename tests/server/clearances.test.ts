import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import type { ClearancesDto, ConflictDto, ConflictEventDto } from '@shared/api';
import { seedDemo } from '@server/seed/seeder';
import { DEMO_SCENARIOS } from '../../seeds/demo';
import { verifyScenario } from '../../seeds/demo/verify';
import { DEMO_USERS } from '../../seeds/demo';
import { makeFixtures, makeTestApp, type Fixtures, type TestContext } from './helpers';

let ctx: TestContext;
beforeAll(async () => {
  ctx = await makeTestApp();
  await seedDemo(ctx.orm.em, ctx.storage, { photos: false });
});
afterAll(() => ctx.close());

const get = (url: string, role: Parameters<TestContext['cookie']>[0] = 'viewer') => request(ctx.app).get(url).set('Cookie', ctx.cookie(role));

async function projectIdByName(name: string): Promise<number> {
  const res = await get('/api/projects', 'admin');
  return res.body.find((p: { name: string }) => p.name === name).id;
}

describe('clearances of the fixture crossing, worked by hand', () => {
  let f: Fixtures;
  beforeAll(async () => {
    f = await makeFixtures(ctx);
  });

  it('when a water line rests on the casing, then the report gives the hand-worked figures and its basis', async () => {
    // Working (US survey feet): the bore runs due east from E 3,000,000 (station 10+00) to
    // E 3,000,250 (12+50), centreline 85.00 falling to 84.00. The line crosses at E 3,000,100:
    // station 10+00 + 100 = 11+00, centreline 85 − 1 × 100/250 = 84.60, casing top 84.60 + 1.5 = 86.10.
    // TH-1 (ground 100.0, depth to top 14.0) gives top 86.00; 1.0 ft pipe → bottom 85.00, centre
    // 85.50, above the casing centreline. Vertical clearance = 85.00 − 86.10 = −1.10 → overlap.
    // Square crossing: skew 0. Requirement: project rule for water, 1.5 ft vertical.
    const res = await get(`/api/projects/${f.project.id}/clearances`);
    expect(res.status).toBe(200);
    const body = res.body as ClearancesDto;
    expect(body.unit).toBe('usft');
    expect(body.verticalDatum).toBe('NAVD 88');
    const line = body.report.bores[0]!.lines.find((l) => l.lineId === f.line.id)!;
    const point = line.points[line.governingPoint]!;
    expect(line.relation).toBe('crossing');
    expect(point.station).toBeCloseTo(1100, 6);
    expect(point.skew).toBeCloseTo(0, 6);
    expect(point.boreCentreline).toBeCloseTo(84.6, 6);
    expect(point.lineTop).toBeCloseTo(86, 6);
    expect(point.position).toBe('above');
    expect(point.verticalClearance).toBeCloseTo(-1.1, 6);
    expect(line.required).toBe(1.5);
    expect(line.requiredSource).toBe('rule');
    expect(line.status).toBe('overlap');
    expect(point.elevation).toMatchObject({ source: 'holes' });
    expect(point.verifyingHoles.map((h) => h.number)).toEqual(['TH-1']);
  });
});

describe('the demo scenario against a second, independent implementation', () => {
  // seeds/demo/verify.ts recomputes each demo line's clearance with its own plain planar
  // arithmetic (seeds/demo/plan.ts), written apart from shared/geometry. Both must agree.
  for (const scenario of DEMO_SCENARIOS) {
    it(`when ${scenario.key} is seeded, then every line's status and clearance agree`, async () => {
      const id = await projectIdByName(scenario.project.name);
      const body = (await get(`/api/projects/${id}/clearances`, 'admin')).body as ClearancesDto;
      const independent = verifyScenario(scenario, DEMO_USERS);
      const byLabel = new Map(body.report.bores.flatMap((b) => b.lines).map((l) => [l.label, l]));
      for (const expected of independent.clearances) {
        const actual = byLabel.get(expected.label);
        if (!actual) {
          // The engine reports only lines near enough to matter (see shared/geometry/engine.ts):
          // a line it leaves out must be a far, clear, non-crossing one.
          expect(expected.relation, expected.label).toBe('parallel');
          expect(expected.status, expected.label).toBe('clear');
          expect(expected.clearance, expected.label).toBeGreaterThan(expected.required * 2);
          continue;
        }
        expect(actual!.status, expected.label).toBe(expected.status);
        expect(actual!.clearance!, expected.label).toBeCloseTo(expected.clearance, 2);
        expect(actual!.required, expected.label).toBeCloseTo(expected.required, 6);
      }
    });
  }

  it('when the demo is seeded, then each failing line has an open conflict with a "found" history entry', async () => {
    for (const scenario of DEMO_SCENARIOS) {
      const id = await projectIdByName(scenario.project.name);
      const body = (await get(`/api/projects/${id}/clearances`, 'admin')).body as ClearancesDto;
      const failing = body.report.bores.flatMap((b) => b.lines).filter((l) => l.status === 'overlap' || l.status === 'conflict');
      const conflicts = (await get(`/api/projects/${id}/conflicts`, 'admin')).body as ConflictDto[];
      expect(conflicts.map((c) => c.lineId).sort()).toEqual(failing.map((l) => l.lineId).sort());
      for (const c of conflicts) {
        expect(c.status).toBe('open');
        const history = (await get(`/api/projects/${id}/conflicts/${c.id}/history`, 'admin')).body as ConflictEventDto[];
        expect(history[0]!.kind).toBe('found');
      }
      const project = (await get(`/api/projects/${id}`, 'admin')).body;
      expect(project.counts.openConflicts).toBe(failing.length);
    }
  });
});

describe('the register follows every write', () => {
  it('when the crew corrects a depth so the line clears, then the conflict is voided with the figures in its history; when it fails again, it reopens', async () => {
    const f = await makeFixtures(ctx);
    const base = `/api/projects/${f.project.id}`;
    const hole = (await get(`${base}/holes/${f.hole.id}`, 'field')).body;
    // Depth 5.0: top 95.0, bottom 94.0 → clearance 94.0 − 86.1 = 7.9 ≥ 1.5 + allowance → clear.
    const deeper = await request(ctx.app).patch(`${base}/holes/${f.hole.id}`).set('Cookie', ctx.cookie('field')).send({ depthToTop: 5, version: hole.version });
    expect(deeper.status).toBe(200);
    let [conflict] = (await get(`${base}/conflicts`)).body as ConflictDto[];
    expect(conflict!.computedStatus).toBe('clear');
    expect(conflict!.status).toBe('void');
    let history = (await get(`${base}/conflicts/${conflict!.id}/history`)).body as ConflictEventDto[];
    const cleared = history.at(-1)!;
    expect(cleared.kind).toBe('cleared');
    expect(cleared.byName).toBe('Test field');
    expect((cleared.data as { before: { figures: { clearance: number } } }).before.figures.clearance).toBeCloseTo(-1.1, 6);
    expect((cleared.data as { after: { figures: { clearance: number } } }).after.figures.clearance).toBeCloseTo(7.9, 6);

    const back = await request(ctx.app).patch(`${base}/holes/${f.hole.id}`).set('Cookie', ctx.cookie('field')).send({ depthToTop: 14, version: deeper.body.version });
    expect(back.status).toBe(200);
    [conflict] = (await get(`${base}/conflicts`)).body as ConflictDto[];
    expect(conflict!.computedStatus).toBe('overlap');
    expect(conflict!.status).toBe('open');
    history = (await get(`${base}/conflicts/${conflict!.id}/history`)).body as ConflictEventDto[];
    expect(history.map((e) => e.kind)).toEqual(['found', 'cleared', 'failed_again']);
  });

  it('when a person has set the status, then later checks record the change but never overwrite it', async () => {
    const f = await makeFixtures(ctx);
    const base = `/api/projects/${f.project.id}`;
    const waived = await request(ctx.app)
      .patch(`${base}/conflicts/${f.conflict.id}/status`)
      .set('Cookie', ctx.cookie('manager')) // a waiver is recorded by the project manager (shared/conflicts.ts)
      .send({ status: 'waived', reason: 'Owner letter 2026-11-30 accepts the crossing with a sleeve.', version: f.conflict.version });
    expect(waived.status).toBe(200);
    // The designer lowers the bore by 3 ft: the line now clears by 1.9 ft.
    const bore = (await get(`${base}/bores/${f.bore.id}`, 'designer')).body;
    const lowered = await request(ctx.app)
      .patch(`${base}/bores/${f.bore.id}`)
      .set('Cookie', ctx.cookie('designer'))
      .send({ profile: bore.profile.map((p: { station: number; elevation: number }) => ({ ...p, elevation: p.elevation - 3 })), version: bore.version });
    expect(lowered.status).toBe(200);
    const [conflict] = (await get(`${base}/conflicts`)).body as ConflictDto[];
    expect(conflict!.status).toBe('waived');
    expect(conflict!.computedStatus).not.toBe('overlap');
    const history = (await get(`${base}/conflicts/${conflict!.id}/history`)).body as ConflictEventDto[];
    expect(history.map((e) => e.kind)).toEqual(['found', 'status', 'cleared']);
    expect(history[1]!.note).toMatch(/Owner letter/);
  });

  it('when a status move has no reason, then 400 and nothing changes', async () => {
    const f = await makeFixtures(ctx);
    const res = await request(ctx.app)
      .patch(`/api/projects/${f.project.id}/conflicts/${f.conflict.id}/status`)
      .set('Cookie', ctx.cookie('manager'))
      .send({ status: 'in_review', version: f.conflict.version });
    expect(res.status).toBe(400);
    expect(res.body.errors.map((e: { path: string }) => e.path)).toContain('reason');
    const [conflict] = (await get(`/api/projects/${f.project.id}/conflicts`)).body as ConflictDto[];
    expect(conflict!.status).toBe('open');
  });
});
