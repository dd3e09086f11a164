import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { BoreDto } from '@shared/api';
import type { BoreCreateInput } from '@shared/schemas/bore';
import { api } from '@/lib/api-client';
import { invalidateAfterBoreWrite } from './invalidate';

export function createBore(projectId: number, input: BoreCreateInput): Promise<BoreDto> {
  return api.post<BoreDto>(`/api/projects/${projectId}/bores`, input);
}

/** Add a bore; the server computes its clearances to every line in the same transaction. */
export function useCreateBore(projectId: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: BoreCreateInput) => createBore(projectId, input),
    onSuccess: () => invalidateAfterBoreWrite(queryClient),
  });
}
