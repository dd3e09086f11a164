import { queryOptions, useQuery } from '@tanstack/react-query';
import type { ConflictEventDto } from '@shared/api';
import { api } from '@/lib/api-client';
import { conflictKeys } from './keys';

export function getConflictHistory(projectId: number, conflictId: number, signal?: AbortSignal): Promise<ConflictEventDto[]> {
  return api.get<ConflictEventDto[]>(`/api/projects/${projectId}/conflicts/${conflictId}/history`, { signal });
}

export const conflictHistoryQueryOptions = (projectId: number, conflictId: number) =>
  queryOptions({ queryKey: conflictKeys.history(projectId, conflictId), queryFn: ({ signal }) => getConflictHistory(projectId, conflictId, signal) });

export function useConflictHistory(projectId: number, conflictId: number) {
  return useQuery(conflictHistoryQueryOptions(projectId, conflictId));
}
