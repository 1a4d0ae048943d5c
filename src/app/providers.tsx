import { QueryClient, QueryClientProvider } from '@tanstack/react-query';
import { useEffect, useState, type ReactNode } from 'react';
import { ToastProvider } from '../components/ui/toast';
import { isApiError, setUnauthenticatedHandler } from '../lib/api-client';
import { meQueryOptions } from '../features/auth/api/get-me';

function makeQueryClient() {
  return new QueryClient({
    defaultOptions: {
      queries: {
        staleTime: 30_000,
        // A 4xx answer will not change on retry; network and 5xx get two more tries.
        retry: (count, error) => count < 2 && !(isApiError(error) && error.status >= 400 && error.status < 500),
        refetchOnWindowFocus: false,
      },
    },
  });
}

export function AppProviders({ children }: { children: ReactNode }) {
  const [queryClient] = useState(makeQueryClient);

  // Any 401 means the session has ended: mark nobody signed in, and the
  // protected layout sends the user to the sign-in page.
  useEffect(() => {
    setUnauthenticatedHandler(() => queryClient.setQueryData(meQueryOptions().queryKey, null));
    return () => setUnauthenticatedHandler(null);
  }, [queryClient]);

  return (
    <QueryClientProvider client={queryClient}>
      <ToastProvider>{children}</ToastProvider>
    </QueryClientProvider>
  );
}
