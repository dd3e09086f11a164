/**
 * Property tests of the clearance engine (fast-check): invariance under moving the whole scene,
 * vertical clearance = 3-D clear distance for level lines, and the window's 1-D/2-D agreement.
 */
import { describe, it, expect } from 'vitest';
import fc from 'fast-check';
import {
  computeClearances, shiftWindow, windowPolygon, type ClearanceInput, type VerticalConstraint, type CoverConstraint,
} from '../../shared/geometry';
import { RULES, SETTINGS, makeScene, transform } from './fixtures';

type Pt = [number, number];

const sceneArb = fc.record({
  legs: fc.array(fc.tuple(fc.double({ min: 40, max: 150, noNaN: true }), fc.double({ min: -0.8, max: 0.8, noNaN: true })), { minLength: 1, maxLength: 3 }),
  profile: fc.array(fc.double({ min: 85, max: 95, noNaN: true }), { minLength: 2, maxLength: 4 }),
  crossings: fc.array(
    fc.record({
      f: fc.double({ min: 0.1, max: 0.9, noNaN: true }),
      angle: fc.double({ min: 0.3, max: Math.PI - 0.3, noNaN: true }),
      top: fc.double({ min: 82, max: 98, noNaN: true }),
      holeAt: fc.double({ min: -6, max: 6, noNaN: true }),
      box: fc.boolean(),
    }),
    { minLength: 1, maxLength: 4 },
  ),
  nearOffset: fc.double({ min: 0.5, max: 5, noNaN: true }),
});

const close = (a: number | null, b: number | null, tol: number) => (a === null ? b === null : b !== null && Math.abs(a - b) <= tol);

describe('invariance', () => {
  it('when the whole scene is translated and rotated then every figure and status is unchanged', () => {
    // Plan geometry is Euclidean in the grid (SPEC §4): rigid motions preserve distances, angles and sides.
    fc.assert(
      fc.property(sceneArb, fc.double({ min: -Math.PI, max: Math.PI, noNaN: true }), fc.double({ min: -3e6, max: 3e6, noNaN: true }), fc.double({ min: -3e6, max: 3e6, noNaN: true }),
        (params, theta, tx, ty) => {
          const input = makeScene(params);
          const a = computeClearances(input).bores[0]!;
          const b = computeClearances(transform(input, theta, tx, ty)).bores[0]!;
          const tol = 1e-6;
          // Same lines reported (order may differ where two lines cross at the same station).
          const byId = (ls: typeof a.lines) => [...ls].sort((x, y) => x.lineId - y.lineId);
          expect(byId(b.lines).map((l) => l.lineId)).toEqual(byId(a.lines).map((l) => l.lineId));
          byId(a.lines).forEach((la, i) => {
            const lb = byId(b.lines)[i]!;
            expect(lb.status).toBe(la.status);
            expect(lb.relation).toBe(la.relation);
            expect(close(la.clearance, lb.clearance, tol)).toBe(true);
            expect(close(la.margin, lb.margin, tol)).toBe(true);
            expect(close(la.clearDistance3d, lb.clearDistance3d, tol)).toBe(true);
            expect(lb.allowance).toBeCloseTo(la.allowance, 6);
            la.points.forEach((pa, k) => {
              const pb = lb.points[k]!;
              expect(pb.station).toBeCloseTo(pa.station, 6);
              expect(pb.offset).toBeCloseTo(pa.offset, 6);
              if (pa.offset > 1e-6) expect(pb.side).toBe(pa.side);
              expect(close(pa.crossingAngle, pb.crossingAngle, 1e-6)).toBe(true);
            });
          });
          expect(b.pitConflicts.map((c) => [c.pitId, c.lineId])).toEqual(a.pitConflicts.map((c) => [c.pitId, c.lineId]));
          expect(close(a.window!.requirement.shift.up, b.window!.requirement.shift.up, tol)).toBe(true);
          expect(close(a.window!.requirement.shift.down, b.window!.requirement.shift.down, tol)).toBe(true);
        }),
      { numRuns: Number(process.env.PROPERTY_RUNS ?? 60) },
    );
  });
});

