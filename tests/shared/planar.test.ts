/**
 * Plan distance from a point to a polyline, worked by hand with Pythagoras (3-4-5 triangles).
 */
import { describe, expect, it } from 'vitest';
import { pointPolylineDistance } from '@shared/geometry';

describe('point to polyline distance', () => {
  const path = [[0, 0], [10, 0], [10, 10]] as const;

  it('when the foot falls inside a segment, then it is the perpendicular distance', () => {
    expect(pointPolylineDistance([3, 4], path)).toBeCloseTo(4, 12);
    expect(pointPolylineDistance([13, 5], path)).toBeCloseTo(3, 12);
  });

  it('when the point lies beyond the ends, then it is the distance to the nearest end (3-4-5)', () => {
    expect(pointPolylineDistance([-3, -4], path)).toBeCloseTo(5, 12);
    expect(pointPolylineDistance([13, 14], path)).toBeCloseTo(5, 12);
  });

  it('when the path is one point or none, then the distance to that point, or Infinity', () => {
    expect(pointPolylineDistance([3, 4], [[0, 0]])).toBeCloseTo(5, 12);
    expect(pointPolylineDistance([3, 4], [])).toBe(Infinity);
  });
});
