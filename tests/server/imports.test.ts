/**
 * Line imports: GeoJSON (reprojected; positions made with proj4 here, independently of
 * shared/geometry), DXF (drawn with dxf-writer, an outside library), CSV point files. Malformed
 * files give row/feature-level errors and write nothing (table counts before and after).
 */
import { randomUUID } from 'node:crypto';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import Drawing from 'dxf-writer';
import proj4 from 'proj4';
import type { ActivityDto, LineDto, LineImportPreviewDto, LineImportResultDto } from '@shared/api';
import { makeFixtures, makeTestApp, tableCounts, type Fixtures, type TestContext } from './helpers';

let ctx: TestContext;
let f: Fixtures;

// EPSG:2278 (NAD83 / Texas South Central, ftUS) as the fixture project defines it, and
// EPSG:32615 (WGS 84 / UTM zone 15N) from its published parameters; both written here.
const FIXTURE_2278 = '+proj=lcc +lat_0=27.8333333333333 +lon_0=-99 +lat_1=30.2833333333333 +lat_2=28.3833333333333 +x_0=600000 +y_0=4000000 +ellps=GRS80 +units=us-ft +no_defs';
const UTM_15N = '+proj=utm +zone=15 +datum=WGS84 +units=m +no_defs';

beforeAll(async () => {
  ctx = await makeTestApp();
  f = await makeFixtures(ctx, `Import fixture ${randomUUID().slice(0, 6)}`);
});
afterAll(() => ctx.close());

const url = (what: 'preview' | 'commit') => `/api/projects/${f.project.id}/imports/lines/${what}`;
const post = (what: 'preview' | 'commit', body: object, role: Parameters<TestContext['cookie']>[0] = 'designer') =>
  request(ctx.app).post(url(what)).set('Cookie', ctx.cookie(role)).send(body);
const defaults = { owner: 'Imported utility', diameter: 0.5, recordDepth: 4, qualityLevel: 'D' as const };

async function linesNamed(labels: string[]): Promise<LineDto[]> {
  const res = await request(ctx.app).get(`/api/projects/${f.project.id}/lines`).set('Cookie', ctx.cookie('viewer'));
  return (res.body as LineDto[]).filter((l) => labels.includes(l.label));
}

function feature(label: string, coordinates: unknown, props: Record<string, unknown> = {}, type = 'LineString') {
  return { type: 'Feature', properties: { label, ...props }, geometry: { type, coordinates } };
}

