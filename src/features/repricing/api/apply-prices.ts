import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { paths } from '../../../lib/paths';

export interface ApplyRequest {
  effectiveFrom: string;
  prices: { drinkId: string; size: string; price: string; priceVersion?: number }[];
  scenarioId?: string;
  keepLadder?: boolean;
}

export interface ApplyResult {
  effectiveFrom: string;
  /** True when dated after today: the prices are scheduled, today's stay until then. */
  planned: boolean;
  scenarioId: string | null;
  applied: { drinkId: string; drinkName: string; drinkSizeId: string; size: string; oldPrice: string | null; newPrice: string; priceVersion: number; effectiveFrom: string; planned: boolean }[];
}

export function applyPrices(body: ApplyRequest): Promise<ApplyResult> {
  return apiClient.post<ApplyResult>(paths.api.repriceApply(), body);
}

export function useApplyPrices() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: applyPrices,
    // Menu prices changed: every repricing view, the price list and histories are stale.
    onSettled: () => queryClient.invalidateQueries({ queryKey: ['reprice'] }),
  });
}
