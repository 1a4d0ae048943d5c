/**
 * Display formatting. Amounts arrive from the API as decimal strings and are
 * handed to Intl.NumberFormat as strings, so no value passes through a float
 * (Intl.NumberFormat v3 formats numeric strings exactly, ECMA-402 2023).
 */

type Numeric = `${number}`;

const numberish = /^-?\d+(\.\d+)?$/;

function asNumeric(value: string): Numeric {
  const trimmed = value.trim();
  if (!numberish.test(trimmed)) throw new Error(`Not a decimal string: "${value}"`);
  return trimmed as Numeric;
}

/** The currency's own number of decimals (its ISO 4217 minor unit): 2 for GBP, 0 for JPY, 3 for BHD. */
export function currencyDecimals(currency: string): number {
  return new Intl.NumberFormat('en', { style: 'currency', currency }).resolvedOptions().maximumFractionDigits ?? 2;
}

/**
 * Money in the business's currency, with the currency's own decimals, or two
 * more where the user asked for detail (4 for pounds, dollars and euros).
 */
export function formatMoney(amount: string, currency: string, opts: { detail?: boolean; locale?: string } = {}): string {
  const decimals = currencyDecimals(currency) + (opts.detail ? 2 : 0);
  return new Intl.NumberFormat(opts.locale, {
    style: 'currency',
    currency,
    minimumFractionDigits: decimals,
    maximumFractionDigits: decimals,
  }).format(asNumeric(amount));
}

/** A ratio given as a decimal string ("0.685") shown as a percentage ("68.5%"). */
export function formatPercent(ratio: string, opts: { decimals?: number; locale?: string } = {}): string {
  const decimals = opts.decimals ?? 1;
  return new Intl.NumberFormat(opts.locale, {
    style: 'percent',
    minimumFractionDigits: decimals,
    maximumFractionDigits: decimals,
  }).format(asNumeric(ratio));
}

/** A plain quantity ("12.5") with a unit beside it when given. */
export function formatQuantity(value: string, unit?: string, opts: { maxDecimals?: number; locale?: string } = {}): string {
  const n = new Intl.NumberFormat(opts.locale, { maximumFractionDigits: opts.maxDecimals ?? 3 }).format(asNumeric(value));
  return unit ? `${n} ${unit}` : n;
}

/** A calendar date ("2025-03-01" or an ISO timestamp) in the reader's locale, e.g. "1 Mar 2025". */
export function formatDate(value: string | Date, opts: { locale?: string; withTime?: boolean } = {}): string {
  // A bare date is a calendar day, not a moment: read it at noon UTC and print in UTC
  // so no time zone moves it to the day before.
  const bare = typeof value === 'string' && /^\d{4}-\d{2}-\d{2}$/.test(value);
  const date = bare ? new Date(`${value}T12:00:00Z`) : new Date(value);
  return new Intl.DateTimeFormat(opts.locale, {
    day: 'numeric',
    month: 'short',
    year: 'numeric',
    ...(opts.withTime ? { hour: '2-digit', minute: '2-digit' } : {}),
    ...(bare ? { timeZone: 'UTC' } : {}),
  }).format(date);
}

export function currencyName(code: string, locale?: string): string {
  return new Intl.DisplayNames(locale ? [locale] : undefined, { type: 'currency' }).of(code) ?? code;
}

export function countryName(code: string, locale?: string): string {
  return new Intl.DisplayNames(locale ? [locale] : undefined, { type: 'region' }).of(code) ?? code;
}
