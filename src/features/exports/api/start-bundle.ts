import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { ExportJobDto } from '@shared/api';
import type { BundleRequest } from '@shared/schemas/export';
import { api } from '@/lib/api-client';
import { exportKeys } from './keys';

/** Start preparing the project zip; the answer is the job to follow. */
export function startBundle(projectId: number, request: BundleRequest): Promise<ExportJobDto> {
  return api.post<ExportJobDto>(`/api/projects/${projectId}/exports/bundle`, request);
}

export function useStartBundle(projectId: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (request: BundleRequest) => startBundle(projectId, request),
    onSuccess: (job) => queryClient.setQueryData(exportKeys.job(projectId, job.id), job),
  });
}
