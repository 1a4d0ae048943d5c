import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { paths } from '../../../lib/paths';
import { ordersKey } from './get-orders';
import { orderQueryOptions } from './get-order';
import type { Order, ReceiptResult } from './types';

export interface ReceiveIn {
  lines: { lineId: string; quantityReceived: string; unitPrice: string; note?: string | null }[];
  receivedOn?: string;
  invoiceNumber?: string | null;
  notes?: string | null;
}

export function receiveOrder({ id, ...input }: ReceiveIn & { id: string }): Promise<Order & { receipt: ReceiptResult }> {
  return apiClient.post(paths.api.purchaseOrderAction(id, 'receive'), input);
}

export interface PackPriceResult {
  packPrice: { packId: string; price: string; effectiveFrom: string; source: string; repricingPath: string };
}

export function acceptInvoicePrice({ id, packId }: { id: string; packId: string }): Promise<PackPriceResult> {
  return apiClient.post(paths.api.purchaseOrderAction(id, 'pack-prices'), { packId });
}

/** Receiving moves stock: the route refreshes the stock pages from the form's `onReceived`. */
export function useReceiveOrder() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: receiveOrder,
    onSuccess: ({ receipt: _receipt, ...order }) => {
      queryClient.setQueryData(orderQueryOptions(order.id).queryKey, order);
    },
    onSettled: () => queryClient.invalidateQueries({ queryKey: ordersKey }),
  });
}

/** A new pack price changes costs: the route passes `onPriceSaved` to refresh costing pages. */
export function useAcceptInvoicePrice(onPriceSaved?: () => void) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: acceptInvoicePrice,
    onSuccess: () => {
      onPriceSaved?.();
      return queryClient.invalidateQueries({ queryKey: ordersKey });
    },
  });
}
