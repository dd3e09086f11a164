/**
 * Distances on the WGS 84 ellipsoid for the map's measuring tool, by GeographicLib
 * (Karney's algorithms, accurate to nanometres). Clearances never use this: they are planar
 * in the project grid.
 */
import * as geographiclib from 'geographiclib-geodesic';
import type { XY } from './planar';
import { GeometryError } from './errors';

type Lib = typeof geographiclib;
// The package is CommonJS: under Node's ESM loader its exports arrive as `default`.
const lib: Lib = (geographiclib as unknown as { default?: Lib }).default ?? geographiclib;

/** Ellipsoidal (geodesic) distance in metres between two [longitude, latitude] points in degrees. */
export function geodesicDistance(a: XY, b: XY): number {
  for (const [lon, lat] of [a, b]) {
    if (!Number.isFinite(lon) || !Number.isFinite(lat) || Math.abs(lat) > 90) {
      throw new GeometryError('INVALID_NUMBER', 'longitude/latitude must be finite degrees (latitude within ±90)');
    }
  }
  return lib.Geodesic.WGS84.Inverse(a[1], a[0], b[1], b[0]).s12 ?? NaN;
}

/** Geodesic length in metres of a path of [longitude, latitude] points. */
export function geodesicLength(path: readonly XY[]): number {
  let total = 0;
  for (let i = 1; i < path.length; i++) total += geodesicDistance(path[i - 1]!, path[i]!);
  return total;
}
