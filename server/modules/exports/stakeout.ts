import Drawing from 'dxf-writer';
import { LINE_KIND_LABELS, LINE_KINDS, type LineKind, type Side } from '@shared/domain';
import {
  buildLineElevationModel,
  lineSize,
  pointAtChainage,
  prepareAlignment,
  preparePolyline,
  prepareProfile,
  profileElevation,
  topFromHoles,
} from '@shared/geometry';
import type { StakeoutSet } from '@shared/schemas/export';
import { stakePoints } from '../stakeout/stakeout.service';
import { csvDocument, type CsvColumn } from './csv';
import { describeFilter, filterNames, type ProjectExportData } from './export-data';
import { decimalsOf, FIELD_CAUTIONS, headerBlock, isoSeconds, round4, stationText } from './export-header';

/**
 * Stake-out exports: the confirmed line positions over each crossing (a dug hole verifies the
 * crossing, the elevation is the top of line from the holes) and the suggested test holes (the
 * crossing or closest point of each unverified line; the elevation is the ground from the bore's
 * ground profile where it has one), as a point file and as DXF.
 */

export interface StakeoutPoint {
  name: string;
  set: StakeoutSet;
  boreId: number;
  boreName: string;
  lineId: number;
  lineLabel: string;
  lineKind: LineKind;
  easting: number;
  northing: number;
  elevation: number | null;
  /** What the elevation is. */
  elevationRef: 'top of line' | 'ground' | null;
  station: number;
  offset: number;
  side: Side;
  holes: string[];
  description: string;
}

export interface StakeoutFilter {
  boreId?: number[];
  kind?: LineKind[];
  set?: StakeoutSet[];
}

/**
 * The stake-out points of the export-time report, taken from the stake-out list's own builder
 * (`stakePoints`, the same points and keys as the Stake-out screen): the confirmed crossings that
 * have a top-of-line elevation and the suggested test holes (pit corners stay on the screen).
 * Points are numbered (`X1`, `X2`… for confirmed crossings, `SH1`… for suggested holes, in bore
 * and station order) because data collectors take short names; the line's label goes in the
 * description.
 */
export function stakeoutPoints(data: ProjectExportData, filter: StakeoutFilter = {}): StakeoutPoint[] {
  const sets = filter.set?.length ? filter.set : (['crossings', 'suggested'] as StakeoutSet[]);
  const { frame } = data;
  const points: StakeoutPoint[] = [];
  for (const p of stakePoints(data.report, data.input.bores, frame.unit)) {
    if (p.lineId == null || p.lineKind == null || p.lineLabel == null) continue; // pit corners
    if (filter.boreId?.length && !filter.boreId.includes(p.boreId)) continue;
    if (filter.kind?.length && !filter.kind.includes(p.lineKind)) continue;
    const line = `${p.lineLabel} ${LINE_KIND_LABELS[p.lineKind]}`;
    const at = `${p.boreName} STA ${stationText(p.station, frame)}`;
    const common = { name: '', boreId: p.boreId, boreName: p.boreName, lineId: p.lineId, lineLabel: p.lineLabel, lineKind: p.lineKind, easting: p.easting, northing: p.northing, elevation: p.elevation, station: p.station, offset: p.offset, side: p.side, holes: p.holes };
    if (p.kind === 'crossing' && p.elevation != null && sets.includes('crossings')) {
      points.push({ ...common, set: 'crossings', elevationRef: 'top of line', description: `${line} top of line over ${at} (confirmed by ${p.holes.join(' ')})` });
    } else if (p.kind === 'suggested_hole' && sets.includes('suggested')) {
      const where = p.reason === 'crossing' ? 'crossing' : 'closest point';
      const off = p.offset ? ` ${p.offset.toFixed(decimalsOf(frame.unit))} ${p.side}` : '';
      const z = p.elevation == null ? 'no elevation (no ground profile at this station: take the ground on site)' : 'elevation = ground from the bore ground profile';
      points.push({ ...common, set: 'suggested', elevationRef: p.elevation == null ? null : 'ground', description: `Suggested test hole ${line} at ${where} ${at}${off}; ${z}` });
    }
  }
  // Number in station order along each bore, crossings first.
  const numbers = { X: 0, SH: 0 };
  points.sort((a, b) => a.boreName.localeCompare(b.boreName) || a.boreId - b.boreId || (a.set === b.set ? 0 : a.set === 'crossings' ? -1 : 1) || a.station - b.station);
  for (const p of points) p.name = p.set === 'crossings' ? `X${++numbers.X}` : `SH${++numbers.SH}`;
  return points;
}

