/**
 * Exports read back with outside libraries: papaparse (CSV), exceljs (XLSX, and its CSV reader
 * as a spreadsheet stand-in), pdf-parse (PDF), dxf-parser (DXF), proj4 (GeoJSON positions,
 * checked independently of shared/geometry) and jszip (the zip).
 */
import { randomUUID } from 'node:crypto';
import { Readable } from 'node:stream';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import Papa from 'papaparse';
import ExcelJS from 'exceljs';
import { PDFParse } from 'pdf-parse';
import DxfParser from 'dxf-parser';
import type { IPointEntity, IPolylineEntity, ITextEntity } from 'dxf-parser';
import JSZip from 'jszip';
import proj4 from 'proj4';
import type { ExportJobDto, ExportSummaryDto, StakeoutDto } from '@shared/api';
import { Bore, Conflict, Project, TestHole, User, UtilityLine } from '@server/entities';
import { recomputeConflicts } from '@server/modules/clearances/clearance.service';
import { makeFixtures, makeTestApp, type Fixtures, type TestContext } from './helpers';

let ctx: TestContext;
let f: Fixtures;
let gasConflictId: number;

/** Binary bodies through supertest. */
function binary(res: request.Response, cb: (err: Error | null, body: Buffer) => void) {
  const chunks: Buffer[] = [];
  res.on('data', (c: Buffer) => chunks.push(c));
  res.on('end', () => cb(null, Buffer.concat(chunks)));
}
const get = (url: string, role: Parameters<TestContext['cookie']>[0] = 'viewer') => request(ctx.app).get(url).set('Cookie', ctx.cookie(role));
const getFile = (url: string, role: Parameters<TestContext['cookie']>[0] = 'viewer') => get(url, role).buffer(true).parse(binary);
const base = () => `/api/projects/${f.project.id}/exports`;

beforeAll(async () => {
  ctx = await makeTestApp();
  f = await makeFixtures(ctx, `Export fixture ${randomUUID().slice(0, 6)}`);
  const em = ctx.orm.em.fork();
  const project = f.project;
  // A ground profile (flat at 100.00) so suggested holes get a ground elevation.
  const bore = await em.findOneOrFail(Bore, f.bore.id);
  bore.groundProfile = [
    { station: 1000, elevation: 100 },
    { station: 1250, elevation: 100 },
  ];
  // W-1 gets a second hole: TH-1 gives top 100 − 14 = 86.00, TH-2 100 − 13 = 87.00 (hand-worked).
  const w1 = await em.findOneOrFail(UtilityLine, f.line.id);
  const th2 = new TestHole(project, w1, randomUUID(), 'TH-2', 3000100, 13800060);
  th2.status = 'dug';
  th2.groundElevation = 100;
  th2.depthToTop = 13;
  em.persist(th2);
  // A gas line labelled 007 (leading zeros) through the casing, exposed by hole 007:
  // casing centreline at STA 12+00 = 85 − 200/250 = 84.20, top 85.70; hole top 100 − 14.5 = 85.50,
  // bottom 85.00 (0.5 ft pipe) → the pipe is inside the casing band: an overlap.
  const gas = new UtilityLine(project, '007', 'Test gas company', 'gas', [
    [3000200, 13799900],
    [3000200, 13800100],
  ]);
  gas.diameter = 0.5;
  gas.contactEmail = 'locates@gas.example.com';
  em.persist(gas);
  const h007 = new TestHole(project, gas, randomUUID(), '007', 3000200, 13800005);
  h007.status = 'dug';
  h007.groundElevation = 100;
  h007.depthToTop = 14.5;
  em.persist(h007);
  // A fibre with no hole crossing at E 3,000,050: unverified, so a suggested test hole.
  const fibre = new UtilityLine(project, 'C-9', 'Test fibre company', 'communications', [
    [3000050, 13799900],
    [3000050, 13800100],
  ]);
  fibre.diameter = 0.25;
  fibre.recordDepth = 3;
  em.persist(fibre);
  await em.flush();
  await recomputeConflicts(em, project, null);
  const assigned = await em.findOneOrFail(Conflict, { project, line: gas });
  assigned.assignee = em.getReference(User, ctx.users.manager.id);
  assigned.dueDate = new Date('2027-03-04T00:00:00Z');
  await em.flush();
  gasConflictId = assigned.id;
});
afterAll(() => ctx.close());

