import type { EntityManager } from '@mikro-orm/sqlite';
import { CLEARANCE_STATUS_LABELS, CLEARANCE_STATUSES, type ClearanceStatus, type LinearUnit } from '@shared/domain';
import { UNIT_SYMBOLS } from '@shared/units';
import type { ClearanceReport, LineClearance, PitConflict } from '@shared/geometry/types';
import { Bore } from '../bores/bore.entity';
import { ConflictEvent } from '../conflicts/conflict-event.entity';
import { Conflict } from '../conflicts/conflict.entity';
import { UtilityLine } from '../lines/utility-line.entity';
import type { Project } from '../projects/project.entity';
import type { User } from '../users/user.entity';

const FAILING: ReadonlySet<ClearanceStatus> = new Set(['overlap', 'conflict']);
const rank = (s: ClearanceStatus) => CLEARANCE_STATUSES.indexOf(s); // 0 = worst

/** The figures a conflict keeps from the last check. */
export function conflictFigures(line: LineClearance | null, pits: PitConflict[]): Record<string, unknown> {
  const point = line ? line.points[line.governingPoint] : undefined;
  return {
    relation: line?.relation ?? null,
    station: point?.station ?? null,
    stationRange: line && line.points.length > 0 ? [Math.min(...line.points.map((p) => p.station)), Math.max(...line.points.map((p) => p.station))] : null,
    offset: point?.offset ?? null,
    side: point?.side ?? null,
    lineTop: point?.lineTop ?? null,
    clearance: line?.clearance ?? null,
    required: line?.required ?? null,
    margin: line?.margin ?? null,
    allowance: line?.allowance ?? null,
    clearDistance3d: line?.clearDistance3d ?? null,
    governing: point?.governing ?? null,
    holes: point?.verifyingHoles.map((h) => h.number) ?? [],
    pits: pits.map((p) => ({ pitId: p.pitId, kind: p.pitKind, enters: p.enters, planGap: p.planGap, heightAbovePitBottom: p.heightAbovePitBottom })),
  };
}

/**
 * Bring the conflict register in line with a fresh report, inside the caller's transaction.
 * A line failing against a bore (overlap or conflict, or a pit conflict) gets a conflict; a
 * change of computed status writes a history event with the figures before and after. The
 * check never overwrites a status a person set; it voids its own conflicts when they clear
 * and reopens them when they fail again.
 */
export async function syncConflicts(em: EntityManager, project: Project, report: ClearanceReport, by: User | null): Promise<void> {
  const existing = await em.find(Conflict, { project }, { populate: ['bore', 'line'] });
  const byKey = new Map(existing.map((c) => [`${c.bore.id}:${c.line.id}`, c]));
  const now = new Date();
  const seen = new Set<string>();

  for (const bore of report.bores) {
    if (!bore.computed) continue;
    const pitsByLine = new Map<number, PitConflict[]>();
    for (const p of bore.pitConflicts) pitsByLine.set(p.lineId, [...(pitsByLine.get(p.lineId) ?? []), p]);
    const lineIds = new Set([...bore.lines.map((l) => l.lineId), ...pitsByLine.keys()]);
    for (const lineId of lineIds) {
      const line = bore.lines.find((l) => l.lineId === lineId) ?? null;
      const pits = pitsByLine.get(lineId) ?? [];
      const pitFailing = pits.length > 0;
      const status: ClearanceStatus = line && FAILING.has(line.status) ? line.status : pitFailing ? 'conflict' : (line?.status ?? 'clear');
      const key = `${bore.boreId}:${lineId}`;
      seen.add(key);
      const figures = conflictFigures(line, pits);
      const conflict = byKey.get(key);
      if (!conflict) {
        if (!FAILING.has(status)) continue;
        const created = new Conflict(project, em.getReference(Bore, bore.boreId), em.getReference(UtilityLine, lineId), status);
        created.figures = figures;
        created.checkedAt = now;
        em.persist(created);
        em.persist(new ConflictEvent(created, 'found', describe(status, line, pits, project.unit), { figures }, by));
        continue;
      }
      conflict.checkedAt = now;
      if (conflict.computedStatus === status) {
        conflict.figures = figures;
        continue;
      }
      const before = { status: conflict.computedStatus, figures: conflict.figures };
      const kind = FAILING.has(status) ? (FAILING.has(conflict.computedStatus) ? (rank(status) < rank(conflict.computedStatus) ? 'worsened' : 'eased') : 'failed_again') : 'cleared';
      conflict.computedStatus = status;
      conflict.figures = figures;
      if (!conflict.statusSetByPerson) {
        if (kind === 'cleared' && conflict.status === 'open') conflict.status = 'void';
        if (kind === 'failed_again' && conflict.status === 'void') conflict.status = 'open';
      }
      em.persist(new ConflictEvent(conflict, kind, describe(status, line, pits, project.unit), { before, after: { status, figures } }, by));
    }
  }

  // Lines or bores that left the picture entirely (deleted geometry is cascaded; moved lines land here).
  for (const [key, conflict] of byKey) {
    if (seen.has(key) || !FAILING.has(conflict.computedStatus)) continue;
    const before = { status: conflict.computedStatus, figures: conflict.figures };
    conflict.computedStatus = 'clear';
    conflict.checkedAt = now;
    if (!conflict.statusSetByPerson && conflict.status === 'open') conflict.status = 'void';
    em.persist(new ConflictEvent(conflict, 'cleared', 'The line is no longer near the bore.', { before, after: { status: 'clear' } }, by));
  }
}

function describe(status: ClearanceStatus, line: LineClearance | null, pits: PitConflict[], unit: LinearUnit): string {
  const u = UNIT_SYMBOLS[unit];
  const parts: string[] = [`Computed status: ${CLEARANCE_STATUS_LABELS[status]}.`];
  if (line && line.clearance !== null) parts.push(`Clearance ${line.clearance.toFixed(2)} ${u} against ${line.required.toFixed(2)} ${u} required (margin ${line.margin != null ? `${line.margin.toFixed(2)} ${u}` : '—'}).`);
  for (const p of pits) parts.push(`${p.pitKind === 'launch' ? 'Launch' : 'Receiving'} pit: ${p.enters ? 'line enters the footprint' : `line ${p.planGap.toFixed(2)} ${u} from the footprint`}.`);
  return parts.join(' ');
}