describe('GeoJSON import', () => {
  it('when the file names the project CRS in its crs member, then the preview lists the lines and writes nothing, and the commit writes them with activity and a recomputation', async () => {
    const gj = {
      type: 'FeatureCollection',
      crs: { type: 'name', properties: { name: 'urn:ogc:def:crs:EPSG::2278' } },
      features: [
        feature('GJ-W1', [[3000150, 13799900], [3000150, 13800100]], { kind: 'water', owner: 'Test water district', diameter: 0.667 }),
        feature('GJ-G1', [[3000180, 13799900], [3000180, 13800050], [3000185, 13800100]], { kind: 'Gas line' }),
      ],
    };
    const before = await tableCounts(ctx.orm);
    const preview = await post('preview', { format: 'geojson', content: JSON.stringify(gj), fileName: 'lines.geojson' });
    expect(preview.status).toBe(200);
    const p = preview.body as LineImportPreviewDto;
    expect(p.source).toMatchObject({ crs: 'EPSG:2278' });
    expect(p.source.how).toMatch(/crs member/);
    expect(p.groups).toEqual([
      { key: 'water', count: 1, suggestedKind: 'water' },
      { key: 'Gas line', count: 1, suggestedKind: 'gas' },
    ]);
    expect(p.items.map((i) => [i.label, i.vertexCount, i.length])).toEqual([
      ['GJ-W1', 2, 200],
      ['GJ-G1', 3, 150 + Math.round(Math.hypot(5, 50) * 1000) / 1000],
    ]);
    expect(p.ready).toBe(false); // no mapping yet
    expect(await tableCounts(ctx.orm)).toEqual(before);

    const mapping = { water: { kind: 'water' }, 'Gas line': { kind: 'gas', owner: 'Test gas company' } };
    const ready = (await post('preview', { format: 'geojson', content: JSON.stringify(gj), mapping, defaults })).body as LineImportPreviewDto;
    expect(ready.problems).toEqual([]);
    expect(ready.ready).toBe(true);

    const commit = await post('commit', { format: 'geojson', content: JSON.stringify(gj), fileName: 'lines.geojson', mapping, defaults });
    expect(commit.status).toBe(201);
    const result = commit.body as LineImportResultDto;
    expect(result.created).toBe(2);
    const lines = await linesNamed(['GJ-W1', 'GJ-G1']);
    const w = lines.find((l) => l.label === 'GJ-W1')!;
    expect(w).toMatchObject({ kind: 'water', owner: 'Test water district', diameter: 0.667, recordDepth: 4, qualityLevel: 'D', status: 'active' });
    expect(w.path).toEqual([
      [3000150, 13799900],
      [3000150, 13800100],
    ]);
    expect(lines.find((l) => l.label === 'GJ-G1')).toMatchObject({ kind: 'gas', owner: 'Test gas company', diameter: 0.5 });

    const activity = (await request(ctx.app).get(`/api/projects/${f.project.id}/activity`).set('Cookie', ctx.cookie('viewer'))).body as ActivityDto[] | { items: ActivityDto[] };
    const entries = Array.isArray(activity) ? activity : activity.items;
    expect(entries.filter((a) => a.entity === 'line' && a.action === 'import').map((a) => a.entityId).sort()).toEqual([...result.lineIds].sort());
    expect(entries.some((a) => a.entity === 'line-import' && a.action === 'import')).toBe(true);

    // The clearances were recomputed with the new lines: both cross the bore.
    const clearances = (await request(ctx.app).get(`/api/projects/${f.project.id}/clearances`).set('Cookie', ctx.cookie('viewer'))).body;
    const seen = clearances.report.bores[0].lines.map((l: { lineId: number }) => l.lineId);
    for (const id of result.lineIds) expect(seen).toContain(id);
  });

  it('when the file has no crs member, then positions are WGS 84 [longitude, latitude] (RFC 7946) and land on the grid proj4 gives', async () => {
    const grid: [number, number][] = [
      [3000120, 13799950],
      [3000130, 13800050],
    ];
    const lonlat = grid.map((p) => proj4(FIXTURE_2278, 'WGS84', p));
    const gj = { type: 'FeatureCollection', features: [feature('GJ-LL', lonlat)] };
    const body = { format: 'geojson', content: JSON.stringify(gj), mapping: { '(all features)': { kind: 'communications' } }, defaults };
    const p = (await post('preview', body)).body as LineImportPreviewDto;
    expect(p.source.crs).toBe('EPSG:4326');
    expect(p.source.how).toMatch(/RFC 7946/);
    expect((await post('commit', body)).status).toBe(201);
    const [line] = await linesNamed(['GJ-LL']);
    line!.path.forEach(([e, n], i) => {
      expect(e).toBeCloseTo(grid[i]![0], 2);
      expect(n).toBeCloseTo(grid[i]![1], 2);
    });
  });

  it('when the person picks EPSG:32615 for a UTM file, then it is reprojected into the project grid and unit', async () => {
    const grid: [number, number][] = [
      [3000160, 13799960],
      [3000165, 13800040],
    ];
    const utm = grid.map((p) => proj4(UTM_15N, proj4(FIXTURE_2278, 'WGS84', p)));
    const gj = { type: 'FeatureCollection', features: [feature('GJ-UTM', utm, { layer: 'ELEC' })] };
    const body = { format: 'geojson', content: JSON.stringify(gj), sourceCrs: 'EPSG:32615', mapping: { ELEC: { kind: 'electric' } }, defaults };
    const p = (await post('preview', body)).body as LineImportPreviewDto;
    expect(p.source).toMatchObject({ crs: 'EPSG:32615', name: 'WGS 84 / UTM zone 15N' });
    expect(p.groups).toEqual([{ key: 'ELEC', count: 1, suggestedKind: 'electric' }]);
    expect((await post('commit', body)).status).toBe(201);
    const [line] = await linesNamed(['GJ-UTM']);
    line!.path.forEach(([e, n], i) => {
      expect(e).toBeCloseTo(grid[i]![0], 2);
      expect(n).toBeCloseTo(grid[i]![1], 2);
    });
  });

  it('when features are malformed, then the preview names them by number, the commit refuses with their paths, and nothing is written', async () => {
    const gj = {
      type: 'FeatureCollection',
      features: [
        feature('OK-1', [[-95.75, 29.65], [-95.7499, 29.6501]]),
        feature('BAD-2', [[-95.75, 29.65], ['x', 29.66]]),
        feature('PT-3', [-95.75, 29.65], {}, 'Point'),
        feature('BAD-4', [[-95.75, 29.65]]),
        feature('BAD-5', [[-95.75, 29.65], [-95.7498, 29.6502]], { diameter: 'big' }),
      ],
    };
    const body = { format: 'geojson', content: JSON.stringify(gj), mapping: { '(all features)': { kind: 'water' } }, defaults };
    const before = await tableCounts(ctx.orm);
    const p = (await post('preview', body)).body as LineImportPreviewDto;
    expect(p.ready).toBe(false);
    expect(p.problems.map((x) => x.path)).toEqual(['file.features.2.geometry.coordinates.2', 'file.features.5.properties.diameter', 'file.features.4.geometry']);
    expect(p.problems[0]!.message).toBe('feature 2: position 2 is not a pair of numbers');
    expect(p.problems[2]!.message).toBe('feature 4: a line needs at least two distinct points (got 1)');
    expect(p.ignored).toEqual([{ what: 'Point feature', count: 1 }]);
    const commit = await post('commit', body);
    expect(commit.status).toBe(400);
    expect(commit.body.errors.map((e: { path: string }) => e.path)).toEqual(p.problems.map((x) => x.path));
    expect(await tableCounts(ctx.orm)).toEqual(before);
  });

  it('when the file is not JSON, or its crs is not in the catalogue, then 400 names the file, and nothing is written', async () => {
    const before = await tableCounts(ctx.orm);
    const notJson = await post('commit', { format: 'geojson', content: '{"type": "FeatureCollection", ', mapping: {}, defaults });
    expect(notJson.status).toBe(400);
    expect(notJson.body.errors[0]).toMatchObject({ path: 'content' });
    expect(notJson.body.errors[0].message).toMatch(/not valid JSON/);
    const unknownCrs = {
      type: 'FeatureCollection',
      crs: { type: 'name', properties: { name: 'EPSG:9999' } },
      features: [feature('X', [[1, 2], [3, 4]])],
    };
    const res = await post('commit', { format: 'geojson', content: JSON.stringify(unknownCrs), mapping: { '(all features)': { kind: 'water' } }, defaults });
    expect(res.status).toBe(400);
    expect(res.body.errors[0]).toMatchObject({ path: 'file.crs' });
    expect(await tableCounts(ctx.orm)).toEqual(before);
  });

  it('when a position is outside the project CRS area, then that feature is named and nothing is written', async () => {
    const gj = { type: 'FeatureCollection', features: [feature('PARIS', [[2.35, 48.85], [2.36, 48.86]])] };
    const before = await tableCounts(ctx.orm);
    const res = await post('commit', { format: 'geojson', content: JSON.stringify(gj), mapping: { '(all features)': { kind: 'water' } }, defaults });
    expect(res.status).toBe(400);
    expect(res.body.errors[0].path).toBe('file.features.1.geometry');
    expect(res.body.errors[0].message).toMatch(/^feature 1: .*outside the area of use of EPSG:2278/);
    expect(await tableCounts(ctx.orm)).toEqual(before);
  });
});

