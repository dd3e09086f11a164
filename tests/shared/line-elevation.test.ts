/**
 * Top-of-line elevation from test holes (SPEC §4.4) and vertical profiles (SPEC §4.3), hand-worked.
 */
import { describe, it, expect } from 'vitest';
import {
  buildLineElevationModel, holeTopElevation, lineSize, maxHoleOffset, minimumCover, preparePolyline, prepareProfile,
  profileElevation, profileElevationOrThrow, topFromHoles, GeometryError,
} from '../../shared/geometry';
import { SETTINGS, hole, line } from './fixtures';

describe('holeTopElevation', () => {
  const round = line(1, [[0, 0], [10, 0]], { diameter: 0.3 });
  const box = line(2, [[0, 0], [10, 0]], { shape: 'box', diameter: null, width: 1.2, height: 0.6 });

  it('when the surveyor gave a top elevation then it wins over ground − depth', () => {
    // SPEC §3 TestHole: surveyed top-of-line elevation wins over ground − depth.
    expect(holeTopElevation(hole(1, 0, 0, { surveyedTopElevation: 91.234 }), round, lineSize(round)!)).toEqual({ top: 91.234, source: 'surveyed_top' });
  });

  it('when the depth is to the top, centre or bottom then the top is ground − depth (+ h/2, + h)', () => {
    // Ground 100.00, depth 2.00: to top → 98.00; to centre (OD 0.30) → 98.15; to bottom → 98.30.
    const at = (ref: 'top' | 'centre' | 'bottom') => holeTopElevation(hole(1, 0, 0, { groundElevation: 100, depthToTop: 2, depthReference: ref }), round, lineSize(round)!);
    expect(at('top')).toMatchObject({ top: 98 });
    expect((at('centre') as { top: number }).top).toBeCloseTo(98.15, 12);
    expect((at('bottom') as { top: number }).top).toBeCloseTo(98.3, 12);
    // A box uses its height (0.60), or the hole's measured box height when logged (0.50).
    expect((holeTopElevation(hole(2, 0, 0, { depthToTop: 2, depthReference: 'bottom' }), box, lineSize(box)!) as { top: number }).top).toBeCloseTo(98.6, 12);
    expect((holeTopElevation(hole(2, 0, 0, { depthToTop: 2, depthReference: 'bottom', boxHeight: 0.5 }), box, lineSize(box)!) as { top: number }).top).toBeCloseTo(98.5, 12);
    // The surveyed ground elevation wins over the crew's ground elevation: 99.50 − 2.00 = 97.50.
    expect(holeTopElevation(hole(1, 0, 0, { groundElevation: 100, surveyedGroundElevation: 99.5, depthToTop: 2 }), round, lineSize(round)!)).toMatchObject({ top: 97.5 });
  });

  it('when a dug hole lacks ground or depth then it says so', () => {
    expect(holeTopElevation(hole(1, 0, 0, { groundElevation: null }), round, lineSize(round)!)).toMatchObject({ code: 'HOLE_NO_ELEVATION' });
    expect(holeTopElevation(hole(1, 0, 0, { depthToTop: Infinity }), round, lineSize(round)!)).toMatchObject({ code: 'HOLE_INVALID_NUMBER' });
  });
});

