import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { paths } from '../../../lib/paths';

export interface PackPrice {
  id: string;
  price: string;
  effectiveFrom: string;
  source: string;
  note: string | null;
  createdAt: string;
}

export const packPricesQueryOptions = (packId: string | null) =>
  queryOptions({
    queryKey: ['reprice', 'pack-prices', packId] as const,
    queryFn: () => apiClient.get<{ prices: PackPrice[] }>(paths.api.packPrices(packId as string)),
    enabled: packId !== null,
  });

export function usePackPrices(packId: string | null) {
  return useQuery(packPricesQueryOptions(packId));
}

export interface PlannedPrice {
  ingredientId: string;
  ingredientName: string;
  packId: string;
  packDescription: string;
  isCostingPack: boolean;
  currentPrice: string | null;
  price: string;
  effectiveFrom: string;
  note: string | null;
}

export const plannedQueryOptions = () =>
  queryOptions({
    queryKey: ['reprice', 'planned'] as const,
    queryFn: () => apiClient.get<{ currency: string; planned: PlannedPrice[] }>(paths.api.repricePlanned()),
  });

export function usePlannedPrices() {
  return useQuery(plannedQueryOptions());
}

/** A new pack price with the date it takes effect (a later date = a planned price). */
export function useAddPackPrice() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ packId, price, effectiveFrom, note }: { packId: string; price: string; effectiveFrom: string; note?: string }) =>
      apiClient.post(paths.api.packPrices(packId), { price, effectiveFrom, note }),
    onSettled: () => queryClient.invalidateQueries({ queryKey: ['reprice'] }),
  });
}
