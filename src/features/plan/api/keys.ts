/** Query keys of the plan & profile view: the clearance report and the base map (tile set). */
export const planKeys = {
  all: ['plan'] as const,
  tileset: (projectId: number) => [...planKeys.all, 'tileset', projectId] as const,
  /** Under the shared `clearances` root, so every feature that invalidates clearances refreshes it too. */
  clearances: (projectId: number) => ['clearances', 'report', projectId] as const,
};

/**
 * Other features' caches a bore save can change: bores themselves, the conflict register, the
 * project counts, the activity log and every clearance report (by key root, so this feature
 * imports no other feature).
 */
export const AFFECTED_BY_BORE_WRITES = [['bores'], ['clearances'], ['conflicts'], ['projects'], ['activity'], ['holes', 'clearances']] as const;
