/**
 * Hand-worked clearance examples. Scene (fixtures.ts): bore B-1 runs east along y = 0 from
 * x = 0 to 100 m, stations 1000–1100, casing centreline level at 90.00, casing OD 0.50
 * (radius 0.25), ground 100.00, tolerances H 0.10 / V 0.05. Rules: water/sewer/comms/electric
 * 0.60, gas 0.30. Uncertainty by quality level A 0.05, B 0.30, C 0.60, D 1.00; extrapolation
 * factor 0.1; verification distance 3.
 * Formulas: SPEC §4.5 (vertical clearance, 3-D clear distance), §4.8 (requirement, margin,
 * allowance), §4.9 (status), §4.10 (window).
 */
import { describe, it, expect } from 'vitest';
import { computeClearances, type BoreReport, type LineClearance } from '../../shared/geometry';
import { bore, hole, line, scene } from './fixtures';

function only(report: ReturnType<typeof computeClearances>): BoreReport {
  expect(report.bores).toHaveLength(1);
  return report.bores[0]!;
}
function lineOf(b: BoreReport, id: number): LineClearance {
  const l = b.lines.find((c) => c.lineId === id);
  expect(l, `line ${id} reported`).toBeDefined();
  return l!;
}

describe('crossings', () => {
  it('when a water line crosses square above the bore with a hole at the crossing then clear', () => {
    // Line 1 runs north along x = 40; crossing at (40, 0) → station 1000 + 40 = 1040, angle 90°, skew 0°.
    // Hole at the crossing: top = ground − depth = 100 − 8 = 92.00; OD 0.30 → bottom 91.70,
    // centre 91.85 > 90 → above. Vertical clearance = 91.70 − (90 + 0.25) = 1.45.
    // Required (water rule) 0.60 → margin 0.85. Allowance = 0.05 (V tol) + 0.30 (QL B) = 0.35.
    // Margin ≥ allowance and the hole is 0 from the crossing (≤ 3) → clear.
    // 3-D: both level and square, centrelines 91.85 − 90 = 1.85 apart → 1.85 − 0.25 − 0.15 = 1.45.
    const b = only(computeClearances(scene([bore()], [line(1, [[40, -50], [40, 50]])], [hole(1, 40, 0)])));
    const l = lineOf(b, 1);
    const p = l.points[0]!;
    expect(l.relation).toBe('crossing');
    expect(p.station).toBeCloseTo(1040, 9);
    expect(p.crossingAngle).toBeCloseTo(90, 9);
    expect(p.skew).toBeCloseTo(0, 9);
    expect(p.position).toBe('above');
    expect(p.lineTop).toBeCloseTo(92, 9);
    expect(p.lineBottom).toBeCloseTo(91.7, 9);
    expect(p.boreCentreline).toBeCloseTo(90, 9);
    expect(p.verticalClearance).toBeCloseTo(1.45, 9);
    expect(p.clearDistance3d).toBeCloseTo(1.45, 9);
    expect(p.cover).toBeCloseTo(9.75, 9);
    expect(l.required).toBe(0.6);
    expect(l.requiredSource).toBe('rule');
    expect(l.margin).toBeCloseTo(0.85, 9);
    expect(l.allowance).toBeCloseTo(0.35, 9);
    expect(l.status).toBe('clear');
    expect(p.elevation).toMatchObject({ source: 'holes', mode: 'at_hole', extrapolationDistance: 0 });
    expect(l.suggestedHoles).toEqual([]);
  });

  it('when a gas line crosses at 45° below the bore between two holes then interpolated and unverified', () => {
    // Line 2 from (0, −30) to (60, 30): direction (1, 1), 45° to the bore; crosses y = 0 at (30, 0),
    // station 1030, crossing angle 45°, skew 45°.
    // Holes on the line: H1 (20, −10), chainage 20√2 = 28.284, top 100 − 15 = 85.00;
    // H2 (40, 10), chainage 40√2 = 56.569, surveyed top 86.00 (wins over 100 − 10 = 90).
    // Crossing chainage 30√2 = 42.426, halfway → top 85.50 (interpolated); OD 0.40 → centre 85.30 < 90 → below.
    // Vertical clearance = (90 − 0.25) − 85.50 = 4.25. Gas rule 0.30 → margin 3.95.
    // Allowance = 0.05 + 0.30 (QL B) = 0.35; both holes are 14.1 from the crossing (> 3) → unverified.
    // 3-D: bore axis along (1,0,0) at z = 90; line centreline direction (1, 1, 1/20) per unit of x
    // (rises 1.0 over 20 of easting), passing (30, 0, 85.30). Distance between the two lines =
    // |(0,0,−4.7)·(d1×d2)| / |d1×d2| with d1×d2 = (0, −1/20, 1): 4.7 / √(1 + 1/400) = 94/√401 = 4.69415;
    // clear distance = 4.69415 − 0.25 − 0.20 = 4.24415 (the closest points lie between the holes).
    const l2 = line(2, [[0, -30], [60, 30]], { kind: 'gas', diameter: 0.4 });
    const holes = [
      hole(2, 20, -10, { groundElevation: 100, depthToTop: 15 }),
      hole(2, 40, 10, { groundElevation: 100, depthToTop: 10, surveyedTopElevation: 86, status: 'surveyed' }),
    ];
    const b = only(computeClearances(scene([bore()], [l2], holes)));
    const l = lineOf(b, 2);
    const p = l.points[0]!;
    expect(p.station).toBeCloseTo(1030, 9);
    expect(p.crossingAngle).toBeCloseTo(45, 9);
    expect(p.skew).toBeCloseTo(45, 9);
    expect(p.lineTop).toBeCloseTo(85.5, 9);
    expect(p.position).toBe('below');
    expect(p.verticalClearance).toBeCloseTo(4.25, 9);
    expect(l.margin).toBeCloseTo(3.95, 9);
    expect(p.clearDistance3d).toBeCloseTo(94 / Math.sqrt(401) - 0.45, 9);
    expect(p.elevation).toMatchObject({ source: 'holes', mode: 'interpolated' });
    if (p.elevation?.source === 'holes') {
      expect(p.elevation.holes.map((h) => h.source)).toEqual(['ground_minus_depth', 'surveyed_top']);
    }
    expect(l.status).toBe('unverified');
    expect(l.suggestedHoles).toEqual([{ boreId: 1, lineId: 2, reason: 'crossing', easting: 30, northing: 0, station: 1030, offset: 0, side: 'R' }]);
  });

  it('when a box duct bank crosses just above the bore then conflict, using half its height for 3-D', () => {
    // Line 3: communications box 0.90 wide × 0.60 high along x = 50, hole at the crossing with
    // depth 9.60 measured to the BOTTOM: top = 100 − 9.60 + 0.60 = 91.00, bottom 90.40,
    // centre 90.70 > 90 → above. Vertical clearance = 90.40 − 90.25 = 0.15; rule 0.60 → margin −0.45 → conflict.
    // 3-D: 0.70 between centrelines − 0.25 − 0.30 (half the box height) = 0.15.
    const l3 = line(3, [[50, -20], [50, 20]], { kind: 'communications', shape: 'box', diameter: null, width: 0.9, height: 0.6 });
    const b = only(computeClearances(scene([bore()], [l3], [hole(3, 50, 0, { depthToTop: 9.6, depthReference: 'bottom' })])));
    const l = lineOf(b, 3);
    expect(l.points[0]!.lineTop).toBeCloseTo(91, 9);
    expect(l.clearance).toBeCloseTo(0.15, 9);
    expect(l.points[0]!.clearDistance3d).toBeCloseTo(0.15, 9);
    expect(l.margin).toBeCloseTo(-0.45, 9);
    expect(l.status).toBe('conflict');
  });

  it('when a line crosses through the casing then overlap', () => {
    // Line 4 along x = 60, hole at the crossing: depth to CENTRE 9.95 with OD 0.30:
    // top = 100 − 9.95 + 0.15 = 90.20; centre 90.05 > 90 → above; clearance = 89.90 − 90.25 = −0.35 < 0 → overlap.
    const l4 = line(4, [[60, -20], [60, 20]]);
    const b = only(computeClearances(scene([bore()], [l4], [hole(4, 60, 0, { depthToTop: 9.95, depthReference: 'centre' })])));
    expect(lineOf(b, 4).clearance).toBeCloseTo(-0.35, 9);
    expect(lineOf(b, 4).status).toBe('overlap');
  });

  it('when a line has one hole away from the crossing then its top is held flat and marked extrapolated', () => {
    // Line 5 along x = 70 from (70, −50); QL C; owner's vertical requirement 0.50 (wins over the rule 0.60).
    // One hole at (70, 12): chainage 62, top 100 − 7.5 = 92.50. Crossing chainage 50 → held flat at
    // 92.50, extrapolated by 12. OD 0.20 → bottom 92.30; clearance = 92.30 − 90.25 = 2.05; margin 1.55.
    // Allowance = 0.05 + 0.60 (QL C) + 0.1 × 12 = 1.85 > 1.55 → marginal.
    const l5 = line(5, [[70, -50], [70, 50]], { qualityLevel: 'C', diameter: 0.2, requiredVertical: 0.5 });
    const b = only(computeClearances(scene([bore()], [l5], [hole(5, 70, 12, { depthToTop: 7.5 })])));
    const l = lineOf(b, 5);
    expect(l.points[0]!.elevation).toMatchObject({ source: 'holes', mode: 'extrapolated' });
    if (l.points[0]!.elevation?.source === 'holes') expect(l.points[0]!.elevation.extrapolationDistance).toBeCloseTo(12, 9);
    expect(l.required).toBe(0.5);
    expect(l.requiredSource).toBe('owner');
    expect(l.clearance).toBeCloseTo(2.05, 9);
    expect(l.allowance).toBeCloseTo(1.85, 9);
    expect(l.status).toBe('marginal');
  });

  it('when a line has no hole then its record depth below the bore ground profile, unverified, with a hole suggested', () => {
    // Ground slopes 100.00 at 1000 to 95.00 at 1100 → 99.00 at 1020. Line 6 (sewer) along x = 20,
    // record depth 8.00 → top 91.00; OD 0.30 → bottom 90.70; above: 90.70 − 90.25 = 0.45;
    // sewer rule 0.60 → margin −0.15 → conflict (worse than unverified), and a hole is suggested.
    const b0 = bore({ groundProfile: [{ station: 1000, elevation: 100 }, { station: 1100, elevation: 95 }] });
    const l6 = line(6, [[20, -30], [20, 30]], { kind: 'sewer', recordDepth: 8 });
    const b = only(computeClearances(scene([b0], [l6], [])));
    const l = lineOf(b, 6);
    expect(l.points[0]!.elevation).toEqual({ source: 'record', recordDepth: 8, groundElevation: 99, groundStation: 1020 });
    expect(l.clearance).toBeCloseTo(0.45, 9);
    expect(l.status).toBe('conflict');
    expect(l.verified).toBe(false);
    expect(b.suggestedHoles).toEqual([{ boreId: 1, lineId: 6, reason: 'crossing', easting: 20, northing: 0, station: 1020, offset: 0, side: 'R' }]);
  });

  it('when the alignment bends then the crossing station runs along both legs', () => {
    // Alignment east 100 then north 100 (stations 0–200). Line 7 along y = 60 crosses the second
    // leg at (100, 60): station 100 + 60 = 160, square. The profile falls from 90 at 0 to 80 at 200:
    // centreline at 160 = 90 − 10 × 160/200 = 82.00. Hole at the crossing, top 92.00 (depth 8) →
    // above: 91.70 − 82.25 = 9.45.
    const b0 = bore({
      alignment: [[0, 0], [100, 0], [100, 100]], beginStation: 0,
      profile: [{ station: 0, elevation: 90 }, { station: 200, elevation: 80 }],
      groundProfile: [{ station: 0, elevation: 100 }, { station: 200, elevation: 100 }],
    });
    const b = only(computeClearances(scene([b0], [line(7, [[50, 60], [150, 60]])], [hole(7, 100, 60)])));
    const p = lineOf(b, 7).points[0]!;
    expect(p.station).toBeCloseTo(160, 9);
    expect(p.crossingAngle).toBeCloseTo(90, 9);
    expect(p.boreCentreline).toBeCloseTo(82, 9);
    expect(p.verticalClearance).toBeCloseTo(9.45, 9);
    expect(b.length).toBe(200);
  });
});

