import type { Knex } from 'knex';
import type { BaseUnit } from '../../src/shared/units';

// Ingredients, their packs and the packs' dated prices: plain rows of one business.

export interface IngredientColumns {
  name?: string;
  category?: string;
  base_unit?: BaseUnit;
  density_g_per_ml?: string | null;
  yield_pct?: string;
  allergens?: string[];
  notes?: string | null;
  costing_pack_id?: string | null;
}

export interface PackColumns {
  supplier_id?: string | null;
  description?: string;
  supplier_code?: string | null;
  count?: string;
  quantity?: string;
  unit?: string;
  purchase_tax_pct?: string;
}

export interface PackPriceRow {
  id: string;
  price: string;
  effective_from: string;
  source: 'manual' | 'delivery' | 'reprice' | 'seed';
  note: string | null;
  created_at: Date;
}

const PRICE_COLUMNS = ['id', 'price', 'effective_from', 'source', 'note', 'created_at'];

/** A live ingredient's units, or undefined. */
export async function findLiveIngredient(db: Knex, businessId: string, id: string) {
  return db('ingredients').where({ business_id: businessId, id }).whereNull('archived_at').first<{ id: string; base_unit: BaseUnit; density_g_per_ml: string | null } | undefined>('id', 'base_unit', 'density_g_per_ml');
}

/** What the detail shows beyond the cost model: notes, the chosen pack, each live pack's code and purchase tax. */
export async function loadIngredientExtras(db: Knex, businessId: string, id: string) {
  const [row, packs] = await Promise.all([
    db('ingredients').where({ business_id: businessId, id }).first<{ notes: string | null; costing_pack_id: string | null } | undefined>('notes', 'costing_pack_id'),
    db('packs').where({ business_id: businessId, ingredient_id: id }).whereNull('archived_at').select<{ id: string; supplier_code: string | null; purchase_tax_pct: string }[]>('id', 'supplier_code', 'purchase_tax_pct'),
  ]);
  return { notes: row?.notes ?? null, costingPackId: row?.costing_pack_id ?? null, packs: new Map(packs.map((p) => [p.id, p])) };
}

/** Prices of an ingredient's packs dated after `asOf`: the planned ones, soonest first. */
export async function listPlannedPrices(db: Knex, businessId: string, ingredientId: string, asOf: string) {
  return db('pack_prices as pp')
    .join('packs as p', 'p.id', 'pp.pack_id')
    .where({ 'pp.business_id': businessId, 'p.ingredient_id': ingredientId })
    .where('pp.effective_from', '>', asOf)
    .orderBy('pp.effective_from')
    .select<{ pack_id: string; price: string; effective_from: string }[]>('pp.pack_id', 'pp.price', 'pp.effective_from');
}

export async function insertIngredient(db: Knex, businessId: string, values: IngredientColumns): Promise<string> {
  const [row] = await db('ingredients').insert({ business_id: businessId, ...values }).returning('id');
  return row.id;
}

export async function updateIngredient(db: Knex, businessId: string, id: string, values: IngredientColumns): Promise<void> {
  await db('ingredients').where({ business_id: businessId, id }).update({ ...values, updated_at: db.fn.now() });
}

/** Locks a live ingredient's row (a line added meanwhile waits), or undefined. */
export async function lockLiveIngredient(trx: Knex, businessId: string, id: string) {
  return trx('ingredients').where({ business_id: businessId, id }).whereNull('archived_at').forUpdate().first('id');
}

export async function deleteIngredient(db: Knex, businessId: string, id: string): Promise<number> {
  return db('ingredients').where({ business_id: businessId, id }).delete();
}

/** Archives an ingredient with its packs: lists and pickers no longer show them; history keeps them. */
export async function archiveIngredient(db: Knex, businessId: string, id: string): Promise<void> {
  await db('packs').where({ business_id: businessId, ingredient_id: id }).whereNull('archived_at').update({ archived_at: db.fn.now(), updated_at: db.fn.now() });
  await db('ingredients').where({ business_id: businessId, id }).update({ archived_at: db.fn.now(), costing_pack_id: null, updated_at: db.fn.now() });
}

export async function insertPack(db: Knex, businessId: string, ingredientId: string, values: PackColumns): Promise<string> {
  const [row] = await db('packs').insert({ business_id: businessId, ingredient_id: ingredientId, ...values }).returning('id');
  return row.id;
}

/** A live pack of a live ingredient with the ingredient's units, or undefined. */
export async function findLivePack(db: Knex, businessId: string, packId: string) {
  return db('packs as p')
    .join('ingredients as i', 'i.id', 'p.ingredient_id')
    .where({ 'p.business_id': businessId, 'p.id': packId })
    .whereNull('p.archived_at')
    .whereNull('i.archived_at')
    .first<{ ingredient_id: string; unit: string; base_unit: BaseUnit; density_g_per_ml: string | null } | undefined>('p.ingredient_id', 'p.unit', 'i.base_unit', 'i.density_g_per_ml');
}

/** Is this a live pack of that ingredient? */
export async function isLivePackOf(db: Knex, businessId: string, ingredientId: string, packId: string): Promise<boolean> {
  return Boolean(await db('packs').where({ business_id: businessId, ingredient_id: ingredientId, id: packId }).whereNull('archived_at').first('id'));
}

export async function updatePack(db: Knex, businessId: string, packId: string, values: PackColumns): Promise<void> {
  await db('packs').where({ business_id: businessId, id: packId }).update({ ...values, updated_at: db.fn.now() });
}

export async function deletePack(db: Knex, businessId: string, packId: string): Promise<number> {
  return db('packs').where({ business_id: businessId, id: packId }).delete();
}

/** Archives a pack: it leaves lists, pickers and costing; orders, deliveries and counts keep it. */
export async function archivePack(db: Knex, businessId: string, packId: string): Promise<void> {
  await db('packs').where({ business_id: businessId, id: packId }).update({ archived_at: db.fn.now(), updated_at: db.fn.now() });
  await db('ingredients').where({ business_id: businessId, costing_pack_id: packId }).update({ costing_pack_id: null, updated_at: db.fn.now() });
}

export async function insertPackPrice(
  db: Knex,
  businessId: string,
  values: { pack_id: string; price: string; effective_from: string; note?: string | null; created_by: string },
): Promise<PackPriceRow> {
  const [row] = await db('pack_prices').insert({ business_id: businessId, ...values }).returning(PRICE_COLUMNS);
  return row;
}

export async function listPackPrices(db: Knex, businessId: string, packId: string): Promise<PackPriceRow[]> {
  return db('pack_prices')
    .where({ business_id: businessId, pack_id: packId })
    .orderBy([{ column: 'effective_from', order: 'desc' }, { column: 'created_at', order: 'desc' }])
    .select(PRICE_COLUMNS);
}

/** Which of these ids are suppliers of the business. */
export async function knownSupplierIds(db: Knex, businessId: string, ids: readonly string[]): Promise<Set<string>> {
  if (ids.length === 0) return new Set();
  const rows = await db('suppliers').where({ business_id: businessId }).whereIn('id', [...new Set(ids)]).select('id');
  return new Set(rows.map((r) => r.id as string));
}
