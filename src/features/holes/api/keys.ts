/** Query keys of test holes, their photos and activity, and the clearance report the table reads. */
export const holeKeys = {
  all: ['holes'] as const,
  lists: () => [...holeKeys.all, 'list'] as const,
  list: (projectId: number) => [...holeKeys.lists(), projectId] as const,
  details: () => [...holeKeys.all, 'detail'] as const,
  detail: (projectId: number, holeId: number) => [...holeKeys.details(), projectId, holeId] as const,
  photos: (projectId: number, holeId: number) => [...holeKeys.all, 'photos', projectId, holeId] as const,
  activity: (projectId: number, holeId: number) => [...holeKeys.all, 'activity', projectId, holeId] as const,
  clearances: (projectId: number) => [...holeKeys.all, 'clearances', projectId] as const,
};

/**
 * Other features' caches a test-hole write can change: the project counts, the lines list (a new
 * unidentified line), the conflict register and activity log, and any clearance report. Listed
 * by their key roots so this feature imports no other feature.
 */
export const AFFECTED_BY_HOLE_WRITES = [['projects'], ['lines'], ['conflicts'], ['activity'], ['clearances']] as const;
