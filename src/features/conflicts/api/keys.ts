/** Query keys of the conflict register. */
export const conflictKeys = {
  all: ['conflicts'] as const,
  lists: () => [...conflictKeys.all, 'list'] as const,
  list: (projectId: number) => [...conflictKeys.lists(), projectId] as const,
};
