import type { Knex } from 'knex';
import { businessToday, systemClock } from '../platform/clock';

// Plain rows for the cost model of one business: a fixed handful of queries
// whatever the size of the menu (no per-drink or per-item queries).

export interface IngredientRow {
  id: string;
  name: string;
  category: string;
  base_unit: 'g' | 'ml' | 'each';
  density_g_per_ml: string | null;
  yield_pct: string;
  allergens: string[];
  costing_pack_id: string | null;
}

export interface PackPriceRow {
  id: string;
  ingredient_id: string;
  supplier_id: string | null;
  supplier_name: string | null;
  description: string;
  count: string;
  quantity: string;
  unit: string;
  /** Price in force on the date asked for, null when none is. */
  price: string | null;
  effective_from: string | null;
  priced_at: Date | null;
}

export interface MeasureRow {
  id: string;
  ingredient_id: string | null;
  preparation_id: string | null;
  name: string;
  quantity: string;
  unit: string;
}

export interface PreparationRow {
  id: string;
  name: string;
  yield_quantity: string;
  yield_unit: string;
  density_g_per_ml: string | null;
}

export interface LineRow {
  id: string;
  position: number;
  ingredient_id: string | null;
  preparation_id: string | null;
  quantity: string;
  unit: string | null;
  measure_id: string | null;
}

export interface PreparationLineRow extends LineRow {
  parent_id: string;
}

export interface PolicyRow {
  category: string | null;
  target_margin_pct: string;
  tax_mode: 'inclusive' | 'exclusive';
  tax_rate_pct: string;
  price_step: string;
  rounding: 'up' | 'nearest' | 'none';
}

export interface CostRows {
  businessId: string;
  /** The date whose prices the packs carry. */
  asOf: string;
  business: { currency: string; tax_mode: 'inclusive' | 'exclusive' };
  ingredients: IngredientRow[];
  packs: PackPriceRow[];
  measures: MeasureRow[];
  preparations: PreparationRow[];
  preparationLines: PreparationLineRow[];
  policies: PolicyRow[];
}

export async function findBusinessMoney(db: Knex, businessId: string) {
  return db('businesses').where({ id: businessId }).first<{ currency: string; tax_mode: 'inclusive' | 'exclusive' }>('currency', 'tax_mode');
}

export async function listPolicies(db: Knex, businessId: string): Promise<PolicyRow[]> {
  return db('pricing_policies')
    .where({ business_id: businessId })
    .orderByRaw('category nulls first')
    .select('category', 'target_margin_pct', 'tax_mode', 'tax_rate_pct', 'price_step', 'rounding');
}

/** Packs with the price in force on `asOf`: the latest effective_from not after it (ties: the last entered). */
export async function listPacksWithPrice(db: Knex, businessId: string, asOf: string, ingredientId?: string): Promise<PackPriceRow[]> {
  const q = db('packs as p')
    .leftJoin('suppliers as s', 's.id', 'p.supplier_id')
    .joinRaw(
      `left join lateral (
         select pp.price, pp.effective_from, pp.created_at from pack_prices pp
         where pp.pack_id = p.id and pp.effective_from <= ?::date
         order by pp.effective_from desc, pp.created_at desc limit 1) pr on true`,
      [asOf],
    )
    .where('p.business_id', businessId)
    .whereNull('p.archived_at')
    .orderBy('p.created_at')
    .select(
      'p.id', 'p.ingredient_id', 'p.supplier_id', 's.name as supplier_name', 'p.description', 'p.count', 'p.quantity', 'p.unit',
      'pr.price', 'pr.effective_from', 'pr.created_at as priced_at',
    );
  if (ingredientId) q.where('p.ingredient_id', ingredientId);
  return q;
}

