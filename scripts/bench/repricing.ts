import type { Knex } from 'knex';
import { menuCosting } from '../../server/costing/menu.service';
import { previewImpact } from '../../server/repricing/impact.service';
import { measure, type Timing } from './measure';
import { touchCosting } from './touch';

export interface RepricingBench {
  ingredient: string;
  affectedRows: number;
  preview: Timing;
  menuCosting: Timing;
  /** preview p50 ÷ full-menu costing p50, both through the database in the same run. */
  ratio: number;
  targetMet: boolean;
}

/**
 * Times the impact preview of one ingredient's price change (+8 %) on the large bench menu, and
 * the full-menu costing (the same service as GET /api/menu/costing), in the same run.
 * The ingredient is the one used by the most build lines, the worst case for the preview.
 */
export async function benchRepricing(db: Knex, businessId: string, runs = 20): Promise<RepricingBench> {
  // Ties broken by name, so every run picks the same ingredient (ids are random).
  const top = await db('build_lines as bl').join('ingredients as i', 'i.id', 'bl.ingredient_id').where('bl.business_id', businessId)
    .groupBy('bl.ingredient_id', 'i.name').orderByRaw('count(*) desc, i.name').first('bl.ingredient_id as ingredient_id');
  const ingredientId = top!.ingredient_id as string;
  const price = await db('pack_prices as pp').join('packs as p', 'p.id', 'pp.pack_id').where('p.ingredient_id', ingredientId).orderBy('pp.effective_from', 'desc').first('pp.price');
  const newPrice = (Number(price!.price) * 1.08).toFixed(2); // a bench input, not a computed figure
  const input = { changes: [{ ingredientId, newPrice }] };
  const first = await previewImpact(db, businessId, input);
  const preview = await measure(() => previewImpact(db, businessId, input), runs, 3);
  // The full menu costed afresh each time (its cached result made stale, untimed), as the
  // preview always works out its figures afresh.
  const menu = await measure(() => menuCosting(db, businessId), runs, 3, () => touchCosting(db, businessId));
  return { ingredient: ingredientId, affectedRows: first.rows.length, preview, menuCosting: menu, ratio: preview.p50 / menu.p50, targetMet: preview.p50 < 200 };
}
