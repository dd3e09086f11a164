import { queryOptions, useQuery } from '@tanstack/react-query';
import type { UserDto } from '@shared/api';
import { api } from '@/lib/api-client';
import { userKeys } from './keys';

/** Every account (administrators and project managers may read it). */
export function getUsers(signal?: AbortSignal): Promise<UserDto[]> {
  return api.get<UserDto[]>('/api/users', { signal });
}

export const usersQueryOptions = () => queryOptions({ queryKey: userKeys.list(), queryFn: ({ signal }) => getUsers(signal) });

export function useUsers({ enabled = true }: { enabled?: boolean } = {}) {
  return useQuery({ ...usersQueryOptions(), enabled });
}