function setsText(filter: StakeoutFilter): string {
  const sets = filter.set?.length ? filter.set : ['crossings', 'suggested'];
  return sets.map((s) => (s === 'crossings' ? 'confirmed crossings' : 'suggested test holes')).join(' and ');
}

function filterText(data: ProjectExportData, filter: StakeoutFilter): string {
  // Bores and kinds in the conflict lists' words.
  const narrowed = filter.boreId?.length || filter.kind?.length;
  const rest = narrowed ? [describeFilter({ boreId: filter.boreId, kind: filter.kind }, filterNames([], data.bores))] : [];
  return [`points = ${setsText(filter)}`, ...rest].join('; ');
}

/** The stake-out header block (with the digging cautions for the field). */
export function stakeoutHeader(data: ProjectExportData, points: StakeoutPoint[], filter: StakeoutFilter): [string, string][] {
  return headerBlock(data.frame, 'stake-out points', [
    ['Points', `${points.length}; ${filterText(data, filter)}`],
    ['Columns', `point; northing; easting (${data.frame.unitSymbol}); elevation (${data.frame.unitSymbol} ${data.frame.verticalDatum}; top of line for confirmed crossings; ground for suggested test holes); description`],
    ...FIELD_CAUTIONS.slice(0, 2).map((c): [string, string] => ['Field caution', c]),
  ]);
}

/** The point file: `point, northing, easting, elevation, description` under the header block. */
export function stakeoutCsv(data: ProjectExportData, points: StakeoutPoint[], filter: StakeoutFilter): string {
  const columns: CsvColumn<StakeoutPoint>[] = [
    { header: 'point', text: true, id: true, user: true, value: (p) => p.name },
    { header: 'northing', text: false, value: (p) => round4(p.northing) },
    { header: 'easting', text: false, value: (p) => round4(p.easting) },
    { header: 'elevation', text: false, value: (p) => round4(p.elevation) },
    { header: 'description', text: true, user: true, value: (p) => p.description },
  ];
  return csvDocument(stakeoutHeader(data, points, filter), columns, points);
}

// ---------------------------------------------------------------------------------------------
// DXF

/** AutoCAD colour index nearest each APWA marking colour (red 1, yellow 2, green 3, blue 5, magenta 6, orange 30, grey 8). */
const KIND_ACI: Record<LineKind, number> = {
  electric: 1,
  gas: 2,
  oil: 2,
  steam: 2,
  communications: 30,
  water: 5,
  reclaimed_water: 6,
  sewer: 3,
  storm: 3,
  unknown: 8,
};

/** Layer names: `UTIL-WATER` (3-D top of line where known, confirmed crossings), `UTIL-WATER-PLAN`, `UTIL-WATER-SUGGESTED`. */
export function kindLayer(kind: LineKind, suffix: '' | '-PLAN' | '-SUGGESTED' = ''): string {
  return `UTIL-${kind.toUpperCase()}${suffix}`;
}
export const BORE_LAYER = 'BORE-CENTRELINE';
export const INFO_LAYER = 'INFO';

/** `$INSUNITS`: 6 metres, 2 feet, 21 US survey feet (AutoCAD 2017 and later; from memory). */
const INSUNITS = { m: 6, ft: 2, usft: 21 } as const;

interface TagWriter {
  lines: (string | number)[];
}
interface Shape {
  tags(manager: TagWriter): void;
}

/**
 * dxf-writer 1.18 writes POINT and TEXT at Z 0 and its 3-D POLYLINE with flag 0; true
 * elevations need Z on the points and labels, and the 3-D flag (70 = 8) on the polyline. These
 * wrappers patch the group codes of the entity just drawn as the drawing is written.
 */
