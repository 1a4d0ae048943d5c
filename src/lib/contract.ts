import {
  queryOptions,
  useMutation,
  useQuery,
  useQueryClient,
  type QueryClient,
  type UseMutationOptions,
  type UseQueryOptions,
} from '@tanstack/react-query';
import {
  urlOf,
  type BodyInOf,
  type Endpoint,
  type ParamsOf,
  type QueryInOf,
  type ResponseOf,
} from '../shared/contract/endpoint';
import { apiClient } from './api-client';

/**
 * The client's side of the contract: every fetch, query key and invalidation is worked out
 * from the endpoint's entry in `src/shared/contract/`, so a page never writes a URL, a type
 * of a response or a query key by hand.
 */

type Empty = Record<string, never>;
/** What a call needs: the path parameters, the query and the body that the entry declares. */
export type CallInput<E extends Endpoint> = (ParamsOf<E> extends Empty ? { params?: Empty } : { params: ParamsOf<E> }) &
  (QueryInOf<E> extends Empty ? { query?: Empty } : { query?: QueryInOf<E> }) &
  (BodyInOf<E> extends undefined ? { body?: undefined } : { body: BodyInOf<E> });

/** Calls one endpoint and answers its response, typed by the entry's schema. */
export function call<E extends Endpoint>(e: E, input: CallInput<E>, signal?: AbortSignal): Promise<ResponseOf<E>> {
  const i = input as { params?: Record<string, string>; query?: Record<string, unknown>; body?: unknown };
  const url = urlOf(e, i.params, i.query);
  switch (e.method) {
    case 'GET':
      return apiClient.get(url, { signal });
    case 'POST':
      return apiClient.post(url, i.body, { signal });
    case 'PUT':
      return apiClient.put(url, i.body, { signal });
    case 'PATCH':
      return apiClient.patch(url, i.body, { signal });
    case 'DELETE':
      return apiClient.delete(url, { signal });
  }
}

/** The URL of an endpoint (for a link to a file or a CSV the browser downloads itself). */
export function hrefOf<E extends Endpoint>(e: E, input: Pick<CallInput<E>, 'params' | 'query'>): string {
  const i = input as { params?: Record<string, string>; query?: Record<string, unknown> };
  return urlOf(e, i.params, i.query);
}

/** The query key of a GET: its path first, so invalidating the path reaches every parameter. */
export type ContractKey = readonly [string, Record<string, string>, Record<string, unknown>];

export function contractKey(e: Endpoint, input?: { params?: object; query?: object }): ContractKey {
  return [e.path, (input?.params ?? {}) as Record<string, string>, (input?.query ?? {}) as Record<string, unknown>];
}

export function contractQueryOptions<E extends Endpoint>(e: E, input: CallInput<E>) {
  return queryOptions<ResponseOf<E>, Error, ResponseOf<E>, ContractKey>({
    queryKey: contractKey(e, input as { params?: object; query?: object }),
    queryFn: ({ signal }) => call(e, input, signal),
  });
}

type QueryExtras<E extends Endpoint, TData> = Omit<UseQueryOptions<ResponseOf<E>, Error, TData, ContractKey>, 'queryKey' | 'queryFn'>;

/** `useContractQuery(listSuppliers)`, `useContractQuery(cogsReport, { query: { month } })`. */
export function useContractQuery<E extends Endpoint, TData = ResponseOf<E>>(
  e: E,
  ...[input, options]: Record<string, never> extends CallInput<E> ? [input?: CallInput<E>, options?: QueryExtras<E, TData>] : [input: CallInput<E>, options?: QueryExtras<E, TData>]
) {
  const i = (input ?? {}) as CallInput<E>;
  return useQuery<ResponseOf<E>, Error, TData, ContractKey>({
    queryKey: contractKey(e, i as { params?: object; query?: object }),
    queryFn: ({ signal }) => call(e, i, signal),
    ...options,
  });
}

/** Marks every cached GET of these endpoints (or of every path under a prefix) as stale. */
export function invalidate(queryClient: QueryClient, ...targets: (Endpoint | `/api/${string}`)[]): Promise<void> {
  const prefixes = targets.map((t) => (typeof t === 'string' ? t : t.path));
  return queryClient.invalidateQueries({
    predicate: (q) => {
      const path = q.queryKey[0];
      return typeof path === 'string' && prefixes.some((p) => path === p || path.startsWith(`${p}/`));
    },
  });
}

interface MutationExtras<E extends Endpoint> extends Omit<UseMutationOptions<ResponseOf<E>, Error, CallInput<E>>, 'mutationFn'> {
  /** Endpoints (or path prefixes) whose cached answers this write makes stale. */
  invalidates?: (Endpoint | `/api/${string}`)[];
}

/** A write: `useContractMutation(createSupplier, { invalidates: ['/api/suppliers'] })`. */
export function useContractMutation<E extends Endpoint>(e: E, { invalidates = [], onSettled, ...options }: MutationExtras<E> = {}) {
  const queryClient = useQueryClient();
  return useMutation<ResponseOf<E>, Error, CallInput<E>>({
    ...options,
    mutationFn: (input) => call(e, input),
    onSettled: async (...args) => {
      // A half-done write may still have changed something: refresh on failure too.
      if (invalidates.length > 0) await invalidate(queryClient, ...invalidates);
      await onSettled?.(...args);
    },
  });
}
