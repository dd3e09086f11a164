import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { HoleDto } from '@shared/api';
import type { HoleCreateInput } from '@shared/schemas/hole';
import { api } from '@/lib/api-client';
import { invalidateAfterHoleWrite } from './invalidate';
import { holeKeys } from './keys';

/**
 * Log a test hole. The body carries a client-made `clientId`: sending the same body again (a
 * retry after a lost answer) returns the record already made, never a second one.
 */
export function createHole(projectId: number, input: HoleCreateInput): Promise<HoleDto> {
  return api.post<HoleDto>(`/api/projects/${projectId}/holes`, input);
}

export function useCreateHole(projectId: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: HoleCreateInput) => createHole(projectId, input),
    // Sent even when the browser says it is offline: the failure is answered at once (the form keeps the
    // entries, a new hole goes to the outbox) instead of a save button that waits without a word.
    networkMode: 'always',
    onSuccess: (hole) => {
      queryClient.setQueryData(holeKeys.detail(projectId, hole.id), hole);
      return invalidateAfterHoleWrite(queryClient);
    },
  });
}