describe('lines that do not cross', () => {
  it('when a line passes beyond the end of the bore then the closest point is flagged past the end', () => {
    // Line 8 along x = 103 from (103, −20) to (103, 20): the bore ends at (100, 0). Least plan
    // distance = 3 (end to (103, 0)). Horizontal clearance = 3 − 0.25 − 0.15 = 2.60; water rule
    // 0.60 → margin 2.00; allowance = 0.10 (H tol) + 0.30 (QL B) = 0.40. No hole → unverified.
    // Station of (103, 0) on the extended last segment: 1103, 3 beyond the end, offset 0.
    const b = only(computeClearances(scene([bore()], [line(8, [[103, -20], [103, 20]])], [])));
    const l = lineOf(b, 8);
    const p = l.points[0]!;
    expect(l.relation).toBe('near');
    expect(p.kind).toBe('closest');
    expect(p.planDistance).toBeCloseTo(3, 9);
    expect(p.horizontalClearance).toBeCloseTo(2.6, 9);
    expect(p.governing).toBe('horizontal');
    expect(l.margin).toBeCloseTo(2, 9);
    expect(l.allowance).toBeCloseTo(0.4, 9);
    expect(p.station).toBeCloseTo(1103, 9);
    expect(p.beyond).toBe('end');
    expect(l.status).toBe('unverified');
    expect(l.suggestedHoles[0]).toMatchObject({ reason: 'closest_point', easting: 103, northing: 0 });
  });

  it('when a parallel line runs close beside the bore then its horizontal clearance governs', () => {
    // Line 9 parallel at y = −0.90 from x = 10 to 90 (right of the bore), OD 0.30, with a hole at (50, −0.9):
    // plan distance 0.90; horizontal clearance = 0.90 − 0.25 − 0.15 = 0.50 < 0.60 required → conflict (margin −0.10).
    const b = only(computeClearances(scene([bore()], [line(9, [[10, -0.9], [90, -0.9]])], [hole(9, 50, -0.9)])));
    const l = lineOf(b, 9);
    expect(l.clearance).toBeCloseTo(0.5, 9);
    expect(l.margin).toBeCloseTo(-0.1, 9);
    expect(l.points[0]!.side).toBe('R');
    expect(l.status).toBe('conflict');
  });

  it('when a parallel line lies right above the casing in plan then its 3-D gap against the vertical requirement governs', () => {
    // Line 10 parallel at y = 0.10 from x = 10 to 90 (plan footprints overlap: 0.10 < 0.25 + 0.15), hole top 92.00:
    // centrelines parallel, 0.10 apart in plan and 91.85 − 90 = 1.85 in height →
    // gap = √(0.10² + 1.85²) − 0.25 − 0.15 = 1.852701 − 0.40 = 1.452701 (vertical at the closest point: 1.45).
    // Required vertical 0.60, allowance 0.35 → clear. Closest point: the lowest-station end of the
    // equally close stretch, (10, 0.10), station 1010, where the hole is.
    const b = only(computeClearances(scene([bore()], [line(10, [[10, 0.1], [90, 0.1]])], [hole(10, 10, 0.1)])));
    const l = lineOf(b, 10);
    const p = l.points[0]!;
    expect(p.governing).toBe('vertical');
    expect(p.verticalClearance).toBeCloseTo(1.45, 9);
    expect(l.clearance).toBeCloseTo(Math.sqrt(0.01 + 1.85 * 1.85) - 0.4, 9);
    expect(p.station).toBeCloseTo(1010, 9);
    expect(l.status).toBe('clear');
  });

  it('when a line is far away then it is not reported', () => {
    // Line 11 at x = 150: 50 past the end; reporting limit = 0.60 + 0.10 + 0.30 + 3 = 4.00 of horizontal clearance.
    const b = only(computeClearances(scene([bore()], [line(11, [[150, -20], [150, 20]])], [])));
    expect(b.lines).toEqual([]);
  });
});

