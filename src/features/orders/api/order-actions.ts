import { useMutation, useQueryClient } from '@tanstack/react-query';
import { ApiError, apiClient, getCsrfToken } from '../../../lib/api-client';
import { paths } from '../../../lib/paths';
import { ordersKey } from './get-orders';
import { orderQueryOptions } from './get-order';
import type { Order } from './types';

type Action = 'place' | 'close' | 'cancel' | 'payment/check';

export function orderAction({ id, action }: { id: string; action: Action }): Promise<Order> {
  return apiClient.post(paths.api.purchaseOrderAction(id, action));
}

export function payOrder({ id, paymentMethodId }: { id: string; paymentMethodId: string }): Promise<Order> {
  return apiClient.post(paths.api.purchaseOrderAction(id, 'pay'), { paymentMethodId });
}

/**
 * A write to one order. The answer is the order itself, so it goes straight into the
 * order's cache; every order query is refreshed afterwards, on failure too (a refused
 * pay may still have recorded an attempt and its reason).
 */
function useOrderWrite<TIn extends { id: string }>(fn: (input: TIn) => Promise<Order>) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: fn,
    onSuccess: (order) => queryClient.setQueryData(orderQueryOptions(order.id).queryKey, order),
    onSettled: () => queryClient.invalidateQueries({ queryKey: ordersKey }),
  });
}

export const useOrderAction = () => useOrderWrite(orderAction);
export const usePayOrder = () => useOrderWrite(payOrder);

/** The supplier's invoice as multipart (field `file`); the api client speaks JSON only, so this sends it with fetch and the same CSRF header. */
export async function uploadInvoice({ id, file }: { id: string; file: File }): Promise<Order> {
  const form = new FormData();
  form.append('file', file);
  const csrf = getCsrfToken();
  let response: Response;
  try {
    response = await fetch(paths.api.purchaseOrderAction(id, 'invoice'), {
      method: 'POST', body: form, credentials: 'same-origin', headers: { Accept: 'application/json', ...(csrf ? { 'X-CSRF-Token': csrf } : {}) },
    });
  } catch {
    throw new ApiError(0, 'network', 'Could not reach the server. Check your connection and try again.');
  }
  const body = await response.json().catch(() => null);
  if (!response.ok) {
    const e = body?.error ?? {};
    throw new ApiError(response.status, e.code ?? `http_${response.status}`, e.message ?? `The server answered ${response.status}.`, e.fields ?? {});
  }
  return body as Order;
}

export const useUploadInvoice = () => useOrderWrite(uploadInvoice);
