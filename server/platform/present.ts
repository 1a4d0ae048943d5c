import { writeMoney, writeQuantity } from '../../src/shared/money';

/** A numeric column (pg gives "7.5000") written as a plain decimal ("7.5"). */
export function qty(value: string | null | undefined): string | null {
  return value === null || value === undefined ? null : writeQuantity(value);
}

/** A numeric money column written to the currency's minor units. */
export function money(value: string | null | undefined, currency: string): string | null {
  return value === null || value === undefined ? null : writeMoney(value, currency);
}
