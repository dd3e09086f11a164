import { describe, it, expect } from 'vitest';
import { geodesicDistance, geodesicLength, lonLatToGrid } from '../../shared/geometry';

describe('geodesicDistance', () => {
  it('when measuring Wellington to Salamanca then 19,959,679.267 m', () => {
    // Source: geographiclib-geodesic README worked example (Karney): Inverse(-41.32, 174.81,
    // 40.96, -5.50) prints 19959679.267 m. Our helper takes [lon, lat], so this also checks the order.
    expect(geodesicDistance([174.81, -41.32], [-5.5, 40.96])).toBeCloseTo(19959679.267, 3);
  });

  it('when measuring along a UTM central meridian then distance = Δnorthing / 0.9996', () => {
    // Source: Transverse Mercator definition — along the central meridian the grid northing is the
    // meridian arc × k0, with k0 = 0.9996 for UTM (Snyder, USGS Professional Paper 1395; from memory).
    // Grid side by proj4 (independent of geographiclib).
    const a: [number, number] = [3, 45];
    const b: [number, number] = [3, 45.009];
    const na = lonLatToGrid('EPSG:32631', a)[1];
    const nb = lonLatToGrid('EPSG:32631', b)[1];
    expect(Math.abs(geodesicDistance(a, b) - (nb - na) / 0.9996)).toBeLessThan(0.001);
  });

  it('when measuring a path then the sum of its legs', () => {
    const p: [number, number][] = [[0, 0], [0, 1], [1, 1]];
    expect(geodesicLength(p)).toBeCloseTo(geodesicDistance([0, 0], [0, 1]) + geodesicDistance([0, 1], [1, 1]), 6);
    // One degree of latitude at the equator on WGS 84 is 110,574 m (common handbook value, from memory).
    expect(geodesicDistance([0, 0], [0, 1])).toBeCloseTo(110574, -1);
  });

  it('when given NaN then INVALID_NUMBER', () => {
    expect(() => geodesicDistance([NaN, 0], [0, 0])).toThrowError(expect.objectContaining({ code: 'INVALID_NUMBER' }));
    expect(() => geodesicDistance([0, 95], [0, 0])).toThrowError(expect.objectContaining({ code: 'INVALID_NUMBER' }));
  });
});
