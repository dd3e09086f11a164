import { queryOptions, useQuery } from '@tanstack/react-query';
import type { ConflictDto } from '@shared/api';
import { api } from '@/lib/api-client';
import { conflictKeys } from './keys';

export function getConflicts(projectId: number, signal?: AbortSignal): Promise<ConflictDto[]> {
  return api.get<ConflictDto[]>(`/api/projects/${projectId}/conflicts`, { signal });
}

export const conflictsQueryOptions = (projectId: number) =>
  queryOptions({ queryKey: conflictKeys.list(projectId), queryFn: ({ signal }) => getConflicts(projectId, signal) });

export function useConflicts(projectId: number) {
  return useQuery(conflictsQueryOptions(projectId));
}
