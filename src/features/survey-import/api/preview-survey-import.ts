import { useMutation } from '@tanstack/react-query';
import type { SurveyImportResultDto } from '@shared/api';
import type { SurveyImportInput } from '@shared/schemas/survey-import';
import { api } from '@/lib/api-client';
import { surveyImportKeys } from './keys';

/** What a point file would change, row by row; writes nothing. */
export function previewSurveyImport(projectId: number, input: SurveyImportInput): Promise<SurveyImportResultDto> {
  return api.post<SurveyImportResultDto>(`/api/projects/${projectId}/survey-imports/preview`, input);
}

export function usePreviewSurveyImport(projectId: number) {
  return useMutation({
    mutationKey: surveyImportKeys.preview(projectId),
    mutationFn: (input: SurveyImportInput) => previewSurveyImport(projectId, input),
  });
}
