import type { z } from 'zod';
import { zodFieldErrors } from '../../../src/shared/schemas/field-errors';
import { invalidInput } from '../errors';

/** Parses input with a zod schema or throws a 400 naming each bad field (`sizes[0].lines[1].unit`). */
export function parse<S extends z.ZodType>(schema: S, input: unknown): z.output<S> {
  const r = schema.safeParse(input);
  if (!r.success) throw invalidInput(zodFieldErrors(r.error));
  return r.data;
}
