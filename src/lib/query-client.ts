import { QueryClient } from '@tanstack/react-query';
import { isApiError } from './api-client';

/** Client errors (4xx) are answers, not glitches: never retried. Network and 5xx: twice. */
function shouldRetry(failureCount: number, error: unknown): boolean {
  if (isApiError(error) && error.status >= 400 && error.status < 500) return false;
  return failureCount < 2;
}

/** The one query client of the app. */
export const queryClient = new QueryClient({
  defaultOptions: {
    queries: {
      staleTime: 30_000,
      retry: shouldRetry,
      // Ask even with no signal: the service worker may answer from its copy of the last reads.
      networkMode: 'offlineFirst',
    },
    mutations: {
      retry: false,
    },
  },
});
