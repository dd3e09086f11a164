import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { MemberDto } from '@shared/api';
import type { MemberAddInput } from '@shared/schemas/project';
import { api } from '@/lib/api-client';
import { memberKeys } from './keys';

export function addMember(projectId: number, input: MemberAddInput): Promise<MemberDto> {
  return api.post<MemberDto>(`/api/projects/${projectId}/members`, input);
}

export function useAddMember(projectId: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: MemberAddInput) => addMember(projectId, input),
    onSettled: () => queryClient.invalidateQueries({ queryKey: memberKeys.list(projectId) }),
  });
}
