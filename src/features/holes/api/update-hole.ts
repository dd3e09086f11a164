import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { HoleDto } from '@shared/api';
import type { HoleUpdateInput } from '@shared/schemas/hole';
import { api, isApiError } from '@/lib/api-client';
import { invalidateAfterHoleWrite } from './invalidate';
import { holeKeys } from './keys';

export function updateHole(projectId: number, holeId: number, input: HoleUpdateInput): Promise<HoleDto> {
  return api.patch<HoleDto>(`/api/projects/${projectId}/holes/${holeId}`, input);
}

/** The record a 409 stale_version carried (`current`), when it looks like a hole. */
export function staleHoleOf(error: unknown): HoleDto | null {
  if (!isApiError(error) || !error.isStale) return null;
  const current = error.problem.current as Partial<HoleDto> | undefined;
  return current && typeof current === 'object' && typeof current.version === 'number' && typeof current.id === 'number' ? (current as HoleDto) : null;
}

/** Change a hole's logged fields, with the version the user started from (409 when someone saved first). */
export function useUpdateHole(projectId: number, holeId: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: HoleUpdateInput) => updateHole(projectId, holeId, input),
    // Sent even when the browser says it is offline: the failure is answered at once (the form keeps the
    // entries, a new hole goes to the outbox) instead of a save button that waits without a word.
    networkMode: 'always',
    onSuccess: (hole) => {
      queryClient.setQueryData(holeKeys.detail(projectId, holeId), hole);
      return invalidateAfterHoleWrite(queryClient);
    },
  });
}
