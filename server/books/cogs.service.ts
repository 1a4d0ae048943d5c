import type { Knex } from 'knex';
import { assembleCogs, monthBounds, type CategoryFigures } from '../../src/shared/books';
import type { CogsReport, CountRef } from '../../src/shared/contract/books';
import { D, dec, type Dec } from '../../src/shared/decimal';
import { writeQuantity } from '../../src/shared/money';
import { chooseCounts, chosenCountsQuery, countValueByCategory, purchasesByCategory, reportStateRow, salesAggregate, wasteInRange, type CategoryValue, type ChosenCount, type SalesAggregate, type WasteRow } from './cogs.repo';
import { listSites } from './books.repo';
import { frozenReport } from './periods.repo';
import { loadMonthCosting } from './month-costing';
import { ensureRecipeCosts, type KnownCostingState } from './recipe-costs.service';
import { valueWaste } from './waste.service';
import type { WasteValue } from './waste.presenter';
import { cacheFor } from '../platform/versions';
import { invalidInput } from '../platform/errors';

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
  const r = await reportStateRow(db, businessId, month, siteId);
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
    listSites(db, businessId, siteId),
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
  if (!state.siteFound) throw invalidInput({ siteId: 'Choose one of your sites.' });
  if (state.closed && state.periodId) {
    const snap = await frozenReport(db, state.periodId, siteId);
    if (snap) return { ...(snap as Omit<CogsReport, 'closed'>), closed: true };
  }
  return { ...(await computeCogs(db, businessId, month, siteId, state)), closed: state.closed };
}