describe('topFromHoles', () => {
  // Line from (0, 0) east then north: (0,0) → (100,0) → (100,100); chainage 0–200.
  const l = line(1, [[0, 0], [100, 0], [100, 100]]);
  const poly = preparePolyline(l.path);
  const size = lineSize(l)!;

  it('when between two holes then linear in distance along the line, across a bend', () => {
    // H1 at (50, 0.5): chainage 50, top 92.00. H2 at (100.4, 50): chainage 150, top 94.00.
    // At chainage 100 (the bend): 92 + (100 − 50)/(150 − 50) × 2 = 93.00.
    const { model } = buildLineElevationModel(l, poly, size, [hole(1, 50, 0.5, { depthToTop: 8 }), hole(1, 100.4, 50, { depthToTop: 6 })], SETTINGS);
    expect(model.holes.map((h) => h.chainage)).toEqual([50, 150]);
    expect(model.holes[1]!.offsetFromLine).toBeCloseTo(0.4, 12);
    expect(topFromHoles(model, 100)).toMatchObject({ top: 93, mode: 'interpolated', extrapolationDistance: 0 });
    expect(topFromHoles(model, 50)).toMatchObject({ top: 92, mode: 'at_hole' });
    // Beyond the outermost holes: held flat, with the distance.
    expect(topFromHoles(model, 10)).toMatchObject({ top: 92, mode: 'extrapolated', extrapolationDistance: 40 });
    expect(topFromHoles(model, 190)).toMatchObject({ top: 94, mode: 'extrapolated', extrapolationDistance: 40 });
  });

  it('when two holes share a chainage then their tops are averaged and both are named', () => {
    const { model } = buildLineElevationModel(l, poly, size, [hole(1, 50, 0, { depthToTop: 8 }), hole(1, 50, 0, { depthToTop: 7.9 })], SETTINGS);
    const r = topFromHoles(model, 50)!;
    expect(r.top).toBeCloseTo(92.05, 12);
    expect(r.holes).toHaveLength(2);
  });

  it('when there is no usable hole then null (the engine falls back to the record depth)', () => {
    const { model } = buildLineElevationModel(l, poly, size, [hole(1, 50, 0, { status: 'planned' })], SETTINGS);
    expect(topFromHoles(model, 50)).toBeNull();
  });

  it('when a hole is farther than verification distance + QL uncertainty then it is not used', () => {
    // QL B: 3 + 0.30 = 3.30. A hole 3.2 off is used; 3.4 off is not.
    expect(maxHoleOffset(SETTINGS, 'B')).toBeCloseTo(3.3, 12);
    const { model, issues } = buildLineElevationModel(l, poly, size, [hole(1, 50, 3.2), hole(1, 60, 3.4)], SETTINGS);
    expect(model.holes).toHaveLength(1);
    expect(issues.map((i) => i.code)).toEqual(['HOLE_FAR_FROM_LINE']);
  });
});

describe('profiles', () => {
  const p = prepareProfile([{ station: 0, elevation: 90 }, { station: 100, elevation: 80 }, { station: 150, elevation: 85 }], 'bore profile');

  it('when between points then linear; outside then null or a clear error', () => {
    // 90 − 10 × 40/100 = 86.00; 80 + 5 × 25/50 = 82.50.
    expect(profileElevation(p, 40)).toBeCloseTo(86, 12);
    expect(profileElevation(p, 125)).toBeCloseTo(82.5, 12);
    expect(profileElevation(p, 150)).toBe(85);
    expect(profileElevation(p, 150.5)).toBeNull();
    expect(profileElevation(p, -1)).toBeNull();
    expect(() => profileElevationOrThrow(p, 151)).toThrowError(expect.objectContaining({ code: 'STATION_OUTSIDE_PROFILE' }));
  });

  it('when stations do not increase then PROFILE_NOT_ORDERED', () => {
    const e = (() => {
      try {
        prepareProfile([{ station: 0, elevation: 1 }, { station: 0, elevation: 2 }], 'ground profile');
      } catch (x) {
        return x as GeometryError;
      }
      return null;
    })();
    expect(e?.code).toBe('PROFILE_NOT_ORDERED');
  });

  it('when computing cover then ground − (centreline + radius), least at a profile break', () => {
    // Ground level 100; casing radius 0.5: cover at 0 = 9.5, at 100 = 19.5, at 150 = 14.5 → least 9.5 at 0.
    const g = prepareProfile([{ station: 0, elevation: 100 }, { station: 150, elevation: 100 }], 'ground');
    expect(minimumCover(p, g, 0.5, 0, 150)).toEqual({ cover: 9.5, station: 0 });
    // From 60 (centre 84.00, cover 15.5) to 150 (cover 14.5): least at 150.
    expect(minimumCover(p, g, 0.5, 60, 150)).toEqual({ cover: 14.5, station: 150 });
  });
});
