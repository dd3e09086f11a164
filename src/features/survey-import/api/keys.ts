/** Mutation keys of survey imports (previews are not cached: each choice of file asks again). */
export const surveyImportKeys = {
  all: ['survey-import'] as const,
  preview: (projectId: number) => [...surveyImportKeys.all, 'preview', projectId] as const,
  commit: (projectId: number) => [...surveyImportKeys.all, 'commit', projectId] as const,
};