function patchLast(drawing: Drawing, patch: (codes: (string | number)[], start: number) => void): void {
  const shapes = drawing.activeLayer!.shapes as unknown as Shape[];
  const shape = shapes[shapes.length - 1]!;
  const original = shape.tags.bind(shape);
  shape.tags = (manager: TagWriter) => {
    const start = manager.lines.length;
    original(manager);
    patch(manager.lines, start);
  };
}

function setZ(drawing: Drawing, z: number, codes: number[]): void {
  patchLast(drawing, (lines, start) => {
    for (let i = start; i + 1 < lines.length; i += 2) if (codes.includes(Number(lines[i]))) lines[i + 1] = z;
  });
}

function flag3d(drawing: Drawing): void {
  patchLast(drawing, (lines, start) => {
    for (let i = start; i + 1 < lines.length; i += 2) {
      if (Number(lines[i]) === 70) {
        lines[i + 1] = 8; // "This is a 3D polyline" (DXF reference, POLYLINE group 70)
        return;
      }
    }
  });
}

/** One line of DXF text: a line break inside a value would end the group early. */
function dxfText(text: string): string {
  return text.replace(/[\r\n]+/g, ' ');
}

/** DXF comment lines (group 999) carrying the header block; readers skip them. */
function dxfComments(header: [string, string][]): string {
  return header.map(([k, v]) => `999\n${`${k}: ${v}`.replace(/[\r\n]+/g, ' ')}\n`).join('');
}

/** The 3-D top of a line over the span its test holes cover, or null when fewer than two holes give elevations. */
export function lineTopPolyline(data: ProjectExportData, lineId: number): [number, number, number][] | null {
  const input = data.input.lines.find((l) => l.id === lineId);
  if (!input) return null;
  const size = lineSize(input);
  if (!size) return null;
  let poly;
  try {
    poly = preparePolyline(input.path, `line ${input.label}`);
  } catch {
    return null;
  }
  const holes = data.input.holes.filter((h) => h.lineId === lineId);
  const { model } = buildLineElevationModel(input, poly, size, holes, data.input.settings);
  if (model.holes.length < 2) return null;
  const c0 = model.holes[0]!.chainage;
  const c1 = model.holes[model.holes.length - 1]!.chainage;
  if (!(c1 - c0 > model.eps)) return null;
  const inside = (c: number) => c > c0 + model.eps && c < c1 - model.eps;
  const chainages = [c0, ...Array.from(poly.cum).filter(inside), ...model.holes.map((h) => h.chainage).filter(inside), c1]
    .sort((a, b) => a - b)
    .filter((c, i, all) => i === 0 || c - all[i - 1]! > model.eps);
  const out: [number, number, number][] = [];
  for (const c of chainages) {
    const p = pointAtChainage(poly, c);
    const top = topFromHoles(model, c);
    if (!top) return null;
    out.push([p.x, p.y, top.top]);
  }
  return out.length >= 2 ? out : null;
}

/** The bore's casing centreline in 3-D, at its alignment vertices and profile points. */
function boreCentreline(bore: ProjectExportData['bores'][number]): [number, number, number][] | null {
  try {
    const a = prepareAlignment(bore.alignment);
    const profile = prepareProfile(bore.profile, 'bore profile');
    const stations = [...Array.from(a.cum).map((c) => bore.beginStation + c), ...bore.profile.map((p) => p.station)]
      .filter((s) => s >= bore.beginStation - 1e-9 && s <= bore.beginStation + a.length + 1e-9)
      .sort((x, y) => x - y)
      .filter((s, i, all) => i === 0 || s - all[i - 1]! > 1e-9);
    const out: [number, number, number][] = [];
    for (const s of stations) {
      const z = profileElevation(profile, s);
      if (z == null) continue;
      const p = pointAtChainage(a, s - bore.beginStation);
      out.push([p.x, p.y, z]);
    }
    return out.length >= 2 ? out : null;
  } catch {
    return null;
  }
}

