import type { Knex } from 'knex';
import { monthOf } from '../../src/shared/calendar';
import type { Period } from '../../src/shared/contract/books';
import { conflict } from '../platform/errors';
import { closedMonthBetween, closedMonthIn, periodRows } from './periods.repo';
import { presentPeriods } from './periods.presenter';

/** "September 2026" for a month (YYYY-MM). */
export function monthLabel(month: string): string {
  return new Date(`${month}-01T00:00:00Z`).toLocaleDateString('en-GB', { month: 'long', year: 'numeric', timeZone: 'UTC' });
}

export async function isMonthClosed(db: Knex, businessId: string, month: string): Promise<boolean> {
  return (await closedMonthIn(db, businessId, [`${month}-01`])) !== undefined;
}

function refuseClosed(month: string): never {
  throw conflict('month_closed', `${monthLabel(monthOf(month))} is closed, so its counts, deliveries, sales and waste cannot change. The owner can reopen it.`);
}

/**
 * Refuses (409 month_closed) a change dated in a closed month: counts, receipts, sales and waste
 * of a closed month are read-only. Call it inside the write's transaction with that transaction.
 * `dates` are YYYY-MM-DD; every month they touch must be open.
 */
export async function assertMonthOpen(db: Knex, businessId: string, ...dates: string[]): Promise<void> {
  const months = [...new Set(dates.map((d) => `${monthOf(d)}-01`))];
  if (!months.length) return;
  const closed = await closedMonthIn(db, businessId, months);
  if (closed) refuseClosed(closed);
}

/** Refuses when any day from `first` to `last` is in a closed month. */
export async function assertRangeOpen(db: Knex, businessId: string, first: string, last: string): Promise<void> {
  const closed = await closedMonthBetween(db, businessId, `${monthOf(first)}-01`, `${monthOf(last)}-01`);
  if (closed) refuseClosed(closed);
}

/** Every month the business has closed or reopened, newest first, with who did what and when. */
export async function listPeriods(db: Knex, businessId: string): Promise<Period[]> {
  const { periods, events } = await periodRows(db, businessId);
  return presentPeriods(periods, events);
}
