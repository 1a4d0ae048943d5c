import type { z } from 'zod';

/**
 * `sizes[0].lines[1].unit` from a zod path `['sizes', 0, 'lines', 1, 'unit']`: the field names
 * forms and CostingInputError use. An issue on the whole input is keyed `_`.
 */
export function formatFieldPath(path: readonly PropertyKey[]): string {
  let out = '';
  for (const part of path) {
    if (typeof part === 'number') out += `[${part}]`;
    else out += out === '' ? String(part) : `.${String(part)}`;
  }
  return out || '_';
}

/** The reverse of {@link formatFieldPath}, for issues raised from a bracket path. */
export function bracketPathToZod(path: string): (string | number)[] {
  return path
    .split(/\.|(?=\[)/)
    .filter(Boolean)
    .map((part) => (/^\[\d+\]$/.test(part) ? Number(part.slice(1, -1)) : part));
}

/**
 * A zod error as `{ "sizes[0].lines[1].unit": "message" }`, the first message of each field:
 * the same shape as CostingInputError.fields, so a form shows both the same way.
 */
export function zodFieldErrors(error: z.ZodError): Record<string, string> {
  const fields: Record<string, string> = {};
  for (const issue of error.issues) {
    const path = formatFieldPath(issue.path);
    if (!(path in fields)) fields[path] = issue.message;
  }
  return fields;
}
