import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { PitDto } from '@shared/api';
import type { PitCreateInput } from '@shared/schemas/bore';
import { api } from '@/lib/api-client';
import { invalidateAfterBoreWrite } from './invalidate';

export function createPit(projectId: number, input: PitCreateInput): Promise<PitDto> {
  return api.post<PitDto>(`/api/projects/${projectId}/pits`, input);
}

/** Add a launch or receiving pit to a bore. */
export function useCreatePit(projectId: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: PitCreateInput) => createPit(projectId, input),
    onSuccess: () => invalidateAfterBoreWrite(queryClient),
  });
}