describe('DXF import', () => {
  /** A drawing made with dxf-writer: layer → line-kind mapping is what the person confirms. */
  function drawing(): string {
    const d = new Drawing();
    d.addLayer('WATER-MAIN', Drawing.ACI.BLUE, 'CONTINUOUS');
    d.addLayer('GAS', Drawing.ACI.YELLOW, 'CONTINUOUS');
    d.addLayer('E-UG', Drawing.ACI.RED, 'CONTINUOUS');
    d.addLayer('NOTES', Drawing.ACI.WHITE, 'CONTINUOUS');
    d.setActiveLayer('WATER-MAIN').drawPolyline([
      [3000210, 13799900],
      [3000210, 13800000],
      [3000215, 13800100],
    ]);
    d.setActiveLayer('GAS').drawLine(3000220, 13799900, 3000220, 13800100);
    d.setActiveLayer('E-UG').drawPolyline3d([
      [3000230, 13799900, 95],
      [3000230, 13800100, 95],
    ]);
    d.setActiveLayer('NOTES').drawText(3000200, 13800000, 2, 0, 'WM');
    return d.toDxfString();
  }

  it('when previewed, then layers are listed with counts and suggested kinds, and non-lines are counted as left out', async () => {
    const p = (await post('preview', { format: 'dxf', content: drawing(), fileName: 'utilities.dxf' })).body as LineImportPreviewDto;
    expect(p.source).toMatchObject({ crs: 'EPSG:2278' });
    expect(p.groups).toEqual([
      { key: 'WATER-MAIN', count: 1, suggestedKind: 'water' },
      { key: 'GAS', count: 1, suggestedKind: 'gas' },
      { key: 'E-UG', count: 1, suggestedKind: 'electric' },
    ]);
    expect(p.ignored).toEqual([{ what: 'TEXT', count: 1 }]);
    expect(p.warnings.some((w) => /Elevations \(Z\)/.test(w))).toBe(true);
  });

  it('when the person maps two layers and skips one, then exactly those lines are written with the drawn vertices', async () => {
    const mapping = { 'WATER-MAIN': { kind: 'water', owner: 'Test water district' }, GAS: { kind: 'gas' }, 'E-UG': { kind: 'skip' } };
    const res = await post('commit', { format: 'dxf', content: drawing(), mapping, defaults });
    expect(res.status).toBe(201);
    expect(res.body).toMatchObject({ created: 2, skipped: 1 });
    const lines = await linesNamed(['WATER-MAIN-1', 'GAS-1', 'E-UG-1']);
    expect(lines.map((l) => [l.label, l.kind, l.owner]).sort()).toEqual([
      ['GAS-1', 'gas', 'Imported utility'],
      ['WATER-MAIN-1', 'water', 'Test water district'],
    ]);
    expect(lines.find((l) => l.label === 'WATER-MAIN-1')!.path).toEqual([
      [3000210, 13799900],
      [3000210, 13800000],
      [3000215, 13800100],
    ]);
  });

  it('when a layer is left without a kind, then the commit names the mapping field and writes nothing', async () => {
    const before = await tableCounts(ctx.orm);
    const res = await post('commit', { format: 'dxf', content: drawing(), mapping: { 'WATER-MAIN': { kind: 'water' }, 'E-UG': { kind: 'skip' } }, defaults });
    expect(res.status).toBe(400);
    expect(res.body.errors.map((e: { path: string }) => e.path)).toEqual(['mapping.GAS.kind']);
    expect(await tableCounts(ctx.orm)).toEqual(before);
  });

  it('when an entity has an unreadable coordinate, then it is named by entity number and nothing is written', async () => {
    const dxf = ['0', 'SECTION', '2', 'ENTITIES', '0', 'LINE', '8', 'WATER', '10', '3000000', '20', '13800000', '11', '3000010', '21', '13800010',
      '0', 'LINE', '8', 'WATER', '10', 'abc', '20', '13800000', '11', '3000010', '21', '13800010', '0', 'ENDSEC', '0', 'EOF'].join('\n');
    const before = await tableCounts(ctx.orm);
    const res = await post('commit', { format: 'dxf', content: dxf, mapping: { WATER: { kind: 'water' } }, defaults });
    expect(res.status).toBe(400);
    expect(res.body.errors).toHaveLength(1);
    expect(res.body.errors[0].path).toBe('file.entities.2.vertices.1');
    expect(res.body.errors[0].message).toMatch(/^entity 2 \(LINE[^)]*\): vertex 1 has no finite x and y$/);
    expect(await tableCounts(ctx.orm)).toEqual(before);
  });
});

