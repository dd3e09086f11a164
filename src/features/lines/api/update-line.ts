import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { LineDto } from '@shared/api';
import type { LineUpdateInput } from '@shared/schemas/line';
import { api } from '@/lib/api-client';
import { invalidateAfterLineWrite } from './invalidate';

export function updateLine(projectId: number, lineId: number, input: LineUpdateInput): Promise<LineDto> {
  return api.patch<LineDto>(`/api/projects/${projectId}/lines/${lineId}`, input);
}

export function useUpdateLine(projectId: number, lineId: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: LineUpdateInput) => updateLine(projectId, lineId, input),
    // On success or a stale version (409) every view must show the line as it now stands.
    onSettled: () => invalidateAfterLineWrite(queryClient),
  });
}
