import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { ConflictDto } from '@shared/api';
import type { ConflictAssignmentInput } from '@shared/schemas/conflict';
import { api } from '@/lib/api-client';
import { invalidateAfterConflictWrite } from './invalidate';

/** Assign a conflict and set its due date; the server mails the assignee. */
export function assignConflict(projectId: number, conflictId: number, input: ConflictAssignmentInput): Promise<ConflictDto> {
  return api.patch<ConflictDto>(`/api/projects/${projectId}/conflicts/${conflictId}/assignment`, input);
}

export function useAssignConflict(projectId: number, conflictId: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: ConflictAssignmentInput) => assignConflict(projectId, conflictId, input),
    onSettled: () => invalidateAfterConflictWrite(queryClient),
  });
}
