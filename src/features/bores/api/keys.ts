/** Query keys of bores and their pits. */
export const boreKeys = {
  all: ['bores'] as const,
  lists: () => [...boreKeys.all, 'list'] as const,
  list: (projectId: number) => [...boreKeys.lists(), projectId] as const,
  details: () => [...boreKeys.all, 'detail'] as const,
  detail: (projectId: number, boreId: number) => [...boreKeys.details(), projectId, boreId] as const,
};

export const pitKeys = {
  all: ['pits'] as const,
  lists: () => [...pitKeys.all, 'list'] as const,
  list: (projectId: number) => [...pitKeys.lists(), projectId] as const,
};
