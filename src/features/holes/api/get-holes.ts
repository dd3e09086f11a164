import { queryOptions, useQuery } from '@tanstack/react-query';
import type { HoleDto } from '@shared/api';
import { api } from '@/lib/api-client';
import { holeKeys } from './keys';

export function getHoles(projectId: number, signal?: AbortSignal): Promise<HoleDto[]> {
  return api.get<HoleDto[]>(`/api/projects/${projectId}/holes`, { signal });
}

export const holesQueryOptions = (projectId: number) =>
  queryOptions({ queryKey: holeKeys.list(projectId), queryFn: ({ signal }) => getHoles(projectId, signal) });

export function useHoles(projectId: number) {
  return useQuery(holesQueryOptions(projectId));
}
