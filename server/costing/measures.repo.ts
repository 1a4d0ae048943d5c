import type { Knex } from 'knex';
import type { MeasureRow } from './cost-model.repo';

export type { MeasureRow };

const COLUMNS = ['id', 'ingredient_id', 'preparation_id', 'name', 'quantity', 'unit'];

export interface MeasureOwner {
  ingredientId?: string | null;
  preparationId?: string | null;
}

export type MeasureColumns = Partial<Pick<MeasureRow, 'name' | 'quantity' | 'unit'>>;

export async function findMeasure(db: Knex, businessId: string, id: string): Promise<MeasureRow | undefined> {
  return db('measures').where({ business_id: businessId, id }).first(COLUMNS);
}

/** The units a measure of a live item is converted with: its base or yield unit and its density. */
export async function findMeasureOwner(db: Knex, businessId: string, owner: MeasureOwner) {
  if (owner.ingredientId) {
    const i = await db('ingredients').where({ business_id: businessId, id: owner.ingredientId }).whereNull('archived_at').first('base_unit', 'density_g_per_ml');
    return i ? { kind: 'ingredient' as const, unit: i.base_unit as string, density: i.density_g_per_ml as string | null } : undefined;
  }
  const p = await db('preparations').where({ business_id: businessId, id: owner.preparationId }).whereNull('archived_at').first('yield_unit', 'density_g_per_ml');
  return p ? { kind: 'preparation' as const, unit: p.yield_unit as string, density: p.density_g_per_ml as string | null } : undefined;
}

export async function insertMeasures(db: Knex, businessId: string, owner: MeasureOwner, measures: readonly Required<MeasureColumns>[]): Promise<MeasureRow[]> {
  if (measures.length === 0) return [];
  return db('measures')
    .insert(measures.map((m) => ({ business_id: businessId, ingredient_id: owner.ingredientId ?? null, preparation_id: owner.preparationId ?? null, ...m })))
    .returning(COLUMNS);
}

/** Adds a preparation's measures, or changes the quantity and unit of one of the same name. */
export async function upsertPreparationMeasures(db: Knex, businessId: string, preparationId: string, measures: readonly Required<MeasureColumns>[]): Promise<void> {
  for (const m of measures) {
    await db('measures')
      .insert({ business_id: businessId, preparation_id: preparationId, ...m })
      .onConflict(db.raw('(coalesce(ingredient_id, preparation_id), lower(name))'))
      .merge({ quantity: m.quantity, unit: m.unit, updated_at: db.fn.now() });
  }
}

export async function updateMeasure(db: Knex, businessId: string, id: string, values: MeasureColumns): Promise<MeasureRow | undefined> {
  const [row] = await db('measures').where({ business_id: businessId, id }).update({ ...values, updated_at: db.fn.now() }).returning(COLUMNS);
  return row;
}

export async function deleteMeasure(db: Knex, businessId: string, id: string): Promise<number> {
  return db('measures').where({ business_id: businessId, id }).delete();
}
