import { queryOptions, useQuery } from '@tanstack/react-query';
import type { CapturedMailDetailDto } from '@shared/api';
import { api } from '@/lib/api-client';
import { mailKeys } from './keys';

export function getCapturedMail(id: number, signal?: AbortSignal): Promise<CapturedMailDetailDto> {
  return api.get<CapturedMailDetailDto>(`/api/admin/mail/captured/${id}`, { signal });
}

export const capturedMailQueryOptions = (id: number) =>
  queryOptions({ queryKey: mailKeys.captured(id), queryFn: ({ signal }) => getCapturedMail(id, signal), staleTime: Infinity });

export function useCapturedMail(id: number | null) {
  return useQuery({ ...capturedMailQueryOptions(id ?? 0), enabled: id !== null });
}
