import { describe, expect, it } from 'vitest';
import proj4 from 'proj4';
import { HOLE_STATUSES, ROLES } from '@shared/domain';
import { userCreateSchema } from '@shared/schemas/auth';
import { boreCreateSchema, pitCreateSchema } from '@shared/schemas/bore';
import { holeCreateSchema } from '@shared/schemas/hole';
import { lineCreateSchema } from '@shared/schemas/line';
import { clearanceRuleSchema, projectCreateSchema } from '@shared/schemas/project';
import { CREEK_HDD_SCENARIO, DEMO_SCENARIOS, DEMO_USERS, ROAD_BORE_SCENARIO } from '../../seeds/demo';
import { polylineCrossings, projectOnPolyline } from '../../seeds/demo/plan';
import type { DemoScenario } from '../../seeds/demo/types';
import { AREAS_OF_USE, ON_LINE_TOLERANCE, checkUsers, verifyScenario } from '../../seeds/demo/verify';
import { DEMO_PHOTO_HEIGHT, DEMO_PHOTO_WIDTH, makeDemoPhoto } from '../../seeds/photos';

const problemsText = (ps: { where: string; message: string }[]) => ps.map((p) => `${p.where}: ${p.message}`).join('\n');

describe('demo users', () => {
  it('when the demo users are checked, then each is a valid create input with a reserved-domain e-mail', () => {
    for (const { active: _active, ...u } of DEMO_USERS) expect(userCreateSchema.safeParse(u).success, u.email).toBe(true);
    expect(problemsText(checkUsers(DEMO_USERS))).toBe('');
  });

  it('when listing roles, then every role has an active demo user and one user is inactive', () => {
    for (const role of ROLES) expect(DEMO_USERS.some((u) => u.role === role && u.active !== false), role).toBe(true);
    expect(DEMO_USERS.some((u) => u.active === false)).toBe(true);
    for (const u of DEMO_USERS) expect(u.password.length).toBeGreaterThanOrEqual(10);
  });
});

describe.each(DEMO_SCENARIOS.map((s) => [s.key, s] as const))('demo scenario %s', (_key, s: DemoScenario) => {
  it('when every record is parsed with the shared schemas, then all pass', () => {
    expect(projectCreateSchema.safeParse(s.project).success).toBe(true);
    for (const r of s.rules) expect(clearanceRuleSchema.safeParse(r).success, r.kind).toBe(true);
    for (const { key: _k, pits, ...b } of s.bores) {
      expect(boreCreateSchema.safeParse(b).error?.issues ?? []).toEqual([]);
      for (const p of pits) expect(pitCreateSchema.safeParse({ ...p, boreId: 1 }).success).toBe(true);
    }
    for (const { key, ...l } of s.lines) expect(lineCreateSchema.safeParse(l).error?.issues ?? [], key).toEqual([]);
    for (const h of s.holes) {
      const {
        lineKey: _l, boreKey, clientId, status: _s, createdByEmail: _c, photos: _p,
        surveyedEasting: _se, surveyedNorthing: _sn, surveyedTopElevation: _st, surveyedGroundElevation: _sg, ...fields
      } = h;
      const parsed = holeCreateSchema.safeParse({ ...fields, lineId: 1, boreId: boreKey ? 1 : undefined, clientId });
      expect(parsed.error?.issues ?? [], h.number).toEqual([]);
    }
  });

  it('when every coordinate is converted with proj4, then it lies inside the area of use of the CRS', () => {
    const area = AREAS_OF_USE[s.project.crsCode]!;
    expect(area).toBeDefined();
    const toLonLat = proj4(s.project.crsProj4, 'EPSG:4326');
    const points: [number, number][] = [
      ...s.bores.flatMap((b) => [...b.alignment, ...b.pits.flatMap((p) => p.footprint)]),
      ...s.lines.flatMap((l) => l.path),
      ...s.holes.map((h) => [h.easting!, h.northing!] as [number, number]),
    ];
    for (const p of points) {
      const [lon, lat] = toLonLat.forward(p);
      expect(lon).toBeGreaterThanOrEqual(area.west);
      expect(lon).toBeLessThanOrEqual(area.east);
      expect(lat).toBeGreaterThanOrEqual(area.south);
      expect(lat).toBeLessThanOrEqual(area.north);
    }
  });

  it('when holes are projected onto their lines, then each lies on its line', () => {
    for (const h of s.holes) {
      const line = s.lines.find((l) => l.key === h.lineKey)!;
      expect(projectOnPolyline([h.easting!, h.northing!], line.path).distance, h.number).toBeLessThan(ON_LINE_TOLERANCE);
    }
  });

  it('when lines meant to cross are intersected with the bore in plan, then they cross, and parallel ones do not', () => {
    const bore = s.bores[0]!;
    for (const l of s.lines) {
      const crosses = polylineCrossings(l.path, bore.alignment).length > 0;
      expect(crosses, l.key).toBe(s.intended[l.key]!.relation === 'crossing');
    }
  });

  it('when holes are listed, then every status is present and numbers are unique in the project', () => {
    for (const st of HOLE_STATUSES) expect(s.holes.some((h) => h.status === st), st).toBe(true);
    expect(new Set(s.holes.map((h) => h.number)).size).toBe(s.holes.length);
  });

  it('when the whole scenario is verified, then there is no problem and each line shows its intended status', () => {
    const report = verifyScenario(s, DEMO_USERS);
    expect(problemsText(report.problems)).toBe('');
    for (const c of report.clearances) expect(c.status, c.lineKey).toBe(s.intended[c.lineKey]!.status);
  });
});

