import { z } from 'zod';
import { pricingPolicySchema } from '../../schemas/costing';
import { text } from '../../schemas/fields';
import { endpoint } from '../endpoint';
import { CATEGORY_MAX, policyOutSchema } from './common';

export const policyInSchema = z.object({
  policy: pricingPolicySchema,
  overrides: z.array(pricingPolicySchema.extend({ category: text({ what: 'drink category', min: 1, max: CATEGORY_MAX }) })).max(50).nullish(),
});
export type PolicyIn = z.input<typeof policyInSchema>;

/** The business's policy (a default until one is saved), its overrides per drink category, and the tax caution. */
export const pricingPolicyResponseSchema = z.object({
  currency: z.string(),
  policy: policyOutSchema,
  isSet: z.boolean(),
  overrides: z.array(policyOutSchema.extend({ category: z.string() })),
  caution: z.string(),
});
export type PricingPolicyBody = z.output<typeof pricingPolicyResponseSchema>;

export const getPricingPolicy = endpoint({
  method: 'GET', path: '/api/pricing-policy', access: 'costs.read',
  summary: 'The pricing policy: target margin, tax, price step and rounding, with overrides per drink category.',
  response: pricingPolicyResponseSchema,
});

export const savePricingPolicy = endpoint({
  method: 'PUT', path: '/api/pricing-policy', access: 'costs.write',
  summary: 'Replaces the policy and every override in one transaction.',
  body: policyInSchema, response: pricingPolicyResponseSchema,
});
