/**
 * A plan polyline prepared once for repeated measurement: zero-length segments dropped,
 * cumulative chainage (distance along the line from its first vertex) precomputed.
 */
import { GeometryError } from './errors';
import { projectOnSegment, type XY } from './planar';

/** A polyline ready for chainage queries. Segment k runs from vertex k to vertex k + 1. */
export interface PreparedPolyline {
  /** Eastings of the kept vertices. */
  readonly xs: Float64Array;
  /** Northings of the kept vertices. */
  readonly ys: Float64Array;
  /** Chainage of each kept vertex (cum[0] = 0). */
  readonly cum: Float64Array;
  /** Total plan length. */
  readonly length: number;
  /** Index in the caller's polyline of the segment each kept segment came from. */
  readonly sourceSegment: Int32Array;
  /** Number of kept segments. */
  readonly segmentCount: number;
  /** Bounding box [minX, minY, maxX, maxY]. */
  readonly bbox: readonly [number, number, number, number];
}

/**
 * Prepare a polyline. Consecutive repeated vertices (zero-length segments) are skipped;
 * fewer than two distinct vertices, or any non-finite coordinate, throws `errorCode`.
 */
export function preparePolyline(
  points: readonly XY[],
  what = 'polyline',
  errorCode: 'DEGENERATE_POLYLINE' | 'DEGENERATE_ALIGNMENT' = 'DEGENERATE_POLYLINE',
): PreparedPolyline {
  if (!Array.isArray(points)) throw new GeometryError(errorCode, `${what} must be a list of [easting, northing] points`);
  const xs: number[] = [];
  const ys: number[] = [];
  const src: number[] = [];
  for (let i = 0; i < points.length; i++) {
    const p = points[i];
    if (!p || p.length < 2 || !Number.isFinite(p[0]) || !Number.isFinite(p[1])) {
      throw new GeometryError('INVALID_NUMBER', `${what}: vertex ${i + 1} is not a pair of finite numbers`, { vertex: i });
    }
    const n = xs.length;
    if (n > 0 && xs[n - 1] === p[0] && ys[n - 1] === p[1]) continue;
    if (n > 0) src.push(i - 1);
    xs.push(p[0]);
    ys.push(p[1]);
  }
  if (xs.length < 2) {
    throw new GeometryError(
      errorCode,
      `${what} needs at least two distinct vertices (got ${xs.length})`,
      { distinctVertices: xs.length },
    );
  }
  const cum = new Float64Array(xs.length);
  let minX = Infinity, minY = Infinity, maxX = -Infinity, maxY = -Infinity;
  for (let i = 0; i < xs.length; i++) {
    const x = xs[i]!;
    const y = ys[i]!;
    if (i > 0) cum[i] = cum[i - 1]! + Math.hypot(x - xs[i - 1]!, y - ys[i - 1]!);
    if (x < minX) minX = x;
    if (x > maxX) maxX = x;
    if (y < minY) minY = y;
    if (y > maxY) maxY = y;
  }
  return {
    xs: Float64Array.from(xs),
    ys: Float64Array.from(ys),
    cum,
    length: cum[cum.length - 1]!,
    sourceSegment: Int32Array.from(src),
    segmentCount: xs.length - 1,
    bbox: [minX, minY, maxX, maxY],
  };
}

/** The closest point of a polyline to a point. */
export interface PolylineFoot {
  /** Chainage of the closest point (clamped to [0, length]). */
  chainage: number;
  /** Plan distance from the point to the polyline. */
  distance: number;
  /** Kept-segment index of the closest point. */
  segment: number;
  /** Unclamped parameter along that segment. */
  t: number;
  /** Easting of the closest point. */
  x: number;
  /** Northing of the closest point. */
  y: number;
}

/** Closest point of the polyline to (px, py); ties go to the earlier segment. */
export function closestOnPolyline(poly: PreparedPolyline, px: number, py: number): PolylineFoot {
  let best = Infinity;
  let bestSeg = 0;
  let bestT = 0;
  let bestTc = 0;
  for (let k = 0; k < poly.segmentCount; k++) {
    const pr = projectOnSegment(poly.xs[k]!, poly.ys[k]!, poly.xs[k + 1]!, poly.ys[k + 1]!, px, py);
    if (pr.d2 < best) {
      best = pr.d2;
      bestSeg = k;
      bestT = pr.t;
      bestTc = pr.tc;
    }
  }
  const segLen = poly.cum[bestSeg + 1]! - poly.cum[bestSeg]!;
  const x = poly.xs[bestSeg]! + bestTc * (poly.xs[bestSeg + 1]! - poly.xs[bestSeg]!);
  const y = poly.ys[bestSeg]! + bestTc * (poly.ys[bestSeg + 1]! - poly.ys[bestSeg]!);
  return { chainage: poly.cum[bestSeg]! + bestTc * segLen, distance: Math.sqrt(best), segment: bestSeg, t: bestT, x, y };
}

/** Kept-segment index holding `chainage` (end segments for values outside [0, length]). */
export function segmentAtChainage(poly: PreparedPolyline, chainage: number): number {
  let lo = 0;
  let hi = poly.segmentCount - 1;
  while (lo < hi) {
    const mid = (lo + hi + 1) >> 1;
    if (poly.cum[mid]! <= chainage) lo = mid;
    else hi = mid - 1;
  }
  return lo;
}

/**
 * Grid point at a chainage. Values before 0 or past the length run along the extended end
 * segment (the caller decides whether that is allowed).
 */
export function pointAtChainage(poly: PreparedPolyline, chainage: number): { x: number; y: number; segment: number; ux: number; uy: number } {
  const k = segmentAtChainage(poly, chainage);
  const x0 = poly.xs[k]!;
  const y0 = poly.ys[k]!;
  const len = poly.cum[k + 1]! - poly.cum[k]!;
  const ux = (poly.xs[k + 1]! - x0) / len;
  const uy = (poly.ys[k + 1]! - y0) / len;
  const along = chainage - poly.cum[k]!;
  return { x: x0 + ux * along, y: y0 + uy * along, segment: k, ux, uy };
}
