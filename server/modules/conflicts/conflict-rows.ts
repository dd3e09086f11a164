import type { EntityManager } from '@mikro-orm/sqlite';
import type { ConflictPitDto, ConflictRowDto } from '@shared/api';
import { matchesConflictFilter, type ConflictFilter } from '@shared/conflicts';
import type { PitKind, Side } from '@shared/domain';
import { TestHole } from '../holes/test-hole.entity';
import type { Project } from '../projects/project.entity';
import { Conflict } from './conflict.entity';
import { presentConflict } from './conflict.presenter';

const num = (v: unknown): number | null => (typeof v === 'number' && Number.isFinite(v) ? v : null);

/** The register's number of a conflict. */
export const conflictNumber = (id: number) => `C-${id}`;

/** One register row from a conflict whose bore, line and assignee are loaded, and the holes on its line. */
export function presentConflictRow(c: Conflict, holesOnLine: { id: number; number: string; status: TestHole['status'] }[]): ConflictRowDto {
  const f = c.figures ?? {};
  const range = Array.isArray(f.stationRange) ? f.stationRange : null;
  const verifying = new Set(Array.isArray(f.holes) ? f.holes.filter((h): h is string => typeof h === 'string') : []);
  const pits: ConflictPitDto[] = Array.isArray(f.pits)
    ? (f.pits as Record<string, unknown>[]).map((p) => ({
        pitId: Number(p.pitId),
        kind: p.kind as PitKind,
        enters: Boolean(p.enters),
        planGap: num(p.planGap) ?? 0,
        heightAbovePitBottom: num(p.heightAbovePitBottom),
      }))
    : [];
  const holes = holesOnLine
    .map((h) => ({ id: h.id, number: h.number, status: h.status, verifying: verifying.has(h.number) }))
    .sort((a, b) => Number(b.verifying) - Number(a.verifying) || a.number.localeCompare(b.number, 'en', { numeric: true }));
  return {
    ...presentConflict(c),
    number: conflictNumber(c.id),
    assigneeName: c.assignee?.name ?? null,
    assigneeEmail: c.assignee?.email ?? null,
    bore: { id: c.bore.id, name: c.bore.name },
    line: {
      id: c.line.id,
      label: c.line.label,
      owner: c.line.owner,
      contactEmail: c.line.contactEmail || null,
      kind: c.line.kind,
      shape: c.line.shape,
      diameter: c.line.diameter ?? null,
      width: c.line.width ?? null,
      height: c.line.height ?? null,
      material: c.line.material ?? null,
      status: c.line.status,
      qualityLevel: c.line.qualityLevel,
    },
    holes,
    pits,
    relation: f.relation === 'crossing' || f.relation === 'near' ? f.relation : null,
    station: num(f.station),
    stationFrom: range ? num(range[0]) : null,
    stationTo: range ? num(range[1]) : null,
    offset: num(f.offset),
    side: f.side === 'L' || f.side === 'R' ? (f.side as Side) : null,
    lineTop: num(f.lineTop),
    governing: f.governing === 'vertical' || f.governing === 'horizontal' ? f.governing : null,
    clearance: num(f.clearance),
    required: num(f.required),
    margin: num(f.margin),
    allowance: num(f.allowance),
    clearDistance3d: num(f.clearDistance3d),
  };
}

/** The conflict register of a project: every row, and when the clearance check last ran over it. */
export interface ConflictRegister {
  rows: ConflictRowDto[];
  /**
   * The latest clearance check the stored figures come from (every write that can change a
   * clearance rechecks the register in its own transaction); null when the register is empty.
   */
  checkedAt: Date | null;
}

/**
 * The one builder of conflict rows (SPEC §8 columns): the register list and row, the conflict
 * exports (CSV, XLSX, PDF, the zip) and the owner mail's attachment all read it, so the screen,
 * the files and the mail show the same figures of the same check. The figures are the stored
 * ones of the last recheck, never recomputed here. Two queries whatever the number of
 * conflicts: the conflicts with their bore, line and assignee, then the holes of those lines.
 */
export async function loadConflictRegister(em: EntityManager, project: Project, ids?: number[]): Promise<ConflictRegister> {
  const where = ids ? { project, id: { $in: ids } } : { project };
  const conflicts = await em.find(Conflict, where, { populate: ['bore', 'line', 'assignee'], orderBy: { id: 'asc' } });
  if (conflicts.length === 0) return { rows: [], checkedAt: null };
  const lineIds = [...new Set(conflicts.map((c) => c.line.id))];
  const holes = await em
    .createQueryBuilder(TestHole, 'h')
    .select(['h.id', 'h.number', 'h.status', 'h.line_id'])
    .where({ project: project.id, line: { $in: lineIds } })
    .execute<{ id: number; number: string; status: TestHole['status']; line_id?: number; lineId?: number; line?: number }[]>('all', false);
  const byLine = new Map<number, { id: number; number: string; status: TestHole['status'] }[]>();
  for (const h of holes) {
    const lineId = Number(h.line_id ?? h.lineId ?? h.line);
    byLine.set(lineId, [...(byLine.get(lineId) ?? []), { id: Number(h.id), number: String(h.number), status: h.status }]);
  }
  return {
    rows: conflicts.map((c) => presentConflictRow(c, byLine.get(c.line.id) ?? [])),
    checkedAt: new Date(Math.max(...conflicts.map((c) => c.checkedAt.getTime()))),
  };
}

/** The register's rows that pass a filter (the list route; `ids` narrows the read to those conflicts). */
export async function listConflictRows(em: EntityManager, project: Project, filter: ConflictFilter = {}, ids?: number[]): Promise<ConflictRowDto[]> {
  return (await loadConflictRegister(em, project, ids)).rows.filter((row) => matchesConflictFilter(row, filter));
}
