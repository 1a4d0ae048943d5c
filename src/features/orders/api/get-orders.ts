import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { paths } from '../../../lib/paths';
import type { OrderSummary } from './types';

/** Every purchase-order query starts with this; each order write refreshes them all. */
export const ordersKey = ['orders'] as const;

export interface OrdersFilter {
  siteId?: string;
  supplierId?: string;
  status?: string;
}

export function getOrders(filter: OrdersFilter = {}): Promise<{ orders: OrderSummary[] }> {
  return apiClient.get(paths.api.purchaseOrders(filter));
}

export const ordersQueryOptions = (filter: OrdersFilter = {}) =>
  queryOptions({ queryKey: [...ordersKey, 'list', filter] as const, queryFn: () => getOrders(filter) });

export function useOrders(filter: OrdersFilter = {}) {
  return useQuery(ordersQueryOptions(filter));
}
