import { z } from 'zod';
import { rules } from './checks';
import { D, dec, type Dec, type DecimalInput } from './decimal';
import { currencyMinorUnits, writeMoney } from './money';
import { decimalString } from './schemas/costing';

/**
 * Purchase-order arithmetic shared by the server, the order editor and the tests:
 * suggested quantities from par levels, order totals, the amount in minor units
 * for the payment provider, and the next delivery date from a supplier's days.
 */

/** ISO 8601 weekday: 1 = Monday … 7 = Sunday. */
export type IsoWeekday = 1 | 2 | 3 | 4 | 5 | 6 | 7;

/**
 * Whole packs to order so that stock on hand reaches par: nothing while stock is above
 * the reorder point; at or below it, `ceil(par − onHand)` packs (never negative).
 * Rounding up to whole packs is common practice, no source: a supplier sells whole packs and
 * rounding down would leave the site below par.
 */
export function suggestedPacks(input: { onHand: DecimalInput; par: DecimalInput; reorderPoint: DecimalInput }): Dec {
  const onHand = dec(input.onHand);
  const par = dec(input.par);
  if (onHand.gt(dec(input.reorderPoint))) return new D(0);
  const short = par.minus(onHand);
  return short.lte(0) ? new D(0) : short.toDecimalPlaces(0, D.ROUND_CEIL);
}

export interface OrderLineInput {
  quantity: DecimalInput;
  unitPrice: DecimalInput;
  /** Purchase tax on this pack, in percent (e.g. "20"). */
  taxPct: DecimalInput;
}

export interface OrderTotals {
  lines: { lineTotal: string; tax: string }[];
  subtotal: string;
  tax: string;
  deliveryCharge: string;
  total: string;
}

/**
 * Line total = quantity × unit price; tax per line = line total × rate ÷ 100; each rounded
 * half up to the currency's minor unit, then summed. Rounding per line is one of the two
 * methods HMRC allows on a VAT invoice (VAT Notice 700, section 16.6, "rounding on
 * individual lines"). The delivery charge is added as given, without purchase tax.
 */
export function orderTotals(lines: readonly OrderLineInput[], deliveryCharge: DecimalInput, currency: string): OrderTotals {
  const places = currencyMinorUnits(currency);
  let subtotal = new D(0);
  let tax = new D(0);
  const out = lines.map((l) => {
    const lineTotal = dec(l.quantity).times(dec(l.unitPrice)).toDecimalPlaces(places, D.ROUND_HALF_UP);
    const lineTax = lineTotal.times(dec(l.taxPct)).div(100).toDecimalPlaces(places, D.ROUND_HALF_UP);
    subtotal = subtotal.plus(lineTotal);
    tax = tax.plus(lineTax);
    return { lineTotal: writeMoney(lineTotal, currency), tax: writeMoney(lineTax, currency) };
  });
  const delivery = dec(deliveryCharge).toDecimalPlaces(places, D.ROUND_HALF_UP);
  return {
    lines: out,
    subtotal: writeMoney(subtotal, currency),
    tax: writeMoney(tax, currency),
    deliveryCharge: writeMoney(delivery, currency),
    total: writeMoney(subtotal.plus(tax).plus(delivery), currency),
  };
}

/**
 * An amount in the currency's smallest unit as an integer, as payment APIs take it
 * (12.34 GBP → 1234, 500 JPY → 500). Refuses an amount with more decimals than the currency has.
 */
export function toMinorUnits(amount: DecimalInput, currency: string): number {
  const scaled = dec(amount).times(new D(10).pow(currencyMinorUnits(currency)));
  if (!scaled.isInteger()) throw new RangeError(`${String(amount)} has more decimals than ${currency} allows`);
  return scaled.toNumber();
}

/** How far short of the supplier's minimum order an order's goods are, or null when it is met. */
export function minimumShortfall(subtotal: DecimalInput, minimumOrder: DecimalInput, currency: string): string | null {
  const short = dec(minimumOrder).minus(dec(subtotal));
  return short.gt(0) ? writeMoney(short, currency) : null;
}

const DATE = /^(\d{4})-(\d{2})-(\d{2})$/;
const TIME = /^([01]\d|2[0-3]):([0-5]\d)$/;

function parseDay(date: string): number {
  const m = DATE.exec(date);
  if (!m) throw new RangeError(`Not a date (YYYY-MM-DD): "${date}"`);
  return Date.UTC(Number(m[1]), Number(m[2]) - 1, Number(m[3]));
}

function writeDay(ms: number): string {
  return new Date(ms).toISOString().slice(0, 10);
}

