import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { paths } from '../../../lib/paths';
import { booksKey } from './keys';
import type { Period } from './types';

export const periodsQueryOptions = () =>
  queryOptions({ queryKey: [...booksKey, 'periods'] as const, queryFn: () => apiClient.get<{ periods: Period[] }>(paths.api.periods()) });

export function usePeriods() {
  return useQuery(periodsQueryOptions());
}

/** Closing or reopening changes every figure of the month: all books queries are refreshed. */
export function usePeriodAction(action: 'close' | 'reopen') {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ month, reason }: { month: string; reason?: string }) =>
      apiClient.post<{ period: Period }>(action === 'close' ? paths.api.closePeriod(month) : paths.api.reopenPeriod(month), { reason: reason || null }),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: booksKey }),
  });
}
