import type { Knex } from 'knex';
import type { LineRow } from '../costing/cost-model.repo';

// Plain rows for repricing: a fixed handful of queries per operation.

export interface ModifierLineRow extends LineRow {
  modifier_id: string;
  modifier_name: string;
  kind: 'add' | 'swap';
  upcharge: string | null;
  size_id: string;
  size_name: string;
  size_position: number;
  action: 'add' | 'remove';
}

export async function listModifierLines(db: Knex, businessId: string): Promise<ModifierLineRow[]> {
  return db('modifier_lines as ml')
    .join('modifiers as m', 'm.id', 'ml.modifier_id')
    .join('cup_sizes as cs', 'cs.id', 'ml.size_id')
    .where('ml.business_id', businessId)
    .whereNull('m.archived_at')
    .orderBy([{ column: 'm.name' }, { column: 'cs.position' }, { column: 'ml.position' }])
    .select(
      'ml.id', 'ml.modifier_id', 'm.name as modifier_name', 'm.kind', 'm.upcharge', 'ml.size_id', 'cs.name as size_name', 'cs.position as size_position',
      'ml.action', 'ml.position', 'ml.ingredient_id', 'ml.preparation_id', 'ml.quantity', 'ml.unit', 'ml.measure_id',
    );
}

/** Cups sold per drink size between two dates (inclusive), from imported till sales, all sites. */
export async function cupsSold(db: Knex, businessId: string, from: string, to: string): Promise<Map<string, string>> {
  const rows: { drink_size_id: string; cups: string }[] = await db('sales_lines')
    .where({ business_id: businessId })
    .whereBetween('sold_on', [from, to])
    .groupBy('drink_size_id')
    .select('drink_size_id', db.raw('sum(quantity)::text as cups'));
  return new Map(rows.map((r) => [r.drink_size_id, r.cups]));
}

export async function expectedWeeklyCups(db: Knex, businessId: string): Promise<Map<string, number>> {
  const rows: { id: string; expected_weekly_cups: number | null }[] = await db('drinks')
    .where({ business_id: businessId })
    .whereNull('archived_at')
    .whereNotNull('expected_weekly_cups')
    .select('id', 'expected_weekly_cups');
  return new Map(rows.map((r) => [r.id, r.expected_weekly_cups as number]));
}

export interface ScenarioRow {
  id: string;
  business_id: string;
  name: string;
  notes: string | null;
  changes: { ingredientId: string; newPrice: string }[];
  prices_as_of: string | null;
  decisions: { drinkSizeId: string; choice: 'keep' | 'suggested' | 'price'; price?: string }[];
  keep_ladder: boolean;
  snapshot: Record<string, number>;
  status: 'draft' | 'applied';
  effective_from: string | null;
  created_by: string | null;
  created_by_name: string | null;
  applied_by: string | null;
  applied_by_name: string | null;
  applied_at: Date | null;
  created_at: Date;
  updated_at: Date;
}

function scenarioQuery(db: Knex, businessId: string) {
  return db('reprice_scenarios as s')
    .leftJoin('users as cu', 'cu.id', 's.created_by')
    .leftJoin('users as au', 'au.id', 's.applied_by')
    .where('s.business_id', businessId)
    .select('s.*', 'cu.name as created_by_name', 'au.name as applied_by_name');
}

export async function listScenarios(db: Knex, businessId: string): Promise<ScenarioRow[]> {
  return scenarioQuery(db, businessId).orderBy([{ column: 's.status' }, { column: 's.updated_at', order: 'desc' }]);
}

export async function findScenarios(db: Knex, businessId: string, ids: readonly string[]): Promise<ScenarioRow[]> {
  return scenarioQuery(db, businessId).whereIn('s.id', ids);
}

export async function findScenario(db: Knex, businessId: string, id: string): Promise<ScenarioRow | undefined> {
  return scenarioQuery(db, businessId).where('s.id', id).first();
}

export interface LockedDrinkSize {
  id: string;
  drink_id: string;
  drink_name: string;
  size_id: string;
  size_name: string;
  position: number;
  price: string | null;
  price_version: number;
}

