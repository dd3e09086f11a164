import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { PitDto } from '@shared/api';
import type { PitUpdateInput } from '@shared/schemas/bore';
import { api } from '@/lib/api-client';
import { invalidateAfterBoreWrite } from './invalidate';

export function updatePit(projectId: number, pitId: number, input: PitUpdateInput): Promise<PitDto> {
  return api.patch<PitDto>(`/api/projects/${projectId}/pits/${pitId}`, input);
}

/** Save a pit with the version the designer started from (409 stale_version carries the pit as it stands). */
export function useUpdatePit(projectId: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ pitId, input }: { pitId: number; input: PitUpdateInput }) => updatePit(projectId, pitId, input),
    onSuccess: () => invalidateAfterBoreWrite(queryClient),
  });
}
