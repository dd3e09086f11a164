/**
 * The bore window (SPEC §4.10): how far the whole profile can move and still keep every crossed
 * line clear on its current side.
 *
 * Parametrisation: the new centreline is c'(s) = c(s) + shift + gradeChange × (s − pivot), with
 * the pivot at the bore's begin station; gradeChange is a ratio (0.01 = 1 %). At a crossing at
 * station s with margin m (clearance − required, optionally less the allowance):
 *   line above: shift + g·(s − pivot) ≤ m      line below: −shift − g·(s − pivot) ≤ m
 * Minimum cover adds, at every break of the bore or ground profile:
 *   shift + g·(s − pivot) ≤ ground(s) − (c(s) + radius) − minCover
 * (cover is linear between breaks, so the breaks suffice). The 1-D window is the g = 0 slice.
 */
import type { ShiftWindow, WindowPolygon } from './types';

/** A crossed line's vertical constraint at one station. */
export interface VerticalConstraint {
  lineId: number;
  station: number;
  position: 'above' | 'below';
  /** Clearance − required (current profile). */
  margin: number;
  allowance: number;
}

/** Spare cover at one station: ground − (centreline + radius) − minimum cover. */
export interface CoverConstraint {
  station: number;
  slack: number;
}

const near = (a: number, b: number): boolean => Math.abs(a - b) <= 1e-9 * Math.max(1, Math.abs(a), Math.abs(b));

/** Range of whole-profile vertical shift [down, up] with the lines (and cover) that govern each limit. */
export function shiftWindow(
  constraints: readonly VerticalConstraint[], cover: readonly CoverConstraint[], useAllowance: boolean,
): ShiftWindow {
  let up: number | null = null;
  let down: number | null = null;
  let coverStation: number | null = null;
  for (const c of constraints) {
    const m = c.margin - (useAllowance ? c.allowance : 0);
    if (c.position === 'above') up = up === null ? m : Math.min(up, m);
    else down = down === null ? -m : Math.max(down, -m);
  }
  for (const k of cover) {
    if (up === null || k.slack < up) {
      up = k.slack;
    }
  }
  const upGoverning: number[] = [];
  const downGoverning: number[] = [];
  for (const c of constraints) {
    const m = c.margin - (useAllowance ? c.allowance : 0);
    if (c.position === 'above' && up !== null && near(m, up) && !upGoverning.includes(c.lineId)) upGoverning.push(c.lineId);
    if (c.position === 'below' && down !== null && near(-m, down) && !downGoverning.includes(c.lineId)) downGoverning.push(c.lineId);
  }
  for (const k of cover) {
    if (up !== null && near(k.slack, up) && coverStation === null) coverStation = k.station;
  }
  return {
    empty: up !== null && down !== null && down > up,
    down,
    up,
    downGoverning: downGoverning.sort((a, b) => a - b),
    upGoverning: upGoverning.sort((a, b) => a - b),
    upGovernedByCover: coverStation !== null,
    coverStation,
  };
}

type V2 = [number, number];

/** Clip a convex polygon by the half-plane a·x + b·y ≤ c (Sutherland–Hodgman, one edge). */
function clip(poly: V2[], a: number, b: number, c: number): V2[] {
  const out: V2[] = [];
  const n = poly.length;
  const scale = Math.max(Math.abs(c), 1) * 1e-12;
  for (let i = 0; i < n; i++) {
    const p = poly[i]!;
    const q = poly[(i + 1) % n]!;
    const fp = a * p[0] + b * p[1] - c;
    const fq = a * q[0] + b * q[1] - c;
    const pin = fp <= scale;
    const qin = fq <= scale;
    if (pin) out.push(p);
    if (pin !== qin) {
      const t = fp / (fp - fq);
      out.push([p[0] + t * (q[0] - p[0]), p[1] + t * (q[1] - p[1])]);
    }
  }
  // Drop repeated vertices produced by clipping through a corner.
  const dedup: V2[] = [];
  for (const v of out) {
    const last = dedup[dedup.length - 1];
    if (!last || !(near(last[0], v[0]) && near(last[1], v[1]))) dedup.push(v);
  }
  const first = dedup[0];
  const last = dedup[dedup.length - 1];
  if (dedup.length > 1 && first && last && near(first[0], last[0]) && near(first[1], last[1])) dedup.pop();
  return dedup;
}

/**
 * The feasible (shift, grade change) polygon from the constraints' half-planes, bounded by the
 * search box |shift| ≤ shiftBound, |gradeChange| ≤ gradeBound. Empty when nothing is feasible.
 */
export function windowPolygon(
  constraints: readonly VerticalConstraint[],
  cover: readonly CoverConstraint[],
  pivotStation: number,
  useAllowance: boolean,
  shiftBound = 100,
  gradeBound = 0.25,
): WindowPolygon {
  let poly: V2[] = [
    [-shiftBound, -gradeBound],
    [shiftBound, -gradeBound],
    [shiftBound, gradeBound],
    [-shiftBound, gradeBound],
  ];
  for (const c of constraints) {
    if (poly.length === 0) break;
    const m = c.margin - (useAllowance ? c.allowance : 0);
    const lever = c.station - pivotStation;
    poly = c.position === 'above' ? clip(poly, 1, lever, m) : clip(poly, -1, -lever, m);
  }
  for (const k of cover) {
    if (poly.length === 0) break;
    poly = clip(poly, 1, k.station - pivotStation, k.slack);
  }
  if (poly.length < 3) poly = [];
  return { pivotStation, vertices: poly, shiftBound, gradeBound };
}
