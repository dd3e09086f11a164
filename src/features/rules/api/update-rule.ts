import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { ClearanceRuleDto } from '@shared/api';
import type { ClearanceRuleUpdateInput } from '@shared/schemas/project';
import { api } from '@/lib/api-client';
import { ruleKeys } from './keys';

export function updateRule(projectId: number, ruleId: number, input: ClearanceRuleUpdateInput): Promise<ClearanceRuleDto> {
  return api.patch<ClearanceRuleDto>(`/api/projects/${projectId}/rules/${ruleId}`, input);
}

export function useUpdateRule(projectId: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ ruleId, input }: { ruleId: number; input: ClearanceRuleUpdateInput }) => updateRule(projectId, ruleId, input),
    // On success or a stale version (409) the list must show the rule as it now stands.
    onSettled: () => queryClient.invalidateQueries({ queryKey: ruleKeys.list(projectId) }),
  });
}
