import Drawing from 'dxf-writer';
import { LINE_KINDS, type LineKind } from '@shared/domain';
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
import { STAKEOUT_SET_KINDS, STAKEOUT_SETS, type StakeoutSet } from '@shared/schemas/export';
import { STAKE_POINT_KIND_LABELS, type StakePointKind } from '@shared/schemas/stakeout';
import { stakePoints, type StakePoint } from '../stakeout/stakeout.service';
import { csvDocument, type CsvColumn } from './csv';
import { describeFilter, filterNames, type ProjectExportData } from './export-data';
import { decimalsOf, FIELD_CAUTIONS, headerBlock, isoSeconds, round4 } from './export-header';

/**
 * Stake-out exports: the Stake-out screen's points — confirmed line positions over each crossing
 * (elevation: top of line from the test holes), suggested test holes (elevation: ground from the
 * bore's ground profile where it has one) and pit corners (elevation: pit bottom) — as a point
 * file and as DXF, under the screen's names and descriptions.
 */

/** A point of a stake-out file: the stake-out list's point as it is, with the set it belongs to. */
export type StakeoutPoint = StakePoint & { set: StakeoutSet };

export interface StakeoutFilter {
  boreId?: number[];
  /** Line kinds: narrows the crossings and suggested holes; pit corners are on no line and stay. */
  kind?: LineKind[];
  set?: StakeoutSet[];
}

const SET_OF_KIND = Object.fromEntries(STAKEOUT_SETS.map((s) => [STAKEOUT_SET_KINDS[s], s])) as Record<StakePointKind, StakeoutSet>;

/**
 * The stake-out points of the export-time report: exactly the stake-out list's points
 * (`stakePoints`, the Stake-out screen's builder), with its names (`X<bore>-<line>`,
 * `SH<bore>-<line>`, `P<pit>-<corner>`, see `stakePointName`), descriptions and order, narrowed by
 * the filter. Nothing is renamed or renumbered here: the name a surveyor reads on the screen is
 * the name in the file.
 */
export function stakeoutPoints(data: ProjectExportData, filter: StakeoutFilter = {}): StakeoutPoint[] {
  const sets: readonly StakeoutSet[] = filter.set?.length ? filter.set : STAKEOUT_SETS;
  const points: StakeoutPoint[] = [];
  for (const p of stakePoints(data.report, data.input.bores, data.frame.unit)) {
    const set = SET_OF_KIND[p.kind];
    if (!sets.includes(set)) continue;
    if (filter.boreId?.length && !filter.boreId.includes(p.boreId)) continue;
    if (filter.kind?.length && p.lineKind != null && !filter.kind.includes(p.lineKind)) continue;
    points.push({ ...p, set });
  }
  return points;
}

/** The filter in the Stake-out screen's words (its kind-of-point labels) and the conflict lists' (bore, line kind). */
function filterText(data: ProjectExportData, filter: StakeoutFilter): string {
  const sets: readonly StakeoutSet[] = filter.set?.length ? STAKEOUT_SETS.filter((s) => filter.set!.includes(s)) : STAKEOUT_SETS;
  const parts = [`kind of point = ${sets.map((s) => STAKE_POINT_KIND_LABELS[STAKEOUT_SET_KINDS[s]]).join(' / ')}`];
  if (filter.boreId?.length || filter.kind?.length) parts.push(describeFilter({ boreId: filter.boreId, kind: filter.kind }, filterNames([], data.bores)));
  if (filter.kind?.length && sets.includes('pits')) parts.push('pit corners are on no line: the line kind does not narrow them');
  return parts.join('; ');
}

/** The stake-out header block (with the digging cautions for the field). */
export function stakeoutHeader(data: ProjectExportData, points: StakeoutPoint[], filter: StakeoutFilter): [string, string][] {
  const u = data.frame.unitSymbol;
  return headerBlock(data.frame, 'stake-out points', [
    ['Points', `${points.length}; filter: ${filterText(data, filter)}`],
    ['Point names', 'as on the Stake-out screen: X<bore>-<line> confirmed crossing; SH<bore>-<line> suggested test hole (N: nearest point, not a crossing); P<pit>-<corner> pit corner'],
    [
      'Columns',
      `point; northing; easting (${u}); elevation (${u} ${data.frame.verticalDatum}; top of line for confirmed crossings; ground for suggested test holes; pit bottom for pit corners; blank where there is none); description`,
    ],
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
/** Pit corners: on no line, so on a layer of their own. */
export const PIT_LAYER = 'PIT-CORNERS';
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
  if (points.some((p) => p.lineKind == null)) drawing.addLayer(PIT_LAYER, 7, 'CONTINUOUS');
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

  // Every point of the file, under its stake-out name: a POINT at its true elevation and, right
  // after it, its TEXT label (`<name> TOP|GND|PIT <elevation>`).
  const ref = { line_top: 'TOP', ground: 'GND', pit_bottom: 'PIT' } as const;
  for (const p of points) {
    drawing.setActiveLayer(p.lineKind == null ? PIT_LAYER : kindLayer(p.lineKind, p.kind === 'suggested_hole' ? '-SUGGESTED' : ''));
    const z = p.elevation ?? 0;
    drawing.drawPoint(p.easting, p.northing);
    setZ(drawing, z, [30]);
    const label = p.elevation == null ? `${p.name} (no elevation)` : `${p.name} ${ref[p.elevationRef]} ${p.elevation.toFixed(decimalsOf(frame.unit))}`;
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
