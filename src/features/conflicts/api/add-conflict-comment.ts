import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { ConflictEventDto } from '@shared/api';
import type { ConflictCommentInput } from '@shared/schemas/conflict';
import { api } from '@/lib/api-client';
import { conflictKeys } from './keys';

export function addConflictComment(projectId: number, conflictId: number, input: ConflictCommentInput): Promise<ConflictEventDto> {
  return api.post<ConflictEventDto>(`/api/projects/${projectId}/conflicts/${conflictId}/comments`, input);
}

export function useAddConflictComment(projectId: number, conflictId: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: ConflictCommentInput) => addConflictComment(projectId, conflictId, input),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: conflictKeys.history(projectId, conflictId) }),
  });
}
