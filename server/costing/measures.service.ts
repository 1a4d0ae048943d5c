import type { z } from 'zod';
import type { measureInSchema } from '../../src/shared/contract/costing';
import type { AppDeps } from '../platform/deps';
import { guardWrite } from '../platform/db-errors';
import { invalidInput, notFound } from '../platform/errors';
import { presentMeasure } from './ingredients.presenter';
import { itemBaseUnit, unitProblem } from './lines.service';
import { deleteMeasure, findMeasure, findMeasureOwner, insertMeasures, updateMeasure, type MeasureColumns, type MeasureOwner } from './measures.repo';

type MeasureIn = z.output<typeof measureInSchema>;

function columns(m: Partial<MeasureIn>): MeasureColumns {
  const out: MeasureColumns = {};
  if (m.name !== undefined) out.name = m.name;
  if (m.quantity !== undefined) out.quantity = m.quantity;
  if (m.unit !== undefined) out.unit = m.unit;
  return out;
}

/** Refuses a unit that does not measure the item (mass ↔ volume needs a density). */
async function checkUnit({ db }: AppDeps, businessId: string, owner: MeasureOwner, unit: string) {
  const item = await findMeasureOwner(db, businessId, owner);
  if (!item) throw notFound(owner.ingredientId ? 'That ingredient' : 'That preparation');
  const base = itemBaseUnit(item);
  const problem = base ? unitProblem(unit, base, item.density) : null;
  if (problem) throw invalidInput({ unit: problem });
}

export async function add(deps: AppDeps, businessId: string, owner: MeasureOwner, m: MeasureIn) {
  await checkUnit(deps, businessId, owner, m.unit);
  const [row] = await guardWrite('A measure', () => insertMeasures(deps.db, businessId, owner, [{ name: m.name, quantity: m.quantity, unit: m.unit }]));
  return presentMeasure(row);
}

export async function update(deps: AppDeps, businessId: string, id: string, m: Partial<MeasureIn>) {
  const current = await findMeasure(deps.db, businessId, id);
  if (!current) throw notFound('That measure');
  if (m.unit) await checkUnit(deps, businessId, { ingredientId: current.ingredient_id, preparationId: current.preparation_id }, m.unit);
  const row = await guardWrite('A measure', () => updateMeasure(deps.db, businessId, id, columns(m)));
  if (!row) throw notFound('That measure');
  return presentMeasure(row);
}

export async function remove({ db }: AppDeps, businessId: string, id: string) {
  const n = await guardWrite('That measure', () => deleteMeasure(db, businessId, id));
  if (!n) throw notFound('That measure');
}