/**
 * The stake-out list as DXF (dxf-writer): a layer per line kind, true elevations as Z.
 * POINT entities with TEXT labels at each point; each line's plan path on `UTIL-<KIND>-PLAN`
 * (2-D, no elevation); the top of line as a 3-D polyline on `UTIL-<KIND>` where test holes give
 * elevations (between the outermost holes); the bore's casing centreline on `BORE-CENTRELINE`;
 * the header block as DXF comments and as text on layer `INFO`.
 */
export function stakeoutDxf(data: ProjectExportData, points: StakeoutPoint[], filter: StakeoutFilter): string {
  const { frame } = data;
  const drawing = new Drawing();
  drawing.header('INSUNITS', [[70, INSUNITS[frame.unit]]]);
  const textHeight = frame.unit === 'm' ? 0.3 : 1.0;
  const kinds = LINE_KINDS.filter((k) => (filter.kind?.length ? filter.kind.includes(k) : true) && data.lines.some((l) => l.kind === k));
  for (const k of kinds) {
    drawing.addLayer(kindLayer(k), KIND_ACI[k], 'CONTINUOUS');
    drawing.addLayer(kindLayer(k, '-PLAN'), KIND_ACI[k], 'DASHED');
    drawing.addLayer(kindLayer(k, '-SUGGESTED'), KIND_ACI[k], 'CONTINUOUS');
  }
  drawing.addLayer(BORE_LAYER, 7, 'CONTINUOUS');
  drawing.addLayer(INFO_LAYER, 7, 'CONTINUOUS');

  const bores = data.bores.filter((b) => !filter.boreId?.length || filter.boreId.includes(b.id));
  drawing.setActiveLayer(BORE_LAYER);
  for (const b of bores) {
    const c = boreCentreline(b);
    if (!c) continue;
    drawing.drawPolyline3d(c);
    flag3d(drawing);
  }

  for (const line of data.lines) {
    if (!kinds.includes(line.kind)) continue;
    drawing.setActiveLayer(kindLayer(line.kind, '-PLAN'));
    drawing.drawPolyline(line.path.map(([e, n]) => [e, n] as [number, number]));
    const top = lineTopPolyline(data, line.id);
    if (top) {
      drawing.setActiveLayer(kindLayer(line.kind));
      drawing.drawPolyline3d(top);
      flag3d(drawing);
    }
  }

  for (const p of points) {
    if (!kinds.includes(p.lineKind)) continue;
    drawing.setActiveLayer(kindLayer(p.lineKind, p.set === 'crossings' ? '' : '-SUGGESTED'));
    const z = p.elevation ?? 0;
    drawing.drawPoint(p.easting, p.northing);
    setZ(drawing, z, [30]);
    const label = p.elevation == null ? `${p.name} (no elevation)` : `${p.name} ${p.elevationRef === 'ground' ? 'GND' : 'TOP'} ${p.elevation.toFixed(decimalsOf(frame.unit))}`;
    drawing.drawText(p.easting + textHeight * 0.5, p.northing + textHeight * 0.5, textHeight, 0, dxfText(label));
    setZ(drawing, z, [30, 31]);
  }

  // The header block, readable in CAD above the drawing's top-left corner.
  const header = stakeoutHeader(data, points, filter);
  const xs = [...points.map((p) => p.easting), ...data.lines.filter((l) => kinds.includes(l.kind)).flatMap((l) => l.path.map((v) => v[0])), ...bores.flatMap((b) => b.alignment.map((v) => v[0]))];
  const ys = [...points.map((p) => p.northing), ...data.lines.filter((l) => kinds.includes(l.kind)).flatMap((l) => l.path.map((v) => v[1])), ...bores.flatMap((b) => b.alignment.map((v) => v[1]))];
  if (xs.length > 0) {
    drawing.setActiveLayer(INFO_LAYER);
    const x0 = Math.min(...xs);
    const y0 = Math.max(...ys) + textHeight * 4;
    header.forEach(([k, v], i) => {
      drawing.drawText(x0, y0 + (header.length - i) * textHeight * 1.6, textHeight, 0, dxfText(`${k}: ${v}`));
    });
  }
  return `${dxfComments([...header, ['Generated', `Threadline ${isoSeconds(frame.exportedAt)}`]])}${drawing.toDxfString()}`;
}
