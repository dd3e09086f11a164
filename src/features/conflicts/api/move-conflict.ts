import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { ConflictDto } from '@shared/api';
import type { ConflictStatusInput } from '@shared/schemas/conflict';
import { api } from '@/lib/api-client';
import { invalidateAfterConflictWrite } from './invalidate';

/** Move a conflict to another status, with a reason. */
export function moveConflict(projectId: number, conflictId: number, input: ConflictStatusInput): Promise<ConflictDto> {
  return api.patch<ConflictDto>(`/api/projects/${projectId}/conflicts/${conflictId}/status`, input);
}

export function useMoveConflict(projectId: number, conflictId: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: ConflictStatusInput) => moveConflict(projectId, conflictId, input),
    // On success or a stale version (409) the screen must show the conflict as it now stands.
    onSettled: () => invalidateAfterConflictWrite(queryClient),
  });
}
