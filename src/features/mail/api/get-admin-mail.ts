import { queryOptions, useQuery } from '@tanstack/react-query';
import type { AdminMailDto } from '@shared/api';
import { api } from '@/lib/api-client';
import { mailKeys } from './keys';

export function getAdminMail(signal?: AbortSignal): Promise<AdminMailDto> {
  return api.get<AdminMailDto>('/api/admin/mail', { signal });
}

/** Refreshed every few seconds while open, so queued messages are seen leaving. */
export const adminMailQueryOptions = () =>
  queryOptions({ queryKey: mailKeys.admin(), queryFn: ({ signal }) => getAdminMail(signal), refetchInterval: 5000 });

export function useAdminMail(options: { enabled?: boolean } = {}) {
  return useQuery({ ...adminMailQueryOptions(), enabled: options.enabled ?? true });
}
