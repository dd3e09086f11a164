import type { EntityManager } from '@mikro-orm/sqlite';
import type { Project } from '../projects/project.entity';
import type { User } from '../users/user.entity';
import { ActivityEntry, type Changes } from './activity-entry.entity';

const IGNORED = new Set(['updatedAt', 'createdAt', 'version', 'counts', 'photoCount']);

/** Field-by-field before/after of two presented records (null for a create or a delete). */
export function diff(before: object | null, after: object | null): Changes {
  const changes: Changes = {};
  const b = (before ?? {}) as Record<string, unknown>;
  const a = (after ?? {}) as Record<string, unknown>;
  for (const key of new Set([...Object.keys(b), ...Object.keys(a)])) {
    if (IGNORED.has(key)) continue;
    const bv = b[key] ?? null;
    const av = a[key] ?? null;
    if (JSON.stringify(bv) !== JSON.stringify(av)) changes[key] = { before: bv, after: av };
  }
  return changes;
}

/** Add an activity entry to the unit of work (flushed with the change it describes). */
export function logActivity(
  em: EntityManager,
  entry: { project: Project | null; user: User | null; entity: string; entityId: number | null; action: string; before: object | null; after: object | null },
): void {
  em.persist(
    new ActivityEntry({
      project: entry.project,
      user: entry.user,
      entity: entry.entity,
      entityId: entry.entityId,
      action: entry.action,
      changes: diff(entry.before, entry.after),
    }),
  );
}
