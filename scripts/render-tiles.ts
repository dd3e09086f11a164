/**
 * `npm run tiles`: render the base map of each demo area (seeds/basemap/) into raster PNG tiles
 * and store them as MBTiles 1.3 (SQLite: `metadata` and `tiles` tables, rows in TMS order) in
 * tiles/<scenario-key>.mbtiles. Linework is in the project's grid; each vertex goes through
 * proj4 to WGS 84 longitude/latitude and then to Web Mercator pixels (shared/tiles.ts).
 * Drawn with @napi-rs/canvas (Skia) and the Inter font the client ships.
 *
 * Run: npx tsx scripts/render-tiles.ts [--min 14] [--max 19] [--only road-bore]
 */
import { mkdirSync, renameSync, rmSync, statSync } from 'node:fs';
import { createRequire } from 'node:module';
import { dirname, join, resolve } from 'node:path';
import { fileURLToPath, pathToFileURL } from 'node:url';
import { parseArgs } from 'node:util';
import { GlobalFonts, createCanvas, type SKRSContext2D } from '@napi-rs/canvas';
import sqlite3 from 'sqlite3';
import { gridToLonLat, projectCrs, type CrsDefinition } from '../shared/geometry';
import { TILE_SIZE, lonLatToWorldPixel, tileRange, type LonLatBox } from '../shared/tiles';
import { DEMO_BASEMAPS, type Basemap, type BasemapFeature, type BasemapKind, type BasemapLabel } from '../seeds/basemap';

const ROOT = resolve(dirname(fileURLToPath(import.meta.url)), '..');
export const TILES_DIR = join(ROOT, 'tiles');
export const DEFAULT_MIN_ZOOM = 14;
export const DEFAULT_MAX_ZOOM = 19;

const require = createRequire(import.meta.url);
let fontReady = false;
function registerFont(): void {
  if (fontReady) return;
  const dir = dirname(require.resolve('@fontsource-variable/inter/package.json'));
  for (const file of ['inter-latin-wght-normal.woff2', 'inter-latin-wght-italic.woff2']) {
    if (!GlobalFonts.registerFromPath(join(dir, 'files', file), 'Inter')) throw new Error(`could not load the font ${file}`);
  }
  fontReady = true;
}

// ---------------------------------------------------------------------------------------------
// Style: muted ground colours, so the APWA colours of the overlay stand out.

const BACKGROUND = '#eeebe2';

interface Style {
  fill?: string;
  stroke?: string;
  /** Width on the ground in metres (drawn at least `minPx` wide). */
  metres?: number;
  minPx?: number;
  dash?: number[];
  /** Lowest zoom the feature is drawn at. */
  minZoom?: number;
}

const STYLES: Record<BasemapKind, Style> = {
  'parcel-fill': { fill: '#f4f2eb' },
  'site-fill': { fill: '#e3e1dc' },
  'gravel-surface': { fill: '#e4dac5', stroke: '#c9bb9d', minPx: 0.8 },
  'road-surface': { fill: '#d5d5d2' },
  water: { fill: '#bcd7ea' },
  building: { fill: '#d8d1c3', stroke: '#9f9585', minPx: 1 },
  'road-edge': { stroke: '#85847f', minPx: 1.2 },
  'edge-line': { stroke: '#ffffff', metres: 0.15, minPx: 0.8, minZoom: 17 },
  'lane-line': { stroke: '#ffffff', metres: 0.15, minPx: 0.8, dash: [3, 9], minZoom: 17 },
  'centre-line': { stroke: '#c9b46a', metres: 0.12, minPx: 0.8, minZoom: 16 },
  'right-of-way': { stroke: '#9b7b5e', minPx: 1, dash: [10, 3, 2, 3], minZoom: 16 },
  'parcel-line': { stroke: '#bdb6a6', minPx: 0.8, minZoom: 15 },
  fence: { stroke: '#8f8b82', minPx: 0.8, dash: [1.5, 3], minZoom: 17 },
  ditch: { stroke: '#8db1cf', minPx: 1, dash: [6, 4], minZoom: 16 },
  'creek-bank': { stroke: '#8c7a58', minPx: 1.2, dash: [2, 3], minZoom: 15 },
  'creek-centreline': { stroke: '#7aa6cb', minPx: 1, minZoom: 14 },
};

