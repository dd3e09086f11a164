import type { EntityManager } from '@mikro-orm/sqlite';
import type { ConflictRowDto, HoleDto } from '@shared/api';
import type { ConflictFilter } from '@shared/conflicts';
import {
  CONFLICT_STATUS_LABELS,
  LINE_KIND_LABELS,
  UNIT_LABELS,
  type BoreMethod,
  type ExcavationMethod,
  type LineStatus,
  type LinearUnit,
  type PitKind,
  type PositionSource,
  type Side,
  type StationStyle,
} from '@shared/domain';
import { computeClearances, findCrs, holePosition, holeTopElevation, lineSize, projectCrs } from '@shared/geometry';
import type { BoreInput, ClearanceInput, ClearanceReport, LineInput } from '@shared/geometry/types';
import type { GridPoint } from '@shared/schemas/common';
import { UNIT_SYMBOLS } from '@shared/units';
import { clearanceInputFrom, loadProjectRows, rawNum, rawStr, type RawRow } from '../clearances/clearance-input';
import { loadConflictRegister, type ConflictRegister } from '../conflicts/conflict-rows';
import { Photo } from '../holes/photo.entity';
import type { Project } from '../projects/project.entity';
import type { User } from '../users/user.entity';

/**
 * Everything an export reads, loaded once per export: the project's rows read once (the
 * clearance engine's input comes from the same rows), the clearances recomputed for the
 * report-based files (stake-out, GeoJSON, test-hole sheets), and the conflict register as the
 * Conflicts screen shows it (`loadConflictRegister`, the one builder of conflict rows).
 */

/**
 * Which clearance check a file's figures come from: recomputed for this file (stake-out,
 * GeoJSON, sheets), or the conflict register's last check (conflict lists: the register is
 * rechecked inside every write that can change a clearance, so its figures are those of the
 * data as it stands; null when the register holds no conflict).
 */
export type ClearanceCheck = { basis: 'recomputed'; at: Date } | { basis: 'register'; at: Date | null };

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
  /** The clearance check the figures of this file come from. */
  check: ClearanceCheck;
  exportedAt: Date;
  exportedBy: string;
}

/** A line: what the engine reads, and the register's other columns. */
export type LineRow = LineInput & {
  owner: string;
  contactEmail: string | null;
  material: string | null;
  status: LineStatus;
  notes: string | null;
};

/** A test hole: the register's columns, with the position and elevations the exports print. */
export type HoleRow = Pick<
  HoleDto,
  | 'id' | 'number' | 'lineId' | 'status' | 'positionSource' | 'approximate' | 'boreId' | 'station' | 'offset' | 'offsetSide'
  | 'depthToTop' | 'depthReference' | 'measuredSize' | 'material' | 'condition' | 'method' | 'ticketNumber' | 'crew' | 'notes'
> & {
  /** The position used: surveyed when both surveyed coordinates exist, else as logged. */
  easting: number;
  northing: number;
  surveyed: boolean;
  /** Surveyed ground when there is one, else as logged. */
  groundElevation: number | null;
  /** Top of line at the hole (surveyed top, else ground − depth), null when it gives none. */
  topElevation: number | null;
  dugAt: Date | null;
};

/** A bore: what the engine reads (without its pits) and its method. */
export type BoreRow = Omit<BoreInput, 'pits'> & { method: BoreMethod };

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

export interface ProjectExportData {
  /** The frame of the report-based files: the clearances recomputed for this export. */
  frame: ExportFrame;
  /** When `report` was computed. */
  computedAt: Date;
  input: ClearanceInput;
  report: ClearanceReport;
  lines: LineRow[];
  linesById: Map<number, LineRow>;
  holes: HoleRow[];
  bores: BoreRow[];
  pits: PitRow[];
  photos: PhotoRow[];
  /** The conflict register (every row, unfiltered) and its last check. */
  register: ConflictRegister;
}

function date(v: unknown): Date | null {
  if (v === null || v === undefined || v === '') return null;
  if (v instanceof Date) return v;
  const n = Number(v);
  const d = new Date(Number.isFinite(n) ? n : String(v));
  return Number.isNaN(d.getTime()) ? null : d;
}

const byText = (a: string, b: string) => (a < b ? -1 : a > b ? 1 : 0);

/** The reference frame of a project, with the check the file's figures come from and the moment it is made. */
export function exportFrame(project: Project, user: Pick<User, 'name'>, check: ClearanceCheck, exportedAt = new Date()): ExportFrame {
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
    check,
    exportedAt,
    exportedBy: user.name,
  };
}

/** The frame of a conflict list: the same project frame, stating the register's last check. */
export function conflictListFrame(frame: ExportFrame, register: Pick<ConflictRegister, 'checkedAt'>): ExportFrame {
  return { ...frame, check: { basis: 'register', at: register.checkedAt } };
}

/**
 * Load a project's data for the exports: its rows read once, the clearances recomputed from them
 * (the same computation as computeProjectReport, keeping its input) and the conflict register.
 */
