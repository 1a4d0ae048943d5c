import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { paths } from '../../../lib/paths';

/** A menu price applied with a later date: it takes effect on `effectiveFrom`. */
export interface ScheduledPrice {
  id: string;
  drinkId: string;
  drinkName: string;
  drinkSizeId: string;
  sizeId: string;
  size: string;
  currentPrice: string | null;
  oldPrice: string | null;
  newPrice: string;
  effectiveFrom: string;
  reason: string | null;
  scenarioId: string | null;
  scenarioName: string | null;
  scheduledBy: { id: string; name: string } | null;
  scheduledAt: string;
}

export const scheduledPricesQueryOptions = () =>
  queryOptions({
    queryKey: ['reprice', 'scheduled'] as const,
    queryFn: () => apiClient.get<{ currency: string; today: string; scheduled: ScheduledPrice[] }>(paths.api.repriceScheduled()),
  });

export function useScheduledPrices() {
  return useQuery(scheduledPricesQueryOptions());
}

/** Cancels a scheduled menu price before its date (owner, manager). */
export function useCancelScheduledPrice() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (id: string) => apiClient.post<{ id: string; status: 'cancelled'; effectiveFrom: string }>(paths.api.repriceCancelScheduled(id), {}),
    // The plan changed: price lists on later dates, histories and versions in previews are stale.
    onSettled: () => queryClient.invalidateQueries({ queryKey: ['reprice'] }),
  });
}
