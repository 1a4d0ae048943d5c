import type { Knex } from 'knex';
import type { BuildLineRow } from '../costing/cost-model.repo';

type Db = Knex | Knex.Transaction;

export interface StockItemRow {
  pack_id: string;
  par_level: string;
  reorder_point: string;
  description: string;
  supplier_code: string | null;
  pack_count: string;
  pack_quantity: string;
  pack_unit: string;
  supplier_id: string | null;
  supplier_name: string | null;
  ingredient_id: string;
  ingredient_name: string;
  base_unit: 'g' | 'ml' | 'each';
  density_g_per_ml: string | null;
  costing_pack_id: string | null;
  storage_area_id: string | null;
  storage_area_name: string | null;
}

export async function stockItems(db: Db, businessId: string, siteId: string): Promise<StockItemRow[]> {
  return db('stock_items as s')
    .join('packs as p', 'p.id', 's.pack_id')
    .join('ingredients as i', 'i.id', 'p.ingredient_id')
    .leftJoin('suppliers as su', 'su.id', 'p.supplier_id')
    .leftJoin('storage_areas as sa', 'sa.id', 's.storage_area_id')
    .where({ 's.business_id': businessId, 's.site_id': siteId })
    .whereNull('p.archived_at')
    .orderBy([{ column: 'su.name', order: 'asc' }, { column: 'i.name', order: 'asc' }, { column: 'p.description', order: 'asc' }])
    .select('s.pack_id', 's.par_level', 's.reorder_point', 'p.description', 'p.supplier_code', 'p.count as pack_count', 'p.quantity as pack_quantity',
      'p.unit as pack_unit', 'p.supplier_id', 'su.name as supplier_name', 'i.id as ingredient_id', 'i.name as ingredient_name', 'i.base_unit',
      'i.density_g_per_ml', 'i.costing_pack_id', 's.storage_area_id', 'sa.name as storage_area_name');
}

/** The site's last finished stock count, if any. */
export async function lastCount(db: Db, businessId: string, siteId: string) {
  return db('stock_counts').where({ business_id: businessId, site_id: siteId, status: 'finished' })
    .orderBy([{ column: 'count_date', order: 'desc' }, { column: 'finished_at', order: 'desc' }])
    .first('id', 'count_date', 'finished_at');
}

export async function countedPacks(db: Db, countId: string): Promise<{ pack_id: string; packs: string }[]> {
  return db('stock_count_lines').where({ count_id: countId }).select('pack_id', 'packs');
}

/** Packs received at the site after `since` (all of them when null). */
export async function receivedSince(db: Db, businessId: string, siteId: string, since: Date | null): Promise<{ pack_id: string; quantity: string }[]> {
  const q = db('receipt_lines as rl').join('receipts as r', 'r.id', 'rl.receipt_id')
    .where({ 'r.business_id': businessId, 'r.site_id': siteId })
    .groupBy('rl.pack_id').select('rl.pack_id', db.raw('sum(rl.quantity)::text as quantity'));
  if (since) q.where('r.created_at', '>', since);
  return q;
}

export interface WasteSinceRow {
  ingredient_id: string | null;
  preparation_id: string | null;
  drink_size_id: string | null;
  quantity: string;
  unit: string | null;
}

/** Waste recorded at the site after `since` (all of it when null): an ingredient, a preparation or cups of a drink size. */
export async function wasteSince(db: Db, businessId: string, siteId: string, since: Date | null): Promise<WasteSinceRow[]> {
  const q = db('waste_entries').where({ business_id: businessId, site_id: siteId })
    .select('ingredient_id', 'preparation_id', 'drink_size_id', 'quantity', 'unit');
  if (since) q.where('created_at', '>', since);
  return q;
}

/**
 * Cups sold at the site per drink size, summed in SQL (one GROUP BY: sales lines are many),
 * days after `afterDay` (all days when null). Only manual days (no import) and lines of
 * accepted imports count; a pending or discarded import's lines never do.
 */
export async function salesByDrinkSizeSince(db: Db, businessId: string, siteId: string, afterDay: string | null): Promise<{ drink_size_id: string; quantity: string }[]> {
  const q = db('sales_lines as sl').leftJoin('sales_imports as si', 'si.id', 'sl.import_id')
    .where({ 'sl.business_id': businessId, 'sl.site_id': siteId })
    .where((w) => w.whereNull('sl.import_id').orWhere('si.status', 'accepted'))
    .groupBy('sl.drink_size_id')
    .select('sl.drink_size_id', db.raw('sum(sl.quantity)::text as quantity'));
  if (afterDay) q.where('sl.sold_on', '>', afterDay);
  return q;
}

/** The build lines of these drink sizes (archived drinks included: what was sold was made), with a label for each size. */
export async function buildsOf(db: Db, businessId: string, drinkSizeIds: readonly string[]) {
  if (!drinkSizeIds.length) return { lines: [], labels: new Map<string, string>() };
  const [lines, sizes] = await Promise.all([
    db('build_lines').where({ business_id: businessId }).whereIn('drink_size_id', drinkSizeIds).orderBy([{ column: 'drink_size_id' }, { column: 'position' }])
      .select('id', 'drink_size_id', 'position', 'ingredient_id', 'preparation_id', 'quantity', 'unit', 'measure_id') as Promise<BuildLineRow[]>,
    db('drink_sizes as ds').join('drinks as d', 'd.id', 'ds.drink_id').join('cup_sizes as cs', 'cs.id', 'ds.size_id')
      .where('ds.business_id', businessId).whereIn('ds.id', drinkSizeIds).select('ds.id', 'd.name as drink', 'cs.name as size'),
  ]);
  return { lines, labels: new Map(sizes.map((s: { id: string; drink: string; size: string }) => [s.id, `${s.drink} (${s.size})`])) };
}

export async function upsertStockItem(db: Db, row: { business_id: string; site_id: string; pack_id: string; par_level: string; reorder_point: string }) {
  await db('stock_items').insert(row).onConflict(['site_id', 'pack_id']).merge({ par_level: row.par_level, reorder_point: row.reorder_point, updated_at: db.fn.now() });
}
