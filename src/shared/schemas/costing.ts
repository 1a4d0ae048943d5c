import { z } from 'zod';
import { ALLERGEN_CODES } from '../allergens';
import { decimalProblem, NOT_A_DECIMAL, rules, type DecimalRule } from '../checks';
import type { CostPreviewRequest } from '../costing';
import { FieldErrors } from '../errors';
import { isCurrencyCode } from '../money';
import { readPolicy, ROUNDING_MODES, TAX_MODES } from '../pricing';
import { BASE_UNITS, UNIT_CODES } from '../units';
import { bracketPathToZod } from './field-errors';

export { formatFieldPath, zodFieldErrors } from './field-errors';

/** A decimal string checked with one of the shared rules (the engine applies the same rules). */
export function decimalString(rule?: DecimalRule) {
  return z.string({ error: NOT_A_DECIMAL }).superRefine((value, ctx) => {
    const problem = decimalProblem(value, rule);
    if (problem) ctx.addIssue({ code: 'custom', message: problem });
  });
}

const unitCode = z.enum(UNIT_CODES, { error: (issue) => `Unknown unit "${String(issue.input)}".` });
const key = z.string({ error: 'Enter a key.' }).min(1, 'Enter a key.').max(100);

export const measureSchema = z.object({ quantity: decimalString(rules.positive), unit: unitCode });

export const lineSchema = z.object({
  item: key,
  quantity: decimalString(rules.positive),
  /** A standard unit or one of the item's measures: only the engine can tell which. */
  unit: z.string({ error: 'Choose a unit or measure.' }).min(1, 'Choose a unit or measure.').max(60),
});

const measures = z.record(z.string().min(1).max(60), measureSchema).nullish();

export const ingredientSchema = z.object({
  key,
  baseUnit: z.enum(BASE_UNITS, { error: 'The base unit must be g, ml or each.' }),
  densityGPerMl: decimalString(rules.positive).nullish(),
  yieldPct: decimalString(rules.yieldPct).nullish(),
  pack: z.object({
    count: decimalString(rules.positive).nullish(),
    quantity: decimalString(rules.positive),
    unit: unitCode,
    price: decimalString(rules.nonNegative),
  }),
  measures,
  allergens: z
    .array(z.enum(ALLERGEN_CODES, { error: (issue) => `Unknown allergen "${String(issue.input)}".` }))
    .max(ALLERGEN_CODES.length)
    .nullish(),
});

export const preparationSchema = z.object({
  key,
  yield: measureSchema,
  densityGPerMl: decimalString(rules.positive).nullish(),
  measures,
  lines: z.array(lineSchema).min(1, 'A preparation needs at least one line.').max(200),
});

export const pricingPolicySchema = z.object({
  targetMarginPct: decimalString(rules.marginPct),
  taxMode: z.enum(TAX_MODES, { error: 'Choose whether prices include tax (inclusive) or not (exclusive).' }),
  taxRatePct: decimalString(rules.nonNegative),
  priceStep: decimalString(rules.positive).nullish(),
  rounding: z.enum(ROUNDING_MODES, { error: 'Choose rounding up, to the nearest step, or none.' }),
});

export const currencySchema = z
  .string({ error: 'Enter a currency code.' })
  .refine(isCurrencyCode, 'Enter a three-letter ISO 4217 currency code such as GBP.');

export const sizeSchema = z.object({
  name: z.string({ error: 'Name the cup size.' }).trim().min(1, 'Name the cup size.').max(60),
  currentPrice: decimalString(rules.positive).nullish(),
  lines: z.array(lineSchema).min(1, 'A cup size needs at least one line.').max(200),
});

/**
 * The cost preview request. Checks shapes and value ranges; what needs the whole request
 * (unknown items, units, measures, densities, cycles) is refused by costPreview with a
 * CostingInputError using the same field paths. The price-step check against the currency's
 * minor unit reuses the engine's readPolicy.
 */
export const costPreviewRequestSchema = z
  .object({
    currency: currencySchema,
    policy: pricingPolicySchema,
    ingredients: z.array(ingredientSchema).max(5000),
    preparations: z.array(preparationSchema).max(1000).nullish(),
    sizes: z.array(sizeSchema).min(1, 'Add at least one cup size.').max(20),
  })
  .superRefine((request, ctx) => {
    const errors = new FieldErrors();
    readPolicy(request.policy, request.currency, errors);
    for (const [path, message] of Object.entries(errors.fields)) {
      ctx.addIssue({ code: 'custom', path: bracketPathToZod(path), message });
    }
  });

/** Compile-time proof that a parsed request is what costPreview takes. */
export function parseCostPreviewRequest(input: unknown): CostPreviewRequest {
  return costPreviewRequestSchema.parse(input);
}
