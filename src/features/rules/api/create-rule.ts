import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { ClearanceRuleDto } from '@shared/api';
import type { ClearanceRuleInput } from '@shared/schemas/project';
import { api } from '@/lib/api-client';
import { ruleKeys } from './keys';

export function createRule(projectId: number, input: ClearanceRuleInput): Promise<ClearanceRuleDto> {
  return api.post<ClearanceRuleDto>(`/api/projects/${projectId}/rules`, input);
}

export function useCreateRule(projectId: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: ClearanceRuleInput) => createRule(projectId, input),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: ruleKeys.list(projectId) }),
  });
}
