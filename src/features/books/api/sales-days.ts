import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { paths } from '../../../lib/paths';
import { booksKey } from './keys';

export interface SalesDay {
  day: string;
  cups: string;
  netSales: string;
  manualLines: number;
  importedLines: number;
}

export const salesDaysQueryOptions = (siteId: string | undefined, month: string) =>
  queryOptions({
    queryKey: [...booksKey, 'sales-days', siteId, month] as const,
    queryFn: () => apiClient.get<{ month: string; currency: string; days: SalesDay[] }>(paths.api.salesDays({ siteId, month })),
    enabled: Boolean(siteId),
  });

export function useSalesDays(siteId: string | undefined, month: string) {
  return useQuery(salesDaysQueryOptions(siteId, month));
}

export interface ManualLine {
  drinkSizeId: string;
  quantity: string;
  netSales: string;
  tax?: string | null;
}

/** Replaces the day's hand-entered lines (imported lines stay as they are). */
export function useSaveSalesDay() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: { siteId: string; soldOn: string; lines: ManualLine[] }) => apiClient.put<{ soldOn: string; lines: ManualLine[] }>(paths.api.salesDays(), input),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: booksKey }),
  });
}
