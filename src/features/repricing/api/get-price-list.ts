import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { paths } from '../../../lib/paths';

export interface PriceList {
  business: { name: string; currency: string; taxMode: 'inclusive' | 'exclusive' };
  effectiveFrom: string | null;
  generatedOn: string;
  taxNote: string;
  sizes: { sizeId: string; name: string; volumeMl: string }[];
  drinks: { id: string; name: string; category: string; temperature: 'hot' | 'iced'; sizes: { sizeId: string; name: string; price: string | null }[]; allergens: string[] }[];
  modifiers: { id: string; name: string; upcharge: string | null; allergens: string[] }[];
  allergenNames: Record<string, string>;
  allergenCaution: string;
}

export const priceListQueryOptions = () =>
  queryOptions({
    queryKey: ['reprice', 'price-list'] as const,
    queryFn: () => apiClient.get<PriceList>(paths.api.priceList()),
  });

export function usePriceList() {
  return useQuery(priceListQueryOptions());
}
