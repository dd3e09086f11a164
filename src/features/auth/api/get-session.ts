import { useRef } from 'react';
import { queryOptions, useQuery, useQueryClient } from '@tanstack/react-query';
import type { SessionDto, UserDto } from '@shared/api';
import { api, isApiError } from '@/lib/api-client';
import { authKeys } from './keys';

/** The signed-in session, or null when signed out (401). */
export async function getSession(signal?: AbortSignal): Promise<SessionDto | null> {
  try {
    return await api.get<SessionDto>('/api/auth/me', { signal, ignoreUnauthorized: true });
  } catch (error) {
    if (isApiError(error) && error.status === 401) return null;
    throw error;
  }
}

export const sessionQueryOptions = () =>
  queryOptions({
    queryKey: authKeys.session(),
    queryFn: ({ signal }) => getSession(signal),
    staleTime: 5 * 60_000,
  });

/** The session query: `data` is null when signed out, undefined while first loading. */
export function useSession() {
  return useQuery(sessionQueryOptions());
}

/** True when the current signed-out state came from the user pressing "Sign out" (not an expiry). */
export function useSignedOutOnPurpose(): boolean {
  return useQueryClient().getQueryData(authKeys.signedOut()) === true;
}

/**
 * The signed-in user. Only for components under the app shell, which guarantees a session.
 * On sign-out a page may render once more after the session is cleared and before the shell
 * sends it to the sign-in page: it then keeps the user it had, instead of failing.
 */
export function useSignedInUser(): UserDto {
  const { data } = useSession();
  const last = useRef<UserDto | null>(null);
  if (data) last.current = data.user;
  if (!last.current) throw new Error('useSignedInUser used outside a signed-in page');
  return last.current;
}
