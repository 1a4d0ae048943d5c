import { z } from 'zod';
import { INGREDIENT_CATEGORIES } from '../../categories';
import { rules } from '../../checks';
import { decimal, id, isoDate, nameOf, optionalText, text } from '../../schemas/fields';
import { endpoint } from '../endpoint';
import { allergenCaution, allergenCode, allergensSchema, baseUnit, measureOutSchema, positiveQuantity, unitCode } from './common';

// Ingredients, the packs they are bought in, the packs' dated prices, and measures (a shot, a
// pump) of ingredients and preparations.

export const ingredientCategory = z.enum(INGREDIENT_CATEGORIES, { error: `Choose a category: ${INGREDIENT_CATEGORIES.join(', ')}.` });

export const measureInSchema = z.object({ name: nameOf('measure'), quantity: positiveQuantity, unit: unitCode });
export type MeasureIn = z.input<typeof measureInSchema>;

const packFields = {
  supplierId: id('supplier').nullish(),
  description: text({ what: 'pack', min: 1, max: 200 }),
  supplierCode: optionalText(60, false),
  count: decimal('quantity', rules.positive).nullish(),
  quantity: positiveQuantity,
  unit: unitCode,
  purchaseTaxPct: decimal('percent', rules.nonNegative).nullish(),
};
const price = decimal('money', rules.nonNegative);

/** A new pack with its first price (from `effectiveFrom`, else the business's today). */
export const packInSchema = z.object({ ...packFields, price, effectiveFrom: isoDate.nullish() });
export type PackIn = z.input<typeof packInSchema>;
/** A pack's own fields; its price changes through its prices. */
export const packPatchSchema = z.object(packFields).partial();
export const priceInSchema = z.object({ price, effectiveFrom: isoDate.nullish(), note: optionalText(500) });

const ingredientFields = {
  name: nameOf('ingredient'),
  category: ingredientCategory,
  baseUnit,
  densityGPerMl: decimal('density', rules.positive).nullish(),
  yieldPct: decimal('percent', rules.yieldPct).nullish(),
  allergens: z.array(allergenCode).max(14).nullish(),
  notes: optionalText(),
};
export const ingredientInSchema = z.object({
  ...ingredientFields,
  packs: z.array(packInSchema).max(50).nullish(),
  measures: z.array(measureInSchema).max(50).nullish(),
});
export type IngredientIn = z.input<typeof ingredientInSchema>;
export const ingredientPatchSchema = z.object({ ...ingredientFields, costingPackId: id('pack').nullable() }).partial();
export type IngredientPatch = z.input<typeof ingredientPatchSchema>;

/** An ingredient as lists show it: its usable cost per base unit today, or the problem that stops it. */
export const ingredientSummarySchema = z.object({
  id: z.uuid(),
  name: z.string(),
  category: ingredientCategory,
  baseUnit,
  densityGPerMl: z.string().nullable(),
  yieldPct: z.string().nullable(),
  unitCost: z.string().nullable(),
  costingPack: z.object({ id: z.uuid(), description: z.string(), price: z.string().nullable(), supplierName: z.string().nullable() }).nullable(),
  allergens: allergensSchema,
  measures: z.array(measureOutSchema),
  problem: z.string().nullable(),
});
export type IngredientSummary = z.output<typeof ingredientSummarySchema>;

/** A pack with the price in force today and the prices planned after it. */
export const packSchema = z.object({
  id: z.uuid(),
  supplierId: z.uuid().nullable(),
  supplierName: z.string().nullable(),
  description: z.string(),
  supplierCode: z.string().nullable(),
  count: z.string(),
  quantity: z.string(),
  unit: unitCode,
  purchaseTaxPct: z.string().nullable(),
  price: z.string().nullable(),
  priceFrom: z.string().nullable(),
  plannedPrices: z.array(z.object({ price: z.string(), effectiveFrom: z.string() })),
  isCostingPack: z.boolean(),
});
export type Pack = z.output<typeof packSchema>;

export const ingredientDetailSchema = ingredientSummarySchema.extend({
  notes: z.string().nullable(),
  /** The owner's choice of pack, or null: the most recently priced one sets the cost. */
  costingPackId: z.uuid().nullable(),
  packs: z.array(packSchema),
});
export type IngredientDetail = z.output<typeof ingredientDetailSchema>;

const oneIngredient = z.object({ ingredient: ingredientDetailSchema, allergenCaution });

