import type { ReactNode } from 'react';
import type { UseQueryResult } from '@tanstack/react-query';
import { ErrorState } from './error-state';
import { SkeletonRows } from './skeleton';

interface QueryViewProps<T> {
  query: Pick<UseQueryResult<T>, 'isPending' | 'isError' | 'error' | 'data' | 'refetch'>;
  /** What is loading, for screen readers ("Loading the suppliers"). */
  loading: string;
  /** Skeleton rows while it loads. */
  rows?: number;
  /** When the answer has nothing to show, the empty state that says what to do next. */
  empty?: { when: (data: T) => boolean; state: ReactNode };
  children: (data: T) => ReactNode;
}

/**
 * Every list's and page's three states in one place: skeleton rows while loading, what went
 * wrong and a retry on error, the empty state when there is nothing yet, else the content.
 */
export function QueryView<T>({ query, loading, rows = 4, empty, children }: QueryViewProps<T>) {
  if (query.isPending) return <SkeletonRows rows={rows} label={loading} />;
  if (query.isError) return <ErrorState error={query.error} onRetry={() => void query.refetch()} />;
  const data = query.data as T;
  if (empty?.when(data)) return <>{empty.state}</>;
  return <>{children(data)}</>;
}
