import { queryOptions, useQuery } from '@tanstack/react-query';
import type { StakeoutDto } from '@shared/api';
import { api } from '@/lib/api-client';
import { stakeoutKeys } from './keys';

/** Every point to stake in the project (the screen filters by bore itself). */
export function getStakeout(projectId: number, signal?: AbortSignal): Promise<StakeoutDto> {
  return api.get<StakeoutDto>(`/api/projects/${projectId}/stakeout`, { signal });
}

export const stakeoutQueryOptions = (projectId: number) =>
  queryOptions({ queryKey: stakeoutKeys.list(projectId), queryFn: ({ signal }) => getStakeout(projectId, signal) });

export function useStakeout(projectId: number) {
  return useQuery(stakeoutQueryOptions(projectId));
}
