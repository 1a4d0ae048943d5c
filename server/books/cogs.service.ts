import type { Knex } from 'knex';
import { assembleCogs, monthBounds, type CategoryFigures, type CogsRowOut, type CogsTotalsOut } from '../../src/shared/books';
import { D, dec, type Dec } from '../../src/shared/decimal';
import { writeQuantity } from '../../src/shared/money';
import { chooseCounts, chosenCountsQuery, countValueByCategory, purchasesByCategory, salesAggregate, wasteInRange, type CategoryValue, type ChosenCount, type SalesAggregate, type WasteRow } from './cogs.repo';
import { loadMonthCosting } from './month-costing';
import { ensureRecipeCosts, type KnownCostingState } from './recipe-costs.service';
import { valueWaste, type WasteValue } from './waste.service';
import { cacheFor } from '../platform/versions';
import { notFound } from '../platform/errors';

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

/** What a report needs to know before its figures, read in ONE statement. */
export interface ReportState extends KnownCostingState {
  /** The business's books version (counts, deliveries, waste, sites). */
  booksVersion: string;
  siteFound: boolean;
  currency: string;
  periodId: string | null;
  closed: boolean;
}

export async function reportState(db: Knex, businessId: string, month: string, siteId: string | null): Promise<ReportState> {
  const { rows } = await db.raw(
    `select b.currency,
            (select version from data_versions where business_id = b.id and kind = 'costing') as version,
            (select version from data_versions where business_id = b.id and kind = 'books') as books_version,
            (select fingerprint from recipe_cost_months where business_id = b.id and month = :month) as fingerprint,
            p.id as period_id, p.status as period_status,
            (:site::uuid is null or exists (select 1 from sites s where s.id = :site::uuid and s.business_id = b.id)) as site_found
       from businesses b left join periods p on p.business_id = b.id and p.month = :month
      where b.id = :biz`,
    { biz: businessId, month: `${month}-01`, site: siteId },
  );
  const r = rows[0];
  if (!r) throw new Error(`Business ${businessId} not found`);
  return { currency: r.currency, version: r.version === null ? '0' : String(r.version), booksVersion: r.books_version === null ? '0' : String(r.books_version), fingerprint: r.fingerprint, periodId: r.period_id, closed: r.period_status === 'closed', siteFound: r.site_found };
}

/**
 * The month's till sales with their theoretical cost by category, at one site or all: makes
 * the month's recipe costs current, then ONE aggregate statement over the sales lines.
 */
export async function monthSales(db: Knex, businessId: string, siteId: string | null, month: string, known?: KnownCostingState): Promise<SalesAggregate> {
  const { first, last } = monthBounds(month);
  const state = known ?? (await reportState(db, businessId, month, siteId));
  const [costing] = await Promise.all([loadMonthCosting(db, businessId, month, state.version), ensureRecipeCosts(db, businessId, month, state)]);
  return salesAggregate(db, businessId, siteId, month, first, last, costing.ranges.map((r) => r.from));
}

interface SideFigures {
  sites: { id: string; name: string }[];
  opening: { counts: ChosenCount[]; values: CategoryValue[] };
  closing: { counts: ChosenCount[]; values: CategoryValue[] };
  purchases: { category: string; net: string }[];
  waste: { rows: WasteRow[]; values: Map<string, WasteValue> };
}

/** Reports' other figures kept per database handle (a business, month and site each). */
const SIDE_CACHE_LIMIT = 200;

/**
 * Everything of the month's report besides the sales, in one round of parallel statements:
 * counts chosen and valued in one statement each, deliveries by category, and waste valued in
 * memory by the month's cost models.
 */
async function sideFigures(db: Knex, businessId: string, month: string, siteId: string | null, costingVersionNow: string): Promise<SideFigures> {
  const { first, last, previousLast } = monthBounds(month);
  const countsOn = (day: string, exactly: boolean) => Promise.all([
    chooseCounts(db, businessId, siteId, day, exactly),
    countValueByCategory(db, chosenCountsQuery(db, businessId, siteId, day, exactly)),
  ]).then(([counts, values]) => ({ counts, values }));
  const [sites, opening, closing, purchases, waste] = await Promise.all([
    db('sites').where({ business_id: businessId }).modify((q) => (siteId ? q.where({ id: siteId }) : q)).orderBy('created_at').select('id', 'name') as Promise<{ id: string; name: string }[]>,
    countsOn(previousLast, false),
    countsOn(last, true),
    purchasesByCategory(db, businessId, siteId, first, last),
    wasteInRange(db, businessId, siteId, first, last).then(async (rows) => ({ rows, values: await valueWaste(db, businessId, month, rows, costingVersionNow) })),
  ]);
  return { sites, opening, closing, purchases, waste };
}

/** The month's cost of goods worked out now from the stored rows (never from a snapshot). */
export async function computeCogs(db: Knex, businessId: string, month: string, siteId: string | null, known?: ReportState): Promise<Omit<CogsReport, 'closed'>> {
  const { last, previousLast } = monthBounds(month);
  const state = known ?? (await reportState(db, businessId, month, siteId));
  // The sales aggregate, always worked out in SQL; beside it the report's other figures, kept
  // while the business's books and costing versions stand (counts, deliveries and waste change
  // far less often than the report is read).
  const [side, sales] = await Promise.all([
    cacheFor<SideFigures>(db, 'cogs-side-figures', SIDE_CACHE_LIMIT).get(
      `${businessId}|${month}|${siteId ?? 'all'}`,
      `${state.version}:${state.booksVersion}`,
      () => sideFigures(db, businessId, month, siteId, state.version),
    ),
    monthSales(db, businessId, siteId, month, state),
  ]);
  const { sites, opening, closing, purchases, waste } = side;
  const { currency } = state;
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
  monthBounds(month);
  const state = await reportState(db, businessId, month, siteId);
  if (!state.siteFound) throw notFound('That site');
  if (state.closed) {
    const snap = await db('period_reports').where({ period_id: state.periodId }).modify((q) => (siteId ? q.where({ site_id: siteId }) : q.whereNull('site_id'))).first('report');
    if (snap) return { ...(snap.report as Omit<CogsReport, 'closed'>), closed: true };
  }
  return { ...(await computeCogs(db, businessId, month, siteId, state)), closed: state.closed };
}
