import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { SessionDto } from '@shared/api';
import type { LoginInput } from '@shared/schemas/auth';
import { api } from '@/lib/api-client';
import { authKeys } from './keys';

/** Sign in; the server sets the session cookie. */
export function login(input: LoginInput): Promise<SessionDto> {
  return api.post<SessionDto>('/api/auth/login', input, { ignoreUnauthorized: true });
}

/** Sign in, drop anything cached for a previous user, and store the new session. */
export function useLogin() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: login,
    onSuccess: (session) => {
      queryClient.removeQueries({ predicate: (query) => query.queryKey[0] !== authKeys.all[0] });
      queryClient.removeQueries({ queryKey: authKeys.signedOut() });
      queryClient.setQueryData(authKeys.session(), session);
    },
  });
}
