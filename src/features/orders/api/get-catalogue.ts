import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { paths } from '../../../lib/paths';
import { ordersKey } from './get-orders';
import type { CataloguePack } from './types';

export function getCatalogue(supplierId: string): Promise<{ packs: CataloguePack[] }> {
  return apiClient.get(paths.api.supplierCatalogue(supplierId));
}

/** The supplier's packs with today's prices: what the order editor picks from. */
export const catalogueQueryOptions = (supplierId: string) =>
  queryOptions({ queryKey: [...ordersKey, 'catalogue', supplierId] as const, queryFn: () => getCatalogue(supplierId) });

export function useCatalogue(supplierId: string | undefined) {
  return useQuery({ ...catalogueQueryOptions(supplierId ?? ''), enabled: Boolean(supplierId) });
}
