/** Query keys of test holes. */
export const holeKeys = {
  all: ['holes'] as const,
  lists: () => [...holeKeys.all, 'list'] as const,
  list: (projectId: number) => [...holeKeys.lists(), projectId] as const,
  details: () => [...holeKeys.all, 'detail'] as const,
  detail: (projectId: number, holeId: number) => [...holeKeys.details(), projectId, holeId] as const,
};
