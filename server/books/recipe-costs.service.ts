import type { Knex } from 'knex';
import { monthBounds } from '../../src/shared/books';
import type { BuildLineRow } from '../costing/cost-model.repo';
import { groupBy } from '../costing/shared';
import { costingVersion } from '../costing/versions';
import { CategorySplitter, loadMonthCosting } from './month-costing';

/**
 * Recipe cost per drink size and ingredient category over the price ranges of a month, kept in
 * recipe_costs so the month's theoretical cost is ONE SQL statement over the sales lines
 * (SUM(quantity × cost) joined on the range that holds the day of sale), however many lines.
 *
 * The table is rebuilt for a month only when the business's costing version (moved on by
 * every change to a costing input: pack prices, packs, ingredients, preparations and their
 * lines, measures, builds) has changed since it was last built, so an unchanged menu costs one
 * cheap query per report.
 */

// Bump when the way recipe costs are worked out changes: every month is rebuilt on next use.
const METHOD_VERSION = 'v2';

/**
 * What the month's rows were built from: the method and the business's costing version (which
 * every change to prices, packs, ingredients, preparations, measures or builds moves on).
 */
export async function costingFingerprint(db: Knex, businessId: string): Promise<string> {
  return `${METHOD_VERSION}:${await costingVersion(db, businessId)}`;
}

export interface RecipeCostRow {
  business_id: string;
  month: string;
  drink_size_id: string;
  category: string;
  valid_from: string;
  valid_to: string;
  cost: string;
}

/** Works out the rows for a month with the costing engine (a drink size that cannot be costed gets none). */
export async function computeRecipeCosts(db: Knex, businessId: string, month: string): Promise<RecipeCostRow[]> {
  const [costing, lines] = await Promise.all([
    loadMonthCosting(db, businessId, month),
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
      for (const [category, cost] of r.byCategory) {
        out.push({ business_id: businessId, month: `${month}-01`, drink_size_id: sizeId, category, valid_from: range.from, valid_to: range.to, cost: cost.toDecimalPlaces(12).toFixed() });
      }
    }
  }
  return out;
}

/**
 * Makes recipe_costs current for an open month (a no-op when nothing has changed). A closed
 * month is never touched: its report comes from the snapshot taken at close.
 */
export async function ensureRecipeCosts(db: Knex, businessId: string, month: string): Promise<void> {
  monthBounds(month);
  const fp = await costingFingerprint(db, businessId);
  const current = await db('recipe_cost_months').where({ business_id: businessId, month: `${month}-01` }).first('fingerprint');
  if (current?.fingerprint === fp) return;
  const rows = await computeRecipeCosts(db, businessId, month);
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
