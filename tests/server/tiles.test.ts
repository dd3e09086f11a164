/**
 * Base-map tiles (issue 5): the tile route reads the project's MBTiles file (bundled demo tiles
 * or an administrator's upload) with caching headers; bad addresses get 400, missing tiles 404,
 * and a broken upload is refused with nothing kept.
 *
 * Outside references: tile addresses come from @mapbox/sphericalmercator (a general-purpose
 * Web Mercator library), lon/lat from proj4 directly, PNGs are decoded with jimp, and the test
 * MBTiles files are written with sqlite3 following the MBTiles 1.3 specification (tables
 * `metadata(name, value)` and `tiles(zoom_level, tile_column, tile_row, tile_data)`, rows in TMS
 * order: counted from the south).
 */
import { mkdtempSync, readdirSync, rmSync, writeFileSync, existsSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import proj4 from 'proj4';
import sqlite3 from 'sqlite3';
import { Jimp } from 'jimp';
import { SphericalMercator } from '@mapbox/sphericalmercator';
import { DEMO_SCENARIOS, ROAD_BORE_SCENARIO } from '../../seeds/demo';
import { makeFixtures, makeTestApp, tableCounts, type Fixtures, type TestContext } from './helpers';

const merc = new SphericalMercator({ size: 256 });

let ctx: TestContext;
let dataDir: string;
let work: string;
const demo = new Map<string, Fixtures>();
let plain: Fixtures;

beforeAll(async () => {
  dataDir = mkdtempSync(join(tmpdir(), 'tl-tiles-data-'));
  work = mkdtempSync(join(tmpdir(), 'tl-tiles-work-'));
  ctx = await makeTestApp({ dataDir });
  // Projects named like the demo scenarios get the bundled tiles (the seeder matches by name too).
  for (const s of DEMO_SCENARIOS) demo.set(s.key, await makeFixtures(ctx, s.project.name));
  plain = await makeFixtures(ctx, 'A project with no base map');
});

afterAll(async () => {
  await ctx.close();
  rmSync(dataDir, { recursive: true, force: true });
  rmSync(work, { recursive: true, force: true });
});

const tilesUrl = (f: Fixtures) => `/api/projects/${f.project.id}/tiles`;
const get = (url: string, role: 'viewer' | 'admin' | 'designer' = 'viewer') => request(ctx.app).get(url).set('Cookie', ctx.cookie(role));

function run(db: sqlite3.Database, sql: string, params: unknown[] = []): Promise<void> {
  return new Promise((res, rej) => db.run(sql, params, (err) => (err ? rej(err) : res())));
}

/** Write a small MBTiles 1.3 file by the specification, with the given tiles (XYZ addresses). */
async function writeMbtiles(file: string, tiles: { z: number; x: number; y: number; data: Buffer }[], options: { tilesColumns?: string; metadata?: Record<string, string> } = {}): Promise<void> {
  const db = await new Promise<sqlite3.Database>((res, rej) => {
    const d: sqlite3.Database = new sqlite3.Database(file, (err) => (err ? rej(err) : res(d)));
  });
  await run(db, 'create table metadata (name text, value text)');
  await run(db, `create table tiles (${options.tilesColumns ?? 'zoom_level integer, tile_column integer, tile_row integer, tile_data blob'})`);
  for (const [name, value] of Object.entries(options.metadata ?? { name: 'Test map', format: 'png' })) {
    await run(db, 'insert into metadata (name, value) values (?, ?)', [name, value]);
  }
  if (!options.tilesColumns) {
    for (const t of tiles) await run(db, 'insert into tiles values (?, ?, ?, ?)', [t.z, t.x, 2 ** t.z - 1 - t.y, t.data]);
  }
  await new Promise<void>((res) => db.close(() => res()));
}

async function redPng(): Promise<Buffer> {
  return new Jimp({ width: 256, height: 256, color: 0xd7191cff }).getBuffer('image/png');
}

function uploadDirFiles(): string[] {
  const dir = join(dataDir, 'tiles');
  if (!existsSync(dir)) return [];
  const out: string[] = [];
  for (const name of readdirSync(dir)) {
    if (name === 'incoming') out.push(...readdirSync(join(dir, name)).map((n) => `incoming/${n}`));
    else out.push(name);
  }
  return out;
}

describe('bundled demo tiles', () => {
  it.each(DEMO_SCENARIOS.map((s) => [s.key, s] as const))(
    'when a viewer asks for the %s base map, then its bounds hold every line and bore, and its tiles cover the bounds at every zoom',
    async (key, s) => {
      const res = await get(tilesUrl(demo.get(key)!));
      expect(res.status).toBe(200);
      expect(res.body).toMatchObject({ available: true, source: 'bundled', format: 'png', problem: null });
      const [w, south, e, n] = res.body.bounds as [number, number, number, number];
      // proj4 on its own (not the product's converter cache): every demo vertex lies inside the bounds
      const toLonLat = proj4(s.project.crsProj4, 'WGS84');
      const vertices = [...s.lines.flatMap((l) => l.path), ...s.bores.flatMap((b) => b.alignment)];
      for (const p of vertices) {
        const [lon, lat] = toLonLat.forward([p[0], p[1]]);
        expect(lon).toBeGreaterThan(w);
        expect(lon).toBeLessThan(e);
        expect(lat).toBeGreaterThan(south);
        expect(lat).toBeLessThan(n);
      }
      // the file holds exactly the tiles that sphericalmercator says cover the bounds, zoom by zoom
      let expected = 0;
      for (let z = res.body.minZoom as number; z <= (res.body.maxZoom as number); z++) {
        const r = merc.xyz([w, south, e, n], z);
        expected += (r.maxX - r.minX + 1) * (r.maxY - r.minY + 1);
      }
      expect(res.body.tileCount).toBe(expected);
    },
  );

  it('when the tile holding the bore start is asked for, then it is a 256 × 256 PNG with caching headers, and a repeat with its ETag gets 304', async () => {
    const bore = ROAD_BORE_SCENARIO.bores[0]!;
    const [lon, lat] = proj4(ROAD_BORE_SCENARIO.project.crsProj4, 'WGS84').forward([bore.alignment[0]![0], bore.alignment[0]![1]]);
    const r = merc.xyz([lon, lat, lon, lat], 18);
    const url = `${tilesUrl(demo.get('road-bore')!)}/18/${r.minX}/${r.minY}.png`;
    const res = await get(url).buffer(true);
    expect(res.status).toBe(200);
    expect(res.headers['content-type']).toBe('image/png');
    expect(res.headers['cache-control']).toMatch(/max-age=\d+/);
    expect(res.headers['cache-control']).toMatch(/private/);
    expect(res.headers.etag).toMatch(/^"[^"]+"$/);
    const image = await Jimp.read(res.body as Buffer);
    expect([image.bitmap.width, image.bitmap.height]).toEqual([256, 256]);
    const again = await get(url).set('If-None-Match', res.headers.etag as string);
    expect(again.status).toBe(304);
  });

  it('when a tile outside the bounds or above the highest zoom is asked for, then 404', async () => {
    const info = (await get(tilesUrl(demo.get('creek-hdd')!))).body;
    const r = merc.xyz(info.bounds, 17);
    expect((await get(`${tilesUrl(demo.get('creek-hdd')!)}/17/${r.maxX + 3}/${r.minY}.png`)).status).toBe(404);
    const deep = merc.xyz(info.bounds, info.maxZoom + 1);
    expect((await get(`${tilesUrl(demo.get('creek-hdd')!)}/${info.maxZoom + 1}/${deep.minX}/${deep.minY}.png`)).status).toBe(404);
  });

  it('when z/x/y is not a tile address, then 400 naming the part', async () => {
    const base = tilesUrl(demo.get('road-bore')!);
    const bad = [
      ['abc/1/1', 'z'],
      ['3/8/0', 'x'], // zoom 3 has columns 0–7
      ['3/0/-1', 'y'],
      ['25/0/0', 'z'],
      ['3/1.5/0', 'x'],
    ] as const;
    for (const [zxy, part] of bad) {
      const res = await get(`${base}/${zxy}.png`);
      expect(res.status, zxy).toBe(400);
      expect(res.headers['content-type']).toMatch(/problem\+json/);
      expect(res.body.errors.map((e: { path: string }) => e.path), zxy).toContain(part);
    }
  });

  it('when a project has no base map, then it says so and every tile is 404', async () => {
    const res = await get(tilesUrl(plain));
    expect(res.body).toMatchObject({ available: false, source: null, bounds: null });
    expect((await get(`${tilesUrl(plain)}/0/0/0.png`)).status).toBe(404);
  });
});

describe('uploading an MBTiles file', () => {
  it('when an administrator uploads a file that is not SQLite, then 400 on the file field and nothing is kept', async () => {
    const file = join(work, 'broken.mbtiles');
    writeFileSync(file, Buffer.concat([Buffer.from('SQLite format 3\0'), Buffer.alloc(4096, 0x5a)]));
    const before = await tableCounts(ctx.orm);
    const res = await request(ctx.app).post(tilesUrl(plain)).set('Cookie', ctx.cookie('admin')).attach('file', file);
    expect(res.status).toBe(400);
    expect(res.body.errors[0].path).toBe('file');
    expect(uploadDirFiles()).toEqual([]);
    expect(await tableCounts(ctx.orm)).toEqual(before);
    expect((await get(tilesUrl(plain))).body.available).toBe(false);
  });

  it('when the SQLite file lacks the MBTiles tile columns, then 400 saying which, and nothing is kept', async () => {
    const file = join(work, 'wrong-columns.mbtiles');
    await writeMbtiles(file, [], { tilesColumns: 'z integer, x integer, y integer, image blob' });
    const res = await request(ctx.app).post(tilesUrl(plain)).set('Cookie', ctx.cookie('admin')).attach('file', file);
    expect(res.status).toBe(400);
    expect(res.body.errors[0].message).toMatch(/zoom_level/);
    expect(uploadDirFiles()).toEqual([]);
  });

  it('when the file holds vector tiles, then 400 (the map shows raster tiles only)', async () => {
    const file = join(work, 'vector.mbtiles');
    await writeMbtiles(file, [{ z: 0, x: 0, y: 0, data: Buffer.from([0x1a, 0x02, 0x08, 0x01]) }], { metadata: { name: 'Vector', format: 'pbf' } });
    const res = await request(ctx.app).post(tilesUrl(plain)).set('Cookie', ctx.cookie('admin')).attach('file', file);
    expect(res.status).toBe(400);
    expect(res.body.errors[0].message).toMatch(/vector/);
    expect(uploadDirFiles()).toEqual([]);
  });

  it('when a designer uploads, then 403 and nothing is kept', async () => {
    const file = join(work, 'ok-designer.mbtiles');
    await writeMbtiles(file, [{ z: 1, x: 0, y: 0, data: await redPng() }]);
    const res = await request(ctx.app).post(tilesUrl(plain)).set('Cookie', ctx.cookie('designer')).attach('file', file);
    expect(res.status).toBe(403);
    expect(uploadDirFiles()).toEqual([]);
  });

  it('when an administrator uploads a good file, then its tiles are served (TMS rows flipped to XYZ), it is logged, and removing it leaves no base map', async () => {
    const file = join(work, 'good.mbtiles');
    // one tile in the northern hemisphere: XYZ 2/1/1 is TMS row 2 (rows count from the south)
    await writeMbtiles(file, [{ z: 2, x: 1, y: 1, data: await redPng() }], { metadata: { name: 'Test map', format: 'png', minzoom: '2', maxzoom: '2' } });
    const res = await request(ctx.app).post(tilesUrl(plain)).set('Cookie', ctx.cookie('admin')).attach('file', file);
    expect(res.status).toBe(201);
    expect(res.body).toMatchObject({ available: true, source: 'uploaded', name: 'Test map', minZoom: 2, maxZoom: 2, tileCount: 1 });
    // no bounds in the metadata: they come from the tiles, i.e. the box of tile 2/1/1 per sphericalmercator
    const expected = merc.bbox(1, 1, 2);
    (res.body.bounds as number[]).forEach((v, i) => expect(v).toBeCloseTo(expected[i]!, 9));
    const tile = await get(`${tilesUrl(plain)}/2/1/1.png`).buffer(true);
    expect(tile.status).toBe(200);
    const image = await Jimp.read(tile.body as Buffer);
    expect(image.getPixelColor(10, 10)).toBe(0xd7191cff);
    expect((await get(`${tilesUrl(plain)}/2/1/2.png`)).status).toBe(404);
    expect(uploadDirFiles()).toEqual([`${plain.project.id}.mbtiles`]);
    const activity = await ctx.orm.em.fork().getConnection().execute<{ action: string }[]>(`select action from activity_entries where entity = 'tileset' and project_id = ?`, [plain.project.id]);
    expect(activity.map((a) => a.action)).toEqual(['upload']);

    const del = await request(ctx.app).delete(tilesUrl(plain)).set('Cookie', ctx.cookie('admin'));
    expect(del.status).toBe(204);
    expect((await get(tilesUrl(plain))).body.available).toBe(false);
    expect((await get(`${tilesUrl(plain)}/2/1/1.png`)).status).toBe(404);
    expect(uploadDirFiles()).toEqual([]);
  });

  it('when an upload replaces a demo project’s bundled tiles, then the upload wins, and removing it brings the bundled tiles back', async () => {
    const f = demo.get('creek-hdd')!;
    const file = join(work, 'replace.mbtiles');
    await writeMbtiles(file, [{ z: 3, x: 1, y: 2, data: await redPng() }]);
    expect((await request(ctx.app).post(tilesUrl(f)).set('Cookie', ctx.cookie('admin')).attach('file', file)).status).toBe(201);
    const info = (await get(tilesUrl(f))).body;
    expect(info.source).toBe('uploaded');
    expect((await get(`${tilesUrl(f)}/3/1/2.png`)).status).toBe(200);
    expect((await request(ctx.app).delete(tilesUrl(f)).set('Cookie', ctx.cookie('admin'))).status).toBe(204);
    expect((await get(tilesUrl(f))).body.source).toBe('bundled');
  });

  it('when there is no uploaded file to remove, then 404', async () => {
    expect((await request(ctx.app).delete(tilesUrl(demo.get('road-bore')!)).set('Cookie', ctx.cookie('admin'))).status).toBe(404);
  });
});
