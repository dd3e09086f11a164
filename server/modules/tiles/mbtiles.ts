/**
 * Read-only access to an MBTiles 1.3 file (an SQLite database with a `metadata` table of
 * name/value pairs and a `tiles` table of zoom_level, tile_column, tile_row (TMS: counted from
 * the south) and tile_data), through the sqlite3 package, and the checks an uploaded file
 * must pass before it is kept.
 */
import sqlite3 from 'sqlite3';
import { tileBounds, type LonLatBox } from '@shared/tiles';

/** Raster formats the map can show. */
export const RASTER_FORMATS = ['png', 'jpg', 'webp'] as const;
export type RasterFormat = (typeof RASTER_FORMATS)[number];

export const CONTENT_TYPES: Record<RasterFormat, string> = { png: 'image/png', jpg: 'image/jpeg', webp: 'image/webp' };

/** What the map needs to know about a tile set. */
export interface MbtilesInfo {
  name: string | null;
  format: RasterFormat;
  bounds: LonLatBox;
  minZoom: number;
  maxZoom: number;
  attribution: string | null;
  tileCount: number;
}

function open(file: string): Promise<sqlite3.Database> {
  return new Promise((resolve, reject) => {
    const db: sqlite3.Database = new sqlite3.Database(file, sqlite3.OPEN_READONLY, (err) => (err ? reject(err) : resolve(db)));
  });
}

function all<T>(db: sqlite3.Database, sql: string, params: unknown[] = []): Promise<T[]> {
  return new Promise((resolve, reject) => db.all(sql, params, (err, rows) => (err ? reject(err) : resolve(rows as T[]))));
}

function get<T>(db: sqlite3.Database, sql: string, params: unknown[] = []): Promise<T | undefined> {
  return new Promise((resolve, reject) => db.get(sql, params, (err, row) => (err ? reject(err) : resolve(row as T | undefined))));
}

function close(db: sqlite3.Database): Promise<void> {
  return new Promise((resolve) => db.close(() => resolve()));
}

/** Why a file is not a usable MBTiles tile set; the message is safe to show. */
export class MbtilesError extends Error {}

/** The image format of a tile from its first bytes (PNG, JPEG, WebP), or null. */
export function sniffFormat(data: Buffer): RasterFormat | null {
  if (data.length >= 8 && data.subarray(0, 8).equals(Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]))) return 'png';
  if (data.length >= 3 && data[0] === 0xff && data[1] === 0xd8 && data[2] === 0xff) return 'jpg';
  if (data.length >= 12 && data.subarray(0, 4).toString('latin1') === 'RIFF' && data.subarray(8, 12).toString('latin1') === 'WEBP') return 'webp';
  return null;
}

const REQUIRED_TILE_COLUMNS = ['zoom_level', 'tile_column', 'tile_row', 'tile_data'];

/** An open MBTiles file. */
export class Mbtiles {
  private constructor(
    private readonly db: sqlite3.Database,
    readonly info: MbtilesInfo,
  ) {}

  /**
   * Open and check a file: it must be an SQLite database with a `tiles` table (or view) holding
   * the four MBTiles columns and at least one tile, a `metadata` table of name/value, and raster
   * tiles (PNG, JPEG or WebP; vector tiles are refused). Throws MbtilesError saying what is wrong.
   */
  static async open(file: string): Promise<Mbtiles> {
    let db: sqlite3.Database;
    try {
      db = await open(file);
    } catch {
      throw new MbtilesError('the file cannot be opened as an SQLite database');
    }
    try {
      const info = await readInfo(db);
      return new Mbtiles(db, info);
    } catch (e) {
      await close(db);
      if (e instanceof MbtilesError) throw e;
      const code = (e as { code?: string }).code;
      if (code === 'SQLITE_NOTADB' || code === 'SQLITE_CORRUPT') throw new MbtilesError('the file is not an SQLite database (or it is damaged)');
      throw new MbtilesError(`the file could not be read as MBTiles (${code ?? 'unknown error'})`);
    }
  }

  /** Tile bytes at an XYZ address (the URL's row is flipped to the file's TMS row), or null. */
  async tile(z: number, x: number, y: number): Promise<Buffer | null> {
    const row = await get<{ tile_data: Buffer }>(this.db, 'select tile_data from tiles where zoom_level = ? and tile_column = ? and tile_row = ?', [z, x, 2 ** z - 1 - y]);
    return row?.tile_data ?? null;
  }

