import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { invalidateAfterHoleWrite } from './invalidate';
import { holeKeys } from './keys';

export function deleteHole(projectId: number, holeId: number): Promise<void> {
  return api.delete(`/api/projects/${projectId}/holes/${holeId}`);
}

export function useDeleteHole(projectId: number, holeId: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: () => deleteHole(projectId, holeId),
    onSuccess: () => {
      queryClient.removeQueries({ queryKey: holeKeys.detail(projectId, holeId) });
      return invalidateAfterHoleWrite(queryClient);
    },
  });
}
