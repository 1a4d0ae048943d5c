import { queryOptions, useQuery, type QueryClient } from '@tanstack/react-query';
import { apiClient, isApiError, setCsrfToken } from '../../../lib/api-client';
import type { Session } from '../../../lib/api-types';
import { paths } from '../../../lib/paths';

/** The signed-in session, or null when nobody is signed in (a 401 is an answer here, not an error). */
export async function getMe(): Promise<Session | null> {
  try {
    const session = await apiClient.get<Session>(paths.api.me());
    setCsrfToken(session.csrfToken);
    return session;
  } catch (err) {
    if (isApiError(err) && err.status === 401) {
      setCsrfToken(null);
      return null;
    }
    throw err;
  }
}

export const meQueryOptions = () =>
  queryOptions({
    queryKey: ['auth', 'me'] as const,
    queryFn: getMe,
    staleTime: 5 * 60_000,
    retry: false,
  });

export function useMe() {
  return useQuery(meQueryOptions());
}

/** Stores a fresh session (from login, signup or accept) as the me query's answer. */
export function storeSession(queryClient: QueryClient, session: Session): void {
  setCsrfToken(session.csrfToken);
  queryClient.setQueryData(meQueryOptions().queryKey, session);
}
