import { queryOptions, useQuery } from '@tanstack/react-query';
import type { HoleDto } from '@shared/api';
import { api } from '@/lib/api-client';
import { holeKeys } from './keys';

export function getHole(projectId: number, holeId: number, signal?: AbortSignal): Promise<HoleDto> {
  return api.get<HoleDto>(`/api/projects/${projectId}/holes/${holeId}`, { signal });
}

export const holeQueryOptions = (projectId: number, holeId: number) =>
  queryOptions({ queryKey: holeKeys.detail(projectId, holeId), queryFn: ({ signal }) => getHole(projectId, holeId, signal) });

export function useHole(projectId: number, holeId: number) {
  return useQuery(holeQueryOptions(projectId, holeId));
}
