import type { EntityManager } from '@mikro-orm/sqlite';
import PDFDocument from 'pdfkit';
import { SAFETY_CAUTIONS } from '@shared/cautions';
import { LINE_KIND_COLOURS, LINE_KIND_LABELS, UNIT_LABELS, type QualityLevel } from '@shared/domain';
import { formatStation, holeTopElevation, lineSize, stationOffset, type ClearanceReport } from '@shared/geometry';
import { UNIT_SYMBOLS } from '@shared/units';
import type { FileStorage } from '../../storage/storage';
import { ActivityEntry } from '../activity/activity-entry.entity';
import { Bore } from '../bores/bore.entity';
import { Pit } from '../bores/pit.entity';
import { computeProjectReport } from '../clearances/clearance.service';
import { UtilityLine } from '../lines/utility-line.entity';
import type { Project } from '../projects/project.entity';
import { presentHole } from './hole.presenter';
import { Photo } from './photo.entity';
import { TestHole } from './test-hole.entity';

type Doc = PDFKit.PDFDocument;
type XY = [number, number];

/** Everything one sheet (one excavation number) shows, loaded before drawing. */
export interface HoleSheetData {
  project: Project;
  number: string;
  /** Every record sharing the excavation's number, the requested one first. */
  records: TestHole[];
  bores: Bore[];
  pits: Pit[];
  lines: UtilityLine[];
  photos: { photo: Photo; thumbnail: Buffer | null }[];
  preparedBy: string | null;
  reviewedBy: { name: string; at: Date } | null;
  report: ClearanceReport;
  checkedAt: Date;
}

/** Photos printed on a sheet. */
const MAX_PHOTOS = 4;

/**
 * Load what the sheet of a hole's excavation needs (all records sharing its number). A caller
 * drawing many sheets (the export zip) passes the clearance report it already computed, so the
 * project is computed once, not once per sheet, and every sheet states the same check time.
 */
export async function loadHoleSheet(
  em: EntityManager,
  project: Project,
  hole: TestHole,
  storage: FileStorage,
  computed?: { report: ClearanceReport; checkedAt: Date },
): Promise<HoleSheetData> {
  const siblings = await em.find(TestHole, { project, number: hole.number }, { populate: ['line', 'bore', 'createdBy'], orderBy: { id: 'asc' } });
  const records = [hole, ...siblings.filter((h) => h.id !== hole.id)];
  const bores = await em.find(Bore, { project }, { orderBy: { id: 'asc' } });
  const pits = bores.length ? await em.find(Pit, { bore: { project } }) : [];
  const lines = await em.find(UtilityLine, { project }, { orderBy: { id: 'asc' } });
  const photoRows = await em.find(Photo, { hole: { $in: records.map((r) => r.id) } }, { orderBy: { id: 'asc' }, limit: MAX_PHOTOS });
  const photos = [];
  for (const photo of photoRows) {
    photos.push({ photo, thumbnail: photo.state === 'ready' ? await storage.get(photo.thumbnailKey) : null });
  }
  const accepted = await em.findOne(
    ActivityEntry,
    { project, entity: 'hole', entityId: { $in: records.map((r) => r.id) }, action: 'accept' },
    { populate: ['user'], orderBy: { createdAt: 'desc', id: 'desc' } },
  );
  const reviewed = records.some((r) => r.status === 'reviewed');
  const creator = records.find((r) => r.createdBy)?.createdBy ?? null;
  return {
    project,
    number: hole.number,
    records,
    bores,
    pits,
    lines,
    photos,
    preparedBy: creator?.name ?? null,
    reviewedBy: reviewed && accepted?.user ? { name: accepted.user.name, at: accepted.createdAt } : null,
    report: computed?.report ?? (await computeProjectReport(em, project)),
    checkedAt: computed?.checkedAt ?? new Date(),
  };
}

