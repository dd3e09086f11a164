import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { LineImportResultDto } from '@shared/api';
import type { LineImportInput } from '@shared/schemas/line-import';
import { api } from '@/lib/api-client';
import { lineImportKeys } from './keys';

/** Write the lines: all of them or none (400 naming the rows otherwise). */
export function commitLineImport(projectId: number, input: LineImportInput): Promise<LineImportResultDto> {
  return api.post<LineImportResultDto>(`/api/projects/${projectId}/imports/lines/commit`, input);
}

/** New lines change clearances, conflicts, counts, exports and the activity log: refresh those caches by their roots. */
const AFFECTED = [['lines'], ['projects'], ['conflicts'], ['clearances'], ['activity'], ['exports'], ['stakeout']] as const;

export function useCommitLineImport(projectId: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationKey: lineImportKeys.commit(projectId),
    mutationFn: (input: LineImportInput) => commitLineImport(projectId, input),
    onSettled: () => Promise.all(AFFECTED.map((key) => queryClient.invalidateQueries({ queryKey: [...key] }))),
  });
}
