import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { SurveyImportResultDto } from '@shared/api';
import type { SurveyImportInput } from '@shared/schemas/survey-import';
import { api } from '@/lib/api-client';
import { surveyImportKeys } from './keys';

/** Write the point file's shots onto the holes: all rows or none (400 naming the rows otherwise). */
export function commitSurveyImport(projectId: number, input: SurveyImportInput): Promise<SurveyImportResultDto> {
  return api.post<SurveyImportResultDto>(`/api/projects/${projectId}/survey-imports/commit`, input);
}

/** Survey values change holes, clearances, conflicts and the activity log: refresh those caches by their roots. */
const AFFECTED = [['holes'], ['projects'], ['conflicts'], ['activity'], ['clearances']] as const;

export function useCommitSurveyImport(projectId: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationKey: surveyImportKeys.commit(projectId),
    mutationFn: (input: SurveyImportInput) => commitSurveyImport(projectId, input),
    onSettled: () => Promise.all(AFFECTED.map((key) => queryClient.invalidateQueries({ queryKey: [...key] }))),
  });
}