/** Render sheets to a PDF buffer (one page per excavation number). */
export function renderHoleSheets(sheets: HoleSheetData[]): Promise<Buffer> {
  const doc = new PDFDocument({ size: 'LETTER', margin: 0, autoFirstPage: false, info: { Title: `Test-hole sheet ${sheets.map((s) => s.number).join(', ')}`, Creator: 'Threadline' } });
  const chunks: Buffer[] = [];
  doc.on('data', (c: Buffer) => chunks.push(c));
  const done = new Promise<Buffer>((resolve, reject) => {
    doc.on('end', () => resolve(Buffer.concat(chunks)));
    doc.on('error', reject);
  });
  for (const s of sheets) writeHoleSheet(doc, s);
  doc.end();
  return done;
}

const PAGE_W = 612;
const M = 36;
const CONTENT_W = PAGE_W - 2 * M;
const INK = '#111827';
const MUTED = '#4b5563';
const RULE = '#9ca3af';

function first<T>(records: TestHole[], pick: (h: TestHole) => T | null | undefined): T | null {
  for (const r of records) {
    const v = pick(r);
    if (v !== null && v !== undefined && v !== '') return v;
  }
  return null;
}

/** Append one page: the sheet of one excavation. */
export function writeHoleSheet(doc: Doc, s: HoleSheetData): void {
  const { project } = s;
  const u = UNIT_SYMBOLS[project.unit];
  const dp = project.unit === 'm' ? 3 : 2;
  const len = (v: number | null | undefined) => (v === null || v === undefined ? '-' : `${v.toFixed(dp)} ${u}`);
  const elev = (v: number | null | undefined) => (v === null || v === undefined ? '-' : `${v.toFixed(dp)} ${u} ${project.verticalDatum}`);
  const text = (v: string | null | undefined) => (v === null || v === undefined || v.trim() === '' ? '-' : v);
  const primary = s.records[0]!;

  doc.addPage({ size: 'LETTER', margin: 0 });
  doc.font('Helvetica').fillColor(INK);

  // Title and reference frame.
  doc.font('Helvetica-Bold').fontSize(16).text('Test-hole sheet', M, M, { width: 300, lineBreak: false });
  doc.text(`Test hole ${s.number}`, M + 300, M, { width: CONTENT_W - 300, align: 'right', lineBreak: false });
  doc.font('Helvetica').fontSize(9).fillColor(MUTED);
  doc.text(`${project.name} - ${project.client}`, M, M + 21, { width: CONTENT_W, lineBreak: false, ellipsis: true });
  doc.fontSize(8).fillColor(INK);
  doc.text(
    `CRS ${project.crsCode}   Unit: ${UNIT_LABELS[project.unit]} (${u})   Vertical datum: ${project.verticalDatum}   Clearances checked: ${isoMinute(s.checkedAt)}`,
    M,
    M + 34,
    { width: CONTENT_W, lineBreak: false, ellipsis: true },
  );
  hr(doc, M + 47);

  // Excavation facts in two columns.
  const method = first(s.records, (h) => h.method);
  const so = stationText(s, primary, u, dp);
  const surveyedPos = primary.surveyedEasting != null && primary.surveyedNorthing != null;
  const e = surveyedPos ? primary.surveyedEasting! : primary.easting;
  const n = surveyedPos ? primary.surveyedNorthing! : primary.northing;
  const posNote = surveyedPos ? 'surveyed' : primary.approximate ? `phone GPS, approximate (+/- ${len(primary.gpsAccuracy)})` : `logged (${primary.positionSource})`;
  const groundSurveyed = first(s.records, (h) => h.surveyedGroundElevation);
  const ground = groundSurveyed ?? first(s.records, (h) => h.groundElevation);
  const marker = first(s.records, (h) => h.markerSet);
  const left: [string, string][] = [
    ['Date dug', primary.dugAt ? isoDate(primary.dugAt) : '-'],
    ['Crew', text(first(s.records, (h) => h.crew))],
    ['Method', method ? `${method === 'air' ? 'Air' : 'Water'} vacuum excavation` : '-'],
    ['One-call ticket', text(first(s.records, (h) => h.ticketNumber))],
    ['Status', s.records.map((r) => `${r.line.label}: ${r.status}`).join(', ')],
    ['Station / offset', so],
  ];
  const right: [string, string][] = [
    ['Easting / northing', `E ${e.toFixed(dp)}  N ${n.toFixed(dp)} ${u} (${posNote})`],
    ['Ground elevation', ground === null ? '-' : `${elev(ground)} (${groundSurveyed !== null ? 'surveyed' : 'logged'})`],
    ['Surface / pavement', text(first(s.records, (h) => h.surfaceType))],
    ['Soil', text(first(s.records, (h) => h.soil))],
    ['Groundwater', text(first(s.records, (h) => h.groundwater))],
    ['Surface marker set', marker === null ? '-' : marker ? 'Yes' : 'No'],
    ['Restoration', text(first(s.records, (h) => h.restoration))],
  ];
  let y = M + 54;
  const rowH = 12;
  y += Math.max(keyValues(doc, left, M, y, 262, rowH), keyValues(doc, right, M + 278, y, 262, rowH)) + 6;

  // The lines exposed in the excavation.
  doc.font('Helvetica-Bold').fontSize(9).fillColor(INK).text('Lines exposed in this excavation', M, y, { lineBreak: false });
  y += 13;
  const cols: { title: string; w: number }[] = [
    { title: 'Line', w: 48 },
    { title: 'Kind', w: 58 },
    { title: 'Owner', w: 70 },
    { title: 'Size', w: 56 },
    { title: 'Material', w: 48 },
    { title: 'Condition', w: 54 },
    { title: 'Direction', w: 44 },
    { title: 'Depth to top', w: 56 },
    { title: 'Top elevation', w: 78 },
    { title: 'QL', w: 28 },
  ];
  doc.rect(M, y - 2, CONTENT_W, 12).fill('#e5e7eb');
  let x = M;
  doc.font('Helvetica-Bold').fontSize(7).fillColor(INK);
  for (const c of cols) {
    doc.text(c.title, x + 2, y, { width: c.w - 4, lineBreak: false, ellipsis: true });
    x += c.w;
  }
  y += 13;
  doc.font('Helvetica').fontSize(7);
  for (const r of s.records.slice(0, 6)) {
    const size = lineSize(r.line) ?? { height: 0, width: 0 };
    const top = holeTopElevation(presentHole(r), r.line, size);
    const depthNote = r.depthReference === 'top' ? '' : ` (to ${r.depthReference})`;
    const cells = [
      r.line.label,
      LINE_KIND_LABELS[r.line.kind],
      r.line.owner,
      sizeText(r, len),
      text(r.material ?? r.line.material),
      text(r.condition),
      text(r.direction),
      r.depthToTop === null ? '-' : `${len(r.depthToTop)}${depthNote}`,
      'top' in top ? `${elev(top.top)} (${top.source === 'surveyed_top' ? 'surveyed' : 'ground - depth'})` : '-',
      qualityReached(r),
    ];
    x = M;
    doc.save().rect(M, y - 1, 4, 18).fill(LINE_KIND_COLOURS[r.line.kind]).restore();
    doc.fillColor(INK);
    cells.forEach((cell, i) => {
      doc.text(cell, x + (i === 0 ? 6 : 2), y, { width: cols[i]!.w - (i === 0 ? 8 : 4), height: 18, ellipsis: true });
      x += cols[i]!.w;
    });
    y += 20;
    doc.moveTo(M, y - 2).lineTo(M + CONTENT_W, y - 2).lineWidth(0.3).strokeColor(RULE).stroke();
  }
  if (s.records.length > 6) {
    doc.fillColor(MUTED).text(`and ${s.records.length - 6} more records with this number`, M, y, { lineBreak: false });
    y += 10;
  }

  // Clearance status of these lines against each bore.
  const statusBits: string[] = [];
  for (const b of s.report.bores) {
    for (const l of b.lines) {
      if (!s.records.some((r) => r.line.id === l.lineId)) continue;
      statusBits.push(`${l.label} vs ${b.name}: ${l.status}${l.clearance !== null ? `, clearance ${len(l.clearance)} (required ${len(l.required)})` : ''}`);
    }
  }
  doc.font('Helvetica').fontSize(7).fillColor(MUTED);
  doc.text(statusBits.length ? `Clearances: ${statusBits.join('; ')}.` : 'Clearances: no bore near these lines.', M, y + 2, { width: CONTENT_W, height: 18, ellipsis: true });
  y += 22;

  // Plan inset and photos side by side.
  const inset = 250;
  drawPlanInset(doc, s, M, y, inset, [e, n], u);
  drawPhotos(doc, s, M + inset + 14, y, CONTENT_W - inset - 14, inset);
  y += inset + 12;

  // Prepared and reviewed by.
  hr(doc, y);
  y += 6;
  const prepared = [s.preparedBy, first(s.records, (h) => h.crew)].filter(Boolean).join(', crew ');
  const reviewed = s.reviewedBy
    ? `${s.reviewedBy.name}, ${isoDate(s.reviewedBy.at)}`
    : s.records.some((r) => r.status === 'reviewed')
      ? 'reviewed (reviewer not recorded)'
      : 'not reviewed yet';
  y += Math.max(keyValues(doc, [['Prepared by', prepared || '-']], M, y, 262, rowH), keyValues(doc, [['Reviewed by', reviewed]], M + 278, y, 262, rowH)) + 8;

  // Cautions (SPEC §7).
  const boxTop = y;
  doc.font('Helvetica-Bold').fontSize(8).fillColor('#92400e').text('Digging near live lines can kill', M + 8, y + 6, { lineBreak: false });
  y += 18;
  doc.fontSize(7);
  for (const c of SAFETY_CAUTIONS) {
    doc.font('Helvetica-Bold').fillColor(INK).text(`${c.lead} `, M + 8, y, { continued: true, width: CONTENT_W - 16 });
    doc.font('Helvetica').text(c.text, { width: CONTENT_W - 16 });
    y = doc.y + 2;
  }
  doc.rect(M, boxTop, CONTENT_W, y - boxTop + 2).lineWidth(0.8).strokeColor('#d97706').stroke();

  // Footer.
  doc.font('Helvetica').fontSize(6.5).fillColor(MUTED);
  doc.text(
    `Threadline test-hole sheet ${s.number}. Lengths and elevations in ${UNIT_LABELS[project.unit]}; elevations on ${project.verticalDatum}; grid ${project.crsCode}. Generated ${isoMinute(s.checkedAt)}. A design aid: local codes and licensed practice govern.`,
    M,
    792 - 28,
    { width: CONTENT_W, lineBreak: false, ellipsis: true },
  );
}

