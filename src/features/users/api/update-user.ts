import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { UserDto } from '@shared/api';
import type { UserUpdateInput } from '@shared/schemas/auth';
import { api } from '@/lib/api-client';
import { userKeys } from './keys';

export function updateUser(userId: number, input: UserUpdateInput): Promise<UserDto> {
  return api.patch<UserDto>(`/api/users/${userId}`, input);
}

/** Edit an account (name, role, password, active) with the version the admin saw. */
export function useUpdateUser() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ userId, input }: { userId: number; input: UserUpdateInput }) => updateUser(userId, input),
    // Success or a stale version: either way the list must show the record as it now stands.
    onSettled: () => queryClient.invalidateQueries({ queryKey: userKeys.all }),
  });
}
