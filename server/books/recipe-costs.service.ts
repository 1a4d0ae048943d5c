import type { Knex } from 'knex';
import { monthBounds } from '../../src/shared/books';
import { INGREDIENT_CATEGORIES } from '../../src/shared/categories';
import type { BuildLineRow } from '../costing/cost-model.repo';
import { groupBy } from '../../src/shared/collections';
import { costingVersion } from '../platform/versions';
import { CategorySplitter, loadMonthCosting } from './month-costing';

/**
 * Recipe cost per drink size over the price ranges of a month, by ingredient category (an array
 * in the order of INGREDIENT_CATEGORIES), kept in recipe_costs so the month's theoretical cost is ONE SQL statement over the sales lines
 * (each category's SUM(cups × cost) joined on the range that holds the day of sale), however many lines.
 *
 * The table is rebuilt for a month only when the business's costing version (moved on by
 * every change to a costing input: pack prices, packs, ingredients, preparations and their
 * lines, measures, builds) has changed since it was last built, so an unchanged menu costs one
 * cheap query per report.
 */

// Bump when the way recipe costs are worked out changes: every month is rebuilt on next use.
const METHOD_VERSION = `v3:${INGREDIENT_CATEGORIES.join(',')}`;

/**
 * What the month's rows were built from: the method and the business's costing version (which
 * every change to prices, packs, ingredients, preparations, measures or builds moves on).
 */
export async function costingFingerprint(db: Knex, businessId: string): Promise<string> {
  return fingerprintAt(await costingVersion(db, businessId));
}

/** The fingerprint of rows built at a costing version. */
export const fingerprintAt = (version: string) => `${METHOD_VERSION}:${version}`;

/** What a caller already read (in one statement with other things): the version and the month's stored fingerprint. */
export interface KnownCostingState {
  version: string;
  fingerprint: string | null;
}

export interface RecipeCostRow {
  business_id: string;
  month: string;
  drink_size_id: string;
  valid_from: string;
  valid_to: string;
  /** Cost of one cup per ingredient category, in the order of INGREDIENT_CATEGORIES; null where the build uses none of it. */
  costs: (string | null)[];
}

const CATEGORY_INDEX = new Map<string, number>(INGREDIENT_CATEGORIES.map((c, i) => [c, i]));

/** Works out the rows for a month with the costing engine (a drink size that cannot be costed gets none). */
export async function computeRecipeCosts(db: Knex, businessId: string, month: string, knownVersion?: string): Promise<RecipeCostRow[]> {
  const [costing, lines] = await Promise.all([
    loadMonthCosting(db, businessId, month, knownVersion),
    db('build_lines')
      .where({ business_id: businessId })
      .orderBy([{ column: 'drink_size_id' }, { column: 'position' }])
      .select('id', 'drink_size_id', 'position', 'ingredient_id', 'preparation_id', 'quantity', 'unit', 'measure_id') as Promise<BuildLineRow[]>,
  ]);
  const bySize = groupBy(lines, (l) => l.drink_size_id);
  const out: RecipeCostRow[] = [];
  for (const range of costing.ranges) {
    const splitter = new CategorySplitter(range.loaded);
    for (const [sizeId, sizeLines] of bySize) {
      const r = splitter.split(sizeLines);
      if (!r.ok) continue;
      const costs: (string | null)[] = INGREDIENT_CATEGORIES.map(() => null);
      for (const [category, cost] of r.byCategory) {
        const i = CATEGORY_INDEX.get(category);
        if (i === undefined) throw new Error(`Unknown ingredient category "${category}"`);
        costs[i] = cost.toDecimalPlaces(12).toFixed();
      }
      out.push({ business_id: businessId, month: `${month}-01`, drink_size_id: sizeId, valid_from: range.from, valid_to: range.to, costs });
    }
  }
  return out;
}

/**
 * Makes recipe_costs current for an open month (a no-op when nothing has changed). A closed
 * month is never touched: its report comes from the snapshot taken at close.
 */
export async function ensureRecipeCosts(db: Knex, businessId: string, month: string, known?: KnownCostingState): Promise<void> {
  monthBounds(month);
  const fp = known ? fingerprintAt(known.version) : await costingFingerprint(db, businessId);
  const current = known ? known.fingerprint : (await db('recipe_cost_months').where({ business_id: businessId, month: `${month}-01` }).first('fingerprint'))?.fingerprint;
  if (current === fp) return;
  const rows = await computeRecipeCosts(db, businessId, month, known?.version);
  await db.transaction(async (trx) => {
    // One rebuild at a time per business and month; a second caller finds it done.
    await trx.raw('select pg_advisory_xact_lock(hashtext(?))', [`recipe_costs:${businessId}:${month}`]);
    const again = await trx('recipe_cost_months').where({ business_id: businessId, month: `${month}-01` }).first('fingerprint');
    if (again?.fingerprint === fp) return;
    await trx('recipe_costs').where({ business_id: businessId, month: `${month}-01` }).del();
    for (let i = 0; i < rows.length; i += 2000) await trx('recipe_costs').insert(rows.slice(i, i + 2000));
    await trx('recipe_cost_months')
      .insert({ business_id: businessId, month: `${month}-01`, fingerprint: fp, computed_at: trx.fn.now() })
      .onConflict(['business_id', 'month'])
      .merge(['fingerprint', 'computed_at']);
  });
}
