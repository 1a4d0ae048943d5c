import { z } from 'zod';
import { rules } from '../../checks';
import { decimal, text, wholeNumber } from '../../schemas/fields';
import { endpoint } from '../endpoint';

/** A cup size: its name, its volume in ml and where it stands among the others. */
export const cupSizeSchema = z.object({ id: z.uuid(), name: z.string(), volumeMl: z.string(), position: z.number().int() });
export type CupSize = z.output<typeof cupSizeSchema>;

export const sizeInSchema = z.object({
  name: text({ what: 'cup size', min: 1, max: 60 }),
  volumeMl: decimal('quantity', rules.positive),
  position: wholeNumber(0, 1000, 'a whole number for its place in the list').optional(),
});
export type SizeIn = z.input<typeof sizeInSchema>;

const one = z.object({ size: cupSizeSchema });

export const listSizes = endpoint({
  method: 'GET', path: '/api/sizes', access: 'costs.read',
  summary: 'The cup sizes, by position then volume.',
  response: z.object({ sizes: z.array(cupSizeSchema) }),
});

export const createSize = endpoint({
  method: 'POST', path: '/api/sizes', access: 'costs.write',
  summary: 'Adds a cup size.',
  body: sizeInSchema, response: one, status: 201,
  errors: { 409: '`name_taken`: a cup size of that name exists' },
});

export const updateSize = endpoint({
  method: 'PATCH', path: '/api/sizes/:id', access: 'costs.write',
  summary: 'Renames, resizes or moves a cup size (only the fields sent).',
  body: sizeInSchema.partial(), response: one,
  errors: { 409: '`name_taken`' },
});

export const deleteSize = endpoint({
  method: 'DELETE', path: '/api/sizes/:id', access: 'costs.write',
  summary: 'Removes a cup size no drink offers.',
  response: null,
  errors: { 409: '`in_use`: a drink offers this size' },
});
