import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { HoleDto } from '@shared/api';
import type { HoleReviewInput } from '@shared/schemas/hole';
import { api } from '@/lib/api-client';
import { invalidateAfterHoleWrite } from './invalidate';
import { holeKeys } from './keys';

/** The designer's decision: accept (locks the hole), send back with a reason, or reopen with a reason. */
export function reviewHole(projectId: number, holeId: number, input: HoleReviewInput): Promise<HoleDto> {
  return api.post<HoleDto>(`/api/projects/${projectId}/holes/${holeId}/review`, input);
}

export function useReviewHole(projectId: number, holeId: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: HoleReviewInput) => reviewHole(projectId, holeId, input),
    onSuccess: (hole) => {
      queryClient.setQueryData(holeKeys.detail(projectId, holeId), hole);
      return invalidateAfterHoleWrite(queryClient);
    },
    // A stale version or a changed state: show the hole as it now stands.
    onError: () => queryClient.invalidateQueries({ queryKey: holeKeys.detail(projectId, holeId) }),
  });
}
