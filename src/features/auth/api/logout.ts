import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api, isApiError } from '@/lib/api-client';
import { authKeys } from './keys';

/** End the session (the server clears the cookie). */
export function logout(): Promise<void> {
  return api.post<void>('/api/auth/logout', undefined, { ignoreUnauthorized: true });
}

/**
 * Sign out and forget every cached record. A 401 means the session had already ended, which is
 * the same outcome; any other failure leaves the user signed in (the cookie is still valid) and
 * is shown by the caller.
 */
export function useLogout() {
  const queryClient = useQueryClient();
  const signedOut = () => {
    queryClient.setQueryData(authKeys.signedOut(), true);
    queryClient.setQueryData(authKeys.session(), null);
    queryClient.removeQueries({ predicate: (query) => query.queryKey[0] !== authKeys.all[0] });
  };
  return useMutation({
    mutationFn: logout,
    onSuccess: signedOut,
    onError: (error) => {
      if (isApiError(error) && error.status === 401) signedOut();
    },
  });
}
