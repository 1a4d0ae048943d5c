import { apiClient } from '../../../lib/api-client';
import { paths } from '../../../lib/paths';
import { useCostingMutation } from './keys';
import type { PolicyOverride, PricingPolicy, PricingPolicyBody } from './types';

/** Replaces the business's policy and all its category overrides at once. */
export function savePricingPolicy(input: { policy: PricingPolicy; overrides: PolicyOverride[] }): Promise<PricingPolicyBody> {
  return apiClient.put(paths.api.pricingPolicy(), input);
}

export const useSavePricingPolicy = () => useCostingMutation(savePricingPolicy);
