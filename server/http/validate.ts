import type { z } from 'zod';
import { invalidInput } from '../errors';

/** Formats a zod issue path as `sizes[0].lines[1].unit`. */
export function fieldPath(path: readonly PropertyKey[]): string {
  let out = '';
  for (const p of path) {
    if (typeof p === 'number') out += `[${p}]`;
    else out += out === '' ? String(p) : `.${String(p)}`;
  }
  return out || '_';
}

export function fieldErrors(error: z.ZodError): Record<string, string> {
  const fields: Record<string, string> = {};
  for (const issue of error.issues) {
    const key = fieldPath(issue.path);
    if (!(key in fields)) fields[key] = issue.message;
  }
  return fields;
}

/** Parses input with a zod schema or throws a 400 naming each bad field. */
export function parse<S extends z.ZodType>(schema: S, input: unknown): z.output<S> {
  const r = schema.safeParse(input);
  if (!r.success) throw invalidInput(fieldErrors(r.error));
  return r.data;
}
