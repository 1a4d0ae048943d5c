import type { Knex } from 'knex';
import type { BuildLineRow } from '../costing/cost-model.repo';
import type { WasteRow } from './cogs.repo';

// Plain rows for the waste log.

/** The build lines of drink sizes, in their order (a wasted drink is costed by its build). */
export async function buildLinesOf(db: Knex, sizeIds: readonly string[]): Promise<BuildLineRow[]> {
  if (!sizeIds.length) return [];
  return db('build_lines').whereIn('drink_size_id', sizeIds).orderBy('position').select('id', 'drink_size_id', 'position', 'ingredient_id', 'preparation_id', 'quantity', 'unit', 'measure_id');
}

/** Names of what was wasted: ingredients and preparations by name, drink sizes as "Latte (Regular)". */
export async function wasteItemNames(db: Knex, ids: { ingredients: string[]; preparations: string[]; sizes: string[] }): Promise<Map<string, string>> {
  const [a, b, c] = await Promise.all([
    ids.ingredients.length ? db('ingredients').whereIn('id', ids.ingredients).select('id', 'name') : [],
    ids.preparations.length ? db('preparations').whereIn('id', ids.preparations).select('id', 'name') : [],
    ids.sizes.length ? db('drink_sizes as ds').join('drinks as d', 'd.id', 'ds.drink_id').join('cup_sizes as cs', 'cs.id', 'ds.size_id').whereIn('ds.id', ids.sizes).select('ds.id', db.raw("d.name || ' (' || cs.name || ')' as name")) : [],
  ]);
  return new Map([...a, ...b, ...c].map((r: { id: string; name: string }) => [r.id, r.name]));
}

/** Who recorded each entry (null once the user is gone). */
export async function recordedBy(db: Knex, ids: readonly string[]): Promise<Map<string, string | null>> {
  if (!ids.length) return new Map();
  const rows = await db('waste_entries as w').leftJoin('users as u', 'u.id', 'w.recorded_by').whereIn('w.id', ids).select('w.id', 'u.name');
  return new Map(rows.map((r: { id: string; name: string | null }) => [r.id, r.name]));
}

/** A waste entry to write: the row as the report reads it, with its business and who recorded it. */
export type NewWaste = Omit<WasteRow, 'id'> & { business_id: string; recorded_by: string };

export async function insertWaste(db: Knex, row: NewWaste): Promise<{ id: string; occurred_on: string }> {
  const [out] = await db('waste_entries').insert(row).returning(['id', 'occurred_on']);
  return out;
}

export async function lockWaste(db: Knex, businessId: string, id: string): Promise<{ occurred_on: string } | undefined> {
  return db('waste_entries').where({ id, business_id: businessId }).forUpdate().first('occurred_on');
}

export async function deleteWasteRow(db: Knex, id: string): Promise<void> {
  await db('waste_entries').where({ id }).del();
}

export const WASTE_TABLES = { ingredient: 'ingredients', preparation: 'preparations', drinkSize: 'drink_sizes' } as const;

/** What waste can be recorded against: live ingredients, preparations and drink sizes, by name. */
export async function wasteChoiceRows(db: Knex, businessId: string) {
  const [ingredients, preparations, sizes] = await Promise.all([
    db('ingredients').where({ business_id: businessId }).whereNull('archived_at').orderBy('name').select('id', 'name', 'base_unit') as Promise<{ id: string; name: string; base_unit: 'g' | 'ml' | 'each' }[]>,
    db('preparations').where({ business_id: businessId }).whereNull('archived_at').orderBy('name').select('id', 'name', 'yield_unit') as Promise<{ id: string; name: string; yield_unit: string }[]>,
    db('drink_sizes as ds').join('drinks as d', 'd.id', 'ds.drink_id').join('cup_sizes as cs', 'cs.id', 'ds.size_id')
      .where('ds.business_id', businessId).whereNull('d.archived_at')
      .orderBy([{ column: 'd.name' }, { column: 'cs.position' }])
      .select('ds.id', 'd.name as drink_name', 'cs.name as size_name') as Promise<{ id: string; drink_name: string; size_name: string }[]>,
  ]);
  return { ingredients, preparations, sizes };
}
