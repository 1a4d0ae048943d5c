import { z } from 'zod';
import { rules } from '../checks';
import { decimalString } from './costing';

// Request shapes of the repricing API, shared by the server (validation) and the
// client's forms (inline messages in the same words).

const isoDate = z
  .string({ error: 'Enter a date as YYYY-MM-DD.' })
  .regex(/^\d{4}-\d{2}-\d{2}$/, 'Enter a date as YYYY-MM-DD.')
  .refine((s) => !Number.isNaN(Date.parse(`${s}T00:00:00Z`)) && new Date(`${s}T00:00:00Z`).toISOString().startsWith(s), 'Enter a real date as YYYY-MM-DD.');

export const priceChangeSchema = z.object({
  ingredientId: z.uuid('Choose an ingredient.'),
  /** New price of the ingredient's costing pack (the whole pack line, count × quantity), before tax. */
  newPrice: decimalString(rules.nonNegative),
});

export const CHOICES = ['keep', 'suggested', 'price'] as const;
export type Choice = (typeof CHOICES)[number];

export const decisionSchema = z
  .object({
    drinkSizeId: z.uuid('Choose a drink size.'),
    choice: z.enum(CHOICES, { error: 'Choose keep, suggested or a price.' }),
    price: decimalString(rules.positive).optional(),
  })
  .refine((d) => d.choice !== 'price' || d.price !== undefined, { message: 'Type the new price.', path: ['price'] });

const changes = z.array(priceChangeSchema).max(200);
const decisions = z.array(decisionSchema).max(5000);

export const previewSchema = z
  .object({
    changes,
    /** Cost with the pack prices in force on this date (planned prices included); default today. */
    asOf: isoDate.optional(),
    decisions: decisions.optional(),
    keepLadder: z.boolean().optional(),
  })
  // With no changes typed in, only a later date (planned prices) can make a difference.
  .refine((p) => p.changes.length > 0 || p.asOf !== undefined, { message: 'Enter at least one price change, or a date to see planned prices.', path: ['changes'] });
export type PreviewInput = z.output<typeof previewSchema>;

export const scenarioSchema = z.object({
  name: z.string({ error: 'Name the scenario.' }).trim().min(1, 'Name the scenario.').max(120),
  notes: z.string().trim().max(2000).nullish(),
  changes: changes,
  asOf: isoDate.nullish(),
  decisions: decisions.default([]),
  keepLadder: z.boolean().default(false),
});
export type ScenarioInput = z.output<typeof scenarioSchema>;

export const applySchema = z.object({
  effectiveFrom: isoDate,
  prices: z
    .array(
      z.object({
        drinkId: z.uuid('Choose a drink.'),
        /** The cup size's name, as in the preview's rows. */
        size: z.string({ error: 'Name the cup size.' }).min(1, 'Name the cup size.').max(120),
        price: decimalString(rules.positive),
        /** The drink size's priceVersion from the preview: a different one now means someone else changed it (409). */
        priceVersion: z.number().int().nonnegative().optional(),
      }),
    )
    .min(1, 'There are no prices to apply.')
    .max(5000),
  scenarioId: z.uuid('Choose a scenario.').optional(),
  keepLadder: z.boolean().optional(),
  reason: z.string().trim().max(300).optional(),
});
export type ApplyInput = z.output<typeof applySchema>;

export const compareQuerySchema = z.object({
  ids: z
    .string({ error: 'Choose scenarios to compare.' })
    .transform((s) => s.split(',').filter(Boolean))
    .pipe(z.array(z.uuid('Choose scenarios to compare.')).min(1, 'Choose scenarios to compare.').max(6, 'Compare at most 6 scenarios.')),
});
