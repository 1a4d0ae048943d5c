import type { Knex } from 'knex';
import { assembleCogs, monthBounds, type CategoryFigures, type CogsRowOut, type CogsTotalsOut } from '../../src/shared/books';
import { D, dec, type Dec } from '../../src/shared/decimal';
import { writeQuantity } from '../../src/shared/money';
import { chooseCounts, countValueByCategory, purchasesByCategory, salesAggregate, wasteInRange, type ChosenCount, type SalesAggregate } from './cogs.repo';
import { loadMonthCosting } from './month-costing';
import { ensureRecipeCosts } from './recipe-costs.service';
import { valueWaste } from './waste.service';
import { assertSite } from './sites';

export interface CountRef {
  siteId: string;
  countId: string;
  countDate: string;
}

export interface CogsReport {
  month: string;
  siteId: string | null;
  closed: boolean;
  currency: string;
  rows: CogsRowOut[];
  totals: CogsTotalsOut;
  /** The counts used as opening and closing stock, one per site that has one. */
  counts: { opening: CountRef[]; closing: CountRef[] };
  /** Cups sold in the month, and those that could not be costed (no build or no price). */
  cups: string;
  uncostedCups: string;
  /** What the reader should know before trusting the figures (a missing count, an unpriced pack…). */
  notes: string[];
}

const refs = (counts: ChosenCount[]): CountRef[] => counts.map((c) => ({ siteId: c.site_id, countId: c.id, countDate: c.count_date }));

/**
 * The month's till sales with their theoretical cost by category, at one site or all: makes
 * the month's recipe costs current, then ONE aggregate statement over the sales lines.
 */
export async function monthSales(db: Knex, businessId: string, siteId: string | null, month: string): Promise<SalesAggregate> {
  const { first, last } = monthBounds(month);
  const [costing] = await Promise.all([loadMonthCosting(db, businessId, month), ensureRecipeCosts(db, businessId, month)]);
  return salesAggregate(db, businessId, siteId, month, first, last, costing.ranges.map((r) => r.from));
}

/** The month's cost of goods worked out now from the stored rows (never from a snapshot). */
export async function computeCogs(db: Knex, businessId: string, month: string, siteId: string | null): Promise<Omit<CogsReport, 'closed'>> {
  const { first, last, previousLast } = monthBounds(month);
  // Every figure in one round of parallel statements: each count is valued as soon as it is
  // chosen, and waste as soon as it is read, while the sales aggregate runs.
  const valued = (counts: Promise<ChosenCount[]>) => counts.then(async (c) => ({ counts: c, values: await countValueByCategory(db, c.map((x) => x.id)) }));
  const [business, sites, opening, closing, purchases, sales, waste] = await Promise.all([
    db('businesses').where({ id: businessId }).first('currency'),
    db('sites').where({ business_id: businessId }).modify((q) => (siteId ? q.where({ id: siteId }) : q)).orderBy('created_at').select('id', 'name') as Promise<{ id: string; name: string }[]>,
    valued(chooseCounts(db, businessId, siteId, previousLast)),
    valued(chooseCounts(db, businessId, siteId, last, true)),
    purchasesByCategory(db, businessId, siteId, first, last),
    monthSales(db, businessId, siteId, month),
    wasteInRange(db, businessId, siteId, first, last).then(async (rows) => ({ rows, values: await valueWaste(db, businessId, month, rows) })),
  ]);
  const currency = business.currency as string;
  const [openingValues, closingValues, wasteValues] = [opening.values, closing.values, waste.values];

  const figures = new Map<string, { opening: Dec; purchases: Dec; closing: Dec; theoretical: Dec; waste: Dec }>();
  const fig = (category: string) => {
    let f = figures.get(category);
    if (!f) figures.set(category, (f = { opening: new D(0), purchases: new D(0), closing: new D(0), theoretical: new D(0), waste: new D(0) }));
    return f;
  };
  for (const v of openingValues) fig(v.category).opening = dec(v.value);
  for (const v of closingValues) fig(v.category).closing = dec(v.value);
  for (const p of purchases) fig(p.category).purchases = dec(p.net);
  for (const t of sales.theoretical) fig(t.category).theoretical = dec(t.cost);
  let unvaluedWaste = 0;
  for (const w of wasteValues.values()) {
    if (!w.total) unvaluedWaste++;
    for (const [cat, v] of w.byCategory) fig(cat).waste = fig(cat).waste.plus(v);
  }
  const list: CategoryFigures[] = [...figures].map(([category, f]) => ({ category, ...f }));
  const { rows, totals } = assembleCogs(list, sales.netSales, currency);

  const notes: string[] = [];
    const without = (counts: ChosenCount[]) => sites.filter((s) => !counts.some((c) => c.site_id === s.id)).map((s) => s.name);
  const noOpening = without(opening.counts);
  const noClosing = without(closing.counts);
  if (noOpening.length) notes.push(`No finished count on or before ${previousLast} for ${noOpening.join(', ')}: opening stock is taken as nothing there.`);
  if (noClosing.length) notes.push(`No finished count dated ${last} for ${noClosing.join(', ')}: closing stock is taken as nothing there.`);
  const unpriced = [...openingValues, ...closingValues].reduce((n, v) => n + Number(v.unpriced), 0);
  if (unpriced) notes.push(`${unpriced} counted pack line${unpriced === 1 ? ' has' : 's have'} no price in force on the count date and ${unpriced === 1 ? 'is' : 'are'} valued at nothing.`);
  if (dec(sales.uncostedCups).gt(0)) notes.push(`${writeQuantity(sales.uncostedCups)} cups sold could not be costed (no build, or an ingredient without a price): the theoretical cost leaves them out.`);
  if (unvaluedWaste) notes.push(`${unvaluedWaste} waste entr${unvaluedWaste === 1 ? 'y' : 'ies'} could not be valued.`);

  return {
    month,
    siteId,
    currency,
    rows,
    totals,
    counts: { opening: refs(opening.counts), closing: refs(closing.counts) },
    cups: writeQuantity(sales.cups),
    uncostedCups: writeQuantity(sales.uncostedCups),
    notes,
  };
}

/**
 * The month's report: for a closed month the one frozen at close (the same every time it is
 * run); otherwise worked out now.
 */
export async function cogsReport(db: Knex, businessId: string, month: string, siteId: string | null): Promise<CogsReport> {
  const [, period] = await Promise.all([
    siteId ? assertSite(db, businessId, siteId) : null,
    db('periods').where({ business_id: businessId, month: `${month}-01` }).first('id', 'status'),
  ]);
  if (period?.status === 'closed') {
    const snap = await db('period_reports').where({ period_id: period.id }).modify((q) => (siteId ? q.where({ site_id: siteId }) : q.whereNull('site_id'))).first('report');
    if (snap) return { ...(snap.report as Omit<CogsReport, 'closed'>), closed: true };
  }
  return { ...(await computeCogs(db, businessId, month, siteId)), closed: period?.status === 'closed' };
}
