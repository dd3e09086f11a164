import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { LineDto } from '@shared/api';
import type { LineCreateInput } from '@shared/schemas/line';
import { api } from '@/lib/api-client';
import { invalidateAfterLineWrite } from './invalidate';

export function createLine(projectId: number, input: LineCreateInput): Promise<LineDto> {
  return api.post<LineDto>(`/api/projects/${projectId}/lines`, input);
}

export function useCreateLine(projectId: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: LineCreateInput) => createLine(projectId, input),
    onSuccess: () => invalidateAfterLineWrite(queryClient),
  });
}
