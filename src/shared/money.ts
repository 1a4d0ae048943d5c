import { D, dec, snap, type Dec, type DecimalInput } from './decimal';

export { isDecimalString } from './decimal';

const minorUnitCache = new Map<string, number>();

/** ISO 4217 shape: three capital letters. */
export function isCurrencyCode(value: unknown): value is string {
  if (typeof value !== 'string' || !/^[A-Z]{3}$/.test(value)) return false;
  try {
    currencyMinorUnits(value);
    return true;
  } catch {
    return false;
  }
}

/**
 * Number of decimal places of a currency's minor unit (GBP 2, JPY 0, BHD 3), as the
 * runtime's ICU data (CLDR, following ISO 4217) gives it through
 * `Intl.NumberFormat(…, {style: 'currency'}).resolvedOptions().maximumFractionDigits`.
 */
export function currencyMinorUnits(currency: string): number {
  const cached = minorUnitCache.get(currency);
  if (cached !== undefined) return cached;
  const digits = new Intl.NumberFormat('en', { style: 'currency', currency }).resolvedOptions().maximumFractionDigits ?? 2;
  minorUnitCache.set(currency, digits);
  return digits;
}

/** The currency's smallest unit as a decimal, e.g. 0.01 for GBP, 1 for JPY. */
export function minorUnitStep(currency: string): Dec {
  return new D(10).pow(-currencyMinorUnits(currency));
}

/**
 * Rounds to `places` decimal places, halves up (away from zero), after {@link snap} so a value
 * exactly on a boundary is not pushed below it by division error.
 */
export function roundHalfUp(value: DecimalInput, places: number): Dec {
  return snap(dec(value)).toDecimalPlaces(places, D.ROUND_HALF_UP);
}

const writtenMemo = new Map<number, Map<string, string>>();
const WRITTEN_MEMO_LIMIT = 20_000;

/** {@link roundHalfUp} written with exactly `places` decimals, e.g. "0.7102", "75.30". */
export function writeFixed(value: DecimalInput, places: number): string {
  if (typeof value !== 'string') return writeDecimalFixed(value, places);
  // Stored figures (prices, quantities) arrive as the same few strings over and over.
  let memo = writtenMemo.get(places);
  if (!memo) writtenMemo.set(places, (memo = new Map()));
  let out = memo.get(value);
  if (out === undefined) {
    if (memo.size >= WRITTEN_MEMO_LIMIT) memo.clear();
    out = writeDecimalFixed(value, places);
    memo.set(value, out);
  }
  return out;
}

const NEGATIVE_ZERO = /^-0(\.0*)?$/;

function writeDecimalFixed(value: DecimalInput, places: number): string {
  // toFixed(places, ROUND_HALF_UP) rounds exactly as toDecimalPlaces(places, ROUND_HALF_UP)
  // does (decimal.js runs the same finalise step), so one step instead of two.
  const out = snap(dec(value)).toFixed(places, D.ROUND_HALF_UP);
  // decimal.js keeps the sign of a negative that rounds to zero ("-0.00"); a figure never shows it.
  return out.charCodeAt(0) === 45 && NEGATIVE_ZERO.test(out) ? out.slice(1) : out;
}

/** A money amount written to the currency's minor units, halves up: "2.88" GBP, "288" JPY. */
export function writeMoney(value: DecimalInput, currency: string): string {
  return writeFixed(value, currencyMinorUnits(currency));
}

/** Decimal places of a cost per cup or per line when written out. */
export const COST_PLACES = 4;
/** Decimal places of a percentage when written out. */
export const PERCENT_PLACES = 2;
/** At most this many decimal places of a quantity written out (trailing zeros dropped). */
export const QUANTITY_PLACES = 12;

/** A cost written to 4 decimal places, halves up, e.g. "0.0615". */
export function writeCost(value: DecimalInput): string {
  return writeFixed(value, COST_PLACES);
}

/** A percentage written to 2 decimal places, halves up, e.g. "72.06". */
export function writePercent(value: DecimalInput): string {
  return writeFixed(value, PERCENT_PLACES);
}

/**
 * A quantity as a plain decimal without trailing zeros ("18", "15", "4.92892159375"): exact
 * when it has at most 12 decimals, otherwise rounded to 12, halves up (e.g. 10 g at 1.03 g/ml).
 */
export function writeQuantity(value: DecimalInput): string {
  // decimal.js drops trailing zeros and toFixed() without places never uses an exponent.
  return roundHalfUp(value, QUANTITY_PLACES).toFixed();
}

export type RoundingMode = 'up' | 'nearest' | 'none';

/**
 * Rounds a price to a step: `up` = the smallest multiple of `step` not below it (a ceiling),
 * `nearest` = the nearest multiple, halves up. Common practice, no source.
 */
export function roundToStep(value: DecimalInput, step: DecimalInput, mode: 'up' | 'nearest'): Dec {
  const s = dec(step);
  const multiples = snap(dec(value).div(s));
  const whole = mode === 'up' ? multiples.toDecimalPlaces(0, D.ROUND_CEIL) : multiples.toDecimalPlaces(0, D.ROUND_HALF_UP);
  return whole.times(s);
}
