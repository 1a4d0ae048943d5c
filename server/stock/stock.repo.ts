import type { Knex } from 'knex';

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
}

export async function stockItems(db: Db, businessId: string, siteId: string): Promise<StockItemRow[]> {
  return db('stock_items as s')
    .join('packs as p', 'p.id', 's.pack_id')
    .join('ingredients as i', 'i.id', 'p.ingredient_id')
    .leftJoin('suppliers as su', 'su.id', 'p.supplier_id')
    .where({ 's.business_id': businessId, 's.site_id': siteId })
    .whereNull('p.archived_at')
    .orderBy([{ column: 'su.name', order: 'asc' }, { column: 'i.name', order: 'asc' }, { column: 'p.description', order: 'asc' }])
    .select('s.pack_id', 's.par_level', 's.reorder_point', 'p.description', 'p.supplier_code', 'p.count as pack_count', 'p.quantity as pack_quantity',
      'p.unit as pack_unit', 'p.supplier_id', 'su.name as supplier_name', 'i.id as ingredient_id', 'i.name as ingredient_name', 'i.base_unit',
      'i.density_g_per_ml', 'i.costing_pack_id');
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

export async function ingredientWasteSince(db: Db, businessId: string, siteId: string, since: Date | null) {
  const q = db('waste_entries').where({ business_id: businessId, site_id: siteId }).whereNotNull('ingredient_id')
    .select('ingredient_id', 'quantity', 'unit');
  if (since) q.where('created_at', '>', since);
  return q as Promise<{ ingredient_id: string; quantity: string; unit: string | null }[]>;
}

export async function upsertStockItem(db: Db, row: { business_id: string; site_id: string; pack_id: string; par_level: string; reorder_point: string }) {
  await db('stock_items').insert(row).onConflict(['site_id', 'pack_id']).merge({ par_level: row.par_level, reorder_point: row.reorder_point, updated_at: db.fn.now() });
}
