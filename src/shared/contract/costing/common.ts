import { z } from 'zod';
import { ALLERGEN_CODES } from '../../allergens';
import { rules } from '../../checks';
import { ROUNDING_MODES, TAX_MODES } from '../../pricing';
import { decimal, id } from '../../schemas/fields';
import { BASE_UNITS, UNIT_CODES } from '../../units';

// What the costing endpoints share: units, allergens, lines (in and out), a policy, the
// figures at a price. Money and quantities are decimal strings, sized to their columns.

export const unitCode = z.enum(UNIT_CODES, { error: (issue) => `Unknown unit "${String(issue.input)}".` });
export const baseUnit = z.enum(BASE_UNITS, { error: 'The base unit must be g, ml or each.' });
export const allergenCode = z.enum(ALLERGEN_CODES, { error: (issue) => `Unknown allergen "${String(issue.input)}".` });
export const temperature = z.enum(['hot', 'iced'], { error: 'Choose hot or iced.' });

/** A quantity of a line, a measure or a yield: more than 0, within numeric(14, 4). */
export const positiveQuantity = decimal('quantity', rules.positive);

/**
 * A line as the API takes it: one item (ingredient or preparation), a quantity, and a unit or a
 * measure. Whether the ids are this business's, and the unit fits the item, the service checks.
 */
export const lineInFields = {
  ingredientId: id('ingredient').nullish(),
  preparationId: id('preparation').nullish(),
  quantity: positiveQuantity,
  unit: unitCode.nullish(),
  measureId: id('measure').nullish(),
};

interface LineShape {
  ingredientId?: string | null;
  preparationId?: string | null;
  unit?: string | null;
  measureId?: string | null;
}

/** Exactly one item and exactly one of unit / measure. */
export function lineRules<T extends LineShape>(l: T, ctx: z.core.$RefinementCtx<T>) {
  if (!l.ingredientId === !l.preparationId) ctx.addIssue({ code: 'custom', path: ['ingredientId'], message: 'Choose one ingredient or one preparation.' });
  if (!l.unit === !l.measureId) ctx.addIssue({ code: 'custom', path: ['unit'], message: 'Choose a unit or a measure (not both).' });
}

export const lineInSchema = z.object(lineInFields).superRefine(lineRules);
export type LineIn = z.input<typeof lineInSchema>;

/** A stored line, with its item's and its measure's names. */
export const lineOutSchema = z.object({
  id: z.uuid(),
  ingredientId: z.uuid().nullable(),
  preparationId: z.uuid().nullable(),
  itemName: z.string(),
  quantity: z.string(),
  unit: unitCode.nullable(),
  measureId: z.uuid().nullable(),
  measureName: z.string().nullable(),
});
export type LineOut = z.output<typeof lineOutSchema>;

/** A measure of an ingredient or preparation as lists show it; `cost` where the item can be costed. */
export const measureOutSchema = z.object({
  id: z.uuid(),
  name: z.string(),
  quantity: z.string(),
  unit: unitCode,
  cost: z.string().nullable().optional(),
});
export type MeasureOut = z.output<typeof measureOutSchema>;

/** A pricing policy as the API answers it. */
export const policyOutSchema = z.object({
  targetMarginPct: z.string(),
  taxMode: z.enum(TAX_MODES),
  taxRatePct: z.string(),
  priceStep: z.string().nullish(),
  rounding: z.enum(ROUNDING_MODES),
});

/** The figures of a menu price: money to the currency's minor units, percentages to 2 places. */
export const priceFiguresSchema = z.object({
  price: z.string(),
  netPrice: z.string(),
  tax: z.string(),
  marginPct: z.string().nullable(),
  costPct: z.string().nullable(),
  profit: z.string(),
});

/** One costed line: its quantity in the item's base unit and its cost (4 places). */
export const lineCostSchema = z.object({
  item: z.string(),
  quantityInBaseUnit: z.string(),
  baseUnit,
  cost: z.string(),
});

export const allergensSchema = z.array(allergenCode);

/** The caution shown beside derived allergens. */
export const allergenCaution = z.string();

export const CATEGORY_MAX = 60;
