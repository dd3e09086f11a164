import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { invalidateAfterBoreWrite } from './invalidate';

export function deleteBore(projectId: number, boreId: number): Promise<void> {
  return api.delete(`/api/projects/${projectId}/bores/${boreId}`);
}

/**
 * Delete a bore with its pits. The server refuses (409 `in_use`, with `detail` saying why) when
 * the bore's conflicts carry people's decisions.
 */
export function useDeleteBore(projectId: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (boreId: number) => deleteBore(projectId, boreId),
    onSuccess: () => invalidateAfterBoreWrite(queryClient),
  });
}
