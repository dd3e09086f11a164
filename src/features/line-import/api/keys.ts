/** Mutation keys of line imports (previews are not cached: each file and mapping asks again). */
export const lineImportKeys = {
  all: ['line-import'] as const,
  preview: (projectId: number) => [...lineImportKeys.all, 'preview', projectId] as const,
  commit: (projectId: number) => [...lineImportKeys.all, 'commit', projectId] as const,
};
