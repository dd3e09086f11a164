import { queryOptions, useQuery } from '@tanstack/react-query';
import type { MemberDto } from '@shared/api';
import { api } from '@/lib/api-client';
import { memberKeys } from './keys';

export function getMembers(projectId: number, signal?: AbortSignal): Promise<MemberDto[]> {
  return api.get<MemberDto[]>(`/api/projects/${projectId}/members`, { signal });
}

export const membersQueryOptions = (projectId: number) =>
  queryOptions({ queryKey: memberKeys.list(projectId), queryFn: ({ signal }) => getMembers(projectId, signal) });

export function useMembers(projectId: number) {
  return useQuery(membersQueryOptions(projectId));
}
