/**
 * Web Mercator tile arithmetic of the base map (the scheme Leaflet, OpenStreetMap and the
 * MBTiles 1.3 specification use): 256-pixel tiles, zoom z has 2^z × 2^z tiles, x from the
 * antimeridian eastwards, y from the north in the URL (XYZ) and from the south in an MBTiles
 * file (TMS rows). Pure functions, shared by the tile renderer, the tile route and the map.
 */

/** Pixel size of one tile. */
export const TILE_SIZE = 256;

/** Web Mercator's latitude limit (the square world), in degrees. */
export const MAX_LATITUDE = 85.0511287798066;

/** Highest zoom the tile route accepts. */
export const MAX_TILE_ZOOM = 24;

/** A tile address in the URL (XYZ) scheme. */
export interface TileXYZ {
  z: number;
  x: number;
  y: number;
}

/** Longitude/latitude bounds in degrees: [west, south, east, north] (MBTiles `bounds`). */
export type LonLatBox = [number, number, number, number];

/** World pixel position of a longitude/latitude at a zoom (fractional; origin top-left). */
export function lonLatToWorldPixel(lon: number, lat: number, z: number): [number, number] {
  const size = TILE_SIZE * 2 ** z;
  const phi = (Math.max(-MAX_LATITUDE, Math.min(MAX_LATITUDE, lat)) * Math.PI) / 180;
  const x = ((lon + 180) / 360) * size;
  const y = (0.5 - Math.log((1 + Math.sin(phi)) / (1 - Math.sin(phi))) / (4 * Math.PI)) * size;
  return [x, y];
}

/** Longitude/latitude of a world pixel position at a zoom (inverse of lonLatToWorldPixel). */
export function worldPixelToLonLat(x: number, y: number, z: number): [number, number] {
  const size = TILE_SIZE * 2 ** z;
  const lon = (x / size) * 360 - 180;
  const n = Math.PI - (2 * Math.PI * y) / size;
  const lat = (180 / Math.PI) * Math.atan(Math.sinh(n));
  return [lon, lat];
}

/** The XYZ tile holding a longitude/latitude at a zoom. */
export function tileOf(lon: number, lat: number, z: number): TileXYZ {
  const [px, py] = lonLatToWorldPixel(lon, lat, z);
  const last = 2 ** z - 1;
  return {
    z,
    x: Math.min(last, Math.max(0, Math.floor(px / TILE_SIZE))),
    y: Math.min(last, Math.max(0, Math.floor(py / TILE_SIZE))),
  };
}

/** Row of a tile in an MBTiles file (TMS: counted from the south) from its XYZ row, and back. */
export function flipY(y: number, z: number): number {
  return 2 ** z - 1 - y;
}

/** Inclusive XYZ tile range covering a lon/lat box at a zoom. */
export function tileRange(bounds: LonLatBox, z: number): { minX: number; maxX: number; minY: number; maxY: number } {
  const [w, s, e, n] = bounds;
  const nw = tileOf(w, n, z);
  const se = tileOf(e, s, z);
  return { minX: nw.x, maxX: se.x, minY: nw.y, maxY: se.y };
}

/** Lon/lat box of an XYZ tile: [west, south, east, north]. */
export function tileBounds(t: TileXYZ): LonLatBox {
  const [w, n] = worldPixelToLonLat(t.x * TILE_SIZE, t.y * TILE_SIZE, t.z);
  const [e, s] = worldPixelToLonLat((t.x + 1) * TILE_SIZE, (t.y + 1) * TILE_SIZE, t.z);
  return [w, s, e, n];
}

/** True when z/x/y are whole numbers naming a tile that exists at that zoom. */
export function isValidTile(z: number, x: number, y: number, maxZoom = MAX_TILE_ZOOM): boolean {
  if (!Number.isInteger(z) || !Number.isInteger(x) || !Number.isInteger(y)) return false;
  if (z < 0 || z > maxZoom) return false;
  const n = 2 ** z;
  return x >= 0 && x < n && y >= 0 && y < n;
}
