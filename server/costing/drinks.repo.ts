import type { Knex } from 'knex';
import { lineColumns, type LineValues } from './lines.repo';

export interface DrinkDetailRow {
  id: string;
  name: string;
  category: string;
  temperature: 'hot' | 'iced';
  notes: string | null;
  expected_weekly_cups: number | null;
}

export type DrinkColumns = Omit<DrinkDetailRow, 'id'>;

export interface LockedDrinkSize {
  id: string;
  size_id: string;
  price: string | null;
}

export async function findLiveDrink(db: Knex, businessId: string, id: string): Promise<DrinkDetailRow | undefined> {
  return db('drinks').where({ business_id: businessId, id }).whereNull('archived_at').first('id', 'name', 'category', 'temperature', 'notes', 'expected_weekly_cups');
}

/** The names of the items and measures a drink's lines use. */
export async function loadLineNames(db: Knex, businessId: string, drinkId: string) {
  const [items, measures] = await Promise.all([
    db.raw(
      `select i.id, i.name from ingredients i where i.business_id = :b and i.id in (
         select bl.ingredient_id from build_lines bl join drink_sizes ds on ds.id = bl.drink_size_id where ds.drink_id = :id)
       union all select p.id, p.name from preparations p where p.business_id = :b and p.id in (
         select bl.preparation_id from build_lines bl join drink_sizes ds on ds.id = bl.drink_size_id where ds.drink_id = :id)`,
      { b: businessId, id: drinkId },
    ),
    db('measures as m')
      .join('build_lines as bl', 'bl.measure_id', 'm.id')
      .join('drink_sizes as ds', 'ds.id', 'bl.drink_size_id')
      .where({ 'ds.drink_id': drinkId, 'm.business_id': businessId })
      .distinct<{ id: string; name: string }[]>('m.id', 'm.name'),
  ]);
  return {
    items: new Map<string, string>(items.rows.map((r: { id: string; name: string }) => [r.id, r.name])),
    measures: new Map<string, string>(measures.map((m) => [m.id, m.name])),
  };
}

export async function insertDrink(db: Knex, businessId: string, values: DrinkColumns): Promise<string> {
  const [row] = await db('drinks').insert({ business_id: businessId, ...values }).returning('id');
  return row.id;
}

export async function updateDrink(db: Knex, businessId: string, id: string, values: DrinkColumns): Promise<void> {
  await db('drinks').where({ business_id: businessId, id }).update({ ...values, updated_at: db.fn.now() });
}

export async function archiveDrink(db: Knex, businessId: string, id: string): Promise<number> {
  return db('drinks').where({ business_id: businessId, id }).whereNull('archived_at').update({ archived_at: db.fn.now() });
}

/** The drink's sizes, locked for the rest of the transaction. */
export async function lockDrinkSizes(trx: Knex, businessId: string, drinkId: string): Promise<LockedDrinkSize[]> {
  return trx('drink_sizes').where({ business_id: businessId, drink_id: drinkId }).forUpdate().select('id', 'size_id', 'price');
}

export async function deleteDrinkSizes(trx: Knex, businessId: string, ids: readonly string[]): Promise<void> {
  if (ids.length) await trx('drink_sizes').where({ business_id: businessId }).whereIn('id', ids).delete();
}

export async function insertDrinkSize(trx: Knex, businessId: string, drinkId: string, sizeId: string, price: string | null): Promise<string> {
  const [row] = await trx('drink_sizes').insert({ business_id: businessId, drink_id: drinkId, size_id: sizeId, price }).returning('id');
  return row.id;
}

/** A new menu price for a drink size; its version moves on, so a repricing previewed before it is refused. */
export async function setDrinkSizePrice(trx: Knex, businessId: string, drinkSizeId: string, price: string | null): Promise<void> {
  await trx('drink_sizes').where({ business_id: businessId, id: drinkSizeId }).update({ price, price_version: trx.raw('price_version + 1'), updated_at: trx.fn.now() });
}

export async function insertPriceHistory(
  trx: Knex,
  businessId: string,
  values: { drink_size_id: string; old_price: string | null; new_price: string; effective_from: string; reason: string; changed_by: string },
): Promise<void> {
  await trx('menu_price_history').insert({ business_id: businessId, ...values });
}

export async function replaceBuildLines(trx: Knex, businessId: string, drinkSizeId: string, lines: readonly LineValues[]): Promise<void> {
  await trx('build_lines').where({ business_id: businessId, drink_size_id: drinkSizeId }).delete();
  if (lines.length) await trx('build_lines').insert(lines.map((l, i) => ({ business_id: businessId, drink_size_id: drinkSizeId, ...lineColumns(l, i) })));
}

/** Every live drink with its cup sizes' names, for the recipe cards. */
export async function listCardRows(db: Knex, businessId: string) {
  return db('drinks as d')
    .leftJoin('drink_sizes as ds', 'ds.drink_id', 'd.id')
    .leftJoin('cup_sizes as cs', 'cs.id', 'ds.size_id')
    .where('d.business_id', businessId)
    .whereNull('d.archived_at')
    .orderBy([{ column: 'd.category' }, { column: 'd.name' }, { column: 'cs.position' }, { column: 'cs.volume_ml' }])
    .select<{ id: string; name: string; category: string; temperature: 'hot' | 'iced'; size_name: string | null }[]>('d.id', 'd.name', 'd.category', 'd.temperature', 'cs.name as size_name');
}

/** What each live modifier adds (its items), for the allergens a card lists beside its add-ons. */
export async function listAddedItems(db: Knex, businessId: string) {
  return db('modifier_lines as ml')
    .join('modifiers as m', 'm.id', 'ml.modifier_id')
    .where('ml.business_id', businessId)
    .where('ml.action', 'add')
    .whereNull('m.archived_at')
    .orderBy('m.name')
    .select<{ id: string; name: string; ingredient_id: string | null; preparation_id: string | null }[]>('m.id', 'm.name', 'ml.ingredient_id', 'ml.preparation_id');
}
