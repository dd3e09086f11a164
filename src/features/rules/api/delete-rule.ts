import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { ruleKeys } from './keys';

export function deleteRule(projectId: number, ruleId: number): Promise<void> {
  return api.delete(`/api/projects/${projectId}/rules/${ruleId}`);
}

export function useDeleteRule(projectId: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (ruleId: number) => deleteRule(projectId, ruleId),
    onSettled: () => queryClient.invalidateQueries({ queryKey: ruleKeys.list(projectId) }),
  });
}
