import { queryOptions, useQuery } from '@tanstack/react-query';
import type { ClearancesDto } from '@shared/api';
import { api } from '@/lib/api-client';
import { holeKeys } from './keys';

/** The project's clearance report (for the status of each hole's line against the bores). */
export function getClearances(projectId: number, signal?: AbortSignal): Promise<ClearancesDto> {
  return api.get<ClearancesDto>(`/api/projects/${projectId}/clearances`, { signal });
}

export const clearancesQueryOptions = (projectId: number) =>
  queryOptions({ queryKey: holeKeys.clearances(projectId), queryFn: ({ signal }) => getClearances(projectId, signal) });

export function useClearances(projectId: number) {
  return useQuery(clearancesQueryOptions(projectId));
}
