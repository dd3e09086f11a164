import { queryOptions, useQuery } from '@tanstack/react-query';
import type { ClearancesDto } from '@shared/api';
import { api } from '@/lib/api-client';
import { planKeys } from './keys';

/** The project's clearance report as the server last computed it, with CRS, unit and datum. */
export function getClearances(projectId: number, signal?: AbortSignal): Promise<ClearancesDto> {
  return api.get<ClearancesDto>(`/api/projects/${projectId}/clearances`, { signal });
}

export const clearancesQueryOptions = (projectId: number) =>
  queryOptions({ queryKey: planKeys.clearances(projectId), queryFn: ({ signal }) => getClearances(projectId, signal) });

export function useClearances(projectId: number) {
  return useQuery(clearancesQueryOptions(projectId));
}
