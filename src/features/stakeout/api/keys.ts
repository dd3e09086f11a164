/** Query keys of the stake-out list. */
export const stakeoutKeys = {
  all: ['stakeout'] as const,
  lists: () => [...stakeoutKeys.all, 'list'] as const,
  list: (projectId: number) => [...stakeoutKeys.lists(), projectId] as const,
};
