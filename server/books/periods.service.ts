import type { Knex } from 'knex';
import { monthOf } from '../../src/shared/books';
import { conflict } from '../platform/errors';

/** "September 2026" for a month (YYYY-MM). */
export function monthLabel(month: string): string {
  return new Date(`${month}-01T00:00:00Z`).toLocaleDateString('en-GB', { month: 'long', year: 'numeric', timeZone: 'UTC' });
}

export async function isMonthClosed(db: Knex, businessId: string, month: string): Promise<boolean> {
  const row = await db('periods').where({ business_id: businessId, month: `${month}-01`, status: 'closed' }).first('id');
  return Boolean(row);
}

/**
 * Refuses (409 month_closed) a change dated in a closed month: counts, receipts, sales and waste
 * of a closed month are read-only. Call it inside the write's transaction with that transaction.
 * `dates` are YYYY-MM-DD; every month they touch must be open.
 */
export async function assertMonthOpen(db: Knex, businessId: string, ...dates: string[]): Promise<void> {
  const months = [...new Set(dates.map((d) => `${monthOf(d)}-01`))];
  if (!months.length) return;
  const closed = await db('periods').where({ business_id: businessId, status: 'closed' }).whereIn('month', months).orderBy('month').first('month');
  if (closed) {
    const m = monthOf(closed.month as string);
    throw conflict('month_closed', `${monthLabel(m)} is closed, so its counts, deliveries, sales and waste cannot change. The owner can reopen it.`);
  }
}

/** Refuses when any day from `first` to `last` is in a closed month. */
export async function assertRangeOpen(db: Knex, businessId: string, first: string, last: string): Promise<void> {
  const closed = await db('periods')
    .where({ business_id: businessId, status: 'closed' })
    .whereBetween('month', [`${monthOf(first)}-01`, `${monthOf(last)}-01`])
    .orderBy('month')
    .first('month');
  if (closed) await assertMonthOpen(db, businessId, closed.month as string);
}

export interface PeriodOut {
  month: string;
  status: 'open' | 'closed';
  closedAt: string | null;
  closedBy: string | null;
  events: { action: 'close' | 'reopen'; at: string; by: string | null; reason: string | null }[];
}

/** Every month the business has closed or reopened, newest first, with who did what and when. */
export async function listPeriods(db: Knex, businessId: string): Promise<PeriodOut[]> {
  const [periods, events] = await Promise.all([
    db('periods as p').leftJoin('users as u', 'u.id', 'p.closed_by').where('p.business_id', businessId).orderBy('p.month', 'desc')
      .select('p.id', 'p.month', 'p.status', 'p.closed_at', 'u.name as closed_by'),
    db('period_events as e').leftJoin('users as u', 'u.id', 'e.actor_id').where('e.business_id', businessId).orderBy('e.at')
      .select('e.period_id', 'e.action', 'e.at', 'e.reason', 'u.name as by'),
  ]);
  return periods.map((p) => ({
    month: monthOf(p.month),
    status: p.status,
    closedAt: p.closed_at ? new Date(p.closed_at).toISOString() : null,
    closedBy: p.status === 'closed' ? p.closed_by : null,
    events: events.filter((e) => e.period_id === p.id).map((e) => ({ action: e.action, at: new Date(e.at).toISOString(), by: e.by, reason: e.reason })),
  }));
}

/** The period row of a month, created open if needed, locked for the rest of the transaction. */
export async function lockPeriod(trx: Knex.Transaction, businessId: string, month: string) {
  await trx('periods').insert({ business_id: businessId, month: `${month}-01` }).onConflict(['business_id', 'month']).ignore();
  return trx('periods').where({ business_id: businessId, month: `${month}-01` }).forUpdate().first('id', 'status');
}

