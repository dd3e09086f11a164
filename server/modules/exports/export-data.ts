import { matchesFilterable, type ConflictFilter } from '@shared/conflicts';
import type { EntityManager } from '@mikro-orm/sqlite';
import {
  CLEARANCE_STATUSES,
  CONFLICT_STATUS_LABELS,
  LINE_KIND_LABELS,
  UNIT_LABELS,
  type BoreMethod,
  type ClearanceStatus,
  type ConflictStatus,
  type DepthReference,
  type ExcavationMethod,
  type HoleStatus,
  type LineKind,
  type LineShape,
  type LineStatus,
  type LinearUnit,
  type PitKind,
  type PositionSource,
  type QualityLevel,
  type Side,
  type StationStyle,
} from '@shared/domain';
import { computeClearances, findCrs, holePosition, holeTopElevation, lineSize, projectCrs } from '@shared/geometry';
import type { ClearanceInput, ClearanceReport, HoleInput } from '@shared/geometry/types';
import type { GridPoint, ProfilePoint } from '@shared/schemas/common';
import { UNIT_SYMBOLS } from '@shared/units';
import { Bore } from '../bores/bore.entity';
import { Pit } from '../bores/pit.entity';
import { loadClearanceInput } from '../clearances/clearance-input';
import { conflictFigures } from '../clearances/conflict-sync';
import { Conflict } from '../conflicts/conflict.entity';
import { Photo } from '../holes/photo.entity';
import { TestHole } from '../holes/test-hole.entity';
import { UtilityLine } from '../lines/utility-line.entity';
import type { Project } from '../projects/project.entity';
import type { User } from '../users/user.entity';

/**
 * Everything an export reads, loaded once per export with plain rows (STACK.md: the query
 * builder is 5× faster than hydrated entities for big reads), and the clearances recomputed at
 * export time, so every file states the moment its figures were checked.
 */

/** The project's reference frame and the moments every export header states. */
export interface ExportFrame {
  projectId: number;
  projectName: string;
  client: string;
  crsCode: string;
  crsName: string;
  crsProj4: string;
  unit: LinearUnit;
  /** `US ft`, `ft`, `m`. */
  unitSymbol: string;
  /** `US survey feet`. */
  unitLabel: string;
  verticalDatum: string;
  stationStyle: StationStyle;
  /** When the clearances in this export were computed (recomputed for the export). */
  checkedAt: Date;
  exportedAt: Date;
  exportedBy: string;
}

export interface LineRow {
  id: number;
  label: string;
  owner: string;
  contactEmail: string | null;
  kind: LineKind;
  shape: LineShape;
  diameter: number | null;
  width: number | null;
  height: number | null;
  material: string | null;
  status: LineStatus;
  qualityLevel: QualityLevel;
  path: GridPoint[];
  recordDepth: number;
  notes: string | null;
}

export interface HoleRow {
  id: number;
  number: string;
  lineId: number;
  status: HoleStatus;
  positionSource: PositionSource;
  /** The position used: surveyed when both surveyed coordinates exist, else as logged. */
  easting: number;
  northing: number;
  surveyed: boolean;
  approximate: boolean;
  boreId: number | null;
  station: number | null;
  offset: number | null;
  offsetSide: Side | null;
  groundElevation: number | null;
  depthToTop: number | null;
  depthReference: DepthReference;
  /** Top of line at the hole (surveyed top, else ground − depth), null when it gives none. */
  topElevation: number | null;
  measuredSize: number | null;
  material: string | null;
  condition: string | null;
  method: ExcavationMethod | null;
  ticketNumber: string | null;
  crew: string | null;
  dugAt: Date | null;
  notes: string | null;
}

export interface BoreRow {
  id: number;
  name: string;
  method: BoreMethod;
  alignment: GridPoint[];
  beginStation: number;
  profile: ProfilePoint[];
  groundProfile: ProfilePoint[];
  casingOd: number;
}

export interface PitRow {
  id: number;
  boreId: number;
  kind: PitKind;
  footprint: GridPoint[];
  bottomElevation: number;
}

export interface PhotoRow {
  id: number;
  holeId: number;
  /** The upright copy when one was made, else the file as uploaded. */
  key: string;
  mimeType: string;
  caption: string | null;
}

