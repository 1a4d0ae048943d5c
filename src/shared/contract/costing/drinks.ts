import { z } from 'zod';
import { rules } from '../../checks';
import { asOfQuery, decimal, id, nameOf, optionalText, text, wholeNumber } from '../../schemas/fields';
import { endpoint } from '../endpoint';
import { allergenCaution, allergensSchema, CATEGORY_MAX, lineCostSchema, lineInSchema, lineOutSchema, policyOutSchema, priceFiguresSchema, temperature } from './common';

// Drinks: a build per cup size and a menu price; their costing against the pricing policy; the
// menu costed at once; and the recipe cards every role reads (no cost anywhere on them).

export const drinkInSchema = z.object({
  name: nameOf('drink'),
  category: text({ what: 'drink category', min: 1, max: CATEGORY_MAX }),
  temperature,
  notes: optionalText(),
  expectedWeeklyCups: wholeNumber(0, 1_000_000, 'a whole number of cups').nullish(),
  sizes: z
    .array(z.object({ sizeId: id('cup size'), currentPrice: decimal('money', rules.positive).nullish(), lines: z.array(lineInSchema).max(200) }))
    .min(1, 'Offer at least one cup size.')
    .max(20),
});
export type DrinkIn = z.input<typeof drinkInSchema>;

export const copyBuildSchema = z.object({ fromSizeId: id('cup size'), toSizeId: id('cup size') });

export const drinkSummarySchema = z.object({
  id: z.uuid(),
  name: z.string(),
  category: z.string(),
  temperature,
  sizes: z.array(z.object({ sizeId: z.uuid(), name: z.string(), currentPrice: z.string().nullable() })),
});
export type DrinkSummary = z.output<typeof drinkSummarySchema>;

export const drinkSchema = z.object({
  id: z.uuid(),
  name: z.string(),
  category: z.string(),
  temperature,
  notes: z.string().nullable(),
  expectedWeeklyCups: z.number().int().nullable(),
  sizes: z.array(
    z.object({
      /** The drink size's own id. */
      id: z.uuid(),
      sizeId: z.uuid(),
      name: z.string(),
      volumeMl: z.string(),
      currentPrice: z.string().nullable(),
      priceVersion: z.number().int(),
      lines: z.array(lineOutSchema),
    }),
  ),
});
export type Drink = z.output<typeof drinkSchema>;

const one = z.object({ drink: drinkSchema });

/** A saved size costed as the preview costs it; a size that cannot be costed has nulls and a problem. */
export const sizeCostingSchema = z.object({
  drinkSizeId: z.uuid(),
  sizeId: z.uuid(),
  name: z.string(),
  cost: z.string().nullable(),
  lines: z.array(lineCostSchema.extend({ lineId: z.uuid(), itemName: z.string() })),
  suggestedPrice: z.string().nullable(),
  atSuggested: priceFiguresSchema.nullable(),
  atCurrent: priceFiguresSchema.nullable(),
  problem: z.string().nullable(),
});
export type SizeCosting = z.output<typeof sizeCostingSchema>;

export const drinkCostingSchema = z.object({
  drinkId: z.uuid(),
  name: z.string(),
  category: z.string(),
  currency: z.string(),
  asOf: z.string(),
  policy: policyOutSchema,
  sizes: z.array(sizeCostingSchema),
  allergens: allergensSchema,
  allergenCaution,
});
export type DrinkCosting = z.output<typeof drinkCostingSchema>;

export const menuCostingSizeSchema = z.object({
  drinkSizeId: z.uuid(),
  sizeId: z.uuid(),
  name: z.string(),
  currentPrice: z.string().nullable(),
  cost: z.string().nullable(),
  marginPct: z.string().nullable(),
  suggestedPrice: z.string().nullable(),
  /** A current price whose margin is below the category's target (false without a price). */
  belowTarget: z.boolean(),
  problem: z.string().nullable(),
});

