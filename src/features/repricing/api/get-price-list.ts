import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { paths } from '../../../lib/paths';

export interface PriceList {
  business: { name: string; currency: string; taxMode: 'inclusive' | 'exclusive' };
  /** The day whose prices are listed. */
  date: string;
  effectiveFrom: string | null;
  /** The next planned menu price change after `date`, if any. */
  nextChangeFrom: string | null;
  generatedOn: string;
  taxNote: string;
  sizes: { sizeId: string; name: string; volumeMl: string }[];
  drinks: { id: string; name: string; category: string; temperature: 'hot' | 'iced'; sizes: { sizeId: string; name: string; price: string | null }[]; allergens: string[] }[];
  modifiers: { id: string; name: string; upcharge: string | null; allergens: string[] }[];
  allergenNames: Record<string, string>;
  allergenCaution: string;
}

/** The prices in force on `date` (default today, planned prices included from their date). */
export const priceListQueryOptions = (date?: string) =>
  queryOptions({
    queryKey: ['reprice', 'price-list', date ?? 'today'] as const,
    queryFn: () => apiClient.get<PriceList>(paths.api.priceList(date)),
  });

export function usePriceList(date?: string) {
  return useQuery(priceListQueryOptions(date));
}
