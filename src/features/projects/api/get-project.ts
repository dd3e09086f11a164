import { queryOptions, useQuery } from '@tanstack/react-query';
import type { ProjectDto } from '@shared/api';
import { api } from '@/lib/api-client';
import { projectKeys } from './keys';

export function getProject(projectId: number, signal?: AbortSignal): Promise<ProjectDto> {
  return api.get<ProjectDto>(`/api/projects/${projectId}`, { signal });
}

export const projectQueryOptions = (projectId: number) =>
  queryOptions({ queryKey: projectKeys.detail(projectId), queryFn: ({ signal }) => getProject(projectId, signal) });

export function useProject(projectId: number) {
  return useQuery(projectQueryOptions(projectId));
}
