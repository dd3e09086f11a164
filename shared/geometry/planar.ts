/**
 * Small exact planar primitives in grid coordinates (easting x, northing y).
 * Grid coordinates are projected, so plain Euclidean math is right here; nothing in this
 * module assumes longitude/latitude.
 */

/** A grid point [easting, northing]. */
export type XY = readonly [number, number];

/** Relative tolerance on segment parameters, so a line through a shared vertex is not missed. */
export const PARAM_EPS = 1e-9;

/** Result of projecting a point onto a segment. */
export interface SegmentProjection {
  /** Unclamped parameter along the segment (0 at start, 1 at end). */
  t: number;
  /** Parameter clamped to [0, 1]. */
  tc: number;
  /** Squared distance from the point to the clamped foot. */
  d2: number;
}

/** Project point (px, py) onto segment (ax, ay)–(bx, by). A zero-length segment gives t = 0. */
export function projectOnSegment(
  ax: number, ay: number, bx: number, by: number, px: number, py: number,
): SegmentProjection {
  const dx = bx - ax;
  const dy = by - ay;
  const len2 = dx * dx + dy * dy;
  const t = len2 > 0 ? ((px - ax) * dx + (py - ay) * dy) / len2 : 0;
  const tc = t < 0 ? 0 : t > 1 ? 1 : t;
  const fx = ax + tc * dx - px;
  const fy = ay + tc * dy - py;
  return { t, tc, d2: fx * fx + fy * fy };
}

/** Intersection parameters of two segments, or null when they do not meet at a single point. */
export interface SegmentHit {
  /** Parameter along the first segment. */
  t: number;
  /** Parameter along the second segment. */
  u: number;
}

/**
 * Intersection of segment A (a→b) with segment B (c→d) by the cross-product form.
 * Parallel and collinear segments give null (a collinear overlap is a "near" line with zero
 * plan distance, handled by the distance code). Parameters within PARAM_EPS of the ends count,
 * and are clamped to [0, 1].
 */
export function segmentIntersection(
  ax: number, ay: number, bx: number, by: number,
  cx: number, cy: number, dx: number, dy: number,
): SegmentHit | null {
  const rx = bx - ax;
  const ry = by - ay;
  const sx = dx - cx;
  const sy = dy - cy;
  const denom = rx * sy - ry * sx;
  const scale = Math.hypot(rx, ry) * Math.hypot(sx, sy);
  if (scale === 0 || Math.abs(denom) <= 1e-12 * scale) return null;
  const qx = cx - ax;
  const qy = cy - ay;
  const t = (qx * sy - qy * sx) / denom;
  const u = (qx * ry - qy * rx) / denom;
  if (t < -PARAM_EPS || t > 1 + PARAM_EPS || u < -PARAM_EPS || u > 1 + PARAM_EPS) return null;
  return { t: Math.min(1, Math.max(0, t)), u: Math.min(1, Math.max(0, u)) };
}

/** Closest pair between two segments in plan. */
export interface SegmentPair {
  /** Plan distance between the segments (0 when they touch or cross). */
  distance: number;
  /** Parameter of the closest point on the first segment. */
  t: number;
  /** Parameter of the closest point on the second segment. */
  u: number;
}

/**
 * Tolerance below which two plan distances count as equal, scaled to the coordinates' size
 * (grid coordinates of millions of units carry rounding of about 1e-10 of their size).
 */
export function tieTolerance(...coords: number[]): number {
  let m = 1;
  for (const c of coords) m = Math.max(m, Math.abs(c));
  return 1e-11 * m;
}

/**
 * Least plan distance between segments A (a→b) and B (c→d), with the parameters of the closest
 * pair. When several pairs are equally close (parallel segments), the one with the smallest
 * parameter on A wins, so the answer does not depend on rounding.
 */
export function segmentSegmentDistance(
  ax: number, ay: number, bx: number, by: number,
  cx: number, cy: number, dx: number, dy: number,
): SegmentPair {
  const hit = segmentIntersection(ax, ay, bx, by, cx, cy, dx, dy);
  if (hit) return { distance: 0, t: hit.t, u: hit.u };
  // Otherwise the minimum is at an end of one of the two segments.
  const tol = tieTolerance(ax, ay, bx, by, cx, cy, dx, dy);
  const p1 = projectOnSegment(cx, cy, dx, dy, ax, ay);
  let bestD = Math.sqrt(p1.d2);
  let bestT = 0;
  let bestU = p1.tc;
  const p2 = projectOnSegment(cx, cy, dx, dy, bx, by);
  const d2 = Math.sqrt(p2.d2);
  if (d2 < bestD - tol) {
    bestD = d2; bestT = 1; bestU = p2.tc;
  }
  const p3 = projectOnSegment(ax, ay, bx, by, cx, cy);
  const d3 = Math.sqrt(p3.d2);
  if (d3 < bestD - tol || (d3 <= bestD + tol && p3.tc < bestT)) {
    bestD = d3; bestT = p3.tc; bestU = 0;
  }
  const p4 = projectOnSegment(ax, ay, bx, by, dx, dy);
  const d4 = Math.sqrt(p4.d2);
  if (d4 < bestD - tol || (d4 <= bestD + tol && p4.tc < bestT)) {
    bestD = d4; bestT = p4.tc; bestU = 1;
  }
  return { distance: bestD, t: bestT, u: bestU };
}

/** Least distance between two axis-aligned boxes (0 when they overlap). */
export function boxDistance(
  aMinX: number, aMinY: number, aMaxX: number, aMaxY: number,
  bMinX: number, bMinY: number, bMaxX: number, bMaxY: number,
): number {
  const dx = Math.max(0, bMinX - aMaxX, aMinX - bMaxX);
  const dy = Math.max(0, bMinY - aMaxY, aMinY - bMaxY);
  return Math.hypot(dx, dy);
}

/** Point-in-polygon by ray casting; the ring is closed implicitly. Points on an edge may go either way. */
export function pointInPolygon(x: number, y: number, ring: readonly XY[]): boolean {
  let inside = false;
  const n = ring.length;
  for (let i = 0, j = n - 1; i < n; j = i++) {
    const pi = ring[i]!;
    const pj = ring[j]!;
    if (pi[1] > y !== pj[1] > y) {
      const xCross = ((pj[0] - pi[0]) * (y - pi[1])) / (pj[1] - pi[1]) + pi[0];
      if (x < xCross) inside = !inside;
    }
  }
  return inside;
}

/** Acute angle in degrees (0–90) between two plan directions; 90 means perpendicular. */
export function acuteAngleDeg(ux: number, uy: number, vx: number, vy: number): number {
  const cross = Math.abs(ux * vy - uy * vx);
  const dot = Math.abs(ux * vx + uy * vy);
  return (Math.atan2(cross, dot) * 180) / Math.PI;
}

/** Plan distance from a point to a polyline (its nearest segment); Infinity for an empty path. */
export function pointPolylineDistance(p: XY, path: readonly XY[]): number {
  if (path.length === 1) return Math.hypot(p[0] - path[0]![0], p[1] - path[0]![1]);
  let best = Infinity;
  for (let i = 1; i < path.length; i++) {
    const a = path[i - 1]!;
    const b = path[i]!;
    best = Math.min(best, projectOnSegment(a[0], a[1], b[0], b[1], p[0], p[1]).d2);
  }
  return Math.sqrt(best);
}