const DRAW_ORDER: BasemapKind[] = [
  'parcel-fill', 'site-fill', 'water', 'gravel-surface', 'road-surface', 'building', 'parcel-line', 'fence', 'ditch',
  'creek-bank', 'creek-centreline', 'right-of-way', 'road-edge', 'edge-line', 'lane-line', 'centre-line',
];

const POLYGONS = new Set<BasemapKind>(['parcel-fill', 'site-fill', 'gravel-surface', 'road-surface', 'water', 'building']);

const LABEL_STYLES: Record<BasemapLabel['kind'], { font: (z: number) => string; colour: string; upper?: boolean }> = {
  street: { font: (z) => `600 ${z >= 18 ? 14 : 12}px Inter`, colour: '#4b4a46' },
  creek: { font: (z) => `italic 500 ${z >= 17 ? 14 : 12}px Inter`, colour: '#3f73a3' },
  place: { font: (z) => `700 ${z >= 17 ? 14 : 12}px Inter`, colour: '#6b665c', upper: true },
  site: { font: () => '600 12px Inter', colour: '#55524b' },
  minor: { font: () => '500 11px Inter', colour: '#7b766c' },
};

// ---------------------------------------------------------------------------------------------
// Projection of the linework

type LonLat = [number, number];

interface ProjectedFeature {
  kind: BasemapKind;
  lonLat: LonLat[];
}

/** Insert vertices so no segment is longer than `step` grid units (straight grid lines bend slightly on the map). */
function densify(points: readonly (readonly [number, number])[], step: number, closed: boolean): [number, number][] {
  const ring = closed ? [...points, points[0]!] : points;
  const out: [number, number][] = [];
  for (let i = 0; i < ring.length - 1; i++) {
    const a = ring[i]!;
    const b = ring[i + 1]!;
    const n = Math.max(1, Math.ceil(Math.hypot(b[0] - a[0], b[1] - a[1]) / step));
    for (let k = 0; k < n; k++) out.push([a[0] + ((b[0] - a[0]) * k) / n, a[1] + ((b[1] - a[1]) * k) / n]);
  }
  if (!closed) out.push([ring[ring.length - 1]![0], ring[ring.length - 1]![1]]);
  return out;
}

function toLonLat(crs: CrsDefinition, p: readonly [number, number]): LonLat {
  return gridToLonLat(crs, p, { checkArea: false });
}

/** Longitude/latitude box of the base map's grid extent (its edges sampled, as they curve). */
export function basemapBounds(map: Basemap): LonLatBox {
  const crs = projectCrs(map.crsCode, map.crsProj4);
  const [e0, n0, e1, n1] = map.extent;
  const edge = densify([[e0, n0], [e1, n0], [e1, n1], [e0, n1]], Math.max(e1 - e0, n1 - n0) / 20, true).map((p) => toLonLat(crs, p));
  const lons = edge.map((p) => p[0]);
  const lats = edge.map((p) => p[1]);
  return [Math.min(...lons), Math.min(...lats), Math.max(...lons), Math.max(...lats)];
}

function project(map: Basemap): ProjectedFeature[] {
  const crs = projectCrs(map.crsCode, map.crsProj4);
  const span = Math.max(map.extent[2] - map.extent[0], map.extent[3] - map.extent[1]);
  const step = span / 200;
  return map.features.map((f: BasemapFeature) => ({
    kind: f.kind,
    lonLat: densify(f.points, step, POLYGONS.has(f.kind)).map((p) => toLonLat(crs, p)),
  }));
}

// ---------------------------------------------------------------------------------------------
// Drawing

/** Ground metres per pixel at a latitude and zoom (Web Mercator scale). */
function metresPerPixel(lat: number, z: number): number {
  return (Math.cos((lat * Math.PI) / 180) * 2 * Math.PI * 6378137) / (TILE_SIZE * 2 ** z);
}

interface ZoomLayer {
  z: number;
  features: { kind: BasemapKind; px: [number, number][]; box: [number, number, number, number] }[];
  labels: { label: BasemapLabel; x: number; y: number; angle: number }[];
}

