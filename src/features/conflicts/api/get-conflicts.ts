import { queryOptions, useQuery } from '@tanstack/react-query';
import type { ConflictRowDto } from '@shared/api';
import type { ConflictListQuery } from '@shared/schemas/conflict';
import { api } from '@/lib/api-client';
import { conflictKeys } from './keys';

/** The register as rows (SPEC §8 columns); the filter is optional (the screen filters the full list itself). */
export function getConflicts(projectId: number, filter: ConflictListQuery = {}, signal?: AbortSignal): Promise<ConflictRowDto[]> {
  const query: Record<string, string> = {};
  for (const [key, value] of Object.entries(filter)) {
    if (Array.isArray(value) ? value.length > 0 : value) query[key] = Array.isArray(value) ? value.join(',') : String(value);
  }
  return api.get<ConflictRowDto[]>(`/api/projects/${projectId}/conflicts`, { signal, query });
}

export const conflictsQueryOptions = (projectId: number, filter: ConflictListQuery = {}) =>
  queryOptions({ queryKey: conflictKeys.list(projectId, filter), queryFn: ({ signal }) => getConflicts(projectId, filter, signal) });

export function useConflicts(projectId: number, filter: ConflictListQuery = {}) {
  return useQuery(conflictsQueryOptions(projectId, filter));
}
