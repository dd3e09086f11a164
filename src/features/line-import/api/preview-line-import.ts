import { useMutation } from '@tanstack/react-query';
import type { LineImportPreviewDto } from '@shared/api';
import type { LineImportInput } from '@shared/schemas/line-import';
import { api } from '@/lib/api-client';
import { lineImportKeys } from './keys';

/** What an import would create, with every bad row or feature named; writes nothing. */
export function previewLineImport(projectId: number, input: LineImportInput): Promise<LineImportPreviewDto> {
  return api.post<LineImportPreviewDto>(`/api/projects/${projectId}/imports/lines/preview`, input);
}

export function usePreviewLineImport(projectId: number) {
  return useMutation({
    mutationKey: lineImportKeys.preview(projectId),
    mutationFn: (input: LineImportInput) => previewLineImport(projectId, input),
  });
}
