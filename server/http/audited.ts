import { OptimisticLockError, type EntityManager, type EntityName, type FilterQuery } from '@mikro-orm/sqlite';
import { staleVersion } from '../errors';
import { logActivity } from '../modules/activity/activity.service';
import type { Project } from '../modules/projects/project.entity';
import type { User } from '../modules/users/user.entity';

interface Audit {
  em: EntityManager;
  project: Project | null;
  user: User;
  /** Name of the entity in the activity log, e.g. `line`. */
  entity: string;
  /** Called inside the transaction after the write, for follow-up work such as recomputation. */
  after?: (em: EntityManager) => Promise<void> | void;
  /** Deletes only: called inside the transaction first; throws (e.g. 409) to refuse the delete. */
  guard?: (em: EntityManager) => Promise<void>;
}

/**
 * Create a record and its activity entry in one transaction.
 * `build` makes the entity (and may throw a validation error before anything is written).
 */
export async function createAudited<E extends { id: number }, D extends object>(
  audit: Audit,
  build: (em: EntityManager) => Promise<E> | E,
  present: (e: E) => D,
): Promise<D> {
  return audit.em.transactional(async (em) => {
    const entity = await build(em);
    await em.persistAndFlush(entity);
    logActivity(em, { project: audit.project, user: audit.user, entity: audit.entity, entityId: entity.id, action: 'create', before: null, after: present(entity) });
    await audit.after?.(em);
    await em.flush();
    return present(entity);
  });
}

/**
 * Update a record after checking the caller's version, logging before and after values.
 * A stale version answers 409 with the record as it stands.
 */
export async function updateAudited<E extends { id: number; version: number }, D extends object>(
  audit: Audit,
  entity: E,
  version: number,
  apply: (e: E, em: EntityManager) => Promise<void> | void,
  present: (e: E) => D,
  action = 'update',
): Promise<D> {
  if (version !== entity.version) throw staleVersion(present(entity));
  const before = present(entity);
  try {
    return await audit.em.transactional(async (em) => {
      const managed = em.merge(entity);
      await apply(managed, em);
      logActivity(em, { project: audit.project, user: audit.user, entity: audit.entity, entityId: managed.id, action, before, after: present(managed) });
      await em.flush();
      await audit.after?.(em);
      await em.flush();
      return present(managed);
    });
  } catch (err) {
    // Someone saved between our version check and our write: answer like any stale edit,
    // with the record as it stands now.
    if (err instanceof OptimisticLockError) {
      const fresh = await audit.em.fork().findOne(entity.constructor as EntityName<E>, { id: entity.id } as FilterQuery<E>);
      if (fresh) throw staleVersion(present(fresh as E));
    }
    throw err;
  }
}

/** Delete a record, logging what it held. */
export async function deleteAudited<E extends { id: number }, D extends object>(audit: Audit, entity: E, present: (e: E) => D): Promise<void> {
  const before = present(entity);
  await audit.em.transactional(async (em) => {
    await audit.guard?.(em);
    logActivity(em, { project: audit.project, user: audit.user, entity: audit.entity, entityId: entity.id, action: 'delete', before, after: null });
    em.remove(em.merge(entity));
    await em.flush();
    await audit.after?.(em);
    await em.flush();
  });
}
