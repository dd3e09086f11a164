import { queryOptions, useQuery } from '@tanstack/react-query';
import type { BoreDto } from '@shared/api';
import { api } from '@/lib/api-client';
import { boreKeys } from './keys';

export function getBores(projectId: number, signal?: AbortSignal): Promise<BoreDto[]> {
  return api.get<BoreDto[]>(`/api/projects/${projectId}/bores`, { signal });
}

export const boresQueryOptions = (projectId: number) =>
  queryOptions({ queryKey: boreKeys.list(projectId), queryFn: ({ signal }) => getBores(projectId, signal) });

export function useBores(projectId: number) {
  return useQuery(boresQueryOptions(projectId));
}
