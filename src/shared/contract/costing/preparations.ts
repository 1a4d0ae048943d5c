import { z } from 'zod';
import { rules } from '../../checks';
import { decimal, nameOf, optionalText } from '../../schemas/fields';
import { endpoint } from '../endpoint';
import { allergenCaution, allergensSchema, baseUnit, lineInSchema, lineOutSchema, measureOutSchema, positiveQuantity, unitCode } from './common';
import { measureInSchema } from './ingredients';

// Preparations: what the café makes itself (a syrup, a cold brew), costed per batch and per unit.

export const preparationInSchema = z.object({
  name: nameOf('preparation'),
  yield: z.object({ quantity: positiveQuantity, unit: unitCode }),
  densityGPerMl: decimal('density', rules.positive).nullish(),
  method: optionalText(5000),
  lines: z.array(lineInSchema).min(1, 'A preparation needs at least one line.').max(200),
  /** Measures to add or change by name; left out, a PUT leaves them as they are. */
  measures: z.array(measureInSchema).max(50).nullish(),
});
export type PreparationIn = z.input<typeof preparationInSchema>;

export const preparationSummarySchema = z.object({
  id: z.uuid(),
  name: z.string(),
  yield: z.object({ quantity: z.string(), unit: unitCode }),
  baseUnit: baseUnit.nullable(),
  batchCost: z.string().nullable(),
  unitCost: z.string().nullable(),
  allergens: allergensSchema,
  problem: z.string().nullable(),
});
export type PreparationSummary = z.output<typeof preparationSummarySchema>;

export const preparationDetailSchema = preparationSummarySchema.extend({
  densityGPerMl: z.string().nullable(),
  method: z.string().nullable(),
  lines: z.array(lineOutSchema.extend({ quantityInBaseUnit: z.string().nullable(), baseUnit: baseUnit.nullable(), cost: z.string().nullable() })),
  measures: z.array(measureOutSchema),
});
export type PreparationDetail = z.output<typeof preparationDetailSchema>;

const one = z.object({ preparation: preparationDetailSchema, allergenCaution });

export const listPreparations = endpoint({
  method: 'GET', path: '/api/preparations', access: 'costs.read',
  summary: 'Every preparation with its batch and unit cost, allergens, or the problem that stops its costing.',
  response: z.object({ preparations: z.array(preparationSummarySchema), allergenCaution }),
});

export const getPreparation = endpoint({
  method: 'GET', path: '/api/preparations/:id', access: 'costs.read',
  summary: 'One preparation with its costed lines, method and measures.',
  response: one,
});

export const createPreparation = endpoint({
  method: 'POST', path: '/api/preparations', access: 'costs.write',
  summary: 'Adds a preparation with its lines and measures in one transaction.',
  body: preparationInSchema, response: one, status: 201,
  errors: { 409: '`name_taken`' },
});

export const replacePreparation = endpoint({
  method: 'PUT', path: '/api/preparations/:id', access: 'costs.write',
  summary: 'Replaces a preparation and its lines in one transaction; a line that would make it contain itself is refused naming the cycle.',
  body: preparationInSchema, response: one,
  errors: { 409: '`name_taken`' },
});

export const deletePreparation = endpoint({
  method: 'DELETE', path: '/api/preparations/:id', access: 'costs.write',
  summary: 'Removes a preparation no line uses.',
  response: null,
  errors: { 409: '`in_use`: a drink, preparation or modifier uses it' },
});
