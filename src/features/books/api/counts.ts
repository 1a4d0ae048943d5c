import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { paths } from '../../../lib/paths';
import { booksKey } from './keys';
import type { CountSheet, StockCount } from './types';

export const countsQueryOptions = (siteId: string | undefined) =>
  queryOptions({
    queryKey: [...booksKey, 'counts', siteId] as const,
    queryFn: () => apiClient.get<{ counts: StockCount[]; currency: string }>(paths.api.stockCounts(siteId)),
    enabled: Boolean(siteId),
  });

export function useCounts(siteId: string | undefined) {
  return useQuery(countsQueryOptions(siteId));
}

export const countSheetQueryOptions = (id: string) =>
  queryOptions({ queryKey: [...booksKey, 'count', id] as const, queryFn: () => apiClient.get<CountSheet>(paths.api.stockCount(id)) });

export function useCountSheet(id: string) {
  return useQuery(countSheetQueryOptions(id));
}

export function useStartCount() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: { siteId: string; countDate: string }) => apiClient.post<{ count: StockCount }>(paths.api.stockCounts(), input),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: booksKey }),
  });
}

/** Saves one pack's count as soon as it is typed (the sheet is refreshed quietly afterwards). */
export function useSaveCountLine(countId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ packId, ...body }: { packId: string; packs?: string; quantity?: string; unit?: string }) =>
      apiClient.put<{ line: { packId: string; packs: string } }>(paths.api.countLine(countId, packId), body),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: countSheetQueryOptions(countId).queryKey }),
  });
}

export function useFinishCount(countId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: () => apiClient.post<{ count: StockCount }>(paths.api.finishCount(countId)),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: booksKey }),
  });
}