function isoDate(d: Date): string {
  return d.toISOString().slice(0, 10);
}

function isoMinute(d: Date): string {
  return `${d.toISOString().slice(0, 16).replace('T', ' ')} UTC`;
}

function hr(doc: Doc, y: number): void {
  doc.moveTo(M, y).lineTo(M + CONTENT_W, y).lineWidth(0.6).strokeColor(RULE).stroke();
}

/** Label–value rows; a long value wraps to a second line at most. Returns the height used. */
function keyValues(doc: Doc, rows: [string, string][], x: number, y: number, w: number, rowH: number): number {
  const labelW = 86;
  const valueW = w - labelW - 2;
  let at = y;
  for (const [k, v] of rows) {
    doc.font('Helvetica').fontSize(8);
    const h = Math.min(doc.heightOfString(v, { width: valueW }), 2 * (rowH - 2));
    doc.font('Helvetica-Bold').fillColor(MUTED).text(k, x, at, { width: labelW, height: rowH, ellipsis: true });
    doc.font('Helvetica').fillColor(INK).text(v, x + labelW + 2, at, { width: valueW, height: h + 1, ellipsis: true });
    at += Math.max(rowH, h + 2);
  }
  return at - y;
}

function sizeText(r: TestHole, len: (v: number | null) => string): string {
  if (r.line.shape === 'box') {
    if (r.boxWidth != null && r.boxHeight != null) return `${len(r.boxWidth)} x ${len(r.boxHeight)} box`;
    if (r.line.width != null && r.line.height != null) return `${len(r.line.width)} x ${len(r.line.height)} (record)`;
    return '-';
  }
  if (r.measuredSize != null) return `${len(r.measuredSize)} OD`;
  if (r.line.diameter != null) return `${len(r.line.diameter)} (record)`;
  return '-';
}

