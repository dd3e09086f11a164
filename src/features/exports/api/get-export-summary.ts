import { queryOptions, useQuery } from '@tanstack/react-query';
import type { ExportSummaryDto } from '@shared/api';
import { api } from '@/lib/api-client';
import { exportKeys } from './keys';

/** Counts of what each export holds, with the project's frame (the server recomputes the clearances for it). */
export function getExportSummary(projectId: number, signal?: AbortSignal): Promise<ExportSummaryDto> {
  return api.get<ExportSummaryDto>(`/api/projects/${projectId}/exports`, { signal });
}

export const exportSummaryQueryOptions = (projectId: number) =>
  queryOptions({ queryKey: exportKeys.summary(projectId), queryFn: ({ signal }) => getExportSummary(projectId, signal) });

export function useExportSummary(projectId: number) {
  return useQuery(exportSummaryQueryOptions(projectId));
}
