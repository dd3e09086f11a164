/** Query keys of exports: the summary of what can be exported, and zip jobs being prepared. */
export const exportKeys = {
  all: ['exports'] as const,
  summary: (projectId: number) => [...exportKeys.all, 'summary', projectId] as const,
  jobs: () => [...exportKeys.all, 'job'] as const,
  job: (projectId: number, jobId: string) => [...exportKeys.jobs(), projectId, jobId] as const,
};