/**
 * Quality level reached (ASCE/UESI/CI 38-22, from memory): a line exposed and measured in a test
 * hole reaches QL A once the hole is tied in by survey; before that it is exposed but not yet QL
 * A; an undug hole leaves the line at its recorded level.
 */
function qualityReached(r: TestHole): string {
  const dug = r.status !== 'planned';
  const surveyed = r.surveyedTopElevation != null && r.surveyedEasting != null && r.surveyedNorthing != null;
  if (dug && surveyed) return 'A';
  if (dug) return 'A once surveyed';
  return r.line.qualityLevel as QualityLevel;
}

function stationText(s: HoleSheetData, hole: TestHole, u: string, dp: number): string {
  const style = s.project.stationStyle;
  if (hole.bore && hole.station != null) {
    const off = hole.offset ? `${hole.offset.toFixed(dp)} ${u} ${hole.offsetSide ?? ''}`.trim() : `0.00 ${u}`;
    return `${formatStation(hole.station, style)}, ${off} on ${hole.bore.name}`;
  }
  const pos: XY = hole.surveyedEasting != null && hole.surveyedNorthing != null ? [hole.surveyedEasting, hole.surveyedNorthing] : [hole.easting, hole.northing];
  let best: { bore: Bore; station: number; offset: number; side: 'L' | 'R' } | null = null;
  for (const bore of s.bores) {
    try {
      const so = stationOffset(bore.alignment, bore.beginStation, pos);
      if (so.beyond) continue;
      if (!best || so.offset < best.offset) best = { bore, station: so.station, offset: so.offset, side: so.side };
    } catch {
      // A bore with a broken alignment gives no station.
    }
  }
  if (!best) return '-';
  return `${formatStation(best.station, style)}, ${best.offset.toFixed(dp)} ${u} ${best.side} on ${best.bore.name} (computed)`;
}

