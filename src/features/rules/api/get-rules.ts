import { queryOptions, useQuery } from '@tanstack/react-query';
import type { ClearanceRuleDto } from '@shared/api';
import { api } from '@/lib/api-client';
import { ruleKeys } from './keys';

export function getRules(projectId: number, signal?: AbortSignal): Promise<ClearanceRuleDto[]> {
  return api.get<ClearanceRuleDto[]>(`/api/projects/${projectId}/rules`, { signal });
}

export const rulesQueryOptions = (projectId: number) =>
  queryOptions({ queryKey: ruleKeys.list(projectId), queryFn: ({ signal }) => getRules(projectId, signal) });

export function useRules(projectId: number) {
  return useQuery(rulesQueryOptions(projectId));
}
