import type { Knex } from 'knex';

// Plain rows for month end: the periods, their events and the reports frozen at close.

export async function closedMonthIn(db: Knex, businessId: string, months: string[]): Promise<string | undefined> {
  const row = await db('periods').where({ business_id: businessId, status: 'closed' }).whereIn('month', months).orderBy('month').first('month');
  return row?.month as string | undefined;
}

export async function closedMonthBetween(db: Knex, businessId: string, firstMonth: string, lastMonth: string): Promise<string | undefined> {
  const row = await db('periods').where({ business_id: businessId, status: 'closed' }).whereBetween('month', [firstMonth, lastMonth]).orderBy('month').first('month');
  return row?.month as string | undefined;
}

export interface PeriodRow {
  id: string;
  month: string;
  status: 'open' | 'closed';
  closed_at: Date | null;
  closed_by: string | null;
}

export interface PeriodEventRow {
  period_id: string;
  action: 'close' | 'reopen';
  at: Date;
  reason: string | null;
  by: string | null;
}

export async function periodRows(db: Knex, businessId: string): Promise<{ periods: PeriodRow[]; events: PeriodEventRow[] }> {
  const [periods, events] = await Promise.all([
    db('periods as p').leftJoin('users as u', 'u.id', 'p.closed_by').where('p.business_id', businessId).orderBy('p.month', 'desc')
      .select('p.id', 'p.month', 'p.status', 'p.closed_at', 'u.name as closed_by'),
    db('period_events as e').leftJoin('users as u', 'u.id', 'e.actor_id').where('e.business_id', businessId).orderBy('e.at')
      .select('e.period_id', 'e.action', 'e.at', 'e.reason', 'u.name as by'),
  ]);
  return { periods, events };
}

/** The period row of a month, created open if needed, locked for the rest of the transaction. */
export async function lockPeriod(trx: Knex.Transaction, businessId: string, month: string): Promise<{ id: string; status: 'open' | 'closed' }> {
  await trx('periods').insert({ business_id: businessId, month: `${month}-01` }).onConflict(['business_id', 'month']).ignore();
  return trx('periods').where({ business_id: businessId, month: `${month}-01` }).forUpdate().first('id', 'status');
}

/** Writes on each count line of the month the pack price it is valued at, or clears it (reopening). */
export async function freezeCountPrices(trx: Knex.Transaction, businessId: string, first: string, last: string, freeze: boolean): Promise<void> {
  await trx.raw(
    freeze
      ? `update stock_count_lines l set frozen_price = (
            select pp.price from pack_prices pp where pp.pack_id = l.pack_id and pp.effective_from <= c.count_date
            order by pp.effective_from desc, pp.created_at desc limit 1)
           from stock_counts c
          where c.id = l.count_id and c.business_id = ? and c.count_date between ? and ?`
      : 'update stock_count_lines l set frozen_price = null from stock_counts c where c.id = l.count_id and c.business_id = ? and c.count_date between ? and ?',
    [businessId, first, last],
  );
}

export async function insertPeriodReport(trx: Knex.Transaction, businessId: string, periodId: string, siteId: string | null, report: unknown): Promise<void> {
  await trx('period_reports').insert({ business_id: businessId, period_id: periodId, site_id: siteId, report: JSON.stringify(report) });
}

export async function deletePeriodReports(trx: Knex.Transaction, periodId: string): Promise<void> {
  await trx('period_reports').where({ period_id: periodId }).del();
}

/** The report frozen at close for all sites (siteId null) or one site. */
export async function frozenReport(db: Knex, periodId: string, siteId: string | null): Promise<unknown> {
  const row = await db('period_reports').where({ period_id: periodId }).modify((q) => (siteId ? q.where({ site_id: siteId }) : q.whereNull('site_id'))).first('report');
  return row?.report;
}

export async function setPeriodStatus(trx: Knex.Transaction, periodId: string, status: 'open' | 'closed', userId: string | null): Promise<void> {
  await trx('periods').where({ id: periodId }).update(
    status === 'closed'
      ? { status, closed_at: trx.fn.now(), closed_by: userId, updated_at: trx.fn.now() }
      : { status, closed_at: null, closed_by: null, updated_at: trx.fn.now() },
  );
}

export async function insertPeriodEvent(trx: Knex.Transaction, businessId: string, periodId: string, action: 'close' | 'reopen', reason: string | null, userId: string): Promise<void> {
  await trx('period_events').insert({ business_id: businessId, period_id: periodId, action, reason, actor_id: userId });
}
