import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { StakeMarkDto } from '@shared/api';
import type { StakeMarkInput } from '@shared/schemas/stakeout';
import { api } from '@/lib/api-client';
import { stakeoutKeys } from './keys';

/** Mark a point staked (again: replaces the earlier mark). */
export function markStaked(projectId: number, input: StakeMarkInput): Promise<StakeMarkDto> {
  return api.post<StakeMarkDto>(`/api/projects/${projectId}/stakeout/marks`, input);
}

export function useMarkStaked(projectId: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: StakeMarkInput) => markStaked(projectId, input),
    onSettled: () => Promise.all([queryClient.invalidateQueries({ queryKey: stakeoutKeys.all }), queryClient.invalidateQueries({ queryKey: ['activity'] })]),
  });
}
