import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { OutboxMessageDto } from '@shared/api';
import { api } from '@/lib/api-client';
import { mailKeys } from './keys';

/** Queue a failed message again. */
export function retryOutbox(id: number): Promise<OutboxMessageDto> {
  return api.post<OutboxMessageDto>(`/api/admin/mail/outbox/${id}/retry`);
}

export function useRetryOutbox() {
  const queryClient = useQueryClient();
  return useMutation({ mutationFn: retryOutbox, onSettled: () => queryClient.invalidateQueries({ queryKey: mailKeys.all }) });
}
