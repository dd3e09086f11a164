/**
 * A local frame for laying out base-map linework: distances along a bearing and offsets to the
 * left of it (both in the grid's unit), turned into grid easting/northing.
 */
import type { GridPoint } from '@shared/schemas/common';

const round = (v: number) => Math.round(v * 100) / 100;

export interface Frame {
  /** Grid point at `along` on the bearing from the origin and `left` to its left. */
  at(along: number, left: number): GridPoint;
  /** A straight line at a constant left offset, from `from` to `to` along the bearing. */
  line(left: number, from: number, to: number): GridPoint[];
  /** A band between two offsets (a polygon), from `from` to `to` along the bearing. */
  band(leftA: number, leftB: number, from: number, to: number): GridPoint[];
  /** A rectangle given by along/left ranges. */
  rect(along0: number, along1: number, left0: number, left1: number): GridPoint[];
}

/** A frame at `origin`, running on a grid bearing in degrees clockwise from grid north. */
export function frame(origin: GridPoint, bearingDeg: number): Frame {
  const b = (bearingDeg * Math.PI) / 180;
  const ux = Math.sin(b);
  const uy = Math.cos(b);
  // left of (ux, uy) is (-uy, ux)
  const at = (along: number, left: number): GridPoint => [round(origin[0] + ux * along - uy * left), round(origin[1] + uy * along + ux * left)];
  return {
    at,
    line: (left, from, to) => [at(from, left), at(to, left)],
    band: (a, c, from, to) => [at(from, a), at(to, a), at(to, c), at(from, c)],
    rect: (a0, a1, l0, l1) => [at(a0, l0), at(a1, l0), at(a1, l1), at(a0, l1)],
  };
}

/** A frame whose origin is the point `along` a straight segment from `start` on `bearingDeg`. */
export function pointOnBearing(start: GridPoint, bearingDeg: number, along: number): GridPoint {
  return frame(start, bearingDeg).at(along, 0);
}
