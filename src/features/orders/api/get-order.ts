import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { paths } from '../../../lib/paths';
import { ordersKey } from './get-orders';
import type { Order } from './types';

export function getOrder(id: string): Promise<Order> {
  return apiClient.get(paths.api.purchaseOrder(id));
}

export const orderQueryOptions = (id: string) => queryOptions({ queryKey: [...ordersKey, 'one', id] as const, queryFn: () => getOrder(id) });

/** One order; while its payment is being confirmed it is read again every few seconds. */
export function useOrder(id: string) {
  return useQuery({
    ...orderQueryOptions(id),
    refetchInterval: (q) => (q.state.data?.payment?.confirming ? 3000 : false),
  });
}
