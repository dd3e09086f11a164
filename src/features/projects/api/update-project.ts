import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { ProjectDto } from '@shared/api';
import type { ProjectUpdateInput } from '@shared/schemas/project';
import { api, isApiError } from '@/lib/api-client';
import { projectKeys } from './keys';

export function updateProject(projectId: number, input: ProjectUpdateInput): Promise<ProjectDto> {
  return api.patch<ProjectDto>(`/api/projects/${projectId}`, input);
}

/**
 * Save project fields (with the version the user saw). On a stale version (409) the cache takes
 * the record as it now stands, so the form can show it.
 */
export function useUpdateProject(projectId: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: ProjectUpdateInput) => updateProject(projectId, input),
    onSuccess: (project) => {
      queryClient.setQueryData(projectKeys.detail(projectId), project);
      return queryClient.invalidateQueries({ queryKey: projectKeys.lists() });
    },
    onError: (error) => {
      if (isApiError(error) && error.isStale) {
        const current = error.problem.current as ProjectDto | undefined;
        if (current && typeof current === 'object' && 'version' in current) {
          queryClient.setQueryData(projectKeys.detail(projectId), current);
        }
        return queryClient.invalidateQueries({ queryKey: projectKeys.all });
      }
    },
  });
}