export const menuCostingSchema = z.object({
  currency: z.string(),
  asOf: z.string(),
  drinks: z.array(
    z.object({ id: z.uuid(), name: z.string(), category: z.string(), temperature, targetMarginPct: z.string(), sizes: z.array(menuCostingSizeSchema) }),
  ),
});
export type MenuCosting = z.output<typeof menuCostingSchema>;

export const cardSummarySchema = z.object({ id: z.uuid(), name: z.string(), category: z.string(), temperature, sizes: z.array(z.string()) });
export type CardSummary = z.output<typeof cardSummarySchema>;

export const recipeCardSchema = z.object({
  id: z.uuid(),
  name: z.string(),
  category: z.string(),
  temperature,
  notes: z.string().nullable(),
  sizes: z.array(
    z.object({
      sizeId: z.uuid(),
      name: z.string(),
      volumeMl: z.string(),
      /** `unit`: the unit code or the measure's name; `unitLabel`: how to print it ("shot", "ml"). */
      lines: z.array(z.object({ itemName: z.string(), quantity: z.string(), unit: z.string().nullable(), unitLabel: z.string() })),
    }),
  ),
  allergens: allergensSchema,
  modifiers: z.array(z.object({ id: z.uuid(), name: z.string(), allergens: allergensSchema })),
  allergenCaution,
});
export type RecipeCard = z.output<typeof recipeCardSchema>;

export const listDrinks = endpoint({
  method: 'GET', path: '/api/drinks', access: 'costs.read',
  summary: 'Every drink on the menu with its sizes and their menu prices.',
  response: z.object({ drinks: z.array(drinkSummarySchema) }),
});

export const getDrink = endpoint({
  method: 'GET', path: '/api/drinks/:id', access: 'costs.read',
  summary: 'One drink with its build per size.',
  response: one,
});

export const createDrink = endpoint({
  method: 'POST', path: '/api/drinks', access: 'costs.write',
  summary: 'Adds a drink with its sizes and builds in one transaction.',
  body: drinkInSchema, response: one, status: 201,
  errors: { 409: '`name_taken`' },
});

export const replaceDrink = endpoint({
  method: 'PUT', path: '/api/drinks/:id', access: 'costs.write',
  summary: 'Replaces the whole drink, its sizes and builds in one transaction (a changed price goes into the menu price history).',
  body: drinkInSchema, response: one,
  errors: { 409: '`name_taken`; `in_use` when a size left out has sales or waste' },
});

export const archiveDrink = endpoint({
  method: 'DELETE', path: '/api/drinks/:id', access: 'costs.write',
  summary: 'Archives a drink: it leaves lists, cards and the menu costing; its price history and sales stay.',
  response: null,
});

export const copyBuild = endpoint({
  method: 'POST', path: '/api/drinks/:id/copy-build', access: 'costs.write',
  summary: "Makes one size's build a copy of another's (adding the size if the drink does not offer it yet).",
  body: copyBuildSchema, response: one,
});

export const getDrinkCosting = endpoint({
  method: 'GET', path: '/api/drinks/:id/costing', access: 'costs.read',
  summary: "A saved drink costed as the preview costs it, on the business's today or `asOf`.",
  query: asOfQuery, response: drinkCostingSchema,
});

export const getMenuCosting = endpoint({
  method: 'GET', path: '/api/menu/costing', access: 'costs.read',
  summary: 'Every drink and size costed, with the margin at the current price against the target.',
  query: asOfQuery, response: menuCostingSchema,
});

export const listCards = endpoint({
  method: 'GET', path: '/api/cards', access: 'cards.read',
  summary: 'The recipe cards: every drink with its size names.',
  response: z.object({ cards: z.array(cardSummarySchema) }),
});

export const getCard = endpoint({
  method: 'GET', path: '/api/drinks/:id/card', access: 'cards.read',
  summary: "A drink's recipe card: the build per size, allergens and add-ons, with no cost anywhere.",
  response: z.object({ card: recipeCardSchema }),
});
