import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { MailOwnersResultDto } from '@shared/api';
import type { MailOwnersInput } from '@shared/schemas/mail';
import { api } from '@/lib/api-client';
import { mailKeys } from './keys';

/** Preview who gets which conflicts, or queue the messages (`mode: 'send'`). */
export function mailOwners(projectId: number, input: MailOwnersInput): Promise<MailOwnersResultDto> {
  return api.post<MailOwnersResultDto>(`/api/projects/${projectId}/mail/owners`, input);
}

export function useMailOwners(projectId: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: MailOwnersInput) => mailOwners(projectId, input),
    onSuccess: (result) => {
      if (result.mode !== 'send') return;
      // Sending sets "owner told" on the conflicts and adds history entries.
      void queryClient.invalidateQueries({ queryKey: ['conflicts'] });
      void queryClient.invalidateQueries({ queryKey: ['activity'] });
      void queryClient.invalidateQueries({ queryKey: mailKeys.all });
    },
  });
}