  close(): Promise<void> {
    return close(this.db);
  }
}

async function readInfo(db: sqlite3.Database): Promise<MbtilesInfo> {
  const tables = await all<{ name: string; type: string }>(db, "select name, type from sqlite_master where type in ('table', 'view')");
  const names = new Set(tables.map((t) => t.name));
  if (!names.has('tiles')) throw new MbtilesError('the file has no "tiles" table, so it is not an MBTiles tile set');
  const columns = new Set((await all<{ name: string }>(db, 'pragma table_info(tiles)')).map((c) => c.name));
  const missing = REQUIRED_TILE_COLUMNS.filter((c) => !columns.has(c));
  if (missing.length > 0) throw new MbtilesError(`the "tiles" table lacks the column${missing.length > 1 ? 's' : ''} ${missing.join(', ')}`);
  if (!names.has('metadata')) throw new MbtilesError('the file has no "metadata" table (MBTiles needs one, with name and value columns)');
  const metaColumns = new Set((await all<{ name: string }>(db, 'pragma table_info(metadata)')).map((c) => c.name));
  if (!metaColumns.has('name') || !metaColumns.has('value')) throw new MbtilesError('the "metadata" table needs name and value columns');

  const meta = new Map((await all<{ name: string; value: string }>(db, 'select name, value from metadata')).map((r) => [String(r.name), String(r.value)]));
  const stats = await get<{ n: number; minz: number | null; maxz: number | null }>(
    db,
    'select count(*) as n, min(zoom_level) as minz, max(zoom_level) as maxz from tiles',
  );
  if (!stats || stats.n === 0 || stats.minz == null || stats.maxz == null) throw new MbtilesError('the "tiles" table holds no tiles');
  const minZoom = Number(stats.minz);
  const maxZoom = Number(stats.maxz);
  if (!Number.isInteger(minZoom) || !Number.isInteger(maxZoom) || minZoom < 0 || maxZoom > 24) {
    throw new MbtilesError('zoom levels must be whole numbers from 0 to 24');
  }

  const declared = (meta.get('format') ?? '').toLowerCase();
  if (declared === 'pbf' || declared === 'mvt') throw new MbtilesError('vector tiles (pbf) are not supported: give raster tiles (PNG, JPEG or WebP)');
  const sample = await get<{ tile_data: Buffer }>(db, 'select tile_data from tiles limit 1');
  const sniffed = sample?.tile_data && Buffer.isBuffer(sample.tile_data) ? sniffFormat(sample.tile_data) : null;
  if (!sniffed) throw new MbtilesError('the tiles are not PNG, JPEG or WebP images');

  let bounds = parseBounds(meta.get('bounds'));
  if (!bounds) {
    // No usable bounds in the metadata: take the extent of the tiles at the lowest zoom.
    const ext = await get<{ x0: number; x1: number; y0: number; y1: number }>(
      db,
      'select min(tile_column) as x0, max(tile_column) as x1, min(tile_row) as y0, max(tile_row) as y1 from tiles where zoom_level = ?',
      [minZoom],
    );
    const n = 2 ** minZoom;
    const nw = tileBounds({ z: minZoom, x: Number(ext!.x0), y: n - 1 - Number(ext!.y1) });
    const se = tileBounds({ z: minZoom, x: Number(ext!.x1), y: n - 1 - Number(ext!.y0) });
    bounds = [nw[0], se[1], se[2], nw[3]];
  }
  return {
    name: meta.get('name') ?? null,
    format: sniffed,
    bounds,
    minZoom,
    maxZoom,
    attribution: meta.get('attribution') ?? null,
    tileCount: Number(stats.n),
  };
}

/** MBTiles `bounds` ("west,south,east,north" in degrees), or null when absent or unusable. */
export function parseBounds(text: string | undefined): LonLatBox | null {
  if (!text) return null;
  const parts = text.split(',').map((s) => Number(s.trim()));
  if (parts.length !== 4 || parts.some((v) => !Number.isFinite(v))) return null;
  const [w, s, e, n] = parts as [number, number, number, number];
  if (w < -180 || e > 180 || s < -90 || n > 90 || w >= e || s >= n) return null;
  return [w, s, e, n];
}
