/**
 * Closest approach of 3-D segments and polylines (for the true clear distance, SPEC §4.5).
 * Segment–segment distance after Ericson, "Real-Time Collision Detection" (2005), §5.1.9.
 */

/** A 3-D point as separate coordinates (callers subtract a local origin first for precision). */
export interface P3 {
  x: number;
  y: number;
  z: number;
}

const clamp01 = (v: number): number => (v < 0 ? 0 : v > 1 ? 1 : v);

/** Least distance between 3-D segments p1–q1 and p2–q2 (degenerate segments are points). */
export function segmentDistance3d(p1: P3, q1: P3, p2: P3, q2: P3): number {
  return segmentDistance3dXYZ(p1.x, p1.y, p1.z, q1.x, q1.y, q1.z, p2.x, p2.y, p2.z, q2.x, q2.y, q2.z);
}

/** `segmentDistance3d` on plain coordinates (no allocation, for inner loops). */
export function segmentDistance3dXYZ(
  p1x: number, p1y: number, p1z: number, q1x: number, q1y: number, q1z: number,
  p2x: number, p2y: number, p2z: number, q2x: number, q2y: number, q2z: number,
): number {
  const d1x = q1x - p1x, d1y = q1y - p1y, d1z = q1z - p1z;
  const d2x = q2x - p2x, d2y = q2y - p2y, d2z = q2z - p2z;
  const rx = p1x - p2x, ry = p1y - p2y, rz = p1z - p2z;
  const a = d1x * d1x + d1y * d1y + d1z * d1z;
  const e = d2x * d2x + d2y * d2y + d2z * d2z;
  const f = d2x * rx + d2y * ry + d2z * rz;
  let s: number;
  let t: number;
  if (a === 0 && e === 0) {
    s = 0;
    t = 0;
  } else if (a === 0) {
    s = 0;
    t = clamp01(f / e);
  } else {
    const c = d1x * rx + d1y * ry + d1z * rz;
    if (e === 0) {
      t = 0;
      s = clamp01(-c / a);
    } else {
      const b = d1x * d2x + d1y * d2y + d1z * d2z;
      const denom = a * e - b * b;
      s = denom > 1e-14 * a * e ? clamp01((b * f - c * e) / denom) : 0;
      t = (b * s + f) / e;
      if (t < 0) {
        t = 0;
        s = clamp01(-c / a);
      } else if (t > 1) {
        t = 1;
        s = clamp01((b - c) / a);
      }
    }
  }
  const dx = rx + d1x * s - d2x * t;
  const dy = ry + d1y * s - d2y * t;
  const dz = rz + d1z * s - d2z * t;
  return Math.sqrt(dx * dx + dy * dy + dz * dz);
}

/** A 3-D polyline as parallel coordinate arrays. */
export interface Polyline3d {
  xs: ArrayLike<number>;
  ys: ArrayLike<number>;
  zs: ArrayLike<number>;
}

/**
 * Least distance between two 3-D polylines over all segment pairs; a pair is skipped when its
 * plan boxes are already farther apart than the best distance found (plan distance ≤ 3-D distance).
 */
export function polylineDistance3d(a: Polyline3d, b: Polyline3d, start = Infinity): number {
  let best = start;
  const ax = a.xs, ay = a.ys, az = a.zs, bx = b.xs, by = b.ys, bz = b.zs;
  for (let i = 0; i + 1 < ax.length; i++) {
    const x0 = ax[i]!, y0 = ay[i]!, x1 = ax[i + 1]!, y1 = ay[i + 1]!;
    const aMinX = Math.min(x0, x1), aMaxX = Math.max(x0, x1);
    const aMinY = Math.min(y0, y1), aMaxY = Math.max(y0, y1);
    for (let j = 0; j + 1 < bx.length; j++) {
      const u0 = bx[j]!, v0 = by[j]!, u1 = bx[j + 1]!, v1 = by[j + 1]!;
      const gx = Math.max(0, Math.min(u0, u1) - aMaxX, aMinX - Math.max(u0, u1));
      const gy = Math.max(0, Math.min(v0, v1) - aMaxY, aMinY - Math.max(v0, v1));
      if (gx * gx + gy * gy >= best * best) continue;
      const d = segmentDistance3dXYZ(x0, y0, az[i]!, x1, y1, az[i + 1]!, u0, v0, bz[j]!, u1, v1, bz[j + 1]!);
      if (d < best) best = d;
    }
  }
  return best;
}