/** One row of the conflict list (SPEC §8), with the figures of the export-time check. */
export interface ConflictExportRow {
  id: number;
  /** The register's number, `C-<id>`. */
  number: string;
  boreId: number;
  boreName: string;
  /** The bore, and the pits the line conflicts with: `Bore 1; launch pit (enters)`. */
  conflictWith: string;
  computedStatus: ClearanceStatus;
  status: ConflictStatus;
  resolutionNote: string | null;
  responsibleParty: string | null;
  assigneeId: number | null;
  assigneeName: string | null;
  dueDate: Date | null;
  foundAt: Date;
  ownerNotifiedAt: Date | null;
  answerDueAt: Date | null;
  closedAt: Date | null;
  notes: string | null;
  line: LineRow;
  /** Numbers of the test holes on the line. */
  holes: string[];
  relation: 'crossing' | 'near' | null;
  station: number | null;
  stationFrom: number | null;
  stationTo: number | null;
  offset: number | null;
  side: Side | null;
  lineTop: number | null;
  governing: 'vertical' | 'horizontal' | null;
  clearance: number | null;
  required: number | null;
  margin: number | null;
  allowance: number | null;
  clearDistance3d: number | null;
}

export interface ProjectExportData {
  frame: ExportFrame;
  input: ClearanceInput;
  report: ClearanceReport;
  lines: LineRow[];
  linesById: Map<number, LineRow>;
  holes: HoleRow[];
  bores: BoreRow[];
  pits: PitRow[];
  photos: PhotoRow[];
  conflicts: ConflictExportRow[];
}

type Raw = Record<string, unknown>;
const json = <T>(v: unknown): T => (typeof v === 'string' ? (JSON.parse(v) as T) : (v as T));
const num = (v: unknown): number | null => (v === null || v === undefined || v === '' ? null : Number(v));
const str = (v: unknown): string | null => (v === null || v === undefined || v === '' ? null : String(v));
function date(v: unknown): Date | null {
  if (v === null || v === undefined || v === '') return null;
  if (v instanceof Date) return v;
  const n = Number(v);
  const d = new Date(Number.isFinite(n) ? n : String(v));
  return Number.isNaN(d.getTime()) ? null : d;
}

/** The reference frame of a project, with the export's moments. */
export function exportFrame(project: Project, user: Pick<User, 'name'>, checkedAt: Date): ExportFrame {
  // The catalogue's name for a known code (the project's own definition is printed beside it where it matters).
  let crsName = findCrs(project.crsCode)?.name ?? project.crsCode;
  if (!findCrs(project.crsCode)) {
    try {
      crsName = projectCrs(project.crsCode, project.crsProj4).name;
    } catch {
      // A definition proj4 cannot read: the code alone names it.
    }
  }
  return {
    projectId: project.id,
    projectName: project.name,
    client: project.client,
    crsCode: project.crsCode,
    crsName,
    crsProj4: project.crsProj4,
    unit: project.unit,
    unitSymbol: UNIT_SYMBOLS[project.unit],
    unitLabel: UNIT_LABELS[project.unit],
    verticalDatum: project.verticalDatum,
    stationStyle: project.stationStyle,
    checkedAt,
    exportedAt: checkedAt,
    exportedBy: user.name,
  };
}

const FAILING: ReadonlySet<ClearanceStatus> = new Set(['overlap', 'conflict']);

