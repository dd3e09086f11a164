import { queryOptions, useQuery } from '@tanstack/react-query';
import type { LineDto } from '@shared/api';
import { api } from '@/lib/api-client';
import { lineKeys } from './keys';

export function getLines(projectId: number, signal?: AbortSignal): Promise<LineDto[]> {
  return api.get<LineDto[]>(`/api/projects/${projectId}/lines`, { signal });
}

export const linesQueryOptions = (projectId: number) =>
  queryOptions({ queryKey: lineKeys.list(projectId), queryFn: ({ signal }) => getLines(projectId, signal) });

export function useLines(projectId: number) {
  return useQuery(linesQueryOptions(projectId));
}
