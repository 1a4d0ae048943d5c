import { z } from 'zod';
import { decimalString } from '../../src/shared/schemas/costing';
import { baseUnitOf, isUnitCode, type BaseUnit } from '../../src/shared/units';

/** Today's calendar date (UTC), the default "as of" for prices in force. */
export function today(): string {
  return new Date().toISOString().slice(0, 10);
}

export const optionalText = (max = 2000) => z.string().trim().max(max).nullish();
export const name = (what: string) => z.string({ error: `Name the ${what}.` }).trim().min(1, `Name the ${what}.`).max(120);
export { decimalString };

/** A preparation's base unit follows its yield's unit (l → ml, kg → g); null for an unknown unit. */
export function yieldBaseUnit(unit: string): BaseUnit | null {
  return isUnitCode(unit) ? baseUnitOf(unit) : null;
}