/** Load a project's data and recompute its clearances (the same computation as computeProjectReport, keeping its input). */
export async function loadExportData(em: EntityManager, project: Project, user: Pick<User, 'name'>): Promise<ProjectExportData> {
  const qb = <T extends object>(entity: new (...args: never[]) => T) => em.createQueryBuilder(entity);
  const [input, lineRows, holeRows, boreRows, pitRows, photoRows, conflicts] = await Promise.all([
    loadClearanceInput(em, project),
    qb(UtilityLine).select('*').where({ project: project.id }).orderBy({ label: 'asc', id: 'asc' }).execute('all'),
    qb(TestHole).select('*').where({ project: project.id }).orderBy({ number: 'asc', id: 'asc' }).execute('all'),
    qb(Bore).select('*').where({ project: project.id }).orderBy({ name: 'asc', id: 'asc' }).execute('all'),
    qb(Pit).select('*').where({ bore: { project: project.id } }).orderBy({ id: 'asc' }).execute('all'),
    qb(Photo).select('*').where({ hole: { project: project.id } }).orderBy({ id: 'asc' }).execute('all'),
    em.find(Conflict, { project }, { populate: ['assignee'], orderBy: { id: 'asc' } }),
  ]);
  const report = computeClearances(input);
  const frame = exportFrame(project, user, new Date());

  const lines: LineRow[] = (lineRows as unknown as Raw[]).map((l) => ({
    id: Number(l.id),
    label: String(l.label),
    owner: String(l.owner),
    contactEmail: str(l.contactEmail),
    kind: l.kind as LineKind,
    shape: l.shape as LineShape,
    diameter: num(l.diameter),
    width: num(l.width),
    height: num(l.height),
    material: str(l.material),
    status: l.status as LineStatus,
    qualityLevel: l.qualityLevel as QualityLevel,
    path: json<GridPoint[]>(l.path),
    recordDepth: Number(l.recordDepth),
    notes: str(l.notes),
  }));
  const linesById = new Map(lines.map((l) => [l.id, l]));
  const inputHoles = new Map(input.holes.map((h) => [h.id, h]));

  const holes: HoleRow[] = (holeRows as unknown as Raw[]).map((h) => {
    const id = Number(h.id);
    const lineId = Number(h.line);
    const engineHole = inputHoles.get(id);
    const line = linesById.get(lineId);
    let top: number | null = null;
    if (engineHole && line) {
      const size = lineSize(line);
      if (size) {
        const t = holeTopElevation(engineHole as HoleInput, line, size);
        if (!('code' in t)) top = t.top;
      }
    }
    const pos = engineHole ? holePosition(engineHole) : { x: Number(h.easting), y: Number(h.northing), surveyed: false };
    return {
      id,
      number: String(h.number),
      lineId,
      status: h.status as HoleStatus,
      positionSource: h.positionSource as PositionSource,
      easting: pos.x,
      northing: pos.y,
      surveyed: pos.surveyed,
      approximate: Boolean(h.approximate),
      boreId: num(h.bore),
      station: num(h.station),
      offset: num(h.offset),
      offsetSide: (str(h.offsetSide) as Side | null) ?? null,
      groundElevation: num(h.surveyedGroundElevation) ?? num(h.groundElevation),
      depthToTop: num(h.depthToTop),
      depthReference: h.depthReference as DepthReference,
      topElevation: top,
      measuredSize: num(h.measuredSize),
      material: str(h.material),
      condition: str(h.condition),
      method: (str(h.method) as ExcavationMethod | null) ?? null,
      ticketNumber: str(h.ticketNumber),
      crew: str(h.crew),
      dugAt: date(h.dugAt),
      notes: str(h.notes),
    };
  });

  const bores: BoreRow[] = (boreRows as unknown as Raw[]).map((b) => ({
    id: Number(b.id),
    name: String(b.name),
    method: b.method as BoreMethod,
    alignment: json<GridPoint[]>(b.alignment),
    beginStation: Number(b.beginStation),
    profile: json<ProfilePoint[]>(b.profile),
    groundProfile: json<ProfilePoint[]>(b.groundProfile) ?? [],
    casingOd: Number(b.casingOd),
  }));
  const boreName = new Map(bores.map((b) => [b.id, b.name]));

  const pits: PitRow[] = (pitRows as unknown as Raw[]).map((p) => ({
    id: Number(p.id),
    boreId: Number(p.bore),
    kind: p.kind as PitKind,
    footprint: json<GridPoint[]>(p.footprint),
    bottomElevation: Number(p.bottomElevation),
  }));

  // Photos still being processed have no upright copy yet: the file as uploaded stands in.
  const photos: PhotoRow[] = (photoRows as unknown as Raw[]).map((p) => ({
    id: Number(p.id),
    holeId: Number(p.hole),
    key: str(p.displayKey) ?? String(p.fileKey),
    mimeType: String(p.mimeType),
    caption: str(p.caption),
  }));

  const holesByLine = new Map<number, string[]>();
  for (const h of holes) {
    const list = holesByLine.get(h.lineId) ?? [];
    if (!list.includes(h.number)) list.push(h.number);
    holesByLine.set(h.lineId, list);
  }

  const rows: ConflictExportRow[] = [];
  for (const c of conflicts) {
    const line = linesById.get(c.line.id);
    if (!line) continue;
    const boreReport = report.bores.find((b) => b.boreId === c.bore.id);
    let computedStatus = c.computedStatus;
    let figures = c.figures;
    if (boreReport?.computed) {
      const lc = boreReport.lines.find((l) => l.lineId === line.id) ?? null;
      const pitsOfLine = boreReport.pitConflicts.filter((p) => p.lineId === line.id);
      // The same rule as the register's sync: a failing line status, else a pit conflict, else the line's status.
      computedStatus = lc && FAILING.has(lc.status) ? lc.status : pitsOfLine.length > 0 ? 'conflict' : (lc?.status ?? 'clear');
      figures = conflictFigures(lc, pitsOfLine);
    }
    const f = figures as {
      relation?: 'crossing' | 'near' | null;
      station?: number | null;
      stationRange?: [number, number] | null;
      offset?: number | null;
      side?: Side | null;
      lineTop?: number | null;
      clearance?: number | null;
      required?: number | null;
      margin?: number | null;
      allowance?: number | null;
      clearDistance3d?: number | null;
      governing?: 'vertical' | 'horizontal' | null;
      pits?: { pitId: number; kind: PitKind; enters: boolean }[];
    };
    const pitText = (f.pits ?? []).map((p) => `${p.kind} pit${p.enters ? ' (line enters it)' : ' (line near it)'}`);
    const name = boreName.get(c.bore.id) ?? `Bore ${c.bore.id}`;
    rows.push({
      id: c.id,
      number: `C-${c.id}`,
      boreId: c.bore.id,
      boreName: name,
      conflictWith: [name, ...pitText].join('; '),
      computedStatus: CLEARANCE_STATUSES.includes(computedStatus) ? computedStatus : c.computedStatus,
      status: c.status,
      resolutionNote: c.resolutionNote ?? null,
      responsibleParty: c.responsibleParty ?? null,
      assigneeId: c.assignee?.id ?? null,
      assigneeName: c.assignee?.name ?? null,
      dueDate: c.dueDate ?? null,
      foundAt: c.createdAt,
      ownerNotifiedAt: c.ownerNotifiedAt ?? null,
      answerDueAt: c.answerDueAt ?? null,
      closedAt: c.closedAt ?? null,
      notes: c.notes ?? null,
      line,
      holes: holesByLine.get(line.id) ?? [],
      relation: f.relation ?? null,
      station: f.station ?? null,
      stationFrom: f.stationRange?.[0] ?? null,
      stationTo: f.stationRange?.[1] ?? null,
      offset: f.offset ?? null,
      side: f.side ?? null,
      lineTop: f.lineTop ?? null,
      governing: f.governing ?? null,
      clearance: f.clearance ?? null,
      required: f.required ?? null,
      margin: f.margin ?? null,
      allowance: f.allowance ?? null,
      clearDistance3d: f.clearDistance3d ?? null,
    });
  }

  return { frame, input, report, lines, linesById, holes, bores, pits, photos, conflicts: rows };
}

