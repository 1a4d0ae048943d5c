import type { Knex } from 'knex';
import type { LineRow } from './cost-model.repo';
import { lineColumns, type LineValues } from './lines.repo';

export interface ModifierRow {
  id: string;
  name: string;
  kind: 'add' | 'swap';
  upcharge: string | null;
}

export interface ModifierLineRow extends LineRow {
  modifier_id: string;
  size_id: string;
  size_name: string;
  action: 'add' | 'remove';
}

export type ModifierColumns = Omit<ModifierRow, 'id'>;

/** The live modifiers (or one) and their lines, by cup size then position. */
export async function loadModifiers(db: Knex, businessId: string, id?: string) {
  const mq = db('modifiers').where({ business_id: businessId }).whereNull('archived_at').orderBy('name').select('id', 'name', 'kind', 'upcharge');
  const lq = db('modifier_lines as ml')
    .join('cup_sizes as cs', 'cs.id', 'ml.size_id')
    .where('ml.business_id', businessId)
    .orderBy([{ column: 'cs.position' }, { column: 'ml.position' }])
    .select('ml.id', 'ml.modifier_id', 'ml.size_id', 'cs.name as size_name', 'ml.action', 'ml.position', 'ml.ingredient_id', 'ml.preparation_id', 'ml.quantity', 'ml.unit', 'ml.measure_id');
  if (id) {
    mq.where('id', id);
    lq.where('ml.modifier_id', id);
  }
  const [modifiers, lines] = await Promise.all([mq as Promise<ModifierRow[]>, lq as Promise<ModifierLineRow[]>]);
  return { modifiers, lines };
}

export async function findLiveModifier(db: Knex, businessId: string, id: string) {
  return db('modifiers').where({ business_id: businessId, id }).whereNull('archived_at').first<{ id: string } | undefined>('id');
}

export async function insertModifier(db: Knex, businessId: string, values: ModifierColumns): Promise<string> {
  const [row] = await db('modifiers').insert({ business_id: businessId, ...values }).returning('id');
  return row.id;
}

export async function updateModifier(db: Knex, businessId: string, id: string, values: ModifierColumns): Promise<void> {
  await db('modifiers').where({ business_id: businessId, id }).update({ ...values, updated_at: db.fn.now() });
}

export async function replaceModifierLines(db: Knex, businessId: string, id: string, lines: readonly (LineValues & { sizeId: string; action: 'add' | 'remove' })[]): Promise<void> {
  await db('modifier_lines').where({ business_id: businessId, modifier_id: id }).delete();
  if (lines.length) {
    await db('modifier_lines').insert(lines.map((l, i) => ({ business_id: businessId, modifier_id: id, size_id: l.sizeId, action: l.action, ...lineColumns(l, i) })));
  }
}

export async function deleteModifier(db: Knex, businessId: string, id: string): Promise<number> {
  return db('modifiers').where({ business_id: businessId, id }).delete();
}
