import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { BoreDto } from '@shared/api';
import type { BoreUpdateInput } from '@shared/schemas/bore';
import { api, isApiError } from '@/lib/api-client';
import { invalidateAfterBoreWrite } from './invalidate';
import { boreKeys } from './keys';

export function updateBore(projectId: number, boreId: number, input: BoreUpdateInput): Promise<BoreDto> {
  return api.patch<BoreDto>(`/api/projects/${projectId}/bores/${boreId}`, input);
}

/** The record a 409 stale_version carried (`current`), when it looks like a bore. */
export function staleBoreOf(error: unknown): BoreDto | null {
  if (!isApiError(error) || !error.isStale) return null;
  const current = error.problem.current as Partial<BoreDto> | undefined;
  return current && typeof current === 'object' && typeof current.version === 'number' && Array.isArray(current.profile) ? (current as BoreDto) : null;
}

/**
 * Save a bore with the version the designer started from (409 with the bore as it stands when
 * someone saved first). The server recomputes the clearance register in the same transaction.
 */
export function useUpdateBore(projectId: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ boreId, input }: { boreId: number; input: BoreUpdateInput }) => updateBore(projectId, boreId, input),
    onSuccess: (bore) => {
      queryClient.setQueryData<BoreDto[]>(boreKeys.list(projectId), (list) => list?.map((b) => (b.id === bore.id ? bore : b)));
      // The server recomputed the clearance register: refresh the conflicts and reports too.
      return invalidateAfterBoreWrite(queryClient);
    },
    onError: (error) => {
      // Someone saved first: show their bore everywhere, and refetch to be sure.
      const theirs = staleBoreOf(error);
      if (theirs) {
        queryClient.setQueryData<BoreDto[]>(boreKeys.list(projectId), (list) => list?.map((b) => (b.id === theirs.id ? theirs : b)));
        return queryClient.invalidateQueries({ queryKey: boreKeys.all });
      }
    },
  });
}
