/**
 * Web Mercator tile arithmetic (shared/tiles.ts) against @mapbox/sphericalmercator, a
 * general-purpose reference library for the same scheme (the one Leaflet's default CRS,
 * EPSG:3857 with 256-pixel tiles, uses), and the MBTiles 1.3 row order (TMS: from the south).
 */
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { SphericalMercator } from '@mapbox/sphericalmercator';
import { flipY, isValidTile, lonLatToWorldPixel, tileBounds, tileOf, tileRange, worldPixelToLonLat } from '@shared/tiles';

const merc = new SphericalMercator({ size: 256 });

describe('tile of a longitude/latitude', () => {
  it('when the demo areas are looked up at zoom 14–19, then the tile is the one sphericalmercator gives', () => {
    // near the two invented demo sites in Texas (lon/lat only; no real place is implied)
    for (const [lon, lat] of [[-97.7, 29.8], [-97.74, 29.31], [0.5, 50.5], [-0.0001, -0.0001]] as const) {
      for (let z = 14; z <= 19; z++) {
        const t = tileOf(lon, lat, z);
        const r = merc.xyz([lon, lat, lon, lat], z);
        expect([t.x, t.y], `${lon},${lat} z${z}`).toEqual([r.minX, r.minY]);
      }
    }
  });

  it('for any point and zoom, the tile and the world pixel agree with sphericalmercator', () => {
    fc.assert(
      fc.property(fc.double({ min: -179.9, max: 179.9, noNaN: true }), fc.double({ min: -85, max: 85, noNaN: true }), fc.integer({ min: 0, max: 22 }), (lon, lat, z) => {
        const [px, py] = lonLatToWorldPixel(lon, lat, z);
        const [rx, ry] = merc.px([lon, lat], z); // rounded to whole pixels by the library
        expect(Math.abs(px - rx)).toBeLessThanOrEqual(0.5 + 1e-6);
        expect(Math.abs(py - ry)).toBeLessThanOrEqual(0.5 + 1e-6);
        const back = worldPixelToLonLat(px, py, z);
        expect(back[0]).toBeCloseTo(lon, 9);
        expect(back[1]).toBeCloseTo(lat, 9);
      }),
      { numRuns: 300 },
    );
  });
});

describe('MBTiles rows and tile boxes', () => {
  it('when an XYZ row is flipped, then it is the TMS row sphericalmercator gives, and flipping twice returns it', () => {
    for (const [lon, lat, z] of [[-97.7, 29.8, 17], [151.2, -33.9, 12], [12.5, 41.9, 9]] as const) {
      const xyz = merc.xyz([lon, lat, lon, lat], z);
      const tms = merc.xyz([lon, lat, lon, lat], z, true);
      expect(flipY(xyz.minY, z)).toBe(tms.minY);
      expect(flipY(flipY(xyz.minY, z), z)).toBe(xyz.minY);
    }
  });

  it('when a tile box is computed, then it matches sphericalmercator.bbox, and the range of a box matches xyz()', () => {
    for (const [x, y, z] of [[0, 0, 0], [1, 1, 2], [30000, 53000, 17]] as const) {
      const mine = tileBounds({ z, x, y });
      const ref = merc.bbox(x, y, z);
      mine.forEach((v, i) => expect(v).toBeCloseTo(ref[i]!, 9));
    }
    const box: [number, number, number, number] = [-97.71, 29.79, -97.69, 29.81];
    for (let z = 10; z <= 19; z++) expect(tileRange(box, z)).toEqual(merc.xyz(box, z));
  });

  it('only whole numbers inside the zoom’s grid are tile addresses', () => {
    expect(isValidTile(0, 0, 0)).toBe(true);
    expect(isValidTile(3, 7, 7)).toBe(true);
    expect(isValidTile(3, 8, 0)).toBe(false);
    expect(isValidTile(3, 0, -1)).toBe(false);
    expect(isValidTile(2.5, 0, 0)).toBe(false);
    expect(isValidTile(25, 0, 0)).toBe(false);
  });
});
