import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { AFFECTED_BY_LINE_WRITES, lineKeys } from './keys';

export function deleteLine(projectId: number, lineId: number): Promise<void> {
  return api.delete(`/api/projects/${projectId}/lines/${lineId}`);
}

/**
 * Delete a line. The lists and everything that depends on lines are refreshed; the line's own
 * detail is left alone (refetching it would turn the open page into a 404 before the page
 * moves away); the cache drops it once nothing shows it.
 */
export function useDeleteLine(projectId: number, lineId: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: () => deleteLine(projectId, lineId),
    onSuccess: () =>
      Promise.all([
        queryClient.invalidateQueries({ queryKey: lineKeys.lists() }),
        ...AFFECTED_BY_LINE_WRITES.map((key) => queryClient.invalidateQueries({ queryKey: [...key] })),
      ]),
  });
}
