import { D, dec, isDecimalString, type Dec } from '../../shared/decimal';

export type SortDirection = 'asc' | 'desc';

/**
 * What a column sorts by: text, a whole number (a count, a rank), or a decimal string as the API
 * sends money and quantities ("12.50", "-0.6"). Decimal strings compare exactly with decimal.js,
 * never through JS numbers. `null`, `undefined` and '' are blanks.
 */
export type SortValue = string | number | null | undefined;

const isBlank = (v: SortValue): v is null | undefined | '' => v === null || v === undefined || v === '' || (typeof v === 'number' && Number.isNaN(v));

const collator = new Intl.Collator(undefined, { numeric: true, sensitivity: 'base' });

const asDecimal = (v: string | number): Dec => (typeof v === 'number' ? new D(v) : dec(v));

/**
 * The comparator for one column's values, chosen once for the whole column so the order is
 * consistent: all whole numbers → numeric; numbers and decimal strings → exact decimal
 * comparison; anything else → the locale's collation with digit runs read as numbers.
 */
function comparatorFor(values: readonly (string | number)[]): (a: string | number, b: string | number) => number {
  if (values.every((v) => typeof v === 'number')) return (a, b) => (a as number) - (b as number);
  if (values.every((v) => typeof v === 'number' || isDecimalString(v))) return (a, b) => asDecimal(a).cmp(asDecimal(b));
  return (a, b) => collator.compare(String(a), String(b));
}

/**
 * Rows ordered by one column. Blanks go last in either direction (a missing price is never the
 * cheapest or the dearest); rows with equal values keep the order they came in.
 */
export function sortRows<T>(rows: readonly T[], value: (row: T) => SortValue, direction: SortDirection): T[] {
  const keyed = rows.map((row, index) => ({ row, index, v: value(row) }));
  const present: { row: T; index: number; v: string | number }[] = [];
  const blanks: T[] = [];
  for (const k of keyed) {
    if (isBlank(k.v)) blanks.push(k.row);
    else present.push({ row: k.row, index: k.index, v: k.v });
  }
  const compare = comparatorFor(present.map((k) => k.v));
  const factor = direction === 'asc' ? 1 : -1;
  present.sort((a, b) => compare(a.v, b.v) * factor || a.index - b.index);
  return [...present.map((k) => k.row), ...blanks];
}

/** Does every word of a search box's text occur in one of `texts`? Case and accents are ignored. */
export function matchesSearch(query: string, ...texts: (string | null | undefined)[]): boolean {
  const words = fold(query).split(/\s+/).filter(Boolean);
  if (words.length === 0) return true;
  const haystack = fold(texts.filter(Boolean).join(' '));
  return words.every((w) => haystack.includes(w));
}

function fold(s: string): string {
  return s.normalize('NFD').replace(/\p{Diacritic}/gu, '').toLowerCase();
}

/**
 * Two present sort values in order: whole numbers numerically, numbers and decimal strings
 * exactly (decimal.js), anything else by the locale's collation with digit runs read as numbers.
 */
export function compareSortValues(a: SortValue, b: SortValue): number {
  if (typeof a === 'number' && typeof b === 'number') return a - b;
  const exact = (v: SortValue): v is string | number => typeof v === 'number' || isDecimalString(v);
  if (exact(a) && exact(b)) return asDecimal(a).cmp(asDecimal(b));
  return collator.compare(String(a ?? ''), String(b ?? ''));
}
