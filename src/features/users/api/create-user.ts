import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { UserDto } from '@shared/api';
import type { UserCreateInput } from '@shared/schemas/auth';
import { api } from '@/lib/api-client';
import { userKeys } from './keys';

export function createUser(input: UserCreateInput): Promise<UserDto> {
  return api.post<UserDto>('/api/users', input);
}

export function useCreateUser() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: createUser,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: userKeys.all }),
  });
}
