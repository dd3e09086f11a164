/** Query keys of the project activity log. */
export const activityKeys = {
  all: ['activity'] as const,
  lists: () => [...activityKeys.all, 'list'] as const,
  list: (projectId: number, page: { limit: number; offset: number }) => [...activityKeys.lists(), projectId, page] as const,
};
