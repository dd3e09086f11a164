import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { LineDto } from '@shared/api';
import type { LineCreateInput } from '@shared/schemas/line';
import { api } from '@/lib/api-client';

/**
 * Add an unidentified line found while digging (POST lines; line.write, so designers and
 * administrators only). Lives here because the logging form is its only caller.
 */
export function createUnknownLine(projectId: number, input: LineCreateInput): Promise<LineDto> {
  return api.post<LineDto>(`/api/projects/${projectId}/lines`, input);
}

export function useCreateUnknownLine(projectId: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: LineCreateInput) => createUnknownLine(projectId, input),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: ['lines'] }),
  });
}
