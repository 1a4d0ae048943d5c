import type { Knex } from 'knex';
import { monthBounds, nextDay } from '../../src/shared/books';
import { conflict } from '../platform/errors';
import { utcToday as today } from '../platform/clock';
import { computeCogs } from './cogs.service';
import { isMonthClosed, listPeriods, lockPeriod, monthLabel, type PeriodOut } from './periods.service';

async function periodOut(db: Knex, businessId: string, month: string): Promise<PeriodOut> {
  const all = await listPeriods(db, businessId);
  return all.find((p) => p.month === month) as PeriodOut;
}

/**
 * Closes a month: its counts, receipts, sales and waste become read-only, the prices its counts
 * were valued at are written on their lines, and the report (all sites and each site) is
 * frozen, so it reads the same every time. A month can only be closed once it has ended.
 */
export async function closeMonth(db: Knex, businessId: string, userId: string, month: string, reason: string | null): Promise<PeriodOut> {
  const { first, last } = monthBounds(month);
  if (last >= today()) throw conflict('month_not_over', `${monthLabel(month)} has not ended yet: close it from ${nextDay(last)}.`);
  if (await isMonthClosed(db, businessId, month)) throw conflict('already_closed', `${monthLabel(month)} is already closed.`);
  // The reports are worked out before the closing transaction (the costing loader runs its
  // queries in parallel, which a single transaction's connection cannot): a change landing in
  // that instant is refused once the month is closed, but may be missing from the snapshot.
  const sites = await db('sites').where({ business_id: businessId }).orderBy('created_at').select('id');
  const reports: { siteId: string | null; report: Awaited<ReturnType<typeof computeCogs>> }[] = [];
  for (const siteId of [null, ...sites.map((s) => s.id as string)]) reports.push({ siteId, report: await computeCogs(db, businessId, month, siteId) });
  await db.transaction(async (trx) => {
    const period = await lockPeriod(trx, businessId, month);
    if (period.status === 'closed') throw conflict('already_closed', `${monthLabel(month)} is already closed.`);
    await trx.raw(
      `update stock_count_lines l set frozen_price = (
          select pp.price from pack_prices pp where pp.pack_id = l.pack_id and pp.effective_from <= c.count_date
          order by pp.effective_from desc, pp.created_at desc limit 1)
         from stock_counts c
        where c.id = l.count_id and c.business_id = ? and c.count_date between ? and ?`,
      [businessId, first, last],
    );
    for (const { siteId, report } of reports) {
      await trx('period_reports').insert({ business_id: businessId, period_id: period.id, site_id: siteId, report: JSON.stringify(report) });
    }
    await trx('periods').where({ id: period.id }).update({ status: 'closed', closed_at: trx.fn.now(), closed_by: userId, updated_at: trx.fn.now() });
    await trx('period_events').insert({ business_id: businessId, period_id: period.id, action: 'close', reason, actor_id: userId });
  });
  return periodOut(db, businessId, month);
}

/** Reopens a closed month (the owner's call), recorded with who, when and why. */
export async function reopenMonth(db: Knex, businessId: string, userId: string, month: string, reason: string | null): Promise<PeriodOut> {
  const { first, last } = monthBounds(month);
  await db.transaction(async (trx) => {
    const period = await lockPeriod(trx, businessId, month);
    if (period.status !== 'closed') throw conflict('not_closed', `${monthLabel(month)} is not closed.`);
    await trx('period_reports').where({ period_id: period.id }).del();
    await trx.raw(
      'update stock_count_lines l set frozen_price = null from stock_counts c where c.id = l.count_id and c.business_id = ? and c.count_date between ? and ?',
      [businessId, first, last],
    );
    await trx('periods').where({ id: period.id }).update({ status: 'open', closed_at: null, closed_by: null, updated_at: trx.fn.now() });
    await trx('period_events').insert({ business_id: businessId, period_id: period.id, action: 'reopen', reason, actor_id: userId });
  });
  return periodOut(db, businessId, month);
}
