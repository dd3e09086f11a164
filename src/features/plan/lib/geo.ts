/**
 * The project's grid as the map sees it: grid E/N (project unit) ↔ WGS 84 latitude/longitude
 * through the shared, cached proj4 converters; nice lengths for scale bars and ticks.
 */
import { gridToLonLat, lonLatToGrid, projectCrs, type CrsDefinition } from '@shared/geometry';
import type { LinearUnit } from '@shared/domain';
import type { ProjectDto } from '@shared/api';

export type XY = readonly [number, number];

export interface ProjectFrame {
  crs: CrsDefinition;
  unit: LinearUnit;
  /** Grid point → [lat, lng] for Leaflet. */
  toLatLng(p: XY): [number, number];
  /** Leaflet lat/lng → grid [E, N] in the project unit. */
  toGrid(lat: number, lng: number): [number, number];
}

/** The conversions of a project (no area-of-use check: the map shows what it is given). */
export function projectFrame(project: Pick<ProjectDto, 'crsCode' | 'crsProj4' | 'unit'>): ProjectFrame {
  const crs = projectCrs(project.crsCode, project.crsProj4);
  const unit = project.unit;
  return {
    crs,
    unit,
    toLatLng: (p) => {
      const [lon, lat] = gridToLonLat(crs, p, { unit, checkArea: false });
      return [lat, lon];
    },
    toGrid: (lat, lng) => lonLatToGrid(crs, [lng, lat], { unit, checkArea: false }),
  };
}

/** Largest 1, 2 or 5 × 10ⁿ not above `max` (for scale bars and grid spacing). */
export function niceLength(max: number): number {
  if (!(max > 0)) return 0;
  const p = 10 ** Math.floor(Math.log10(max));
  for (const m of [5, 2, 1]) if (m * p <= max) return m * p;
  return p;
}

/** Bounding box [minE, minN, maxE, maxN] of grid points, or null for none. */
export function gridBox(points: Iterable<XY>): [number, number, number, number] | null {
  let e0 = Infinity;
  let n0 = Infinity;
  let e1 = -Infinity;
  let n1 = -Infinity;
  for (const [e, n] of points) {
    if (e < e0) e0 = e;
    if (e > e1) e1 = e;
    if (n < n0) n0 = n;
    if (n > n1) n1 = n;
  }
  return Number.isFinite(e0) ? [e0, n0, e1, n1] : null;
}
