import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { paths } from '../../../lib/paths';
import type { SavedCard } from './types';

export function getPaymentCard(): Promise<SavedCard> {
  return apiClient.get(paths.api.paymentCard());
}

export const paymentCardQueryOptions = () => queryOptions({ queryKey: ['payment-card'] as const, queryFn: getPaymentCard });

/** The business's saved card (owner only: other roles get 403, so pass enabled=false for them). */
export function usePaymentCard(enabled = true) {
  return useQuery({ ...paymentCardQueryOptions(), enabled });
}

export function savePaymentCard(paymentMethodId: string): Promise<SavedCard> {
  return apiClient.put(paths.api.paymentCard(), { paymentMethodId });
}

export function removePaymentCard(): Promise<SavedCard> {
  return apiClient.delete(paths.api.paymentCard());
}

function useCardWrite<TIn>(fn: (input: TIn) => Promise<SavedCard>) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: fn,
    onSuccess: (card) => queryClient.setQueryData(paymentCardQueryOptions().queryKey, card),
    onSettled: () => queryClient.invalidateQueries({ queryKey: paymentCardQueryOptions().queryKey }),
  });
}

export const useSavePaymentCard = () => useCardWrite(savePaymentCard);
export const useRemovePaymentCard = () => useCardWrite((_: void) => removePaymentCard());
