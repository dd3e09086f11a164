import { queryOptions, useQuery } from '@tanstack/react-query';
import type { ExportJobDto } from '@shared/api';
import { api } from '@/lib/api-client';
import { exportKeys } from './keys';

/** How far the zip has come. */
export function getBundleJob(projectId: number, jobId: string, signal?: AbortSignal): Promise<ExportJobDto> {
  return api.get<ExportJobDto>(`/api/projects/${projectId}/exports/bundle/${encodeURIComponent(jobId)}`, { signal });
}

/** Polled twice a second while the zip is being prepared, then left alone. */
export const bundleJobQueryOptions = (projectId: number, jobId: string) =>
  queryOptions({
    queryKey: exportKeys.job(projectId, jobId),
    queryFn: ({ signal }) => getBundleJob(projectId, jobId, signal),
    refetchInterval: (query) => (query.state.data?.state === 'running' ? 500 : false),
    staleTime: Infinity,
  });

export function useBundleJob(projectId: number, jobId: string | null) {
  return useQuery({ ...bundleJobQueryOptions(projectId, jobId ?? ''), enabled: jobId !== null });
}
