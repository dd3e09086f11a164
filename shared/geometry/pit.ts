/**
 * Plan geometry of pits against lines (SPEC §4.7): does the line's plan path enter the pit
 * footprint, and how close does it come. The elevation test (above the pit bottom) is done by
 * the engine with the line's elevation model.
 */
import { pointInPolygon, segmentIntersection, segmentSegmentDistance, type XY } from './planar';
import type { PreparedPolyline } from './polyline';
import type { Issue, PitInput } from './types';

/** A pit whose footprint passed the checks. */
export interface PreparedPit {
  input: PitInput;
  ring: XY[];
  bbox: [number, number, number, number];
}

/** Check a pit footprint: at least three corners, finite, closure implied (a repeated closing corner is dropped). */
export function preparePit(pit: PitInput, boreId: number): PreparedPit | Issue {
  const ring = Array.isArray(pit.footprint) ? pit.footprint.map((p) => [p[0], p[1]] as XY) : [];
  const first = ring[0];
  const last = ring[ring.length - 1];
  if (ring.length > 1 && first && last && first[0] === last[0] && first[1] === last[1]) ring.pop();
  if (ring.length < 3 || ring.some((p) => !Number.isFinite(p[0]) || !Number.isFinite(p[1])) || !Number.isFinite(pit.bottomElevation)) {
    return {
      code: 'PIT_INVALID',
      message: `pit ${pit.id} needs a footprint of at least three finite corners and a finite bottom elevation; it is not checked`,
      boreId,
      pitId: pit.id,
    };
  }
  let minX = Infinity, minY = Infinity, maxX = -Infinity, maxY = -Infinity;
  for (const [x, y] of ring) {
    minX = Math.min(minX, x); maxX = Math.max(maxX, x);
    minY = Math.min(minY, y); maxY = Math.max(maxY, y);
  }
  return { input: pit, ring, bbox: [minX, minY, maxX, maxY] };
}

/** How a line's plan path relates to a pit footprint. */
export interface PitPlanRelation {
  /** True when the centreline enters the footprint (crosses or touches an edge, or has a vertex inside). */
  entersCentreline: boolean;
  /** Least plan distance from the centreline to the footprint (0 when it enters). */
  distance: number;
  /** Closest point on the line (chainage and grid position). */
  chainage: number;
  x: number;
  y: number;
  /** Chainages where the line is at or inside the footprint (edge crossings, inside vertices). */
  insideChainages: number[];
}

/** Plan relation of the given segments of a line (kept-segment indices) to a pit footprint. */
export function pitPlanRelation(pit: PreparedPit, poly: PreparedPolyline, segments: readonly number[]): PitPlanRelation {
  const ring = pit.ring;
  let best = Infinity;
  let bestChainage = 0;
  let bestX = 0;
  let bestY = 0;
  const inside: number[] = [];
  for (const j of segments) {
    const ax = poly.xs[j]!, ay = poly.ys[j]!, bx = poly.xs[j + 1]!, by = poly.ys[j + 1]!;
    const segLen = poly.cum[j + 1]! - poly.cum[j]!;
    if (pointInPolygon(ax, ay, ring)) inside.push(poly.cum[j]!);
    if (pointInPolygon(bx, by, ring)) inside.push(poly.cum[j + 1]!);
    for (let e = 0; e < ring.length; e++) {
      const p = ring[e]!;
      const q = ring[(e + 1) % ring.length]!;
      const hit = segmentIntersection(ax, ay, bx, by, p[0], p[1], q[0], q[1]);
      if (hit) inside.push(poly.cum[j]! + hit.t * segLen);
      const d = segmentSegmentDistance(ax, ay, bx, by, p[0], p[1], q[0], q[1]);
      if (d.distance < best) {
        best = d.distance;
        bestChainage = poly.cum[j]! + d.t * segLen;
        bestX = ax + d.t * (bx - ax);
        bestY = ay + d.t * (by - ay);
      }
    }
  }
  const enters = inside.length > 0;
  if (enters) {
    best = 0;
    const c = Math.min(...inside);
    const j = segmentContaining(poly, segments, c);
    const f = (c - poly.cum[j]!) / (poly.cum[j + 1]! - poly.cum[j]!);
    bestChainage = c;
    bestX = poly.xs[j]! + f * (poly.xs[j + 1]! - poly.xs[j]!);
    bestY = poly.ys[j]! + f * (poly.ys[j + 1]! - poly.ys[j]!);
  }
  inside.sort((a, b) => a - b);
  return { entersCentreline: enters, distance: best, chainage: bestChainage, x: bestX, y: bestY, insideChainages: inside };
}

function segmentContaining(poly: PreparedPolyline, segments: readonly number[], chainage: number): number {
  for (const j of segments) if (chainage >= poly.cum[j]! && chainage <= poly.cum[j + 1]!) return j;
  return segments[0] ?? 0;
}
