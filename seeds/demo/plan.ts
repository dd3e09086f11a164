/**
 * Plain planar geometry for checking the demo data: grid points, polylines, stations.
 * Deliberately independent of shared/geometry, so the demo is checked by a second, simple
 * implementation rather than by the code it is meant to exercise.
 */
import type { GridPoint, ProfilePoint } from '@shared/schemas/common';

export type Pt = GridPoint;

export function dist(a: Pt, b: Pt): number {
  return Math.hypot(b[0] - a[0], b[1] - a[1]);
}

export function polylineLength(path: Pt[]): number {
  let total = 0;
  for (let i = 1; i < path.length; i++) total += dist(path[i - 1]!, path[i]!);
  return total;
}

/** Closest point on segment ab to p, with the parameter t in [0, 1]. */
export function closestOnSegment(p: Pt, a: Pt, b: Pt): { point: Pt; t: number; distance: number } {
  const dx = b[0] - a[0];
  const dy = b[1] - a[1];
  const len2 = dx * dx + dy * dy;
  const t = len2 === 0 ? 0 : Math.max(0, Math.min(1, ((p[0] - a[0]) * dx + (p[1] - a[1]) * dy) / len2));
  const point: Pt = [a[0] + t * dx, a[1] + t * dy];
  return { point, t, distance: dist(p, point) };
}

/** Closest point of a polyline to p: the point, its distance along the polyline and from p. */
export function projectOnPolyline(p: Pt, path: Pt[]): { point: Pt; along: number; distance: number } {
  let best = { point: path[0]!, along: 0, distance: Infinity };
  let start = 0;
  for (let i = 1; i < path.length; i++) {
    const a = path[i - 1]!;
    const b = path[i]!;
    const c = closestOnSegment(p, a, b);
    if (c.distance < best.distance) best = { point: c.point, along: start + c.t * dist(a, b), distance: c.distance };
    start += dist(a, b);
  }
  return best;
}

/** The point at a distance along a polyline (clamped to its ends). */
export function pointAlong(path: Pt[], along: number): Pt {
  let start = 0;
  for (let i = 1; i < path.length; i++) {
    const a = path[i - 1]!;
    const b = path[i]!;
    const len = dist(a, b);
    if (along <= start + len || i === path.length - 1) {
      const t = len === 0 ? 0 : Math.max(0, Math.min(1, (along - start) / len));
      return [a[0] + t * (b[0] - a[0]), a[1] + t * (b[1] - a[1])];
    }
    start += len;
  }
  return path[path.length - 1]!;
}

/** Unit direction of the polyline segment that holds `along`. */
export function directionAt(path: Pt[], along: number): Pt {
  let start = 0;
  for (let i = 1; i < path.length; i++) {
    const a = path[i - 1]!;
    const b = path[i]!;
    const len = dist(a, b);
    if (along <= start + len || i === path.length - 1) return [(b[0] - a[0]) / len, (b[1] - a[1]) / len];
    start += len;
  }
  throw new Error('empty polyline');
}

/** Intersection of segments ab and cd (proper or touching), with both parameters. */
export function segmentIntersection(a: Pt, b: Pt, c: Pt, d: Pt): { point: Pt; t: number; u: number } | null {
  const r: Pt = [b[0] - a[0], b[1] - a[1]];
  const s: Pt = [d[0] - c[0], d[1] - c[1]];
  const den = r[0] * s[1] - r[1] * s[0];
  if (Math.abs(den) < 1e-12) return null;
  const qp: Pt = [c[0] - a[0], c[1] - a[1]];
  const t = (qp[0] * s[1] - qp[1] * s[0]) / den;
  const u = (qp[0] * r[1] - qp[1] * r[0]) / den;
  if (t < 0 || t > 1 || u < 0 || u > 1) return null;
  return { point: [a[0] + t * r[0], a[1] + t * r[1]], t, u };
}

