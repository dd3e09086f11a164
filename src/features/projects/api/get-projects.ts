import { queryOptions, useQuery } from '@tanstack/react-query';
import type { ProjectDto } from '@shared/api';
import { api } from '@/lib/api-client';
import { projectKeys } from './keys';

/** Projects the user is a member of (all of them for an administrator), with counts. */
export function getProjects(signal?: AbortSignal): Promise<ProjectDto[]> {
  return api.get<ProjectDto[]>('/api/projects', { signal });
}

export const projectsQueryOptions = () =>
  queryOptions({ queryKey: projectKeys.list(), queryFn: ({ signal }) => getProjects(signal) });

export function useProjects() {
  return useQuery(projectsQueryOptions());
}