export async function loadCostRows(db: Knex, businessId: string, asOf: string): Promise<CostRows> {
  const [business, ingredients, packs, measures, preparations, preparationLines, policies] = await Promise.all([
    findBusinessMoney(db, businessId),
    db('ingredients')
      .where({ business_id: businessId })
      .whereNull('archived_at')
      .orderBy('name')
      .select('id', 'name', 'category', 'base_unit', 'density_g_per_ml', 'yield_pct', 'allergens', 'costing_pack_id') as Promise<IngredientRow[]>,
    listPacksWithPrice(db, businessId, asOf),
    db('measures').where({ business_id: businessId }).orderBy('name').select('id', 'ingredient_id', 'preparation_id', 'name', 'quantity', 'unit') as Promise<MeasureRow[]>,
    db('preparations')
      .where({ business_id: businessId })
      .whereNull('archived_at')
      .orderBy('name')
      .select('id', 'name', 'yield_quantity', 'yield_unit', 'density_g_per_ml') as Promise<PreparationRow[]>,
    db('preparation_lines')
      .where({ business_id: businessId })
      .orderBy([{ column: 'parent_id' }, { column: 'position' }])
      .select('id', 'parent_id', 'position', 'ingredient_id', 'preparation_id', 'quantity', 'unit', 'measure_id') as Promise<PreparationLineRow[]>,
    listPolicies(db, businessId),
  ]);
  if (!business) throw new Error(`Business ${businessId} not found`);
  return { businessId, asOf, business, ingredients, packs, measures, preparations, preparationLines, policies };
}

export interface DrinkRow {
  id: string;
  name: string;
  category: string;
  temperature: 'hot' | 'iced';
}

export interface DrinkSizeRow {
  id: string;
  drink_id: string;
  size_id: string;
  size_name: string;
  volume_ml: string;
  position: number;
  price: string | null;
  price_version: number;
}

export interface BuildLineRow extends LineRow {
  drink_size_id: string;
}

export type MenuRows = Awaited<ReturnType<typeof loadMenuRows>>;

/**
 * Every live drink, its sizes and build lines: three queries for the whole menu (or one drink).
 * `price` is the menu price in force on `asOf` (default the business's today): the latest planned entry of
 * menu_price_history dated on or before it, else drink_sizes.price (see the migration
 * menu_price_schedule: due planned prices are read this way, no background job needed).
 */
export async function loadMenuRows(db: Knex, businessId: string, drinkId?: string, asOf?: string) {
  // Costing's services pass the day from deps.clock; callers that do not yet get the business's today.
  const day = asOf ?? (await businessToday(db, systemClock, businessId));
  const drinksQ = db('drinks').where({ business_id: businessId }).whereNull('archived_at').orderBy([{ column: 'category' }, { column: 'name' }]).select('id', 'name', 'category', 'temperature');
  const sizesQ = db('drink_sizes as ds')
    .join('cup_sizes as cs', 'cs.id', 'ds.size_id')
    .join('drinks as d', 'd.id', 'ds.drink_id')
    .where('ds.business_id', businessId)
    .whereNull('d.archived_at')
    .joinRaw(
      `left join lateral (
         select h.new_price from menu_price_history h
         where h.drink_size_id = ds.id and h.status = 'planned' and h.effective_from <= ?::date
         order by h.effective_from desc, h.changed_at desc limit 1) mp on true`,
      [day],
    )
    .orderBy([{ column: 'cs.position' }, { column: 'cs.volume_ml' }])
    .select('ds.id', 'ds.drink_id', 'ds.size_id', 'cs.name as size_name', 'cs.volume_ml', 'cs.position', db.raw('coalesce(mp.new_price, ds.price) as price'), 'ds.price_version');
  const linesQ = db('build_lines as bl')
    .join('drink_sizes as ds', 'ds.id', 'bl.drink_size_id')
    .join('drinks as d', 'd.id', 'ds.drink_id')
    .where('bl.business_id', businessId)
    .whereNull('d.archived_at')
    .orderBy([{ column: 'bl.drink_size_id' }, { column: 'bl.position' }])
    .select('bl.id', 'bl.drink_size_id', 'bl.position', 'bl.ingredient_id', 'bl.preparation_id', 'bl.quantity', 'bl.unit', 'bl.measure_id');
  if (drinkId) {
    drinksQ.where('id', drinkId);
    sizesQ.where('ds.drink_id', drinkId);
    linesQ.where('ds.drink_id', drinkId);
  }
  const [drinks, sizes, lines] = await Promise.all([drinksQ as Promise<DrinkRow[]>, sizesQ as Promise<DrinkSizeRow[]>, linesQ as Promise<BuildLineRow[]>]);
  return { drinks, sizes, lines };
}
