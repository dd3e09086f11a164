import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { stakeoutKeys } from './keys';

/** Remove a stake mark (the point shows as not staked). */
export function unmarkStaked(projectId: number, markId: number): Promise<void> {
  return api.delete(`/api/projects/${projectId}/stakeout/marks/${markId}`);
}

export function useUnmarkStaked(projectId: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (markId: number) => unmarkStaked(projectId, markId),
    onSettled: () => Promise.all([queryClient.invalidateQueries({ queryKey: stakeoutKeys.all }), queryClient.invalidateQueries({ queryKey: ['activity'] })]),
  });
}