export async function loadExportData(em: EntityManager, project: Project, user: Pick<User, 'name'>): Promise<ProjectExportData> {
  const [rows, photoRows, register] = await Promise.all([
    loadProjectRows(em, project),
    em.createQueryBuilder(Photo).select('*').where({ hole: { project: project.id } }).orderBy({ id: 'asc' }).execute('all'),
    loadConflictRegister(em, project),
  ]);
  const input = clearanceInputFrom(project, rows);
  const report = computeClearances(input);
  const computedAt = new Date();
  const frame = exportFrame(project, user, { basis: 'recomputed', at: computedAt }, computedAt);

  // input.lines[i] is rows.lines[i]: the engine's fields, plus the register's other columns.
  const lines: LineRow[] = input.lines
    .map((l, i) => {
      const raw = rows.lines[i]!;
      return { ...l, owner: String(raw.owner), contactEmail: rawStr(raw.contactEmail), material: rawStr(raw.material), status: raw.status as LineStatus, notes: rawStr(raw.notes) };
    })
    .sort((a, b) => byText(a.label, b.label) || a.id - b.id);
  const linesById = new Map(lines.map((l) => [l.id, l]));

  const holes: HoleRow[] = input.holes
    .map((engineHole, i): HoleRow => {
      const raw: RawRow = rows.holes[i]!;
      const line = linesById.get(engineHole.lineId);
      let top: number | null = null;
      const size = line ? lineSize(line) : null;
      if (line && size) {
        const t = holeTopElevation(engineHole, line, size);
        if (!('code' in t)) top = t.top;
      }
      const pos = holePosition(engineHole);
      return {
        id: engineHole.id,
        number: engineHole.number,
        lineId: engineHole.lineId,
        status: engineHole.status,
        positionSource: raw.positionSource as PositionSource,
        easting: pos.x,
        northing: pos.y,
        surveyed: pos.surveyed,
        approximate: engineHole.approximate,
        boreId: rawNum(raw.bore),
        station: rawNum(raw.station),
        offset: rawNum(raw.offset),
        offsetSide: rawStr(raw.offsetSide) as Side | null,
        groundElevation: engineHole.surveyedGroundElevation ?? engineHole.groundElevation,
        depthToTop: engineHole.depthToTop,
        depthReference: engineHole.depthReference,
        topElevation: top,
        measuredSize: engineHole.measuredSize ?? null,
        material: rawStr(raw.material),
        condition: rawStr(raw.condition),
        method: rawStr(raw.method) as ExcavationMethod | null,
        ticketNumber: rawStr(raw.ticketNumber),
        crew: rawStr(raw.crew),
        dugAt: date(raw.dugAt),
        notes: rawStr(raw.notes),
      };
    })
    .sort((a, b) => byText(a.number, b.number) || a.id - b.id);

  const bores: BoreRow[] = input.bores
    .map(({ pits: _pits, ...b }, i) => ({ ...b, groundProfile: b.groundProfile ?? [], method: rows.bores[i]!.method as BoreMethod }))
    .sort((a, b) => byText(a.name, b.name) || a.id - b.id);
  const pits: PitRow[] = input.bores.flatMap((b) => (b.pits ?? []).map((p) => ({ ...p, boreId: b.id }))).sort((a, b) => a.id - b.id);

  // Photos still being processed have no upright copy yet: the file as uploaded stands in.
  const photos: PhotoRow[] = (photoRows as unknown as RawRow[]).map((p) => ({
    id: Number(p.id),
    holeId: Number(p.hole),
    key: rawStr(p.displayKey) ?? String(p.fileKey),
    mimeType: String(p.mimeType),
    caption: rawStr(p.caption),
  }));

  return { frame, computedAt, input, report, lines, linesById, holes, bores, pits, photos, register };
}

/** The conflict filter of the register (the same as the Conflicts screen's). */
export type ConflictFilterInput = ConflictFilter;

/** Names the filter words use: bores and assignees by id. */
export interface FilterNames {
  bores: Map<number, string>;
  users: Map<number, string>;
}

/** Bore and assignee names from conflict rows (and from the project's bores, when known). */
export function filterNames(rows: ConflictRowDto[], bores: Pick<BoreRow, 'id' | 'name'>[] = []): FilterNames {
  return {
    bores: new Map([...rows.map((r): [number, string] => [r.bore.id, r.bore.name]), ...bores.map((b): [number, string] => [b.id, b.name])]),
    users: new Map(rows.filter((r) => r.assigneeId != null).map((r): [number, string] => [r.assigneeId!, r.assigneeName ?? ''])),
  };
}

/** The filter in words for a header: `status = Open, In review; kind = Gas`, or `none (everything)`. */
export function describeFilter(filter: ConflictFilterInput, names: FilterNames): string {
  const parts: string[] = [];
  if (filter.status?.length) parts.push(`status = ${filter.status.map((s) => CONFLICT_STATUS_LABELS[s]).join(', ')}`);
  if (filter.computedStatus?.length) parts.push(`last check = ${filter.computedStatus.join(', ')}`);
  if (filter.boreId?.length) parts.push(`bore = ${filter.boreId.map((id) => names.bores.get(id) ?? `#${id}`).join(', ')}`);
  if (filter.kind?.length) parts.push(`kind = ${filter.kind.map((k) => LINE_KIND_LABELS[k]).join(', ')}`);
  if (filter.assignee?.length) parts.push(`assignee = ${filter.assignee.map((a) => (a === 'none' ? 'unassigned' : (names.users.get(a) ?? `#${a}`))).join(', ')}`);
  if (filter.q?.trim()) parts.push(`text contains "${filter.q.trim()}"`);
  return parts.length ? parts.join('; ') : 'none (everything)';
}