/** Liang-Barsky: the part of a segment inside the box, or null. */
function clip(a: XY, b: XY, min: XY, max: XY): [XY, XY] | null {
  let t0 = 0;
  let t1 = 1;
  const dx = b[0] - a[0];
  const dy = b[1] - a[1];
  const tests: [number, number][] = [
    [-dx, a[0] - min[0]],
    [dx, max[0] - a[0]],
    [-dy, a[1] - min[1]],
    [dy, max[1] - a[1]],
  ];
  for (const [p, q] of tests) {
    if (p === 0) {
      if (q < 0) return null;
      continue;
    }
    const t = q / p;
    if (p < 0) {
      if (t > t1) return null;
      if (t > t0) t0 = t;
    } else {
      if (t < t0) return null;
      if (t < t1) t1 = t;
    }
  }
  return [
    [a[0] + t0 * dx, a[1] + t0 * dy],
    [a[0] + t1 * dx, a[1] + t1 * dy],
  ];
}

/** A round scale-bar length (1, 2, 2.5 or 5 × 10^k units) close to `target`. */
function niceLength(target: number): number {
  const p = 10 ** Math.floor(Math.log10(target));
  for (const m of [5, 2.5, 2, 1]) if (m * p <= target) return m * p;
  return p;
}

/**
 * A small plan of the excavation drawn with vector paths, grid north up: the lines near it in
 * their APWA colours, the bores as casing-width bands with their centrelines, pits, the hole,
 * a north arrow and a scale bar in the project's unit.
 */