function layerAt(map: Basemap, projected: ProjectedFeature[], z: number): ZoomLayer {
  const crs = projectCrs(map.crsCode, map.crsProj4);
  const features = projected.map((f) => {
    const px = f.lonLat.map(([lon, lat]) => lonLatToWorldPixel(lon, lat, z));
    const xs = px.map((p) => p[0]);
    const ys = px.map((p) => p[1]);
    return { kind: f.kind, px, box: [Math.min(...xs), Math.min(...ys), Math.max(...xs), Math.max(...ys)] as [number, number, number, number] };
  });
  const labels = map.labels
    .filter((l) => z >= l.minZoom)
    .map((label) => {
      const [lon, lat] = toLonLat(crs, label.at);
      const [x, y] = lonLatToWorldPixel(lon, lat, z);
      let angle = 0;
      if (label.towards) {
        const [lon2, lat2] = toLonLat(crs, label.towards);
        const [x2, y2] = lonLatToWorldPixel(lon2, lat2, z);
        angle = Math.atan2(y2 - y, x2 - x);
        // keep text upright
        if (angle > Math.PI / 2) angle -= Math.PI;
        if (angle < -Math.PI / 2) angle += Math.PI;
      }
      return { label, x, y, angle };
    });
  return { z, features, labels };
}

function drawTile(ctx: SKRSContext2D, layer: ZoomLayer, tx: number, ty: number, lat: number): void {
  const ox = tx * TILE_SIZE;
  const oy = ty * TILE_SIZE;
  const mpp = metresPerPixel(lat, layer.z);
  ctx.fillStyle = BACKGROUND;
  ctx.fillRect(0, 0, TILE_SIZE, TILE_SIZE);
  ctx.lineJoin = 'round';
  ctx.lineCap = 'butt';
  const margin = 40;
  for (const kind of DRAW_ORDER) {
    const style = STYLES[kind];
    if (style.minZoom !== undefined && layer.z < style.minZoom) continue;
    for (const f of layer.features) {
      if (f.kind !== kind) continue;
      const [x0, y0, x1, y1] = f.box;
      if (x1 < ox - margin || x0 > ox + TILE_SIZE + margin || y1 < oy - margin || y0 > oy + TILE_SIZE + margin) continue;
      ctx.beginPath();
      f.px.forEach(([x, y], i) => (i === 0 ? ctx.moveTo(x - ox, y - oy) : ctx.lineTo(x - ox, y - oy)));
      if (POLYGONS.has(kind)) ctx.closePath();
      if (style.fill) {
        ctx.fillStyle = style.fill;
        ctx.fill();
      }
      if (style.stroke) {
        ctx.strokeStyle = style.stroke;
        ctx.lineWidth = Math.max(style.minPx ?? 1, (style.metres ?? 0) / mpp);
        ctx.setLineDash(style.dash ?? []);
        // dashes continue across tile edges: the pattern starts at the world origin of the line
        ctx.lineDashOffset = 0;
        ctx.stroke();
      }
    }
  }
  ctx.setLineDash([]);
  for (const { label, x, y, angle } of layer.labels) {
    if (x < ox - 400 || x > ox + TILE_SIZE + 400 || y < oy - 400 || y > oy + TILE_SIZE + 400) continue;
    const style = LABEL_STYLES[label.kind];
    const text = style.upper ? label.text.toUpperCase() : label.text;
    ctx.save();
    ctx.translate(x - ox, y - oy);
    ctx.rotate(angle);
    ctx.font = style.font(layer.z);
    ctx.textAlign = 'center';
    ctx.textBaseline = 'middle';
    ctx.lineWidth = 3;
    ctx.strokeStyle = 'rgba(255,255,255,0.85)';
    ctx.strokeText(text, 0, 0);
    ctx.fillStyle = style.colour;
    ctx.fillText(text, 0, 0);
    ctx.restore();
  }
}

// ---------------------------------------------------------------------------------------------
// MBTiles

function run(db: sqlite3.Database, sql: string, params: unknown[] = []): Promise<void> {
  return new Promise((res, rej) => db.run(sql, params, (err) => (err ? rej(err) : res())));
}

function openDb(file: string): Promise<sqlite3.Database> {
  return new Promise((res, rej) => {
    const db = new sqlite3.Database(file, (err) => (err ? rej(err) : res(db)));
  });
}

function closeDb(db: sqlite3.Database): Promise<void> {
  return new Promise((res, rej) => db.close((err) => (err ? rej(err) : res())));
}

export interface RenderResult {
  key: string;
  file: string;
  tiles: number;
  bytes: number;
  bounds: LonLatBox;
}