/** The conflict filter of the register (the same as the Conflicts screen's). */
export type ConflictFilterInput = ConflictFilter;

/** True when a row passes the filter: the register's own rule (shared/conflicts.ts). */
export function matchesFilter(row: ConflictExportRow, filter: ConflictFilterInput): boolean {
  return matchesFilterable(row, filter);
}

/** The filter in words for a header: `status = Open, In review; kind = Gas`, or `none (everything)`. */
export function describeFilter(filter: ConflictFilterInput, data: Pick<ProjectExportData, 'bores'>, users?: Map<number, string>): string {
  const parts: string[] = [];
  if (filter.status?.length) parts.push(`status = ${filter.status.map((s) => CONFLICT_STATUS_LABELS[s]).join(', ')}`);
  if (filter.computedStatus?.length) parts.push(`last check = ${filter.computedStatus.join(', ')}`);
  if (filter.boreId?.length) parts.push(`bore = ${filter.boreId.map((id) => data.bores.find((b) => b.id === id)?.name ?? `#${id}`).join(', ')}`);
  if (filter.kind?.length) parts.push(`kind = ${filter.kind.map((k) => LINE_KIND_LABELS[k]).join(', ')}`);
  if (filter.assignee?.length) parts.push(`assignee = ${filter.assignee.map((a) => (a === 'none' ? 'unassigned' : (users?.get(a) ?? `#${a}`))).join(', ')}`);
  if (filter.q?.trim()) parts.push(`text contains "${filter.q.trim()}"`);
  return parts.length ? parts.join('; ') : 'none (everything)';
}
