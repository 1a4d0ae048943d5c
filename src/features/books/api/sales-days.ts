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

/** A day at a site as the hand-entry form loads it. */
export interface ManualDay {
  siteId: string;
  soldOn: string;
  /** Its month is closed: saving is refused. */
  closed: boolean;
  currency: string;
  /** The lines typed in by hand, in the order they were saved. */
  lines: (ManualLine & { label: string; tax: string | null })[];
  /** Lines from till files that day (saving by hand leaves them as they are). */
  importedLines: number;
}

export const salesDayQueryOptions = (siteId: string, soldOn: string) =>
  queryOptions({
    queryKey: [...booksKey, 'sales-day', siteId, soldOn] as const,
    queryFn: () => apiClient.get<ManualDay>(paths.api.salesDay(siteId, soldOn)),
  });

export function useSalesDay(siteId: string, soldOn: string | null) {
  return useQuery({ ...salesDayQueryOptions(siteId, soldOn ?? ''), enabled: Boolean(soldOn) });
}

/** Replaces the day's hand-entered lines (imported lines stay as they are). */
export function useSaveSalesDay() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: { siteId: string; soldOn: string; lines: ManualLine[] }) => apiClient.put<ManualDay & { replaced: number }>(paths.api.salesDays(), input),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: booksKey }),
  });
}