/** Every size of the given live drinks, locked for the rest of the transaction. */
export async function lockDrinkSizes(trx: Knex.Transaction, businessId: string, drinkIds: readonly string[]): Promise<LockedDrinkSize[]> {
  return trx('drink_sizes as ds')
    .join('drinks as d', 'd.id', 'ds.drink_id')
    .join('cup_sizes as cs', 'cs.id', 'ds.size_id')
    .where('ds.business_id', businessId)
    .whereIn('ds.drink_id', drinkIds)
    .whereNull('d.archived_at')
    .orderBy([{ column: 'ds.drink_id' }, { column: 'cs.position' }, { column: 'cs.volume_ml' }])
    .forUpdate('ds')
    .select('ds.id', 'ds.drink_id', 'd.name as drink_name', 'ds.size_id', 'cs.name as size_name', 'cs.position', 'ds.price', 'ds.price_version');
}

export interface PriceHistoryRow {
  id: string;
  drink_size_id: string;
  size_id: string;
  size_name: string;
  old_price: string | null;
  new_price: string;
  effective_from: string;
  reason: string | null;
  scenario_id: string | null;
  scenario_name: string | null;
  changed_by: string | null;
  changed_by_name: string | null;
  changed_at: Date;
  status: 'applied' | 'planned' | 'cancelled';
  cancelled_at: Date | null;
}

export async function priceHistory(db: Knex, businessId: string, drinkId: string): Promise<PriceHistoryRow[]> {
  return db('menu_price_history as h')
    .join('drink_sizes as ds', 'ds.id', 'h.drink_size_id')
    .join('cup_sizes as cs', 'cs.id', 'ds.size_id')
    .leftJoin('reprice_scenarios as s', 's.id', 'h.scenario_id')
    .leftJoin('users as u', 'u.id', 'h.changed_by')
    .where('h.business_id', businessId)
    .where('ds.drink_id', drinkId)
    .orderBy([{ column: 'h.changed_at', order: 'desc' }, { column: 'cs.position' }])
    .select(
      'h.id', 'h.drink_size_id', 'ds.size_id', 'cs.name as size_name', 'h.old_price', 'h.new_price', db.raw("to_char(h.effective_from, 'YYYY-MM-DD') as effective_from"),
      'h.reason', 'h.scenario_id', 's.name as scenario_name', 'h.changed_by', 'u.name as changed_by_name', 'h.changed_at', 'h.status', 'h.cancelled_at',
    );
}

/** The latest effective date, on or before `date`, among the menu's price changes (cancelled plans aside; null when none). */
export async function menuPricesEffectiveFrom(db: Knex, businessId: string, date: string): Promise<string | null> {
  const row = await db('menu_price_history as h')
    .join('drink_sizes as ds', 'ds.id', 'h.drink_size_id')
    .join('drinks as d', 'd.id', 'ds.drink_id')
    .where('h.business_id', businessId)
    .whereNot('h.status', 'cancelled')
    .where('h.effective_from', '<=', date)
    .whereNull('d.archived_at')
    .first(db.raw("to_char(max(h.effective_from), 'YYYY-MM-DD') as d"));
  return (row as { d: string | null } | undefined)?.d ?? null;
}

export interface PlannedPriceRow {
  ingredient_id: string;
  ingredient_name: string;
  costing_pack_id: string | null;
  pack_id: string;
  description: string;
  price: string;
  effective_from: string;
  note: string | null;
}

/** Pack prices dated after `today`: changes a supplier has announced. */
export async function plannedPackPrices(db: Knex, businessId: string, today: string): Promise<PlannedPriceRow[]> {
  return db('pack_prices as pp')
    .join('packs as p', 'p.id', 'pp.pack_id')
    .join('ingredients as i', 'i.id', 'p.ingredient_id')
    .where('pp.business_id', businessId)
    .where('pp.effective_from', '>', today)
    .whereNull('p.archived_at')
    .whereNull('i.archived_at')
    .orderBy([{ column: 'pp.effective_from' }, { column: 'i.name' }])
    .select('i.id as ingredient_id', 'i.name as ingredient_name', 'i.costing_pack_id', 'p.id as pack_id', 'p.description', 'pp.price', db.raw("to_char(pp.effective_from, 'YYYY-MM-DD') as effective_from"), 'pp.note');
}

export async function businessName(db: Knex, businessId: string) {
  return db('businesses').where({ id: businessId }).first<{ name: string; currency: string; tax_mode: 'inclusive' | 'exclusive'; country: string }>('name', 'currency', 'tax_mode', 'country');
}
