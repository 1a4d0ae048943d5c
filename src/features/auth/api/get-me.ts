import { queryOptions, useQuery, type QueryClient } from '@tanstack/react-query';
import { isApiError, setCsrfToken } from '../../../lib/api-client';
import { call, contractKey } from '../../../lib/contract';
import { me, type Session } from '../../../shared/contract/auth';

/** The signed-in session, or null when nobody is signed in (a 401 is an answer here, not an error). */
export async function getMe(): Promise<Session | null> {
  try {
    const session = await call(me, {});
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
    queryKey: contractKey(me),
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

/** A new session replaces whatever was cached for the previous visitor. */
export function startSession(queryClient: QueryClient, session: Session): void {
  queryClient.clear();
  storeSession(queryClient, session);
}