/** Every plan crossing of two polylines, with the distance along each. */
export function polylineCrossings(p: Pt[], q: Pt[]): { point: Pt; alongP: number; alongQ: number }[] {
  const out: { point: Pt; alongP: number; alongQ: number }[] = [];
  let sp = 0;
  for (let i = 1; i < p.length; i++) {
    let sq = 0;
    for (let j = 1; j < q.length; j++) {
      const x = segmentIntersection(p[i - 1]!, p[i]!, q[j - 1]!, q[j]!);
      if (x) out.push({ point: x.point, alongP: sp + x.t * dist(p[i - 1]!, p[i]!), alongQ: sq + x.u * dist(q[j - 1]!, q[j]!) });
      sq += dist(q[j - 1]!, q[j]!);
    }
    sp += dist(p[i - 1]!, p[i]!);
  }
  return out;
}

/** Least distance between two polylines that do not cross, and where it occurs on each. */
export function polylineGap(p: Pt[], q: Pt[]): { distance: number; onP: Pt; onQ: Pt } {
  let best = { distance: Infinity, onP: p[0]!, onQ: q[0]! };
  for (const v of p) {
    const c = projectOnPolyline(v, q);
    if (c.distance < best.distance) best = { distance: c.distance, onP: v, onQ: c.point };
  }
  for (const v of q) {
    const c = projectOnPolyline(v, p);
    if (c.distance < best.distance) best = { distance: c.distance, onP: c.point, onQ: v };
  }
  return best;
}

/**
 * Station and signed offset (+ right looking up-station) of a point on an alignment whose
 * first vertex carries `beginStation`. Points are taken to their nearest foot on the polyline.
 */
export function stationOffset(alignment: Pt[], beginStation: number, p: Pt): { station: number; offset: number } {
  const c = projectOnPolyline(p, alignment);
  const dir = directionAt(alignment, c.along);
  // right of (dx, dy) is (dy, -dx)
  const offset = (p[0] - c.point[0]) * dir[1] - (p[1] - c.point[1]) * dir[0];
  return { station: beginStation + c.along, offset };
}

/** Inverse of stationOffset: grid point at a station and signed offset (+ right). */
export function fromStationOffset(alignment: Pt[], beginStation: number, station: number, offset: number): Pt {
  const along = station - beginStation;
  const foot = pointAlong(alignment, along);
  const dir = directionAt(alignment, along);
  return [foot[0] + offset * dir[1], foot[1] - offset * dir[0]];
}

/** Linear interpolation in a station-ordered profile, held flat beyond its ends. */
export function profileAt(profile: ProfilePoint[], station: number): number {
  if (profile.length === 0) return NaN;
  if (station <= profile[0]!.station) return profile[0]!.elevation;
  for (let i = 1; i < profile.length; i++) {
    const a = profile[i - 1]!;
    const b = profile[i]!;
    if (station <= b.station) return a.elevation + ((station - a.station) / (b.station - a.station)) * (b.elevation - a.elevation);
  }
  return profile[profile.length - 1]!.elevation;
}

/** Ray-casting point-in-polygon for a ring given without its closing vertex. */
export function insideRing(p: Pt, ring: Pt[]): boolean {
  let inside = false;
  for (let i = 0, j = ring.length - 1; i < ring.length; j = i++) {
    const a = ring[i]!;
    const b = ring[j]!;
    if (a[1] > p[1] !== b[1] > p[1] && p[0] < ((b[0] - a[0]) * (p[1] - a[1])) / (b[1] - a[1]) + a[0]) inside = !inside;
  }
  return inside;
}

/** Acute angle in degrees between two directions. */
export function acuteAngle(u: Pt, v: Pt): number {
  const c = Math.abs(u[0] * v[0] + u[1] * v[1]) / (Math.hypot(...u) * Math.hypot(...v));
  return (Math.acos(Math.min(1, c)) * 180) / Math.PI;
}