function drawPlanInset(doc: Doc, s: HoleSheetData, x0: number, y0: number, size: number, centre: XY, u: string): void {
  const half = s.project.unit === 'm' ? 15 : 50; // ground distance from the hole to the inset's edge
  const k = size / (2 * half);
  const min: XY = [centre[0] - half, centre[1] - half];
  const max: XY = [centre[0] + half, centre[1] + half];
  const toPage = (p: XY): XY => [x0 + (p[0] - min[0]) * k, y0 + (max[1] - p[1]) * k];

  doc.save();
  doc.rect(x0, y0, size, size).fill('#fbfaf7');
  doc.rect(x0, y0, size, size).clip();

  for (const pit of s.pits) {
    const pts = pit.footprint.map((p) => toPage(p as XY));
    if (pts.length < 3) continue;
    doc.polygon(...pts).lineWidth(0.8).dash(2, { space: 2 }).strokeColor('#6b7280').stroke().undash();
  }
  for (const bore of s.bores) {
    const pts = bore.alignment.map((p) => toPage(p as XY));
    if (pts.length < 2) continue;
    doc.moveTo(...pts[0]!);
    for (const p of pts.slice(1)) doc.lineTo(...p);
    doc.lineWidth(Math.max(2, bore.casingOd * k)).lineCap('butt').strokeColor('#d1d5db').stroke();
    doc.moveTo(...pts[0]!);
    for (const p of pts.slice(1)) doc.lineTo(...p);
    doc.lineWidth(0.8).dash(6, { space: 3 }).strokeColor('#111827').stroke().undash();
  }
  const labels: { text: string; candidates: XY[] }[] = [];
  for (const line of s.lines) {
    let longest: [XY, XY] | null = null;
    let longestLen = 0;
    const width = Math.max(1.6, (lineSize(line)?.width ?? 0) * k);
    for (let i = 0; i + 1 < line.path.length; i++) {
      const seg = clip(line.path[i] as XY, line.path[i + 1] as XY, min, max);
      if (!seg) continue;
      const [a, b] = [toPage(seg[0]), toPage(seg[1])];
      doc.moveTo(...a).lineTo(...b).lineWidth(width).lineCap('round').strokeColor(LINE_KIND_COLOURS[line.kind]).stroke();
      const l = Math.hypot(b[0] - a[0], b[1] - a[1]);
      if (l > longestLen) {
        longestLen = l;
        longest = [a, b];
      }
    }
    if (longest && longestLen > 20) {
      const label = line.label.length > 26 ? `${line.label.slice(0, 25)}...` : line.label;
      const candidates = [0.5, 0.3, 0.7, 0.15, 0.85].map((t): XY => [longest![0][0] + t * (longest![1][0] - longest![0][0]) + 3, longest![0][1] + t * (longest![1][1] - longest![0][1]) + 2]);
      labels.push({ text: label, candidates });
    }
  }
  // Place labels where they do not overlap one another or the hole's number; skip the rest.
  doc.font('Helvetica-Bold').fontSize(6.5);
  const [hxl, hyl] = toPage(centre);
  const taken: [number, number, number, number][] = [[hxl - 8, hyl - 12, 40, 22]];
  const overlaps = (a: [number, number, number, number]) => taken.some((b) => a[0] < b[0] + b[2] && b[0] < a[0] + a[2] && a[1] < b[1] + b[3] && b[1] < a[1] + a[3]);
  for (const l of labels) {
    const w = doc.widthOfString(l.text) + 4;
    const spot = l.candidates.map((c): [number, number, number, number] => [c[0] - 2, c[1] - 1, w, 9]).find((box) => !overlaps(box) && box[0] + box[2] < x0 + size);
    if (!spot) continue;
    taken.push(spot);
    doc.save().fillOpacity(0.8).rect(spot[0], spot[1], spot[2], spot[3]).fill('#ffffff').restore();
    doc.fillColor('#111827').text(l.text, spot[0] + 2, spot[1] + 1.5, { lineBreak: false });
  }

  // The hole: a ring at its position with its number.
  const [hx, hy] = toPage(centre);
  doc.circle(hx, hy, 5).lineWidth(1.5).fillAndStroke('#ffffff', '#111827');
  doc.circle(hx, hy, 1.6).fill('#111827');
  doc.font('Helvetica-Bold').fontSize(7).fillColor('#111827').text(s.number, hx + 7, hy - 10, { lineBreak: false });
  doc.restore();

  // Frame, north arrow, scale bar.
  doc.rect(x0, y0, size, size).lineWidth(0.8).strokeColor('#111827').stroke();
  const ax = x0 + size - 16;
  const ay = y0 + 10;
  doc.save().fillOpacity(0.85).rect(ax - 10, ay - 4, 20, 38).fill('#ffffff').restore();
  doc.polygon([ax, ay], [ax - 5, ay + 16], [ax, ay + 12], [ax + 5, ay + 16]).fill('#111827');
  doc.font('Helvetica-Bold').fontSize(7).fillColor('#111827').text('N', ax - 3, ay + 18, { lineBreak: false });
  doc.font('Helvetica').fontSize(5.5).text('grid', ax - 6, ay + 26, { lineBreak: false });

  const bar = niceLength(half / 2);
  const barW = bar * k;
  const bx = x0 + 8;
  const by = y0 + size - 14;
  doc.save().fillOpacity(0.85).rect(bx - 4, by - 11, barW + 30, 19).fill('#ffffff').restore();
  doc.rect(bx, by, barW / 2, 4).fill('#111827');
  doc.rect(bx + barW / 2, by, barW / 2, 4).lineWidth(0.6).fillAndStroke('#ffffff', '#111827');
  doc.font('Helvetica').fontSize(6).fillColor('#111827');
  doc.text('0', bx - 1, by - 8, { lineBreak: false });
  doc.text(`${bar} ${u}`, bx + barW - 6, by - 8, { lineBreak: false });
  doc.font('Helvetica').fontSize(6.5).fillColor(MUTED).text(`Plan, grid north up, 1 : ${Math.round((2 * half) / (size / 72) * (s.project.unit === 'm' ? 39.37 : 12))} at print size`, x0, y0 + size + 2, { width: size, lineBreak: false, ellipsis: true });
}