describe('level lines', () => {
  it('when a level line crosses a level bore then vertical clearance = 3-D clear distance (round and box)', () => {
    // SPEC §4.5: two level centrelines that cross in plan are closest where they cross, at the
    // height difference; minus the casing radius and the line's half-height this is the vertical clearance.
    fc.assert(
      fc.property(
        fc.double({ min: 80, max: 95, noNaN: true }), fc.double({ min: 75, max: 99, noNaN: true }), fc.double({ min: 0.1, max: 0.9, noNaN: true }),
        fc.boolean(), fc.double({ min: 0.1, max: 2, noNaN: true }), fc.double({ min: 0.1, max: 3, noNaN: true }), fc.double({ min: 0.2, max: 2, noNaN: true }),
        fc.constantFrom(Math.PI / 2, Math.PI / 3, 1.2, 0.4),
        (boreZ, top, f, box, size, width, od, angle) => {
          const cx = 100 * f;
          const path: Pt[] = [[cx - 40 * Math.cos(angle), -40 * Math.sin(angle)], [cx + 40 * Math.cos(angle), 40 * Math.sin(angle)]];
          const input: ClearanceInput = {
            unit: 'm', settings: SETTINGS, rules: RULES,
            bores: [{ id: 1, name: 'L', alignment: [[0, 0], [100, 0]], beginStation: 0, profile: [{ station: 0, elevation: boreZ }, { station: 100, elevation: boreZ }],
              groundProfile: [{ station: 0, elevation: 100 }, { station: 100, elevation: 100 }], casingOd: od, toleranceHorizontal: 0.1, toleranceVertical: 0.1, minCover: 0, pits: [] }],
            lines: [{ id: 1, label: 'A', kind: 'water', shape: box ? 'box' : 'round', diameter: box ? null : size, width: box ? width : null, height: box ? size : null,
              qualityLevel: 'A', path, recordDepth: 1, requiredVertical: null, requiredHorizontal: null }],
            holes: [{ id: 1, number: '1', lineId: 1, status: 'dug', easting: cx, northing: 0, approximate: false, groundElevation: 100, depthToTop: 100 - top,
              depthReference: 'top', surveyedEasting: null, surveyedNorthing: null, surveyedTopElevation: null }],
          };
          const p = computeClearances(input).bores[0]!.lines[0]!.points[0]!;
          expect(p.kind).toBe('crossing');
          expect(Math.abs(p.verticalClearance! - p.clearDistance3d!)).toBeLessThan(1e-9);
        },
      ),
      { numRuns: 200 },
    );
  });
});

describe('window', () => {
  it('when the 2-D polygon is cut at grade change 0 then it gives the 1-D shift range', () => {
    const constraint = fc.record({
      lineId: fc.integer({ min: 1, max: 9 }),
      station: fc.double({ min: 0, max: 500, noNaN: true }),
      position: fc.constantFrom('above' as const, 'below' as const),
      margin: fc.double({ min: -5, max: 5, noNaN: true }),
      allowance: fc.double({ min: 0, max: 1, noNaN: true }),
    });
    const cover = fc.record({ station: fc.double({ min: 0, max: 500, noNaN: true }), slack: fc.double({ min: -2, max: 10, noNaN: true }) });
    fc.assert(
      fc.property(fc.array(constraint, { maxLength: 6 }), fc.array(cover, { maxLength: 3 }), fc.boolean(), (cs: VerticalConstraint[], cov: CoverConstraint[], allow) => {
        const w = shiftWindow(cs, cov, allow);
        const poly = windowPolygon(cs, cov, 0, allow, 100, 0.25);
        // Slice of the convex polygon at g = 0.
        let lo = Infinity;
        let hi = -Infinity;
        const v = poly.vertices;
        for (let i = 0; i < v.length; i++) {
          const [d0, g0] = v[i]!;
          const [d1, g1] = v[(i + 1) % v.length]!;
          if (g0 === 0) { lo = Math.min(lo, d0); hi = Math.max(hi, d0); }
          if ((g0 < 0 && g1 > 0) || (g0 > 0 && g1 < 0)) {
            const d = d0 + ((0 - g0) * (d1 - d0)) / (g1 - g0);
            lo = Math.min(lo, d); hi = Math.max(hi, d);
          }
        }
        const down = Math.max(w.down ?? -100, -100);
        const up = Math.min(w.up ?? 100, 100);
        if (w.empty || down > up) {
          expect(lo === Infinity || hi - lo < 1e-7).toBe(true);
        } else if (up - down > 1e-6) {
          expect(lo).toBeCloseTo(down, 6);
          expect(hi).toBeCloseTo(up, 6);
        }
      }),
      { numRuns: 300 },
    );
  });
});
