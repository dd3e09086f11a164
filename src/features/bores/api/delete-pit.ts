import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { invalidateAfterBoreWrite } from './invalidate';

export function deletePit(projectId: number, pitId: number): Promise<void> {
  return api.delete(`/api/projects/${projectId}/pits/${pitId}`);
}

export function useDeletePit(projectId: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (pitId: number) => deletePit(projectId, pitId),
    onSuccess: () => invalidateAfterBoreWrite(queryClient),
  });
}
