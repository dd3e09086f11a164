import { queryOptions, useQuery } from '@tanstack/react-query';
import type { PitDto } from '@shared/api';
import { api } from '@/lib/api-client';
import { pitKeys } from './keys';

/** Launch and receiving pits of every bore in the project. */
export function getPits(projectId: number, signal?: AbortSignal): Promise<PitDto[]> {
  return api.get<PitDto[]>(`/api/projects/${projectId}/pits`, { signal });
}

export const pitsQueryOptions = (projectId: number) =>
  queryOptions({ queryKey: pitKeys.list(projectId), queryFn: ({ signal }) => getPits(projectId, signal) });

export function usePits(projectId: number) {
  return useQuery(pitsQueryOptions(projectId));
}
