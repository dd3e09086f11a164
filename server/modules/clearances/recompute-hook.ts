import type { EntityManager } from '@mikro-orm/sqlite';
import type { Project } from '../projects/project.entity';
import type { User } from '../users/user.entity';
import { recomputeConflicts } from './clearance.service';

/** The `after` hook of an audited write that can change clearances. */
export function recompute(project: Project, user: User): (em: EntityManager) => Promise<void> {
  return async (em) => {
    await recomputeConflicts(em, project, user);
  };
}
