import { z } from 'zod';
import { isDecimalString, dec } from '../decimal';
import { NOT_A_DECIMAL, type DecimalRule } from '../checks';

/**
 * PostgreSQL numeric columns by kind: `numeric(precision, scale)` as the migrations declare
 * them. A value with more integer digits than precision − scale overflows the column (an
 * error); one with more decimal places than the scale is silently rounded (0.00001 → 0), so
 * both are refused here, before anything is written.
 */
export const DECIMAL_COLUMNS = {
  /** Prices, totals, charges: numeric(14, 4). */
  money: { precision: 14, scale: 4 },
  /** Quantities of packs, lines, counts: numeric(14, 4). */
  quantity: { precision: 14, scale: 4 },
  /** Percentages (yield, margin, tax): numeric(7, 4). */
  percent: { precision: 7, scale: 4 },
  /** Densities in g per ml: numeric(14, 6). */
  density: { precision: 14, scale: 6 },
  /** Fractions of a pack counted open: numeric(14, 6). */
  packs: { precision: 14, scale: 6 },
} as const;
export type DecimalColumn = keyof typeof DECIMAL_COLUMNS;

/** The problem with a decimal string for a column kind, or null when the column holds it exactly. */
export function columnProblem(value: string, column: DecimalColumn): string | null {
  const { precision, scale } = DECIMAL_COLUMNS[column];
  const [whole, fraction = ''] = value.replace(/^-/, '').split('.');
  const places = fraction.replace(/0+$/, '').length;
  const digits = whole.replace(/^0+/, '').length;
  if (digits > precision - scale) return `Too large: at most ${precision - scale} digits before the decimal point.`;
  if (places > scale) return `Use at most ${scale} decimal places.`;
  return null;
}

/** A decimal string that fits its column exactly and passes the rule ("Must be more than 0."). */
export function decimal(column: DecimalColumn, rule?: DecimalRule) {
  return z.string({ error: NOT_A_DECIMAL }).superRefine((value, ctx) => {
    if (!isDecimalString(value)) {
      ctx.addIssue({ code: 'custom', message: NOT_A_DECIMAL });
      return;
    }
    const problem = columnProblem(value, column) ?? (rule ? rule(dec(value)) : null);
    if (problem) ctx.addIssue({ code: 'custom', message: problem });
  });
}

