import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { ProjectDto } from '@shared/api';
import type { ProjectCreateInput } from '@shared/schemas/project';
import { api } from '@/lib/api-client';
import { projectKeys } from './keys';

export function createProject(input: ProjectCreateInput): Promise<ProjectDto> {
  return api.post<ProjectDto>('/api/projects', input);
}

/** Create a project; seeds its detail cache and refreshes the lists. */
export function useCreateProject() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: createProject,
    onSuccess: (project) => {
      queryClient.setQueryData(projectKeys.detail(project.id), project);
      return queryClient.invalidateQueries({ queryKey: projectKeys.lists() });
    },
  });
}
