/**
 * Amounts are integers in the currency's minor unit. Minimum charge amounts
 * per currency follow the API's published table (from memory); currencies not
 * listed use the common 50 minor units.
 */
const MINIMUMS: Readonly<Record<string, number>> = {
  usd: 50, eur: 50, gbp: 30, cad: 50, aud: 50, nzd: 50, chf: 50, sgd: 50,
  jpy: 50, sek: 300, nok: 300, dkk: 250, pln: 200, czk: 1500, huf: 17500, mxn: 1000, hkd: 400,
};

// ISO 4217 currencies with no minor unit that the API treats as zero-decimal (from memory).
const ZERO_DECIMAL = new Set(['bif', 'clp', 'djf', 'gnf', 'jpy', 'kmf', 'krw', 'mga', 'pyg', 'rwf', 'ugx', 'vnd', 'vuv', 'xaf', 'xof', 'xpf']);

/** The API's largest amount: eight digits of minor units. */
export const MAX_AMOUNT = 99_999_999;

export function minimumAmount(currency: string): number {
  return MINIMUMS[currency] ?? 50;
}

/** Minor units as a major-unit string by integer arithmetic, e.g. 1250 → "12.50". */
export function formatMinor(amount: number, currency: string): string {
  if (ZERO_DECIMAL.has(currency)) return String(amount);
  const sign = amount < 0 ? '-' : '';
  const abs = Math.abs(amount);
  return `${sign}${Math.trunc(abs / 100)}.${String(abs % 100).padStart(2, '0')}`;
}