export const packPriceSchema = z.object({
  id: z.uuid(),
  price: z.string(),
  effectiveFrom: z.string(),
  source: z.enum(['manual', 'delivery', 'reprice', 'seed']),
  note: z.string().nullable(),
  createdAt: z.string(),
});

export const measureSchema = z.object({
  id: z.uuid(),
  ingredientId: z.uuid().nullable(),
  preparationId: z.uuid().nullable(),
  name: z.string(),
  quantity: z.string(),
  unit: unitCode,
});
const oneMeasure = z.object({ measure: measureSchema });

export const listIngredients = endpoint({
  method: 'GET', path: '/api/ingredients', access: 'costs.read',
  summary: 'Every ingredient with its usable cost per base unit today, its costing pack, allergens and measures.',
  response: z.object({ ingredients: z.array(ingredientSummarySchema), allergenCaution }),
});

export const getIngredient = endpoint({
  method: 'GET', path: '/api/ingredients/:id', access: 'costs.read',
  summary: 'One ingredient with its packs, their prices in force and planned, and its measures.',
  response: oneIngredient,
});

export const createIngredient = endpoint({
  method: 'POST', path: '/api/ingredients', access: 'costs.write',
  summary: 'Adds an ingredient with its packs and measures in one transaction.',
  body: ingredientInSchema, response: oneIngredient, status: 201,
  errors: { 409: '`name_taken`' },
});

export const updateIngredient = endpoint({
  method: 'PATCH', path: '/api/ingredients/:id', access: 'costs.write',
  summary: "Changes an ingredient's fields, or which pack sets its cost (only the fields sent).",
  body: ingredientPatchSchema, response: oneIngredient,
  errors: { 409: '`name_taken`' },
});

export const deleteIngredient = endpoint({
  method: 'DELETE', path: '/api/ingredients/:id', access: 'costs.write',
  summary: 'Removes an ingredient; one that orders, deliveries, counts, waste or retired drinks remember is archived instead.',
  response: null,
  errors: { 409: '`in_use`: a drink, preparation or modifier uses it' },
});

export const addPack = endpoint({
  method: 'POST', path: '/api/ingredients/:id/packs', access: 'costs.write',
  summary: 'Adds a pack to an ingredient, with its first price.',
  body: packInSchema, response: z.object({ pack: packSchema }), status: 201,
});

export const updatePack = endpoint({
  method: 'PATCH', path: '/api/packs/:id', access: 'costs.write',
  summary: "Changes a pack's supplier, description, code, size or purchase tax (prices go through its prices).",
  body: packPatchSchema, response: z.object({ pack: packSchema }),
});

export const deletePack = endpoint({
  method: 'DELETE', path: '/api/packs/:id', access: 'costs.write',
  summary: 'Removes a pack; one that a purchase order, a delivery or a stock count names is archived instead (hidden from lists and pickers, kept by history).',
  response: null,
});

export const listPackPrices = endpoint({
  method: 'GET', path: '/api/packs/:id/prices', access: 'costs.read',
  summary: "A pack's prices, newest first.",
  response: z.object({ prices: z.array(packPriceSchema) }),
});

export const addPackPrice = endpoint({
  method: 'POST', path: '/api/packs/:id/prices', access: 'costs.write',
  summary: 'A new dated price (history is kept); a future date is a planned price.',
  body: priceInSchema, response: z.object({ price: packPriceSchema, pack: packSchema }), status: 201,
});

export const addIngredientMeasure = endpoint({
  method: 'POST', path: '/api/ingredients/:id/measures', access: 'costs.write',
  summary: 'Adds a measure (a shot, a scoop) to an ingredient.',
  body: measureInSchema, response: oneMeasure, status: 201,
  errors: { 409: '`name_taken`: the item has a measure of that name' },
});

export const addPreparationMeasure = endpoint({
  method: 'POST', path: '/api/preparations/:id/measures', access: 'costs.write',
  summary: 'Adds a measure (a pump) to a preparation.',
  body: measureInSchema, response: oneMeasure, status: 201,
  errors: { 409: '`name_taken`' },
});

export const updateMeasure = endpoint({
  method: 'PATCH', path: '/api/measures/:id', access: 'costs.write',
  summary: 'Changes a measure (only the fields sent).',
  body: measureInSchema.partial(), response: oneMeasure,
  errors: { 409: '`name_taken`' },
});

export const deleteMeasure = endpoint({
  method: 'DELETE', path: '/api/measures/:id', access: 'costs.write',
  summary: 'Removes a measure no line uses.',
  response: null,
  errors: { 409: '`in_use`: a line uses it' },
});
