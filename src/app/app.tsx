import { QueryClientProvider } from '@tanstack/react-query';
import { RouterProvider } from 'react-router-dom';
import { authKeys } from '@/features/auth/api/keys';
import { onUnauthorized } from '@/lib/api-client';
import { queryClient } from '@/lib/query-client';
import { router } from './router';

// Any 401 means the session has ended: mark it signed out, and the shell sends the user to sign in.
onUnauthorized(() => {
  queryClient.setQueryData(authKeys.session(), null);
});

/** Providers and the router. */
export function App() {
  return (
    <QueryClientProvider client={queryClient}>
      <RouterProvider router={router} />
    </QueryClientProvider>
  );
}
