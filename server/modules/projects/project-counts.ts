import type { EntityManager } from '@mikro-orm/sqlite';
import type { ProjectCounts } from '@shared/api';

const OPEN_STATUSES = `('open', 'in_review')`;

/** Counts per project in four grouped queries (not one query per project). */
export async function projectCounts(em: EntityManager, projectIds: number[]): Promise<Map<number, ProjectCounts>> {
  const counts = new Map<number, ProjectCounts>(projectIds.map((id) => [id, { lines: 0, holes: 0, openConflicts: 0, bores: 0 }]));
  if (projectIds.length === 0) return counts;
  const ids = projectIds.map(Number).filter(Number.isSafeInteger).join(',');
  const conn = em.getConnection();
  const tally = async (sql: string, key: keyof ProjectCounts) => {
    const rows = await conn.execute<{ project_id: number; n: number }[]>(sql);
    for (const row of rows) {
      const c = counts.get(Number(row.project_id));
      if (c) c[key] = Number(row.n);
    }
  };
  await tally(`select project_id, count(*) as n from utility_lines where project_id in (${ids}) group by project_id`, 'lines');
  // Holes counted by excavation: records sharing a number are one hole.
  await tally(`select project_id, count(distinct number) as n from test_holes where project_id in (${ids}) group by project_id`, 'holes');
  await tally(`select project_id, count(*) as n from conflicts where project_id in (${ids}) and status in ${OPEN_STATUSES} group by project_id`, 'openConflicts');
  await tally(`select project_id, count(*) as n from bores where project_id in (${ids}) group by project_id`, 'bores');
  return counts;
}