/** Render one base map into an MBTiles file (written to a temporary name, then moved into place). */
export async function renderBasemap(map: Basemap, outDir: string, minZoom = DEFAULT_MIN_ZOOM, maxZoom = DEFAULT_MAX_ZOOM): Promise<RenderResult> {
  registerFont();
  mkdirSync(outDir, { recursive: true });
  const file = join(outDir, `${map.key}.mbtiles`);
  const tmp = `${file}.tmp-${process.pid}`;
  rmSync(tmp, { force: true });
  // rounded once, so the bounds written to the metadata are exactly those the tiles cover
  const bounds = basemapBounds(map).map((v) => Number(v.toFixed(7))) as LonLatBox;
  const projected = project(map);
  const db = await openDb(tmp);
  let count = 0;
  try {
    await run(db, 'pragma journal_mode = off');
    await run(db, 'create table metadata (name text, value text)');
    await run(db, 'create unique index name on metadata (name)');
    await run(db, 'create table tiles (zoom_level integer, tile_column integer, tile_row integer, tile_data blob)');
    await run(db, 'create unique index tile_index on tiles (zoom_level, tile_column, tile_row)');
    const centre = [(bounds[0] + bounds[2]) / 2, (bounds[1] + bounds[3]) / 2];
    const metadata: Record<string, string> = {
      name: map.name,
      format: 'png',
      type: 'baselayer',
      version: '1',
      description: map.description,
      attribution: 'Invented demo base map, drawn by Threadline from seeds/basemap',
      bounds: bounds.join(','),
      center: `${centre[0]!.toFixed(7)},${centre[1]!.toFixed(7)},${Math.min(maxZoom, 17)}`,
      minzoom: String(minZoom),
      maxzoom: String(maxZoom),
      // not in the MBTiles spec: where the linework came from
      'threadline:crs': map.crsCode,
      'threadline:source': `seeds/basemap/${map.key}.ts`,
    };
    await run(db, 'begin');
    for (const [name, value] of Object.entries(metadata)) await run(db, 'insert into metadata (name, value) values (?, ?)', [name, value]);
    const canvas = createCanvas(TILE_SIZE, TILE_SIZE);
    const ctx = canvas.getContext('2d');
    const lat = centre[1]!;
    for (let z = minZoom; z <= maxZoom; z++) {
      const layer = layerAt(map, projected, z);
      const r = tileRange(bounds, z);
      for (let x = r.minX; x <= r.maxX; x++) {
        for (let y = r.minY; y <= r.maxY; y++) {
          drawTile(ctx, layer, x, y, lat);
          const png = await canvas.encode('png');
          // MBTiles rows count from the south (TMS)
          await run(db, 'insert into tiles (zoom_level, tile_column, tile_row, tile_data) values (?, ?, ?, ?)', [z, x, 2 ** z - 1 - y, png]);
          count++;
        }
      }
    }
    await run(db, 'commit');
    await run(db, 'vacuum');
  } finally {
    await closeDb(db);
  }
  renameSync(tmp, file);
  return { key: map.key, file, tiles: count, bytes: statSync(file).size, bounds };
}

async function main(): Promise<void> {
  const { values } = parseArgs({ options: { min: { type: 'string' }, max: { type: 'string' }, only: { type: 'string' }, out: { type: 'string' } } });
  const min = values.min ? Number(values.min) : DEFAULT_MIN_ZOOM;
  const max = values.max ? Number(values.max) : DEFAULT_MAX_ZOOM;
  if (!Number.isInteger(min) || !Number.isInteger(max) || min < 0 || max > 22 || min > max) {
    console.error('--min and --max must be whole zoom levels, 0 ≤ min ≤ max ≤ 22');
    process.exit(2);
  }
  const out = values.out ? resolve(values.out) : TILES_DIR;
  const maps = DEMO_BASEMAPS.filter((m) => !values.only || m.key === values.only);
  if (maps.length === 0) {
    console.error(`no base map "${values.only}"; known: ${DEMO_BASEMAPS.map((m) => m.key).join(', ')}`);
    process.exit(2);
  }
  let total = 0;
  for (const map of maps) {
    const started = Date.now();
    process.stdout.write(`${map.key}: zoom ${min}-${max}… `);
    const r = await renderBasemap(map, out, min, max);
    total += r.bytes;
    console.log(`${r.tiles} tiles, ${(r.bytes / 1024).toFixed(0)} kB → ${r.file} (${((Date.now() - started) / 1000).toFixed(1)} s)`);
  }
  console.log(`total ${(total / 1024 / 1024).toFixed(2)} MB`);
}

if (import.meta.url === pathToFileURL(process.argv[1] ?? '').href) {
  await main();
}
