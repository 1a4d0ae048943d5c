import { z } from 'zod';
import { rules } from '../../checks';
import { decimal, id, nameOf } from '../../schemas/fields';
import { endpoint } from '../endpoint';
import { allergensSchema, lineInFields, lineOutSchema, lineRules } from './common';

// Modifiers: add-ons (an extra shot) and swaps (oat for dairy), lines per cup size.

export const modifierKind = z.enum(['add', 'swap'], { error: 'Choose an add-on or a swap.' });
export const modifierAction = z.enum(['add', 'remove'], { error: 'Choose add or remove.' });

export const modifierLineInSchema = z.object({ ...lineInFields, sizeId: id('cup size'), action: modifierAction }).superRefine(lineRules);

export const modifierInSchema = z.object({
  name: nameOf('modifier'),
  kind: modifierKind,
  upcharge: decimal('money', rules.nonNegative).nullish(),
  lines: z.array(modifierLineInSchema).max(400),
});
export type ModifierIn = z.input<typeof modifierInSchema>;

/** A modifier per cup size: cost delta = added − removed, and the upcharge that keeps the target margin on it. */
export const modifierSchema = z.object({
  id: z.uuid(),
  name: z.string(),
  kind: modifierKind,
  upcharge: z.string().nullable(),
  sizes: z.array(
    z.object({
      sizeId: z.uuid(),
      name: z.string(),
      lines: z.array(lineOutSchema.extend({ action: modifierAction })),
      costDelta: z.string().nullable(),
      suggestedUpcharge: z.string().nullable(),
      problem: z.string().nullable(),
    }),
  ),
  allergens: allergensSchema,
});
export type Modifier = z.output<typeof modifierSchema>;

const one = z.object({ modifier: modifierSchema });

export const listModifiers = endpoint({
  method: 'GET', path: '/api/modifiers', access: 'costs.read',
  summary: 'Every add-on and swap, costed per cup size with a suggested upcharge.',
  response: z.object({ modifiers: z.array(modifierSchema) }),
});

export const getModifier = endpoint({
  method: 'GET', path: '/api/modifiers/:id', access: 'costs.read',
  summary: 'One modifier, costed per cup size.',
  response: one,
});

export const createModifier = endpoint({
  method: 'POST', path: '/api/modifiers', access: 'costs.write',
  summary: 'Adds a modifier with its lines for each cup size in one transaction.',
  body: modifierInSchema, response: one, status: 201,
  errors: { 409: '`name_taken`' },
});

export const replaceModifier = endpoint({
  method: 'PUT', path: '/api/modifiers/:id', access: 'costs.write',
  summary: 'Replaces a modifier and its lines in one transaction.',
  body: modifierInSchema, response: one,
  errors: { 409: '`name_taken`' },
});

export const deleteModifier = endpoint({
  method: 'DELETE', path: '/api/modifiers/:id', access: 'costs.write',
  summary: 'Removes a modifier.',
  response: null,
});