describe('CSV point-file import', () => {
  const good = [
    'point,northing,easting,elevation,description',
    '1,13799900,3000240,96.1,007 fibre',
    '2,13800000,3000240,96.0,007',
    '3,13800100,3000241,,007',
    '4,13799900,3000250,95.2,SS1 sewer',
    '5,13800100,3000250,95.0,SS1',
  ].join('\r\n');

  it('when points share a code, then each code becomes one line through its points in file order, and 007 stays 007', async () => {
    const p = (await post('preview', { format: 'csv', content: good })).body as LineImportPreviewDto;
    expect(p.groups).toEqual([
      { key: '007', count: 1, suggestedKind: null },
      { key: 'SS1', count: 1, suggestedKind: 'sewer' },
    ]);
    expect(p.items.map((i) => [i.ref, i.label, i.vertexCount])).toEqual([
      ['rows 2\u20134 (code 007)', '007', 3],
      ['rows 5\u20136 (code SS1)', 'SS1', 2],
    ]);
    expect(p.warnings.some((w) => /not stored on lines/.test(w))).toBe(true);
    const res = await post('commit', { format: 'csv', content: good, mapping: { '007': { kind: 'communications' }, SS1: { kind: 'sewer' } }, defaults });
    expect(res.status).toBe(201);
    const [line] = await linesNamed(['007']);
    expect(line!.path).toEqual([
      [3000240, 13799900],
      [3000240, 13800000],
      [3000241, 13800100],
    ]);
  });

  it('when rows are malformed, then each is named by row number and field, and nothing is written', async () => {
    const bad = [
      'point,northing,easting,elevation,description',
      '1,13799900,3000260,96.1,W9',
      '2,13800000,3000260,96.0,W9',
      '3,north,3000260,,W9',
      '4,13800100,3000261,high,W9',
      '5,13800100,3000262,,',
      '6,13800100,3000263,,LONE',
    ].join('\n');
    const before = await tableCounts(ctx.orm);
    const p = (await post('preview', { format: 'csv', content: bad, mapping: { W9: { kind: 'water' }, LONE: { kind: 'water' } }, defaults })).body as LineImportPreviewDto;
    expect(p.problems.map((x) => [x.ref, x.path])).toEqual([
      ['row 4', 'file.rows.4.northing'],
      ['row 5', 'file.rows.5.elevation'],
      ['row 6', 'file.rows.6.description'],
      ['row 7 (code LONE)', 'file.rows.7.geometry'],
    ]);
    expect(p.problems[0]!.message).toBe('row 4: northing "north" is not a number');
    const res = await post('commit', { format: 'csv', content: bad, mapping: { W9: { kind: 'water' }, LONE: { kind: 'water' } }, defaults });
    expect(res.status).toBe(400);
    expect(res.body.errors).toHaveLength(4);
    expect(await tableCounts(ctx.orm)).toEqual(before);
  });

  it('when no record depth is given, then the commit asks for it and writes nothing', async () => {
    const before = await tableCounts(ctx.orm);
    const res = await post('commit', { format: 'csv', content: good, mapping: { '007': { kind: 'communications' }, SS1: { kind: 'sewer' } }, defaults: { owner: 'X', diameter: 0.5 } });
    expect(res.status).toBe(400);
    expect(res.body.errors.map((e: { path: string }) => e.path)).toEqual(['defaults.recordDepth']);
    expect(await tableCounts(ctx.orm)).toEqual(before);
  });

  it('when a reviewer or the manager tries an import, then 403 and nothing is written', async () => {
    const before = await tableCounts(ctx.orm);
    for (const role of ['viewer', 'manager', 'surveyor', 'field'] as const) {
      expect((await post('preview', { format: 'csv', content: good }, role)).status).toBe(403);
      expect((await post('commit', { format: 'csv', content: good, mapping: { '007': { kind: 'water' }, SS1: { kind: 'sewer' } }, defaults }, role)).status).toBe(403);
    }
    expect(await tableCounts(ctx.orm)).toEqual(before);
  });

  it('when the file is larger than the 1 MB JSON limit of other requests, then the import still takes it', async () => {
    const rows = ['point,northing,easting,elevation,description'];
    for (let k = 0; k < 4; k++) for (let i = 0; i < 9000; i++) rows.push(`${k * 10000 + i},${13799000 + i * 0.2},${3000300 + k * 5},95.123,BIG${k}`);
    const content = rows.join('\n');
    expect(content.length).toBeGreaterThan(1_200_000); // over the 1 MB limit of other JSON bodies
    const res = await post('preview', { format: 'csv', content });
    expect(res.status).toBe(200);
    expect((res.body as LineImportPreviewDto).itemCount).toBe(4);
  });

  it('when the body misses the format, then 400 names it', async () => {
    const res = await post('preview', { content: good });
    expect(res.status).toBe(400);
    expect(res.body.errors[0].path).toBe('format');
  });
});
