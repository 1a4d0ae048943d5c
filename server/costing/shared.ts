import { z } from 'zod';
import { decimalString } from '../../src/shared/schemas/costing';
import { writeMoney, writeQuantity } from '../../src/shared/money';
import { AppError, conflict } from '../errors';
import { baseUnitOf, isUnitCode, type BaseUnit } from '../../src/shared/units';

/** Today's calendar date (UTC), the default "as of" for prices in force. */
export function today(): string {
  return new Date().toISOString().slice(0, 10);
}

export const isoDate = z
  .string({ error: 'Enter a date as YYYY-MM-DD.' })
  .regex(/^\d{4}-\d{2}-\d{2}$/, 'Enter a date as YYYY-MM-DD.')
  .refine((s) => !Number.isNaN(Date.parse(`${s}T00:00:00Z`)) && new Date(`${s}T00:00:00Z`).toISOString().startsWith(s), 'Enter a real date as YYYY-MM-DD.');

export const asOfQuery = z.object({ asOf: isoDate.optional() });

/** A numeric column (pg gives "7.5000") written as a plain decimal ("7.5"). */
export function qty(value: string | null | undefined): string | null {
  return value === null || value === undefined ? null : writeQuantity(value);
}

/** A numeric money column written to the currency's minor units. */
export function money(value: string | null | undefined, currency: string): string | null {
  return value === null || value === undefined ? null : writeMoney(value, currency);
}

export const optionalText = (max = 2000) => z.string().trim().max(max).nullish();
export const name = (what: string) => z.string({ error: `Name the ${what}.` }).trim().min(1, `Name the ${what}.`).max(120);
export { decimalString };

interface PgError { code?: string; constraint?: string }

/**
 * Runs a write, turning PostgreSQL's unique and foreign-key refusals into 409s the client can show.
 */
export async function guardWrite<T>(what: string, fn: () => Promise<T>): Promise<T> {
  try {
    return await fn();
  } catch (e) {
    if (e instanceof AppError) throw e;
    const pgErr = e as PgError;
    if (pgErr?.code === '23505') throw conflict('name_taken', `${what} with that name already exists.`);
    if (pgErr?.code === '23503') throw conflict('in_use', `${what} is still used elsewhere (a drink, preparation, modifier or pack). Remove it there first.`);
    throw e;
  }
}

export function groupBy<T>(rows: readonly T[], key: (r: T) => string): Map<string, T[]> {
  const out = new Map<string, T[]>();
  for (const r of rows) {
    const k = key(r);
    const list = out.get(k);
    if (list) list.push(r);
    else out.set(k, [r]);
  }
  return out;
}

/** A preparation's base unit follows its yield's unit (l → ml, kg → g); null for an unknown unit. */
export function yieldBaseUnit(unit: string): BaseUnit | null {
  return isUnitCode(unit) ? baseUnitOf(unit) : null;
}