/** Split the header block (# lines) from a CSV export. */
function headerOf(csv: string): string[] {
  return csv.replace(/^\ufeff/, '').split('\r\n').filter((l) => l.startsWith('#'));
}

describe('conflict list as CSV', () => {
  it('when a reviewer exports everything, then papaparse reads the rows with ids as text and the header block names CRS, unit, datum and check time', async () => {
    const res = await get(`${base()}/conflicts.csv`);
    expect(res.status).toBe(200);
    expect(res.headers['content-type']).toMatch(/^text\/csv/);
    expect(res.headers['content-disposition']).toMatch(/^attachment; filename="[a-z0-9-]+-conflicts-\d{8}-\d{4}\.csv"$/);
    const csv = res.text;
    expect(csv.charCodeAt(0)).toBe(0xfeff);
    const header = headerOf(csv);
    expect(header).toContain('# CRS: EPSG:2278 NAD83 / Texas South Central (ftUS)');
    expect(header.find((l) => l.startsWith('# Unit: US survey feet (US ft)'))).toBeDefined();
    expect(header).toContain('# Vertical datum: NAVD 88');
    const checked = header.find((l) => l.startsWith('# Clearances checked: '))!;
    expect(Number.isNaN(Date.parse(checked.slice('# Clearances checked: '.length, checked.indexOf(' ('))))).toBe(false);
    expect(header.some((l) => l.includes('design aid'))).toBe(true);

    // papaparse, told to skip # comment lines: the column row first, then one row per conflict.
    const parsed = Papa.parse<Record<string, string>>(csv, { header: true, comments: '#', skipEmptyLines: true });
    expect(parsed.errors).toEqual([]);
    expect(parsed.data).toHaveLength(2);
    const gas = parsed.data.find((r) => r.Line === '007')!;
    expect(gas).toBeDefined();
    expect(gas.Conflict).toBe(`C-${gasConflictId}`);
    expect(gas['Test holes']).toBe('007');
    expect(gas.Kind).toBe('Gas');
    expect(gas['Last check']).toBe('Overlap');
    expect(gas.Assignee).toBe('Test manager');
    expect(gas['Due (assignee)']).toBe('2027-03-04');
    // Hand-worked above: top of line 85.50 US ft NAVD 88 at the crossing.
    expect(Number(gas['Top of line (US ft NAVD 88)'])).toBeCloseTo(85.5, 6);
    const water = parsed.data.find((r) => r.Line === 'W-1')!;
    expect(water['Test holes']).toBe('TH-1, TH-2');
  });

  it('when a spreadsheet opens the file, then each header line is one cell of column A and the table starts at the column row', async () => {
    const csv = (await get(`${base()}/conflicts.csv`)).text;
    // exceljs's CSV reader stands in for a spreadsheet opening the file.
    const wb = new ExcelJS.Workbook();
    const ws = await wb.csv.read(Readable.from([csv.replace(/^\ufeff/, '')]));
    const rows: (string | number | null)[][] = [];
    ws.eachRow({ includeEmpty: false }, (row) => rows.push((row.values as (string | number | null)[]).slice(1)));
    const headerCount = headerOf(csv).length;
    for (const r of rows.slice(0, headerCount)) {
      expect(r.filter((v) => v !== null && v !== undefined && v !== '').length).toBe(1);
      expect(String(r[0])).toMatch(/^# /);
    }
    const columnRow = rows[headerCount]!;
    expect(columnRow[0]).toBe('Conflict');
    expect(columnRow).toHaveLength(30);
    for (const r of rows.slice(headerCount + 1)) expect(r.length).toBeLessThanOrEqual(30);
  });

  it('when ids=spreadsheet, then identifiers are written ="007" so a spreadsheet keeps the text', async () => {
    const csv = (await get(`${base()}/conflicts.csv?ids=spreadsheet`)).text;
    const parsed = Papa.parse<Record<string, string>>(csv, { header: true, comments: '#', skipEmptyLines: true });
    const gas = parsed.data.find((r) => r.Line === '="007"');
    expect(gas?.['Test holes']).toBe('="007"');
    expect(gas?.Owner).toBe('Test gas company');
  });

  it('when filtered by kind, then only those rows come out and the header says the filter and the count', async () => {
    const csv = (await get(`${base()}/conflicts.csv?kind=gas`)).text;
    expect(headerOf(csv)).toContain('# Rows: 1 of 2 conflicts; filter: kind = Gas');
    const parsed = Papa.parse<Record<string, string>>(csv, { header: true, comments: '#', skipEmptyLines: true });
    expect(parsed.data.map((r) => r.Line)).toEqual(['007']);
  });

  it('when the filter names an unknown status, then 400 names the query field', async () => {
    const res = await get(`${base()}/conflicts.csv?status=bogus`);
    expect(res.status).toBe(400);
    expect(res.body.errors[0].path).toMatch(/^query\.status/);
  });
});

describe('conflict list as XLSX', () => {
  it('when exceljs reads it back, then ids are text cells (007 stays 007), figures are numbers, and the header block is above the table', async () => {
    const res = await getFile(`${base()}/conflicts.xlsx`);
    expect(res.status).toBe(200);
    expect(res.headers['content-type']).toBe('application/vnd.openxmlformats-officedocument.spreadsheetml.sheet');
    const wb = new ExcelJS.Workbook();
    await wb.xlsx.load((res.body as Buffer).buffer.slice((res.body as Buffer).byteOffset, (res.body as Buffer).byteOffset + (res.body as Buffer).length) as ArrayBuffer);
    const ws = wb.getWorksheet('Conflicts')!;
    const labels = new Map<string, string>();
    for (let r = 1; r <= 12; r++) labels.set(String(ws.getCell(r, 1).value), String(ws.getCell(r, 2).value));
    expect(labels.get('CRS')).toBe('EPSG:2278 NAD83 / Texas South Central (ftUS)');
    expect(labels.get('Unit')).toMatch(/^US survey feet/);
    expect(labels.get('Vertical datum')).toBe('NAVD 88');
    expect(labels.get('Clearances checked')).toMatch(/^\d{4}-\d\d-\d\dT\d\d:\d\d:\d\dZ/);

    let headRow = 0;
    ws.eachRow((row, n) => {
      if (row.getCell(1).value === 'Conflict') headRow = n;
    });
    expect(headRow).toBeGreaterThan(5);
    const col = (name: string) => {
      let found = 0;
      ws.getRow(headRow).eachCell((c, n) => {
        if (c.value === name) found = n;
      });
      return found;
    };
    let gasRow = 0;
    for (let r = headRow + 1; r <= ws.rowCount; r++) if (ws.getCell(r, col('Line')).value === '007') gasRow = r;
    expect(gasRow).toBeGreaterThan(headRow);
    const label = ws.getCell(gasRow, col('Line'));
    expect(label.value).toBe('007');
    expect(label.type).toBe(ExcelJS.ValueType.String);
    expect(label.numFmt).toBe('@');
    expect(ws.getCell(gasRow, col('Test holes')).value).toBe('007');
    expect(ws.getCell(gasRow, col('Conflict')).value).toBe(`C-${gasConflictId}`);
    const top = ws.getCell(gasRow, col('Top of line (US ft NAVD 88)'));
    expect(top.type).toBe(ExcelJS.ValueType.Number);
    expect(top.value as number).toBeCloseTo(85.5, 6);
    const due = ws.getCell(gasRow, col('Due (assignee)')).value as Date;
    expect(due.toISOString().slice(0, 10)).toBe('2027-03-04');
  });
});

describe('conflict list as PDF', () => {
  it('when pdf-parse reads it, then the header block, the design-aid caution and a conflict row are in the text', async () => {
    const res = await getFile(`${base()}/conflicts.pdf`);
    expect(res.status).toBe(200);
    expect(res.headers['content-type']).toBe('application/pdf');
    const parser = new PDFParse({ data: new Uint8Array(res.body as Buffer) });
    const text = (await parser.getText()).text.replace(/\s+/g, ' ');
    await parser.destroy();
    expect(text).toContain('CRS: EPSG:2278 NAD83 / Texas South Central (ftUS)');
    expect(text).toContain('Vertical datum: NAVD 88');
    expect(text).toContain('Clearances checked:');
    expect(text).toContain('Clearances here are a design aid');
    expect(text).toContain(`C-${gasConflictId}`);
    expect(text).toContain('Test gas company');
    expect(text).toContain('85.50 US ft');
  });
});

describe('stake-out exports', () => {
  /** The Stake-out screen's list (its API), the source of every name and position in the files. */
  const stakeList = async () => ((await get(`/api/projects/${f.project.id}/stakeout`)).body as StakeoutDto).points;
  const readPointFile = (text: string) => {
    const parsed = Papa.parse<Record<string, string>>(text, { header: true, comments: '#', skipEmptyLines: true });
    expect(parsed.errors).toEqual([]);
    return parsed;
  };
  /** Each POINT of the DXF with the TEXT label written right after it (dxf-parser keeps file order). */
  const dxfPoints = (text: string) => {
    const dxf = new DxfParser().parseSync(text)!;
    const out: { point: IPointEntity; label: ITextEntity }[] = [];
    dxf.entities.forEach((e, i) => {
      if (e.type !== 'POINT') return;
      const label = dxf.entities[i + 1] as ITextEntity;
      expect(label.type).toBe('TEXT');
      out.push({ point: e as IPointEntity, label });
    });
    return { dxf, out };
  };

  it('when the point file is read back, then it has exactly point, northing, easting, elevation, description and the hand-worked points', async () => {
    const res = await get(`${base()}/stakeout.csv`);
    expect(res.status).toBe(200);
    expect(headerOf(res.text)).toContain('# Vertical datum: NAVD 88');
    expect(headerOf(res.text)).toContain('# Points: 7; filter: kind of point = Confirmed crossing / Suggested test hole / Pit corner');
    const parsed = readPointFile(res.text);
    expect(parsed.meta.fields).toEqual(['point', 'northing', 'easting', 'elevation', 'description']);
    const list = await stakeList();
    const lineId = (label: string) => list.find((p) => p.lineLabel === label)!.lineId!;
    const b = f.bore.id;
    // Names come from the bore, line and pit ids, as on the Stake-out screen, in the screen's order:
    // crossings up-station (W-1 at 11+00, 007 at 12+00), the fibre's suggested hole, the pit's corners.
    expect(parsed.data.map((r) => r.point)).toEqual([
      `X${b}-${f.line.id}`,
      `X${b}-${lineId('007')}`,
      `SH${b}-${lineId('C-9')}`,
      ...[1, 2, 3, 4].map((c) => `P${f.pit.id}-${c}`),
    ]);
    // W-1 crosses the bore at E 3,000,100, N 13,800,000; TH-1 verifies it (10 ft away) and the top there is held
    // at TH-1's 86.00 (the crossing lies before the first hole along the line: held flat, SPEC §4.4).
    const x = parsed.data[0]!;
    expect(x.description).toBe('Confirmed crossing W-1 (Potable water) over Bore 1; top of line; TH-1');
    expect(Number(x.northing)).toBeCloseTo(13800000, 3);
    expect(Number(x.easting)).toBeCloseTo(3000100, 3);
    expect(Number(x.elevation)).toBeCloseTo(86, 6);
    const x007 = parsed.data[1]!;
    expect(x007.description).toMatch(/^Confirmed crossing 007 \(Gas\) over Bore 1; top of line; 007$/);
    expect(Number(x007.elevation)).toBeCloseTo(85.5, 6);
    // The fibre has no hole: its suggested test hole sits on the crossing, elevation = ground 100.00 from the profile.
    const s = parsed.data[2]!;
    expect(Number(s.easting)).toBeCloseTo(3000050, 3);
    expect(Number(s.northing)).toBeCloseTo(13800000, 3);
    expect(Number(s.elevation)).toBeCloseTo(100, 6);
    expect(s.description).toMatch(/^Suggested test hole C-9 \(.+\) at its crossing of Bore 1; ground$/);
    // The launch pit's corners (helpers.ts footprint) at its bottom, 80.00.
    expect(parsed.data.slice(3).map((r) => [Number(r.easting), Number(r.northing), Number(r.elevation)])).toEqual([
      [2999980, 13799990, 80],
      [3000000, 13799990, 80],
      [3000000, 13800010, 80],
      [2999980, 13800010, 80],
    ]);
    expect(parsed.data[3]!.description).toBe('Pit corner 1 of 4 launch pit of Bore 1; pit bottom 80.00 US ft');
  });

  it('when the Stake-out list and the point file and DXF are read back, then they hold the same points under the same names at the same places, and names are unique and short', async () => {
    // The defect this guards against: the screen named points by line (X1-4 = the sewer) while the file
    // numbered them (X4 = another line). Compare the API with the files, point for point.
    const list = await stakeList();
    expect(list).toHaveLength(7);
    const names = list.map((p) => p.name);
    expect(new Set(names).size).toBe(names.length);
    // Data collectors commonly take point names of 10 to 16 characters (common practice).
    for (const n of names) expect(n.length).toBeLessThanOrEqual(16);

    const csv = readPointFile((await get(`${base()}/stakeout.csv`)).text).data;
    // The file rounds coordinates to 4 decimals (round4).
    expect(csv.map((r) => [r.point, Number(r.northing), Number(r.easting), r.elevation === '' ? null : Number(r.elevation), r.description])).toEqual(
      list.map((p) => [p.name, Math.round(p.northing * 1e4) / 1e4, Math.round(p.easting * 1e4) / 1e4, p.elevation === null ? null : Math.round(p.elevation * 1e4) / 1e4, p.description]),
    );

    // dxf-writer writes its entities layer by layer, so the DXF is compared by name.
    const { out } = dxfPoints(((await getFile(`${base()}/stakeout.dxf`)).body as Buffer).toString('utf8'));
    const byName = new Map(out.map((e) => [e.label.text.split(' ')[0]!, e.point]));
    expect(byName.size).toBe(out.length);
    expect([...byName.keys()].sort()).toEqual([...names].sort());
    for (const p of list) {
      const point = byName.get(p.name)!;
      expect(point.position.x).toBeCloseTo(p.easting, 6);
      expect(point.position.y).toBeCloseTo(p.northing, 6);
      expect(point.position.z).toBeCloseTo(p.elevation ?? 0, 6);
    }

    // …and the zip's copies are the same files.
    const start = await request(ctx.app).post(`${base()}/bundle`).set('Cookie', ctx.cookie('viewer')).send({ photos: false });
    const job = await waitForJob(`${base()}/bundle/${(start.body as ExportJobDto).id}`, 'viewer');
    const zip = await JSZip.loadAsync((await getFile(job.downloadUrl!, 'viewer')).body as Buffer);
    expect(readPointFile(await zip.file('stakeout-points.csv')!.async('string')).data.map((r) => r.point)).toEqual(names);
    expect(dxfPoints(await zip.file('stakeout.dxf')!.async('string')).out.map(({ label }) => label.text.split(' ')[0]).sort()).toEqual([...names].sort());
  });

  it('when a line is added, then no other point changes its name (names come from ids, not list order)', async () => {
    const before = await stakeList();
    // A sewer crossing at E 3,000,020 (station 10+20), ahead of every other crossing along the bore.
    const em = ctx.orm.em.fork();
    const project = await em.findOneOrFail(Project, f.project.id);
    const sewer = new UtilityLine(project, 'S-1', 'Test sewer district', 'sewer', [
      [3000020, 13799900],
      [3000020, 13800100],
    ]);
    sewer.diameter = 1.25;
    sewer.recordDepth = 8;
    em.persist(sewer);
    await em.flush();
    try {
      const after = await stakeList();
      expect(after).toHaveLength(before.length + 1);
      const byKey = new Map(after.map((p) => [p.key, p.name]));
      for (const p of before) expect(byKey.get(p.key)).toBe(p.name);
      expect(after.find((p) => p.lineLabel === 'S-1')!.name).toBe(`SH${f.bore.id}-${sewer.id}`);
    } finally {
      await em.removeAndFlush(sewer);
    }
  });

  it('when only one kind of point is asked for, then only those points come out and the header says so in the screen’s words', async () => {
    const res = await get(`${base()}/stakeout.csv?set=suggested`);
    const list = await stakeList();
    expect(readPointFile(res.text).data.map((r) => r.point)).toEqual(list.filter((p) => p.kind === 'suggested_hole').map((p) => p.name));
    expect(headerOf(res.text)).toContain('# Points: 1; filter: kind of point = Suggested test hole');
    const pits = await get(`${base()}/stakeout.csv?set=pits&boreId=${f.bore.id}`);
    expect(readPointFile(pits.text).data.map((r) => r.point)).toEqual([1, 2, 3, 4].map((c) => `P${f.pit.id}-${c}`));
    expect(headerOf(pits.text)).toContain('# Points: 4; filter: kind of point = Pit corner; bore = Bore 1');
    // A line kind narrows the lines' points; pit corners are on no line and stay (the header says so).
    const gas = await get(`${base()}/stakeout.csv?kind=gas`);
    expect(readPointFile(gas.text).data.map((r) => r.point)).toEqual(list.filter((p) => p.lineKind === 'gas' || p.kind === 'pit_corner').map((p) => p.name));
    expect(headerOf(gas.text).find((l) => l.startsWith('# Points: 5;'))).toContain('kind = Gas; pit corners are on no line');
  });

  it('when dxf-parser reads the DXF, then layers go by line kind and Z values equal the elevations', async () => {
    const res = await getFile(`${base()}/stakeout.dxf`);
    expect(res.status).toBe(200);
    const text = (res.body as Buffer).toString('utf8');
    expect(text).toContain('999\nCRS: EPSG:2278');
    expect(text).toContain('999\nVertical datum: NAVD 88');
    const { dxf, out } = dxfPoints(text);
    const layers = Object.keys(dxf.tables.layer.layers);
    for (const l of ['UTIL-WATER', 'UTIL-WATER-PLAN', 'UTIL-GAS', 'UTIL-COMMUNICATIONS-SUGGESTED', 'BORE-CENTRELINE', 'PIT-CORNERS', 'INFO']) expect(layers).toContain(l);

    const x = out.find(({ point }) => point.layer === 'UTIL-WATER')!;
    expect(x.point.position.x).toBeCloseTo(3000100, 3);
    expect(x.point.position.y).toBeCloseTo(13800000, 3);
    expect(x.point.position.z).toBeCloseTo(86, 6);
    expect(x.label.text).toBe(`X${f.bore.id}-${f.line.id} TOP 86.00`);
    expect(x.label.layer).toBe('UTIL-WATER');
    expect(x.label.startPoint.z).toBeCloseTo(86, 6);
    expect(out.find(({ point }) => point.layer === 'UTIL-GAS')!.point.position.z).toBeCloseTo(85.5, 6);
    expect(out.find(({ point }) => point.layer === 'UTIL-COMMUNICATIONS-SUGGESTED')!.point.position.z).toBeCloseTo(100, 6);
    expect(out.filter(({ point }) => point.layer === 'PIT-CORNERS').map(({ label }) => label.text)).toEqual([1, 2, 3, 4].map((c) => `P${f.pit.id}-${c} PIT 80.00`));

    // The top of W-1 as a 3-D polyline between its holes: TH-1 (86.00) to TH-2 (87.00).
    const top = (dxf.entities.filter((e) => e.type === 'POLYLINE') as IPolylineEntity[]).find((p) => p.layer === 'UTIL-WATER')!;
    expect(top.is3dPolyline).toBe(true);
    expect(top.vertices.map((v) => [v.x, v.y, v.z])).toEqual([
      [3000100, 13800010, 86],
      [3000100, 13800060, 87],
    ]);
    // The casing centreline: 85.00 at 10+00 falling to 84.00 at 12+50.
    const bore = (dxf.entities.filter((e) => e.type === 'POLYLINE') as IPolylineEntity[]).find((p) => p.layer === 'BORE-CENTRELINE')!;
    expect(bore.vertices.map((v) => v.z)).toEqual([85, 84]);
    expect(dxf.entities.some((e) => e.type === 'LWPOLYLINE' && e.layer === 'UTIL-COMMUNICATIONS-PLAN')).toBe(true);
  });
});

describe('GeoJSON', () => {
  // EPSG:2278 from its published parameters (NAD83 / Texas South Central, US survey feet), written
  // here independently of shared/geometry; the fixture project uses y_0 = 4,000,000 m, the EPSG false
  // northing rounded (3,999,999.9998984 m), a 0.1 mm difference.
  const EPSG_2278 =
    '+proj=lcc +lat_1=30.28333333333333 +lat_2=28.38333333333333 +lat_0=27.83333333333333 +lon_0=-99 +x_0=600000 +y_0=3999999.9998984 +ellps=GRS80 +units=us-ft +no_defs';

  it('when read back, then it is an RFC 7946 FeatureCollection with [longitude, latitude] positions that proj4 confirms', async () => {
    const res = await get(`${base()}/project.geojson`);
    expect(res.status).toBe(200);
    expect(res.headers['content-type']).toMatch(/^application\/geo\+json/);
    const gj = JSON.parse(res.text);
    expect(gj.type).toBe('FeatureCollection');
    expect(gj.crs).toBeUndefined(); // RFC 7946 §4: no crs member
    expect(gj.coordinateOrder).toMatch(/longitude, latitude/);
    expect(gj.threadline).toMatchObject({ projectCrs: 'EPSG:2278', unit: 'usft', verticalDatum: 'NAVD 88', coordinateOrder: 'longitude, latitude' });
    expect(Number.isNaN(Date.parse(gj.threadline.clearancesCheckedAt))).toBe(false);
    for (const feat of gj.features) {
      expect(feat.type).toBe('Feature');
      const positions: number[][] = feat.geometry.type === 'Point' ? [feat.geometry.coordinates] : feat.geometry.coordinates;
      if (feat.geometry.type === 'LineString') expect(positions.length).toBeGreaterThanOrEqual(2); // RFC 7946 §3.1.4
      for (const p of positions) {
        expect(p).toHaveLength(2);
        expect(Math.abs(p[0]!)).toBeLessThanOrEqual(180);
        expect(Math.abs(p[1]!)).toBeLessThanOrEqual(90);
      }
    }
    const [w, s, e, n] = gj.bbox;
    expect(w).toBeLessThanOrEqual(e);
    expect(s).toBeLessThanOrEqual(n);

    const hole = gj.features.find((x: { properties: { number?: string } }) => x.properties.number === 'TH-1');
    const [lon, lat] = hole.geometry.coordinates;
    // Independently: proj4 with the EPSG parameters. E 3,000,100, N 13,800,010 US ft lies in south-east Texas.
    const [refLon, refLat] = proj4(EPSG_2278, 'WGS84', [3000100, 13800010]);
    expect(lon).toBeCloseTo(refLon!, 6);
    expect(lat).toBeCloseTo(refLat!, 6);
    expect(lat).toBeGreaterThan(29);
    expect(lat).toBeLessThan(30);
    expect(lon).toBeGreaterThan(-96); // west of −95 and east of −96: longitude first, latitude second
    expect(lon).toBeLessThan(-95);
    expect(hole.properties).toMatchObject({ gridEasting: 3000100, gridNorthing: 13800010, groundElevation: 100, topElevation: 86, verticalDatum: 'NAVD 88' });

    const line = gj.features.find((x: { properties: { label?: string } }) => x.properties.label === '007');
    expect(line.properties.gridCoordinates).toEqual([
      [3000200, 13799900],
      [3000200, 13800100],
    ]);
  });

  it('when asked for holes of one kind, then only those features come out', async () => {
    const gj = JSON.parse((await get(`${base()}/project.geojson?layers=holes&kind=gas`)).text);
    expect(gj.features.map((x: { properties: { number: string } }) => x.properties.number)).toEqual(['007']);
  });
});

async function waitForJob(url: string, role: Parameters<TestContext['cookie']>[0]): Promise<ExportJobDto> {
  for (let i = 0; i < 200; i++) {
    const job = (await get(url, role)).body as ExportJobDto;
    if (job.state !== 'running') return job;
    await new Promise((r) => setTimeout(r, 25));
  }
  throw new Error('the zip job did not finish');
}

describe('the project zip', () => {
  it('when a reviewer prepares and downloads it, then jszip lists the data, the README with the frame, and photos named by hole number', async () => {
    const start = await request(ctx.app).post(`${base()}/bundle`).set('Cookie', ctx.cookie('viewer')).send({});
    expect(start.status).toBe(202);
    const started = start.body as ExportJobDto;
    expect(started.fileName).toMatch(/-export-\d{8}-\d{4}\.zip$/);
    const job = await waitForJob(`${base()}/bundle/${started.id}`, 'viewer');
    expect(job.state).toBe('done');
    expect(job.percent).toBe(100);
    expect(job.downloadUrl).toBe(`${base()}/bundle/${started.id}/download`);

    const res = await getFile(job.downloadUrl!);
    expect(res.status).toBe(200);
    expect(res.headers['content-type']).toBe('application/zip');
    expect(Number(res.headers['content-length'])).toBe(job.byteSize);
    expect(res.headers['content-disposition']).toBe(`attachment; filename="${job.fileName}"`);
    const zip = await JSZip.loadAsync(res.body as Buffer);
    const names = Object.keys(zip.files).filter((n) => !zip.files[n]!.dir).sort();
    expect(names).toEqual(
      [
        'README.txt',
        'conflicts.csv',
        'conflicts.pdf',
        'conflicts.xlsx',
        'holes.csv',
        'lines.csv',
        'photos/TH-1_1.jpg',
        'project.geojson',
        'sheets/007.pdf',
        'sheets/TH-1.pdf',
        'sheets/TH-2.pdf',
        'stakeout-points.csv',
        'stakeout.dxf',
      ].sort(),
    );
    // The sheets come from the test-hole sheet builder: a PDF naming its hole.
    const sheet = new PDFParse({ data: await zip.file('sheets/TH-1.pdf')!.async('uint8array') });
    expect((await sheet.getText()).text).toContain('TH-1');
    await sheet.destroy();
    const readme = await zip.file('README.txt')!.async('string');
    expect(readme).toContain('CRS:                 EPSG:2278 NAD83 / Texas South Central (ftUS)');
    expect(readme).toContain('Unit:                US survey feet (US ft)');
    expect(readme).toContain('Vertical datum:      NAVD 88');
    expect(readme).toMatch(/Clearances checked: {2}\d{4}-\d\d-\d\dT\d\d:\d\d:\d\dZ UTC/);
    expect(readme).toContain('1 photo named by hole number');
    expect(readme).toContain('design aid');
    // The photo is the stored file, byte for byte.
    expect(Buffer.from(await zip.file('photos/TH-1_1.jpg')!.async('uint8array'))).toEqual(await ctx.storage.get(f.photo.fileKey));
    const csv = await zip.file('holes.csv')!.async('string');
    const holes = Papa.parse<Record<string, string>>(csv, { header: true, comments: '#', skipEmptyLines: true }).data;
    expect(holes.map((h) => h.number)).toEqual(['007', 'TH-1', 'TH-2']);
  });

  it('when the zip is asked for without photos and for one kind, then it holds neither other kinds nor photos', async () => {
    const start = await request(ctx.app).post(`${base()}/bundle`).set('Cookie', ctx.cookie('manager')).send({ filter: { kind: ['gas'] }, photos: false });
    const job = await waitForJob(`${base()}/bundle/${(start.body as ExportJobDto).id}`, 'manager');
    const res = await getFile(job.downloadUrl!, 'manager');
    const zip = await JSZip.loadAsync(res.body as Buffer);
    expect(Object.keys(zip.files).some((n) => n.startsWith('photos/'))).toBe(false);
    const conflicts = Papa.parse<Record<string, string>>(await zip.file('conflicts.csv')!.async('string'), { header: true, comments: '#', skipEmptyLines: true }).data;
    expect(conflicts.map((r) => r.Line)).toEqual(['007']);
    expect(await zip.file('README.txt')!.async('string')).toContain('Filter:              kind = Gas');
  });

  it("when someone else asks for my zip job, then 404 (jobs are not shared, not even by id)", async () => {
    const start = await request(ctx.app).post(`${base()}/bundle`).set('Cookie', ctx.cookie('viewer')).send({ photos: false });
    const id = (start.body as ExportJobDto).id;
    expect((await get(`${base()}/bundle/${id}`, 'manager')).status).toBe(404);
    expect((await get(`${base()}/bundle/${id}/download`, 'admin')).status).toBe(404);
    await waitForJob(`${base()}/bundle/${id}`, 'viewer');
  });

  it('when the body is not valid, then 400 names the field', async () => {
    const res = await request(ctx.app).post(`${base()}/bundle`).set('Cookie', ctx.cookie('viewer')).send({ photos: 'yes' });
    expect(res.status).toBe(400);
    expect(res.body.errors[0].path).toBe('photos');
  });
});

describe('export summary', () => {
  it('when the Exports screen opens, then it gets the counts and the frame', async () => {
    const res = await get(base());
    expect(res.status).toBe(200);
    const body = res.body as ExportSummaryDto;
    expect(body).toMatchObject({ crsCode: 'EPSG:2278', unit: 'usft', verticalDatum: 'NAVD 88', holeSheets: 'pdf' });
    expect(body.counts).toMatchObject({ conflicts: 2, lines: 3, holes: 3, bores: 1, photos: 1, crossings: 2, suggested: 1 });
  });
});
