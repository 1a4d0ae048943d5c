import type { Knex } from 'knex';
import { lineColumns, type LineValues } from './lines.repo';

export interface PreparationColumns {
  name: string;
  yield_quantity: string;
  yield_unit: string;
  density_g_per_ml: string | null;
  method: string | null;
}

export async function findLivePreparation(db: Knex, businessId: string, id: string) {
  return db('preparations').where({ business_id: businessId, id }).whereNull('archived_at').first<{ id: string } | undefined>('id');
}

export async function findMethod(db: Knex, businessId: string, id: string): Promise<string | null> {
  return (await db('preparations').where({ business_id: businessId, id }).first('method'))?.method ?? null;
}

/** Every edge "parent uses child" between the business's preparations, but those of `except`. */
export async function listPreparationEdges(db: Knex, businessId: string, except: string) {
  return db('preparation_lines').where({ business_id: businessId }).whereNotNull('preparation_id').whereNot('parent_id', except).select<{ parent_id: string; preparation_id: string }[]>('parent_id', 'preparation_id');
}

export async function listPreparationNames(db: Knex, businessId: string) {
  return db('preparations').where({ business_id: businessId }).select<{ id: string; name: string }[]>('id', 'name');
}

/** Locks every preparation of the business, so two edits cannot together close a cycle. */
export async function lockPreparations(trx: Knex, businessId: string): Promise<void> {
  await trx('preparations').where({ business_id: businessId }).forUpdate().select('id');
}

export async function insertPreparation(db: Knex, businessId: string, values: PreparationColumns): Promise<string> {
  const [row] = await db('preparations').insert({ business_id: businessId, ...values }).returning('id');
  return row.id;
}

export async function updatePreparation(db: Knex, businessId: string, id: string, values: PreparationColumns): Promise<void> {
  await db('preparations').where({ business_id: businessId, id }).update({ ...values, updated_at: db.fn.now() });
}

export async function replacePreparationLines(db: Knex, businessId: string, parentId: string, lines: readonly LineValues[]): Promise<void> {
  await db('preparation_lines').where({ business_id: businessId, parent_id: parentId }).delete();
  if (lines.length) await db('preparation_lines').insert(lines.map((l, i) => ({ business_id: businessId, parent_id: parentId, ...lineColumns(l, i) })));
}

export async function lockLivePreparation(trx: Knex, businessId: string, id: string) {
  return trx('preparations').where({ business_id: businessId, id }).whereNull('archived_at').forUpdate().first('id');
}

export async function deletePreparation(db: Knex, businessId: string, id: string): Promise<number> {
  return db('preparations').where({ business_id: businessId, id }).delete();
}

/** Archives a preparation: lists and pickers no longer show it; waste and retired drinks keep it. */
export async function archivePreparation(db: Knex, businessId: string, id: string): Promise<void> {
  await db('preparations').where({ business_id: businessId, id }).update({ archived_at: db.fn.now(), updated_at: db.fn.now() });
}
