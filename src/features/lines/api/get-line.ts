import { queryOptions, useQuery } from '@tanstack/react-query';
import type { LineDto } from '@shared/api';
import { api } from '@/lib/api-client';
import { lineKeys } from './keys';

export function getLine(projectId: number, lineId: number, signal?: AbortSignal): Promise<LineDto> {
  return api.get<LineDto>(`/api/projects/${projectId}/lines/${lineId}`, { signal });
}

export const lineQueryOptions = (projectId: number, lineId: number) =>
  queryOptions({ queryKey: lineKeys.detail(projectId, lineId), queryFn: ({ signal }) => getLine(projectId, lineId, signal) });

export function useLine(projectId: number, lineId: number) {
  return useQuery(lineQueryOptions(projectId, lineId));
}
