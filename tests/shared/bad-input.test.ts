/**
 * Bad input never crashes the engine nor yields a silent wrong number: project-wide faults throw
 * a GeometryError with a stable code; a bad bore gets computed: false with its error; bad lines
 * and holes are left out with a warning; figures that cannot be computed are null with a problem.
 */
import { describe, it, expect } from 'vitest';
import { GeometryError, computeClearances, type ClearanceReport } from '../../shared/geometry';
import { SETTINGS, bore, hole, line, scene } from './fixtures';

const codes = (r: ClearanceReport) => r.warnings.map((w) => w.code);

function thrown(fn: () => unknown): GeometryError {
  try {
    fn();
  } catch (e) {
    expect(e).toBeInstanceOf(GeometryError);
    return e as GeometryError;
  }
  throw new Error('expected a GeometryError');
}

describe('bad bores', () => {
  const cases: [string, Parameters<typeof bore>[0], RegExp][] = [
    ['a NaN vertex', { alignment: [[0, 0], [NaN, 0]] }, /vertex 2 is not a pair of finite numbers/],
    ['a single-vertex alignment', { alignment: [[0, 0]] }, /at least two distinct vertices/],
    ['two identical vertices', { alignment: [[5, 5], [5, 5]] }, /at least two distinct vertices/],
    ['a profile out of order', { profile: [{ station: 1100, elevation: 90 }, { station: 1000, elevation: 90 }] }, /stations must increase/],
    ['a one-point profile', { profile: [{ station: 1000, elevation: 90 }] }, /at least 2 points/],
    ['a ground profile with Infinity', { groundProfile: [{ station: 1000, elevation: Infinity }, { station: 1100, elevation: 100 }] }, /finite station and elevation/],
    ['a zero casing', { casingOd: 0 }, /casing outside diameter/],
    ['a NaN casing', { casingOd: NaN }, /casing outside diameter/],
    ['an infinite tolerance', { toleranceVertical: Infinity }, /vertical tolerance/],
    ['a NaN begin station', { beginStation: NaN }, /begin station/],
  ];
  for (const [what, over, message] of cases) {
    it(`when a bore has ${what} then it is not computed and says why, and other bores still are`, () => {
      const r = computeClearances(scene([bore({ id: 1, ...over }), bore({ id: 2, name: 'B-2' })], [line(1, [[40, -20], [40, 20]])], [hole(1, 40, 0)]));
      const bad = r.bores[0]!;
      expect(bad.computed).toBe(false);
      expect(bad.error?.code).toBe('BORE_INVALID');
      expect(bad.error?.message).toMatch(message);
      expect(bad.lines).toEqual([]);
      expect(r.bores[1]!.computed).toBe(true);
      expect(r.bores[1]!.lines).toHaveLength(1);
    });
  }

  it('when a crossing lies outside the bore profile then no vertical figures, a problem, and a bore warning', () => {
    // Profile covers 1000–1050 only; line at x = 80 crosses at 1080.
    const b0 = bore({ profile: [{ station: 1000, elevation: 90 }, { station: 1050, elevation: 90 }] });
    const r = computeClearances(scene([b0], [line(1, [[80, -20], [80, 20]])], [hole(1, 80, 0)]));
    const b = r.bores[0]!;
    const p = b.lines[0]!.points[0]!;
    expect(p.boreCentreline).toBeNull();
    expect(p.clearance).toBeNull();
    expect(p.status).toBe('unverified');
    expect(p.problems.map((x) => x.code)).toContain('STATION_OUTSIDE_PROFILE');
    expect(b.warnings.map((w) => w.code)).toEqual(expect.arrayContaining(['PROFILE_DOES_NOT_COVER_ALIGNMENT', 'LINES_WITHOUT_FIGURES']));
    expect(b.window!.linesWithoutFigures).toEqual([1]);
  });

  it('when a pit footprint has two corners then it is skipped with a warning', () => {
    const r = computeClearances(scene([bore({ pits: [{ id: 7, kind: 'launch', footprint: [[0, 0], [1, 1]], bottomElevation: 88 }] })], [], []));
    expect(r.bores[0]!.warnings.map((w) => w.code)).toContain('PIT_INVALID');
  });
});

