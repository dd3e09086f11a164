/** Query keys of utility lines. */
export const lineKeys = {
  all: ['lines'] as const,
  lists: () => [...lineKeys.all, 'list'] as const,
  list: (projectId: number) => [...lineKeys.lists(), projectId] as const,
  details: () => [...lineKeys.all, 'detail'] as const,
  detail: (projectId: number, lineId: number) => [...lineKeys.details(), projectId, lineId] as const,
};

/**
 * Other features' caches a line write can change, by their key roots (so this feature imports no
 * other): test holes (their line's label and the clearance report they read), every clearance
 * report, the conflict register, the project counts, the activity log, exports and stake-out.
 */
export const AFFECTED_BY_LINE_WRITES = [['holes'], ['clearances'], ['conflicts'], ['projects'], ['activity'], ['exports'], ['stakeout']] as const;
