import type { ConflictListQuery } from '@shared/schemas/conflict';

/** Query keys of the conflict register. */
export const conflictKeys = {
  all: ['conflicts'] as const,
  lists: () => [...conflictKeys.all, 'list'] as const,
  list: (projectId: number, filter: ConflictListQuery = {}) => [...conflictKeys.lists(), projectId, filter] as const,
  details: () => [...conflictKeys.all, 'detail'] as const,
  detail: (projectId: number, conflictId: number) => [...conflictKeys.details(), projectId, conflictId] as const,
  history: (projectId: number, conflictId: number) => [...conflictKeys.all, 'history', projectId, conflictId] as const,
};

/**
 * Other features' caches a conflict write can change, by their key roots (so this feature
 * imports no other): project counts (open conflicts) and the activity log.
 */
export const AFFECTED_BY_CONFLICT_WRITES = [['projects'], ['activity']] as const;
