import { queryOptions, useQuery } from '@tanstack/react-query';
import type { ConflictRowDto } from '@shared/api';
import { api } from '@/lib/api-client';
import { conflictKeys } from './keys';

export function getConflict(projectId: number, conflictId: number, signal?: AbortSignal): Promise<ConflictRowDto> {
  return api.get<ConflictRowDto>(`/api/projects/${projectId}/conflicts/${conflictId}`, { signal });
}

export const conflictQueryOptions = (projectId: number, conflictId: number) =>
  queryOptions({ queryKey: conflictKeys.detail(projectId, conflictId), queryFn: ({ signal }) => getConflict(projectId, conflictId, signal) });

export function useConflict(projectId: number, conflictId: number) {
  return useQuery(conflictQueryOptions(projectId, conflictId));
}