/** ISO weekday of a calendar date (1 = Monday). */
export function isoWeekday(date: string): IsoWeekday {
  const d = new Date(parseDay(date)).getUTCDay();
  return (d === 0 ? 7 : d) as IsoWeekday;
}

/** The calendar date `days` after `date`. */
export function addDays(date: string, days: number): string {
  return writeDay(parseDay(date) + days * 86_400_000);
}

/** Is "HH:MM" a valid 24-hour time? */
export function isClockTime(value: string): boolean {
  return TIME.test(value);
}

/**
 * The first day a supplier can deliver an order placed at `now` (the site's local date and
 * time). An order placed at or after the cut-off counts as placed the next day; the goods
 * need `leadDays` days from that order day; the delivery is the first of the supplier's
 * delivery days (ISO weekdays) on or after that. Null when the supplier has no delivery days.
 * Common practice, no source.
 */
export function nextDeliveryDate(input: { date: string; time: string; deliveryDays: readonly number[]; cutoff: string; leadDays: number }): string | null {
  if (!isClockTime(input.time)) throw new RangeError(`Not a time (HH:MM): "${input.time}"`);
  if (!isClockTime(input.cutoff)) throw new RangeError(`Not a cut-off time (HH:MM): "${input.cutoff}"`);
  if (!Number.isInteger(input.leadDays) || input.leadDays < 0) throw new RangeError('Lead time must be a whole number of days, 0 or more');
  const days = new Set(input.deliveryDays.filter((d) => Number.isInteger(d) && d >= 1 && d <= 7));
  if (days.size === 0) return null;
  // "HH:MM" strings compare in clock order.
  const orderDay = input.time < input.cutoff ? input.date : addDays(input.date, 1);
  let candidate = addDays(orderDay, input.leadDays);
  for (let i = 0; i < 7; i += 1) {
    if (days.has(isoWeekday(candidate))) return candidate;
    candidate = addDays(candidate, 1);
  }
  return null;
}

// Schemas the API validates with and the order forms reuse for their inline messages.

const uuid = z.uuid({ error: 'Choose one from the list.' });
const wholePacks = decimalString(rules.positive).refine((v) => dec(v).isInteger(), 'Order whole packs.');

export const orderLineSchema = z.object({ packId: uuid, quantity: wholePacks });

export const newOrderSchema = z.object({
  siteId: uuid,
  supplierId: uuid,
  lines: z.array(orderLineSchema).max(200, 'An order takes at most 200 lines.'),
  notes: z.string().trim().max(2000).nullish(),
});

export const editOrderSchema = z.object({
  lines: z.array(orderLineSchema).max(200, 'An order takes at most 200 lines.').optional(),
  notes: z.string().trim().max(2000).nullish(),
  /** The version the editor loaded: a stale edit is refused instead of overwriting. */
  version: z.number().int().nonnegative().optional(),
});

export const receiveLineSchema = z.object({
  lineId: uuid,
  quantityReceived: decimalString(rules.nonNegative),
  unitPrice: decimalString(rules.nonNegative),
  note: z.string().trim().max(500).nullish(),
});

export const receiveSchema = z.object({
  lines: z.array(receiveLineSchema).min(1, 'Enter what arrived on at least one line.'),
  receivedOn: z.string().regex(/^\d{4}-\d{2}-\d{2}$/, 'Enter a date as YYYY-MM-DD.').optional(),
  invoiceNumber: z.string().trim().max(80).nullish(),
  notes: z.string().trim().max(2000).nullish(),
});

export const payOrderSchema = z.object({ paymentMethodId: z.string({ error: 'Choose a card.' }).min(1, 'Choose a card.').max(255) });

export const stockLevelSchema = z.object({
  par: decimalString(rules.nonNegative),
  reorderPoint: decimalString(rules.nonNegative),
}).refine((v) => dec(v.reorderPoint).lte(dec(v.par)), { path: ['reorderPoint'], message: 'The reorder point must not be above the par level.' });

export const ISO_WEEKDAYS = [1, 2, 3, 4, 5, 6, 7] as const;

export const supplierOrderingSchema = z.object({
  minimumOrder: decimalString(rules.nonNegative),
  deliveryDays: z.array(z.number().int().min(1).max(7)).max(7).refine((d) => new Set(d).size === d.length, 'Each day once.'),
  orderCutoff: z.string().refine(isClockTime, 'Enter a time as HH:MM (24-hour).'),
  leadDays: z.number({ error: 'Enter whole days.' }).int('Enter whole days.').min(0).max(60),
  deliveryCharge: decimalString(rules.nonNegative),
  paymentTerms: z.enum(['card', 'account'], { error: 'Choose how this supplier is paid.' }),
});