function drawPhotos(doc: Doc, s: HoleSheetData, x0: number, y0: number, w: number, h: number): void {
  if (s.photos.length === 0) {
    doc.rect(x0, y0, w, h).lineWidth(0.5).strokeColor(RULE).stroke();
    doc.font('Helvetica').fontSize(8).fillColor(MUTED).text('No photos yet. Photos of the exposed line with a rod or tape, the marker and the restored surface belong here.', x0 + 10, y0 + h / 2 - 10, { width: w - 20, align: 'center' });
    return;
  }
  const cols = 2;
  const gap = 8;
  const cellW = (w - gap) / cols;
  const cellH = (h - gap) / 2;
  s.photos.slice(0, MAX_PHOTOS).forEach(({ photo, thumbnail }, i) => {
    const cx = x0 + (i % cols) * (cellW + gap);
    const cy = y0 + Math.floor(i / cols) * (cellH + gap);
    const imgH = cellH - 12;
    if (thumbnail) {
      try {
        doc.image(thumbnail, cx, cy, { fit: [cellW, imgH], align: 'center', valign: 'center' });
      } catch {
        placeholder(doc, cx, cy, cellW, imgH, 'photo could not be placed');
      }
    } else {
      placeholder(doc, cx, cy, cellW, imgH, photo.state === 'processing' ? 'photo still being processed' : 'photo could not be decoded');
    }
    const caption = [photo.caption, photo.takenAt ? isoDate(photo.takenAt) : null].filter(Boolean).join(', ') || `Photo ${photo.id}`;
    doc.font('Helvetica').fontSize(6.5).fillColor(INK).text(caption, cx, cy + imgH + 2, { width: cellW, lineBreak: false, ellipsis: true });
  });
}

function placeholder(doc: Doc, x: number, y: number, w: number, h: number, label: string): void {
  doc.rect(x, y, w, h).lineWidth(0.5).strokeColor(RULE).stroke();
  doc.font('Helvetica').fontSize(7).fillColor(MUTED).text(label, x + 4, y + h / 2 - 4, { width: w - 8, align: 'center', lineBreak: false });
}