describe('bad lines', () => {
  it('when a line path is bad then the line is left out with a warning and the others are computed', () => {
    const lines = [
      line(1, [[40, -20], [40, 20]]),
      line(2, [[50, -20]]),
      line(3, [[60, -20], [60, NaN]]),
      line(4, [[70, -20], [70, 20]], { shape: 'box', diameter: null, width: 1, height: null }),
      line(5, [[75, -20], [75, 20]], { diameter: -1 }),
    ];
    const r = computeClearances(scene([bore()], lines, [hole(1, 40, 0)]));
    expect(r.bores[0]!.lines.map((l) => l.lineId)).toEqual([1]);
    expect(r.warnings.filter((w) => w.code === 'LINE_INVALID_PATH').map((w) => w.lineId)).toEqual([2, 3]);
    expect(r.warnings.filter((w) => w.code === 'LINE_INVALID_SIZE').map((w) => w.lineId)).toEqual([4, 5]);
  });

  it('when a line has no hole, no ground profile at the crossing, then its elevation is unknown, not guessed', () => {
    const r = computeClearances(scene([bore({ groundProfile: [] })], [line(1, [[40, -20], [40, 20]])], []));
    const b = r.bores[0]!;
    const p = b.lines[0]!.points[0]!;
    expect(p.lineTop).toBeNull();
    expect(p.clearance).toBeNull();
    expect(p.status).toBe('unverified');
    expect(p.problems.map((x) => x.code)).toEqual(['NO_GROUND_FOR_RECORD_DEPTH']);
    expect(b.warnings.map((w) => w.code)).toContain('NO_GROUND_PROFILE');
    expect(b.cover).toBeNull();
    expect(b.suggestedHoles).toHaveLength(1);
  });

  it('when a line has no hole and a NaN record depth then NO_ELEVATION', () => {
    const r = computeClearances(scene([bore()], [line(1, [[40, -20], [40, 20]], { recordDepth: NaN })], []));
    expect(codes(r)).toContain('LINE_INVALID_NUMBER');
    expect(r.bores[0]!.lines[0]!.points[0]!.problems.map((x) => x.code)).toEqual(['NO_ELEVATION']);
  });

  it('when a line kind has no rule and no owner value then required 0 from "none", with a warning', () => {
    const r = computeClearances(scene([bore()], [line(1, [[40, -20], [40, 20]], { kind: 'steam' })], [hole(1, 40, 0)]));
    expect(codes(r)).toContain('NO_RULE_FOR_KIND');
    expect(r.bores[0]!.lines[0]!.requiredSource).toBe('none');
    expect(r.bores[0]!.lines[0]!.required).toBe(0);
  });
});

describe('bad holes', () => {
  it('when a dug hole lies far from its line then it is flagged and not used', () => {
    // Limit = verification distance 3 + QL B uncertainty 0.30 = 3.30; the hole is 10 off the line.
    // The line falls back to its record depth: 100 − 1.20 = 98.80.
    const r = computeClearances(scene([bore()], [line(1, [[40, -20], [40, 20]])], [hole(1, 50, 0, { depthToTop: 5 })]));
    const w = r.warnings.find((x) => x.code === 'HOLE_FAR_FROM_LINE');
    expect(w?.message).toMatch(/10\.00 from line L-1/);
    const p = r.bores[0]!.lines[0]!.points[0]!;
    expect(p.elevation?.source).toBe('record');
    expect(p.lineTop).toBeCloseTo(98.8, 9);
  });

  it('when holes carry NaN, no depth, no position or an unknown line then each is flagged; planned holes are ignored', () => {
    const holes = [
      hole(1, 40, 0, { depthToTop: NaN }),
      hole(1, 40, 1, { depthToTop: null }),
      hole(1, NaN, 1),
      hole(99, 40, 0),
      hole(1, 40, 0, { status: 'planned', depthToTop: 2 }),
    ];
    const r = computeClearances(scene([bore()], [line(1, [[40, -20], [40, 20]])], holes));
    expect(codes(r).sort()).toEqual(['HOLE_INVALID_NUMBER', 'HOLE_INVALID_POSITION', 'HOLE_NO_ELEVATION', 'HOLE_UNKNOWN_LINE']);
    expect(r.bores[0]!.lines[0]!.points[0]!.elevation?.source).toBe('record');
    expect(r.bores[0]!.lines[0]!.verified).toBe(false);
  });
});

describe('project-wide faults', () => {
  it('when settings are not finite then INVALID_SETTINGS', () => {
    expect(thrown(() => computeClearances(scene([bore()], [], [], { settings: { ...SETTINGS, verificationDistance: NaN } }))).code).toBe('INVALID_SETTINGS');
    expect(thrown(() => computeClearances(scene([bore()], [], [], { settings: { ...SETTINGS, qualityLevelUncertainty: { A: 0, B: 0, C: Infinity, D: 0 } } }))).message).toMatch(/quality level C/);
  });

  it('when a rule is negative or doubled then INVALID_RULE', () => {
    expect(thrown(() => computeClearances(scene([bore()], [], [], { rules: [{ kind: 'gas', vertical: -1, horizontal: 1 }] }))).code).toBe('INVALID_RULE');
    expect(thrown(() => computeClearances(scene([bore()], [], [], { rules: [{ kind: 'gas', vertical: 1, horizontal: 1 }, { kind: 'gas', vertical: 2, horizontal: 2 }] }))).message).toMatch(/two clearance rules for gas/);
  });

  it('when two lines share an id then DUPLICATE_ID', () => {
    const e = thrown(() => computeClearances(scene([bore()], [line(1, [[0, 1], [1, 1]]), line(1, [[0, 2], [1, 2]])], [])));
    expect(e.code).toBe('DUPLICATE_ID');
    expect(e.message).toMatch(/line id 1 appears twice/);
  });
});
