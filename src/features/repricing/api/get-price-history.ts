import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { paths } from '../../../lib/paths';

export interface PriceHistory {
  drink: { id: string; name: string; archived: boolean };
  currency: string;
  history: {
    id: string;
    drinkSizeId: string;
    sizeId: string;
    size: string;
    oldPrice: string | null;
    newPrice: string;
    effectiveFrom: string;
    reason: string | null;
    scenarioId: string | null;
    scenarioName: string | null;
    changedBy: { id: string; name: string } | null;
    changedAt: string;
    /** planned = takes effect later; cancelled = a plan withdrawn before its date. */
    status: 'applied' | 'planned' | 'cancelled';
    planned: boolean;
    cancelledAt: string | null;
  }[];
}

export const priceHistoryQueryOptions = (drinkId: string) =>
  queryOptions({
    queryKey: ['reprice', 'price-history', drinkId] as const,
    queryFn: () => apiClient.get<PriceHistory>(paths.api.drinkPriceHistory(drinkId)),
  });

export function usePriceHistory(drinkId: string) {
  return useQuery(priceHistoryQueryOptions(drinkId));
}
