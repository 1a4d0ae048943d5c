import type { Knex } from 'knex';
import { D, type Dec } from '../../src/shared/decimal';
import { monthBounds, nextDay } from '../../src/shared/books';
import { loadCostModel, type LoadedCostModel } from '../costing/cost-model.service';
import type { LineRow } from '../costing/cost-model.repo';
import { cacheFor, costingVersion } from '../platform/versions';

/**
 * Costing over a month: the days on which the prices in force change split the month into a
 * few ranges, and one cost model is built for each (by the costing engine, from the stored
 * rows), so any date of the month is costed with the prices in force on it.
 */

export interface PriceRange {
  from: string;
  to: string;
  loaded: LoadedCostModel;
}

export interface MonthCosting {
  ranges: PriceRange[];
  at(date: string): LoadedCostModel;
}

/** The first day of each price range of the month: the 1st, then every day a pack price takes effect. */
export async function priceChangeDays(db: Knex, businessId: string, month: string): Promise<string[]> {
  const { first, last } = monthBounds(month);
  const rows = await db('pack_prices')
    .where({ business_id: businessId })
    .where('effective_from', '>', first)
    .where('effective_from', '<=', last)
    .distinct('effective_from')
    .orderBy('effective_from');
  return [first, ...rows.map((r) => r.effective_from as string)];
}

/**
 * The month's price ranges and their cost models, kept while the business's costing version is
 * unchanged (models are only read once built; see versions.ts).
 */
export async function loadMonthCosting(db: Knex, businessId: string, month: string, knownVersion?: string): Promise<MonthCosting> {
  monthBounds(month);
  const version = knownVersion ?? (await costingVersion(db, businessId));
  return cacheFor<MonthCosting>(db, 'month-costing', MONTH_CACHE_LIMIT).get(`${businessId}|${month}`, version, () => buildMonthCosting(db, businessId, month));
}

/** Months kept per database handle: a month's models for a large menu take a few megabytes. */
const MONTH_CACHE_LIMIT = 24;

async function buildMonthCosting(db: Knex, businessId: string, month: string): Promise<MonthCosting> {
  const { last } = monthBounds(month);
  const days = await priceChangeDays(db, businessId, month);
  const ranges: PriceRange[] = [];
  for (let i = 0; i < days.length; i++) {
    const to = i + 1 < days.length ? nextDay(days[i + 1], -1) : last;
    ranges.push({ from: days[i], to, loaded: await loadCostModel(db, businessId, { asOf: days[i] }) });
  }
  return {
    ranges,
    at(date: string) {
      const r = ranges.find((x) => x.from <= date && date <= x.to);
      if (!r) throw new RangeError(`${date} is not in ${month}`);
      return r.loaded;
    },
  };
}

const ONE = new D(1);

function addInto(into: Map<string, Dec>, category: string, amount: Dec) {
  into.set(category, (into.get(category) ?? new D(0)).plus(amount));
}

/**
 * Splits costs by ingredient category. An ingredient's cost is all its category's; a
 * preparation's cost is shared among the categories of its own lines in proportion to their
 * cost in one batch (nested preparations likewise), so the parts always add up to the whole.
 */
export class CategorySplitter {
  private readonly shares = new Map<string, Map<string, Dec>>();
  constructor(private readonly loaded: LoadedCostModel) {}

  /** Category → share of one unit of cost of the item (ingredient or preparation id). */
  shareOf(itemId: string): Map<string, Dec> {
    const hit = this.shares.get(itemId);
    if (hit) return hit;
    const out = new Map<string, Dec>();
    const ing = this.loaded.ingredients.get(itemId);
    if (ing) out.set(ing.row.category, ONE);
    const prep = this.loaded.preparations.get(itemId);
    if (prep?.lineCosts && prep.batchCost && !prep.batchCost.isZero()) {
      for (const lc of prep.lineCosts) {
        for (const [cat, share] of this.shareOf(lc.item)) addInto(out, cat, share.times(lc.cost).div(prep.batchCost));
      }
    }
    this.shares.set(itemId, out);
    return out;
  }

  /** Cost of stored lines by category, or the reason they cannot be costed. */
  split(lines: readonly LineRow[]): { ok: true; byCategory: Map<string, Dec> } | { ok: false; problem: string } {
    const costed = this.loaded.costStoredLines(lines);
    if (!costed.ok) return costed;
    const byCategory = new Map<string, Dec>();
    for (const lc of costed.lines) for (const [cat, share] of this.shareOf(lc.item)) addInto(byCategory, cat, lc.cost.times(share));
    return { ok: true, byCategory };
  }
}
