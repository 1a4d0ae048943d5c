import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { paths } from '../../../lib/paths';
import { costingKey } from './keys';
import type { PricingPolicyBody } from './types';

export function getPricingPolicy(): Promise<PricingPolicyBody> {
  return apiClient.get(paths.api.pricingPolicy());
}

export const pricingPolicyQueryOptions = () => queryOptions({ queryKey: [...costingKey, 'policy'] as const, queryFn: getPricingPolicy });

export function usePricingPolicy() {
  return useQuery(pricingPolicyQueryOptions());
}