describe('pits', () => {
  // Launch pit behind the begin: square x −5…3, y −3…3, bottom 88.00.
  const pit = { id: 31, kind: 'launch' as const, footprint: [[-5, -3], [3, -3], [3, 3], [-5, 3]] as [number, number][], bottomElevation: 88 };

  it('when a line runs through the pit above its bottom then a pit conflict', () => {
    // Line 12 along x = −1 (inside the footprint), hole top 95.00 at (−1, 10), OD 0.20 → bottom 94.80,
    // 6.80 above the pit bottom → conflict, entering the pit.
    const b = only(computeClearances(scene([bore({ pits: [pit] })], [line(12, [[-1, -40], [-1, 40]], { diameter: 0.2 })], [hole(12, -1, 10, { depthToTop: 5 })])));
    expect(b.pitConflicts).toHaveLength(1);
    const c = b.pitConflicts[0]!;
    expect(c).toMatchObject({ pitId: 31, lineId: 12, enters: true, planGap: 0 });
    expect(c.lineBottom).toBeCloseTo(94.8, 9);
    expect(c.heightAbovePitBottom).toBeCloseTo(6.8, 9);
  });

  it('when a line passes outside the pit but within the owner\'s horizontal requirement then a pit conflict', () => {
    // Line 13 along x = −6.5: 1.50 from the pit's west wall; OD 0.20 → gap 1.40 < owner's 2.00 → conflict.
    const l13 = line(13, [[-6.5, -40], [-6.5, 40]], { diameter: 0.2, requiredHorizontal: 2 });
    const b = only(computeClearances(scene([bore({ pits: [pit] })], [l13], [hole(13, -6.5, 0, { depthToTop: 5 })])));
    expect(b.pitConflicts).toHaveLength(1);
    expect(b.pitConflicts[0]!.enters).toBe(false);
    expect(b.pitConflicts[0]!.planGap).toBeCloseTo(1.4, 9);
  });

  it('when a line runs through the pit below its bottom then no pit conflict', () => {
    // Line 14 along x = −3, top 87.00 (depth 13) → bottom 86.80 ≤ 88.00: below the pit bottom.
    const b = only(computeClearances(scene([bore({ pits: [pit] })], [line(14, [[-3, -40], [-3, 40]], { diameter: 0.2 })], [hole(14, -3, 0, { depthToTop: 13 })])));
    expect(b.pitConflicts).toEqual([]);
  });
});

