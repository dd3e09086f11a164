import type { EntityManager } from '@mikro-orm/sqlite';
import type { ClearancesDto } from '@shared/api';
import { computeClearances } from '@shared/geometry';
import type { ClearanceReport } from '@shared/geometry/types';
import { Project } from '../projects/project.entity';
import type { User } from '../users/user.entity';
import { loadClearanceInput } from './clearance-input';
import { syncConflicts } from './conflict-sync';

/** The frame a computed answer states (clearances, stake-out): computed now, in the project's grid, unit and datum. */
export function reportFrame(project: Project): Pick<ClearancesDto, 'checkedAt' | 'crsCode' | 'unit' | 'verticalDatum' | 'stationStyle'> {
  return { checkedAt: new Date().toISOString(), crsCode: project.crsCode, unit: project.unit, verticalDatum: project.verticalDatum, stationStyle: project.stationStyle };
}

/** Compute every clearance of a project from what is stored now. */
export async function computeProjectReport(em: EntityManager, project: Project): Promise<ClearanceReport> {
  return computeClearances(await loadClearanceInput(em, project));
}

/**
 * Recompute and bring the conflict register up to date. Called inside the transaction of every
 * write that can change a clearance (bores, pits, lines, holes, rules, project settings), so the
 * register never lags the data it was computed from.
 */
export async function recomputeConflicts(em: EntityManager, project: Project, by: User | null): Promise<ClearanceReport> {
  await em.flush();
  // The project as this unit of work sees it (settings may have just changed).
  const current = await em.findOneOrFail(Project, project.id);
  const report = await computeProjectReport(em, current);
  await syncConflicts(em, current, report, by);
  return report;
}
