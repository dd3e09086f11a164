import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { ConflictDto } from '@shared/api';
import type { ConflictDetailsInput } from '@shared/schemas/conflict';
import { api } from '@/lib/api-client';
import { invalidateAfterConflictWrite } from './invalidate';

/** Save the working fields: responsible party, owner told, answer due, resolution, notes. */
export function updateConflict(projectId: number, conflictId: number, input: ConflictDetailsInput): Promise<ConflictDto> {
  return api.patch<ConflictDto>(`/api/projects/${projectId}/conflicts/${conflictId}`, input);
}

export function useUpdateConflict(projectId: number, conflictId: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: ConflictDetailsInput) => updateConflict(projectId, conflictId, input),
    onSettled: () => invalidateAfterConflictWrite(queryClient),
  });
}
