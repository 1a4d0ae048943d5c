import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { paths } from '../../../lib/paths';
import { ordersKey } from './get-orders';
import type { Order } from './types';

export interface OrderLineIn {
  packId: string;
  quantity: string;
}

export function createOrder(input: { siteId: string; supplierId: string; lines: OrderLineIn[]; notes?: string | null }): Promise<Order> {
  return apiClient.post(paths.api.purchaseOrders(), input);
}

export function updateOrder({ id, ...input }: { id: string; lines: OrderLineIn[]; notes?: string | null; version: number }): Promise<Order> {
  return apiClient.patch(paths.api.purchaseOrder(id), input);
}

export function useCreateOrder() {
  const queryClient = useQueryClient();
  return useMutation({ mutationFn: createOrder, onSuccess: () => queryClient.invalidateQueries({ queryKey: ordersKey }) });
}

export function useUpdateOrder() {
  const queryClient = useQueryClient();
  return useMutation({ mutationFn: updateOrder, onSuccess: () => queryClient.invalidateQueries({ queryKey: ordersKey }) });
}
