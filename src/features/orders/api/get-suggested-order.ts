import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { paths } from '../../../lib/paths';
import { ordersKey } from './get-orders';
import type { SuggestedOrder } from './types';

export function getSuggestedOrder(siteId: string, supplierId: string): Promise<SuggestedOrder> {
  return apiClient.get(paths.api.suggestedOrder(siteId, supplierId));
}

export const suggestedOrderQueryOptions = (siteId: string, supplierId: string) =>
  queryOptions({ queryKey: [...ordersKey, 'suggested', siteId, supplierId] as const, queryFn: () => getSuggestedOrder(siteId, supplierId) });

export function useSuggestedOrder(siteId: string | undefined, supplierId: string | undefined, enabled = true) {
  return useQuery({ ...suggestedOrderQueryOptions(siteId ?? '', supplierId ?? ''), enabled: enabled && Boolean(siteId && supplierId) });
}
