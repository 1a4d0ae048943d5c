import Decimal from 'decimal.js';

/**
 * The one Decimal constructor for every money and quantity computation in Tamp & Tally.
 *
 * A clone, so the global `Decimal` configuration is never touched (other code, or a library,
 * may rely on its defaults). 64 significant digits while computing: divisions such as
 * 21.40 ÷ 0.96 do not terminate, and the extra digits let {@link snap} recover values that are
 * exactly on a rounding boundary before they are written out. ROUND_HALF_UP is decimal.js's
 * "halves away from zero", which is what "halves up" means for the non-negative figures here.
 */
export const D = Decimal.clone({ precision: 64, rounding: Decimal.ROUND_HALF_UP, toExpNeg: -64, toExpPos: 64 });

/** An instance of {@link D}. */
export type Dec = Decimal;

/** What the shared core accepts where a number is wanted: a decimal string or a Decimal, never a JS float. */
export type DecimalInput = string | Decimal;

/** Significant digits kept by {@link snap}; more than enough for any real price, pack or recipe. */
export const SNAP_DIGITS = 40;

/**
 * Removes the last digits' worth of division error before a value is rounded for writing out.
 *
 * Why: 0.0214 ÷ 0.96 × 18 is exactly 0.40125, but at a finite precision it may come out as
 * 0.40124999…9 (64 digits) and would round down to 0.4012. Rounding first to 40 significant
 * digits gives 0.40125 back, which then rounds half up to 0.4013, as exact rational arithmetic
 * does. Inputs are short decimals, so a true value can never sit within 1e-40 of a boundary
 * without being on it.
 */
export function snap(value: Decimal): Decimal {
  // A value with no more digits than that (a price, a stored quantity) is already what rounding
  // would give: skip the copy, which write-out would otherwise make for every figure.
  return value.sd() <= SNAP_DIGITS ? value : value.toSignificantDigits(SNAP_DIGITS, D.ROUND_HALF_UP);
}

const DECIMAL_PATTERN = /^-?\d+(\.\d+)?$/;
/** Longest decimal string accepted: longer inputs are not prices or quantities, and stay exact well within the precision. */
export const MAX_DECIMAL_LENGTH = 32;

/**
 * Is `value` a plain decimal string such as "12", "0.05" or "-3.5"?
 * No exponents, no thousands separators, no leading "+" or ".": these are the strings the API
 * and PostgreSQL numeric columns exchange.
 */
export function isDecimalString(value: unknown): value is string {
  return typeof value === 'string' && value.length <= MAX_DECIMAL_LENGTH && DECIMAL_PATTERN.test(value);
}

const parsed = new Map<string, Decimal>();
const PARSE_CACHE_LIMIT = 20_000;

/**
 * Converts a decimal string (already checked) or a Decimal to a {@link D} instance.
 * Strings are memoised (Decimals are immutable): a menu repeats the same few quantities and
 * prices thousands of times, and parsing is a large share of costing one.
 */
export function dec(value: DecimalInput): Decimal {
  if (typeof value !== 'string') return value instanceof D ? value : new D(value);
  let d = parsed.get(value);
  if (d === undefined) {
    if (parsed.size >= PARSE_CACHE_LIMIT) parsed.clear();
    d = new D(value);
    parsed.set(value, d);
  }
  return d;
}
