import type { Knex } from 'knex';
import type { z } from 'zod';
import { dec } from '../../src/shared/decimal';
import { conversionFactor, UnitConversionError, type BaseUnit } from '../../src/shared/units';
import { invalidInput, notFound } from '../platform/errors';
import type { measureInSchema } from './ingredients.service';
import { yieldBaseUnit } from './shared';
import { guardWrite } from '../platform/db-errors';
import { qty } from '../platform/present';

type MeasureIn = z.output<typeof measureInSchema>;
const COLS = ['id', 'ingredient_id', 'preparation_id', 'name', 'quantity', 'unit'];

function present(m: { id: string; ingredient_id: string | null; preparation_id: string | null; name: string; quantity: string; unit: string }) {
  return { id: m.id, ingredientId: m.ingredient_id, preparationId: m.preparation_id, name: m.name, quantity: qty(m.quantity), unit: m.unit };
}

async function itemUnits(db: Knex, businessId: string, owner: { ingredientId?: string | null; preparationId?: string | null }): Promise<{ baseUnit: BaseUnit; density: string | null }> {
  if (owner.ingredientId) {
    const i = await db('ingredients').where({ business_id: businessId, id: owner.ingredientId }).whereNull('archived_at').first('base_unit', 'density_g_per_ml');
    if (!i) throw notFound('That ingredient');
    return { baseUnit: i.base_unit, density: i.density_g_per_ml };
  }
  const p = await db('preparations').where({ business_id: businessId, id: owner.preparationId }).whereNull('archived_at').first('yield_unit', 'density_g_per_ml');
  if (!p) throw notFound('That preparation');
  return { baseUnit: yieldBaseUnit(String(p.yield_unit)) ?? 'each', density: p.density_g_per_ml };
}

function checkUnit(unit: string, u: { baseUnit: BaseUnit; density: string | null }) {
  try {
    conversionFactor(unit, u.baseUnit, u.density ? dec(u.density) : null);
  } catch (e) {
    if (e instanceof UnitConversionError) throw invalidInput({ unit: e.message });
    throw e;
  }
}

export async function addMeasure(db: Knex, businessId: string, owner: { ingredientId?: string; preparationId?: string }, m: MeasureIn) {
  checkUnit(m.unit, await itemUnits(db, businessId, owner));
  const [row] = await guardWrite('A measure', () =>
    db('measures')
      .insert({ business_id: businessId, ingredient_id: owner.ingredientId ?? null, preparation_id: owner.preparationId ?? null, name: m.name, quantity: m.quantity, unit: m.unit })
      .returning(COLS),
  );
  return { measure: present(row) };
}

export async function updateMeasure(db: Knex, businessId: string, id: string, m: Partial<MeasureIn>) {
  const current = await db('measures').where({ business_id: businessId, id }).first(COLS);
  if (!current) throw notFound('That measure');
  if (m.unit) checkUnit(m.unit, await itemUnits(db, businessId, { ingredientId: current.ingredient_id, preparationId: current.preparation_id }));
  const patch: Record<string, unknown> = { updated_at: db.fn.now() };
  if (m.name !== undefined) patch.name = m.name;
  if (m.quantity !== undefined) patch.quantity = m.quantity;
  if (m.unit !== undefined) patch.unit = m.unit;
  const [row] = await guardWrite('A measure', () => db('measures').where({ business_id: businessId, id }).update(patch).returning(COLS));
  return { measure: present(row) };
}

export async function deleteMeasure(db: Knex, businessId: string, id: string) {
  const n = await guardWrite('That measure', () => db('measures').where({ business_id: businessId, id }).delete());
  if (!n) throw notFound('That measure');
}
