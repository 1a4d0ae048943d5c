import { z } from 'zod';
import { ALLERGEN_CODES } from '../allergens';
import { decimalProblem, NOT_A_DECIMAL, rules, type DecimalRule } from '../checks';
import type { CostPreviewRequest } from '../costing';
import { FieldErrors } from '../errors';
import { isCurrencyCode } from '../money';
import { readPolicy, ROUNDING_MODES, TAX_MODES } from '../pricing';
import { BASE_UNITS, UNIT_CODES } from '../units';
import { bracketPathToZod } from './field-errors';
import { decimal, text } from './fields';

export { formatFieldPath, zodFieldErrors } from './field-errors';

/**
 * A decimal string checked with one of the shared rules (the engine applies the same rules),
 * whatever its size. For a value that is or could be stored, use `decimal(column, rule)` of
 * ./fields, which also keeps it within its column.
 */
export function decimalString(rule?: DecimalRule) {
  return z.string({ error: NOT_A_DECIMAL }).superRefine((value, ctx) => {
    const problem = decimalProblem(value, rule);
    if (problem) ctx.addIssue({ code: 'custom', message: problem });
  });
}

const unitCode = z.enum(UNIT_CODES, { error: (issue) => `Unknown unit "${String(issue.input)}".` });
const key = z.string({ error: 'Enter a key.' }).min(1, 'Enter a key.').max(100);

// The preview stores nothing, but each figure is one the business could store: it is held to
// the same column as the stored one, so what previews is what saves.
export const measureSchema = z.object({ quantity: decimal('quantity', rules.positive), unit: unitCode });

export const lineSchema = z.object({
  item: key,
  quantity: decimal('quantity', rules.positive),
  /** A standard unit or one of the item's measures: only the engine can tell which. */
  unit: z.string({ error: 'Choose a unit or measure.' }).min(1, 'Choose a unit or measure.').max(60),
});

const measures = z.record(z.string().min(1).max(60), measureSchema).nullish();

export const ingredientSchema = z.object({
  key,
  baseUnit: z.enum(BASE_UNITS, { error: 'The base unit must be g, ml or each.' }),
  densityGPerMl: decimal('density', rules.positive).nullish(),
  yieldPct: decimal('percent', rules.yieldPct).nullish(),
  pack: z.object({
    count: decimal('quantity', rules.positive).nullish(),
    quantity: decimal('quantity', rules.positive),
    unit: unitCode,
    price: decimal('money', rules.nonNegative),
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
  densityGPerMl: decimal('density', rules.positive).nullish(),
  measures,
  lines: z.array(lineSchema).min(1, 'A preparation needs at least one line.').max(200),
});

export const pricingPolicySchema = z.object({
  targetMarginPct: decimal('percent', rules.marginPct),
  taxMode: z.enum(TAX_MODES, { error: 'Choose whether prices include tax (inclusive) or not (exclusive).' }),
  taxRatePct: decimal('percent', rules.nonNegative),
  priceStep: decimal('money', rules.positive).nullish(),
  rounding: z.enum(ROUNDING_MODES, { error: 'Choose rounding up, to the nearest step, or none.' }),
});

export const currencySchema = z
  .string({ error: 'Enter a currency code.' })
  .refine(isCurrencyCode, 'Enter a three-letter ISO 4217 currency code such as GBP.');

export const sizeSchema = z.object({
  name: text({ what: 'cup size', min: 1, max: 60 }),
  currentPrice: decimal('money', rules.positive).nullish(),
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
