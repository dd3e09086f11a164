import { queryOptions, useQuery } from '@tanstack/react-query';
import type { ActivityDto } from '@shared/api';
import { api } from '@/lib/api-client';
import { holeKeys } from './keys';

/** Every change to one hole (and its photos), newest first, with before and after values. */
export function getHoleActivity(projectId: number, holeId: number, signal?: AbortSignal): Promise<ActivityDto[]> {
  return api.get<ActivityDto[]>(`/api/projects/${projectId}/holes/${holeId}/activity`, { signal });
}

export const holeActivityQueryOptions = (projectId: number, holeId: number) =>
  queryOptions({ queryKey: holeKeys.activity(projectId, holeId), queryFn: ({ signal }) => getHoleActivity(projectId, holeId, signal) });

export function useHoleActivity(projectId: number, holeId: number) {
  return useQuery(holeActivityQueryOptions(projectId, holeId));
}
