import { D, dec, type Dec, type DecimalInput } from './decimal';
import { writeMoney, writePercent } from './money';
import type { CogsRow, CogsTotals } from './contract/books';
import { addDays, monthBounds as calendarMonthBounds } from './calendar';

/**
 * The books arithmetic: monthly cost of goods by the periodic method, theoretical against
 * actual, percentages of sales, and the helpers the report and its CSV share. Pure: the server,
 * the client and the tests use the same code.
 */

const ZERO = new D(0);
const HUNDRED = new D(100);

/**
 * Cost of goods (periodic method) = opening stock + purchases − closing stock
 * (Dittmer & Keefe, Principles of Food, Beverage, and Labor Cost Controls, ch. 8).
 */
export function costOfGoods(opening: DecimalInput, purchases: DecimalInput, closing: DecimalInput): Dec {
  return dec(opening).plus(dec(purchases)).minus(dec(closing));
}

/** Variance = actual cost − standard (theoretical) cost (Dittmer & Keefe ch. 10). */
export function costVariance(actual: DecimalInput, theoretical: DecimalInput): Dec {
  return dec(actual).minus(dec(theoretical));
}

/** A part as a percentage of a whole; null when the whole is zero (no meaningful ratio). */
export function percentOf(part: DecimalInput, whole: DecimalInput): Dec | null {
  const w = dec(whole);
  return w.isZero() ? null : dec(part).times(HUNDRED).div(w);
}

/** Cost % = cost ÷ net sales × 100 (Dittmer & Keefe ch. 8); null without sales. */
export function costPctOfSales(cost: DecimalInput, netSales: DecimalInput): Dec | null {
  return percentOf(cost, netSales);
}

/** Average inventory = (opening + closing) ÷ 2 (T. Jones, Culinary Calculations). */
export function averageInventory(opening: DecimalInput, closing: DecimalInput): Dec {
  return dec(opening).plus(dec(closing)).div(2);
}

/** Inventory turnover = cost of goods ÷ average inventory; null when there is no stock. */
export function inventoryTurnover(cogs: DecimalInput, average: DecimalInput): Dec | null {
  const a = dec(average);
  return a.isZero() ? null : dec(cogs).div(a);
}

/** One ingredient category's unrounded figures for a month, as the server gathers them. */
export interface CategoryFigures {
  category: string;
  opening: DecimalInput;
  purchases: DecimalInput;
  closing: DecimalInput;
  theoretical: DecimalInput;
  waste: DecimalInput;
}

const writePct = (v: Dec | null) => (v === null ? null : writePercent(v));

/**
 * Assembles the month's cost-of-goods rows and totals.
 *
 * Each category's opening, purchases, closing, theoretical and waste are first rounded to the
 * currency's minor unit; actual and variance are then derived from those rounded figures and
 * the totals are the sums of the rounded rows. So every printed figure adds up exactly, on the
 * page and in the CSV (actual = opening + purchases − closing, variance = actual − theoretical,
 * totals = sum of rows), at the price of at most half a minor unit per category against the
 * unrounded sum. Percentages are worked out from the rounded money and written to 2 places.
 * Rows are sorted by category name; categories with every figure zero are left out.
 */
export function assembleCogs(figures: readonly CategoryFigures[], netSales: DecimalInput, currency: string): { rows: CogsRow[]; totals: CogsTotals } {
  const r = (v: DecimalInput) => dec(writeMoney(v, currency));
  const sums = { opening: ZERO, purchases: ZERO, closing: ZERO, actual: ZERO, theoretical: ZERO, variance: ZERO, waste: ZERO };
  const rows: CogsRow[] = [];
  for (const f of [...figures].sort((a, b) => a.category.localeCompare(b.category))) {
    const opening = r(f.opening);
    const purchases = r(f.purchases);
    const closing = r(f.closing);
    const theoretical = r(f.theoretical);
    const waste = r(f.waste);
    if ([opening, purchases, closing, theoretical, waste].every((v) => v.isZero())) continue;
    const actual = costOfGoods(opening, purchases, closing);
    const variance = costVariance(actual, theoretical);
    sums.opening = sums.opening.plus(opening);
    sums.purchases = sums.purchases.plus(purchases);
    sums.closing = sums.closing.plus(closing);
    sums.actual = sums.actual.plus(actual);
    sums.theoretical = sums.theoretical.plus(theoretical);
    sums.variance = sums.variance.plus(variance);
    sums.waste = sums.waste.plus(waste);
    const m = (v: Dec) => writeMoney(v, currency);
    rows.push({
      category: f.category,
      opening: m(opening),
      purchases: m(purchases),
      closing: m(closing),
      actual: m(actual),
      theoretical: m(theoretical),
      variance: m(variance),
      variancePct: writePct(percentOf(variance, theoretical)),
      waste: m(waste),
    });
  }
  const sales = r(netSales);
  const m = (v: Dec) => writeMoney(v, currency);
  return {
    rows,
    totals: {
      opening: m(sums.opening),
      purchases: m(sums.purchases),
      closing: m(sums.closing),
      actual: m(sums.actual),
      theoretical: m(sums.theoretical),
      variance: m(sums.variance),
      variancePct: writePct(percentOf(sums.variance, sums.theoretical)),
      waste: m(sums.waste),
      netSales: m(sales),
      cogsPctOfSales: writePct(costPctOfSales(sums.actual, sales)),
    },
  };
}

const MONTH_PATTERN = /^\d{4}-(0[1-9]|1[0-2])$/;

/** First and last day of a month, and the last day of the month before (all YYYY-MM-DD). */
export function monthBounds(month: string): { first: string; last: string; previousLast: string } {
  if (!MONTH_PATTERN.test(month)) throw new RangeError(`Not a month: ${month}`);
  const { first, last } = calendarMonthBounds(month);
  return { first, last, previousLast: addDays(first, -1) };
}

export { addMonths, monthOf } from './calendar';

/** The day `n` days after a date (YYYY-MM-DD); the next day by default. */
export const nextDay = (date: string, n = 1): string => addDays(date, n);

const NUMERIC_CELL = /^-?\d+(\.\d+)?$/;
const FORMULA_START = /^[=+\-@\t\r]/;

/**
 * Neutralises a CSV cell that a spreadsheet could read as a formula (OWASP, CSV Injection):
 * a cell starting with `=`, `+`, `-`, `@`, tab or carriage return gets a leading single quote.
 * A plain decimal number, including a negative one such as "-12.50", is left as it is: it cannot
 * run as a formula and must stay a number for the bookkeeper's spreadsheet.
 */
export function neutraliseCsvCell(value: string): string {
  if (NUMERIC_CELL.test(value)) return value;
  return FORMULA_START.test(value) ? `'${value}` : value;
}
