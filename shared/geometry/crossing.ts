/**
 * Plan relation of a line to a bore alignment (SPEC §4.5–4.6): exact segment intersections in
 * grid coordinates (crossings, with the acute crossing angle), or the closest pair of points.
 */
import type { BoreContext } from './bore-context';
import { acuteAngleDeg, segmentIntersection, segmentSegmentDistance, tieTolerance } from './planar';
import type { LineContext } from './scene';

/** A place where a line meets (crossing) or comes closest to (closest) a bore in plan. */
export interface PlanPoint {
  kind: 'crossing' | 'closest';
  boreChainage: number;
  lineChainage: number;
  x: number;
  y: number;
  planDistance: number;
  angle: number | null;
}


/** Every plan crossing of the line's given segments with the alignment, in station order (duplicates at shared vertices merged). */
export function findCrossings(b: BoreContext, l: LineContext, segs: readonly number[]): PlanPoint[] {
  const a = b.align;
  const p = l.poly;
  const raw: PlanPoint[] = [];
  for (const j of segs) {
    const lx0 = p.xs[j]!, ly0 = p.ys[j]!, lx1 = p.xs[j + 1]!, ly1 = p.ys[j + 1]!;
    const lLen = p.cum[j + 1]! - p.cum[j]!;
    for (let i = 0; i < a.segmentCount; i++) {
      const ax0 = a.xs[i]!, ay0 = a.ys[i]!, ax1 = a.xs[i + 1]!, ay1 = a.ys[i + 1]!;
      const hit = segmentIntersection(ax0, ay0, ax1, ay1, lx0, ly0, lx1, ly1);
      if (!hit) continue;
      raw.push({
        kind: 'crossing',
        boreChainage: a.cum[i]! + hit.t * (a.cum[i + 1]! - a.cum[i]!),
        lineChainage: p.cum[j]! + hit.u * lLen,
        x: ax0 + hit.t * (ax1 - ax0),
        y: ay0 + hit.t * (ay1 - ay0),
        planDistance: 0,
        angle: acuteAngleDeg(ax1 - ax0, ay1 - ay0, lx1 - lx0, ly1 - ly0),
      });
    }
  }
  raw.sort((u, v) => u.boreChainage - v.boreChainage || u.lineChainage - v.lineChainage);
  const eps = 1e-9 * Math.max(1, a.length, p.length);
  const out: PlanPoint[] = [];
  for (const r of raw) {
    if (out.some((o) => Math.abs(o.boreChainage - r.boreChainage) <= eps && Math.abs(o.lineChainage - r.lineChainage) <= eps)) continue;
    out.push(r);
  }
  return out;
}


/** The closest pair between the line's given segments and the alignment (ties: lowest bore station). */
export function findClosest(b: BoreContext, l: LineContext, segs: readonly number[]): PlanPoint {
  const a = b.align;
  const p = l.poly;
  let best: PlanPoint | null = null;
  for (const j of segs) {
    const lx0 = p.xs[j]!, ly0 = p.ys[j]!, lx1 = p.xs[j + 1]!, ly1 = p.ys[j + 1]!;
    for (let i = 0; i < a.segmentCount; i++) {
      const d = segmentSegmentDistance(a.xs[i]!, a.ys[i]!, a.xs[i + 1]!, a.ys[i + 1]!, lx0, ly0, lx1, ly1);
      const boreChainage = a.cum[i]! + d.t * (a.cum[i + 1]! - a.cum[i]!);
      // Equally close stretches (parallel lines): the lowest bore station wins, whatever the rounding.
      const tol = tieTolerance(lx0, ly0, a.xs[i]!, a.ys[i]!);
      if (best === null || d.distance < best.planDistance - tol || (d.distance <= best.planDistance + tol && boreChainage < best.boreChainage)) {
        best = {
          kind: 'closest',
          boreChainage,
          lineChainage: p.cum[j]! + d.u * (p.cum[j + 1]! - p.cum[j]!),
          x: lx0 + d.u * (lx1 - lx0),
          y: ly0 + d.u * (ly1 - ly0),
          planDistance: d.distance,
          angle: null,
        };
      }
    }
  }
  return best!;
}

