import { addDays } from '../../src/shared/calendar';
import { monthBounds } from '../../src/shared/books';
import type { Period } from '../../src/shared/contract/books';
import { businessToday } from '../platform/clock';
import type { AppDeps } from '../platform/deps';
import { conflict } from '../platform/errors';
import { listSites } from './books.repo';
import { computeCogs } from './cogs.service';
import { deletePeriodReports, freezeCountPrices, insertPeriodEvent, insertPeriodReport, lockPeriod, setPeriodStatus } from './periods.repo';
import { isMonthClosed, listPeriods, monthLabel } from './periods.service';

async function periodOut(db: AppDeps['db'], businessId: string, month: string): Promise<Period> {
  return (await listPeriods(db, businessId)).find((p) => p.month === month) as Period;
}

/**
 * Closes a month: its counts, receipts, sales and waste become read-only, the prices its counts
 * were valued at are written on their lines, and the report (all sites and each site) is
 * frozen, so it reads the same every time. A month can only be closed once it has ended (in
 * the business's own time zone).
 */
export async function closeMonth({ db, clock }: Pick<AppDeps, 'db' | 'clock'>, businessId: string, userId: string, month: string, reason: string | null): Promise<Period> {
  const { first, last } = monthBounds(month);
  if (last >= (await businessToday(db, clock, businessId))) throw conflict('month_not_over', `${monthLabel(month)} has not ended yet: close it from ${addDays(last, 1)}.`);
  if (await isMonthClosed(db, businessId, month)) throw conflict('already_closed', `${monthLabel(month)} is already closed.`);
  // The reports are worked out before the closing transaction (the costing loader runs its
  // queries in parallel, which a single transaction's connection cannot): a change landing in
  // that instant is refused once the month is closed, but may be missing from the snapshot.
  const sites = await listSites(db, businessId, null);
  const reports: { siteId: string | null; report: Awaited<ReturnType<typeof computeCogs>> }[] = [];
  for (const siteId of [null, ...sites.map((s) => s.id)]) reports.push({ siteId, report: await computeCogs(db, businessId, month, siteId) });
  await db.transaction(async (trx) => {
    const period = await lockPeriod(trx, businessId, month);
    if (period.status === 'closed') throw conflict('already_closed', `${monthLabel(month)} is already closed.`);
    await freezeCountPrices(trx, businessId, first, last, true);
    for (const { siteId, report } of reports) await insertPeriodReport(trx, businessId, period.id, siteId, report);
    await setPeriodStatus(trx, period.id, 'closed', userId);
    await insertPeriodEvent(trx, businessId, period.id, 'close', reason, userId);
  });
  return periodOut(db, businessId, month);
}

/** Reopens a closed month (the owner's call), recorded with who, when and why. */
export async function reopenMonth({ db }: Pick<AppDeps, 'db'>, businessId: string, userId: string, month: string, reason: string | null): Promise<Period> {
  const { first, last } = monthBounds(month);
  await db.transaction(async (trx) => {
    const period = await lockPeriod(trx, businessId, month);
    if (period.status !== 'closed') throw conflict('not_closed', `${monthLabel(month)} is not closed.`);
    await deletePeriodReports(trx, period.id);
    await freezeCountPrices(trx, businessId, first, last, false);
    await setPeriodStatus(trx, period.id, 'open', null);
    await insertPeriodEvent(trx, businessId, period.id, 'reopen', reason, userId);
  });
  return periodOut(db, businessId, month);
}