describe('bore window', () => {
  it('when one line is above and one below then the shift range and its governing lines', () => {
    // Above: line 20 at x = 40 (station 1040), top 92.00, OD 0.30: clearance 1.45, margin 0.85 → up ≤ 0.85.
    // Below: line 21 (gas, QL A) at x = 60 (station 1060), top 88.00, OD 0.20: clearance
    // 89.75 − 88.00 = 1.75, margin 1.75 − 0.30 = 1.45 → down ≥ −1.45.
    // Cover: 100 − 90.25 − 1.00 = 8.75 everywhere > 0.85, so the line governs the top.
    // With allowance: up = 0.85 − 0.35 = 0.50; down = −(1.45 − (0.05 + 0.05)) = −1.35.
    // 2-D (pivot at 1000): δ + 40g ≤ 0.85 and −δ − 60g ≤ 1.45 meet at g = −0.115, δ = 5.45.
    const l20 = line(20, [[40, -20], [40, 20]]);
    const l21 = line(21, [[60, -20], [60, 20]], { kind: 'gas', qualityLevel: 'A', diameter: 0.2 });
    const b = only(computeClearances(scene([bore()], [l20, l21], [hole(20, 40, 0), hole(21, 60, 0, { depthToTop: 12 })])));
    const w = b.window!;
    expect(w.requirement.shift.up).toBeCloseTo(0.85, 9);
    expect(w.requirement.shift.down).toBeCloseTo(-1.45, 9);
    expect(w.requirement.shift.upGoverning).toEqual([20]);
    expect(w.requirement.shift.downGoverning).toEqual([21]);
    expect(w.requirement.shift.empty).toBe(false);
    expect(w.withAllowance.shift.up).toBeCloseTo(0.5, 9);
    expect(w.withAllowance.shift.down).toBeCloseTo(-1.35, 9);
    const hasVertex = w.requirement.polygon.vertices.some(([d, g]) => Math.abs(d - 5.45) < 1e-9 && Math.abs(g + 0.115) < 1e-12);
    expect(hasVertex).toBe(true);
  });

  it('when lines above and below leave no room then the window is empty, but a grade change can still work', () => {
    // Above: line 22 at station 1040, top 90.60, OD 0.30 → clearance 90.30 − 90.25 = 0.05, margin −0.55 → up ≤ −0.55.
    // Below: line 23 (gas) at station 1060, top 89.50, OD 0.20 → clearance 89.75 − 89.50 = 0.25,
    // margin −0.05 → down ≥ 0.05 > −0.55 → empty.
    // 2-D: δ + 40g ≤ −0.55 and δ + 60g ≥ 0.05 need 20g ≥ 0.60, g ≥ 0.03: e.g. g = 0.05, δ = −2.70 works
    // (cover: δ + 100g = 2.30 ≤ 8.75).
    const l22 = line(22, [[40, -20], [40, 20]]);
    const l23 = line(23, [[60, -20], [60, 20]], { kind: 'gas', diameter: 0.2 });
    const b = only(computeClearances(scene([bore()], [l22, l23], [hole(22, 40, 0, { depthToTop: 9.4 }), hole(23, 60, 0, { depthToTop: 10.5 })])));
    const w = b.window!;
    expect(w.requirement.shift.empty).toBe(true);
    expect(w.requirement.shift.up).toBeCloseTo(-0.55, 9);
    expect(w.requirement.shift.down).toBeCloseTo(0.05, 9);
    expect(w.requirement.shift.upGoverning).toEqual([22]);
    expect(w.requirement.shift.downGoverning).toEqual([23]);
    const vs = w.requirement.polygon.vertices;
    expect(vs.length).toBeGreaterThanOrEqual(3);
    for (const [, g] of vs) expect(g).toBeGreaterThanOrEqual(0.03 - 1e-12);
  });
});

describe('cover', () => {
  it('when the casing comes within the minimum cover then a bore warning', () => {
    // Profile rises to 98.00 at 1100; ground 100: cover = 100 − 98.25 = 1.75 < minimum 2.00 at station 1100.
    const b0 = bore({ minCover: 2, profile: [{ station: 1000, elevation: 90 }, { station: 1100, elevation: 98 }] });
    const b = only(computeClearances(scene([b0], [], [])));
    expect(b.cover).toEqual({ minimum: 1.75, station: 1100, belowMinimum: true });
    expect(b.warnings.map((w) => w.code)).toContain('COVER_BELOW_MINIMUM');
  });
});
