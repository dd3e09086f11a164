import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { lineKeys } from './keys';
import { invalidateAfterLineWrite } from './invalidate';

export function deleteLine(projectId: number, lineId: number): Promise<void> {
  return api.delete(`/api/projects/${projectId}/lines/${lineId}`);
}

export function useDeleteLine(projectId: number, lineId: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: () => deleteLine(projectId, lineId),
    onSuccess: () => {
      // The line is gone: drop its detail rather than refetch it into a 404.
      queryClient.removeQueries({ queryKey: lineKeys.detail(projectId, lineId) });
      return invalidateAfterLineWrite(queryClient);
    },
  });
}
