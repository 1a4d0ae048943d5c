import { dec, isDecimalString, MAX_DECIMAL_LENGTH, type Dec } from './decimal';
import type { FieldErrors } from './errors';

/**
 * Rules for a single decimal field, shared by the zod schemas (form and API validation) and by
 * the costing engine (which also receives stored rows), so both refuse with the same words.
 * Each returns a message, or null when the value is acceptable.
 */
export type DecimalRule = (value: Dec) => string | null;

export const NOT_A_DECIMAL = `Enter a plain decimal number such as 12 or 0.05 (at most ${MAX_DECIMAL_LENGTH} characters).`;

export const rules = {
  positive: (v: Dec) => (v.gt(0) ? null : 'Must be more than 0.'),
  nonNegative: (v: Dec) => (v.gte(0) ? null : 'Must be 0 or more.'),
  /** Yield % of an ingredient: in (0, 100]. */
  yieldPct: (v: Dec) => (v.gt(0) && v.lte(100) ? null : 'A yield must be more than 0 % and at most 100 %.'),
  /** Target margin %: in [0, 100); 100 % would need an infinite price. */
  marginPct: (v: Dec) => (v.gte(0) && v.lt(100) ? null : 'A target margin must be at least 0 % and below 100 %.'),
} satisfies Record<string, DecimalRule>;

/** Checks a decimal string against a rule; the message, or null. */
export function decimalProblem(value: unknown, rule?: DecimalRule): string | null {
  if (!isDecimalString(value)) return NOT_A_DECIMAL;
  return rule ? rule(dec(value)) : null;
}

/**
 * Reads a decimal field for the engine: the value, or null after recording the problem at `path`.
 */
export function readDecimal(value: unknown, rule: DecimalRule | undefined, path: string, errors: FieldErrors): Dec | null {
  if (!isDecimalString(value)) {
    errors.add(path, NOT_A_DECIMAL);
    return null;
  }
  const d = dec(value);
  const problem = rule ? rule(d) : null;
  if (problem) {
    errors.add(path, problem);
    return null;
  }
  return d;
}
