/** Query keys of utility lines. */
export const lineKeys = {
  all: ['lines'] as const,
  lists: () => [...lineKeys.all, 'list'] as const,
  list: (projectId: number) => [...lineKeys.lists(), projectId] as const,
  details: () => [...lineKeys.all, 'detail'] as const,
  detail: (projectId: number, lineId: number) => [...lineKeys.details(), projectId, lineId] as const,
};