describe('demo scenario contents', () => {
  it('when the road bore is read, then it has at least 8 lines of the required kinds and at least 12 holes', () => {
    const s = ROAD_BORE_SCENARIO;
    expect(s.project.unit).toBe('usft');
    expect(s.bores[0]!.method).toBe('auger_bore');
    expect(s.lines.length).toBeGreaterThanOrEqual(8);
    for (const kind of ['water', 'sewer', 'storm', 'gas', 'electric', 'communications'] as const) {
      expect(s.lines.some((l) => l.kind === kind), kind).toBe(true);
    }
    expect(s.lines.some((l) => l.kind === 'electric' && l.shape === 'box' && l.width && l.height)).toBe(true);
    expect(s.lines.some((l) => l.status === 'abandoned')).toBe(true);
    expect(s.lines.some((l) => l.kind === 'unknown' && l.owner === 'Unknown')).toBe(true);
    expect(Object.values(s.intended).filter((i) => i.relation === 'parallel').length).toBeGreaterThanOrEqual(2);
    expect(s.holes.length).toBeGreaterThanOrEqual(12);
    // one line with two or more dug holes, one with exactly one, one with none
    const dug = (key: string) => s.holes.filter((h) => h.lineKey === key && h.status !== 'planned').length;
    expect(s.lines.some((l) => dug(l.key) >= 2)).toBe(true);
    expect(s.lines.some((l) => dug(l.key) === 1)).toBe(true);
    expect(s.lines.some((l) => s.holes.every((h) => h.lineKey !== l.key))).toBe(true);
    expect(new Set(Object.values(s.intended).map((i) => i.status))).toEqual(new Set(['overlap', 'conflict', 'marginal', 'unverified', 'clear']));
  });

  it('when the creek HDD is read, then it is metric with a curved profile, 5 lines and at least 6 holes', () => {
    const s = CREEK_HDD_SCENARIO;
    expect(s.project.unit).toBe('m');
    expect(s.project.stationStyle).toBe('1000');
    expect(s.bores[0]!.method).toBe('hdd');
    expect(s.bores[0]!.profile.length).toBeGreaterThanOrEqual(5);
    expect(s.lines.length).toBeGreaterThanOrEqual(5);
    expect(s.holes.length).toBeGreaterThanOrEqual(6);
  });

  it('when client ids are compared across the demo, then each is a distinct UUID', () => {
    const ids = DEMO_SCENARIOS.flatMap((s) => s.holes.map((h) => h.clientId));
    expect(new Set(ids).size).toBe(ids.length);
    for (const id of ids) expect(id).toMatch(/^[0-9a-f]{8}-[0-9a-f]{4}-[1-8][0-9a-f]{3}-[89ab][0-9a-f]{3}-[0-9a-f]{12}$/);
  });

  it('when a hole is moved off its line or a point out of the zone, then the verifier notices', () => {
    const s = structuredClone(ROAD_BORE_SCENARIO);
    s.holes[0]!.easting! += 1;
    s.lines[0]!.path[0] = [600000, 13652395];
    const messages = verifyScenario(s, DEMO_USERS).problems.map((p) => `${p.where}: ${p.message}`);
    expect(messages.some((m) => m.startsWith(`hole ${s.holes[0]!.number}:`) && m.includes('off line'))).toBe(true);
    expect(messages.some((m) => m.startsWith('line water-12 vertex 0') && m.includes('outside'))).toBe(true);
  });
});

describe('demo photos', () => {
  it('when a photo is made twice with the same seed, then it is the same 640 × 480 JPEG', async () => {
    const opts = { holeNumber: 'TH-04', lineKind: 'storm' as const, caption: 'TH-04: 42-in RCP exposed', kind: 'exposed' as const, seed: 4 };
    const a = await makeDemoPhoto(opts);
    const b = await makeDemoPhoto(opts);
    expect(a.subarray(0, 2).toString('hex')).toBe('ffd8');
    expect(a.equals(b)).toBe(true);
    // SOF0 frame header: height and width
    const sof = a.indexOf(Buffer.from([0xff, 0xc0]));
    expect(a.readUInt16BE(sof + 5)).toBe(DEMO_PHOTO_HEIGHT);
    expect(a.readUInt16BE(sof + 7)).toBe(DEMO_PHOTO_WIDTH);
    const other = await makeDemoPhoto({ ...opts, seed: 5 });
    expect(other.equals(a)).toBe(false);
  });
});
