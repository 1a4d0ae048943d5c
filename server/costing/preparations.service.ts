import type { Knex } from 'knex';
import { z } from 'zod';
import { ALLERGEN_CAUTION } from '../../src/shared/allergens';
import { rules } from '../../src/shared/checks';
import { writeLineCost } from '../../src/shared/costing';
import { writeCost } from '../../src/shared/money';
import { UNIT_CODES } from '../../src/shared/units';
import { invalidInput, notFound } from '../platform/errors';
import { loadCostModel, type CostedPreparation, type LoadedCostModel } from './cost-model.service';
import { measureInSchema } from './ingredients.service';
import { checkLines, lineColumns, lineInSchema, presentLine, throwIfFields, type LineIn } from './lines';
import { decimalString, name, optionalText } from './shared';
import { guardWrite } from '../platform/db-errors';
import { qty } from '../platform/present';

export const preparationInSchema = z.object({
  name: name('preparation'),
  yield: z.object({ quantity: decimalString(rules.positive), unit: z.enum(UNIT_CODES, { error: (issue) => `Unknown unit "${String(issue.input)}".` }) }),
  densityGPerMl: decimalString(rules.positive).nullish(),
  method: optionalText(5000),
  lines: z.array(lineInSchema).min(1, 'A preparation needs at least one line.').max(200),
  measures: z.array(measureInSchema).max(50).nullish(),
});
type PreparationIn = z.output<typeof preparationInSchema>;

function summary(loaded: LoadedCostModel, p: CostedPreparation) {
  return {
    id: p.row.id,
    name: p.row.name,
    yield: { quantity: qty(p.row.yield_quantity), unit: p.row.yield_unit },
    baseUnit: p.baseUnit,
    batchCost: p.batchCost ? writeCost(p.batchCost) : null,
    unitCost: p.unitCost ? writeCost(p.unitCost) : null,
    allergens: loaded.allergensOf([p.row.id]),
    problem: p.problem,
  };
}

export async function listPreparations(db: Knex, businessId: string) {
  const loaded = await loadCostModel(db, businessId);
  return { preparations: [...loaded.preparations.values()].map((p) => summary(loaded, p)), allergenCaution: ALLERGEN_CAUTION };
}

export async function getPreparation(db: Knex, businessId: string, id: string) {
  const loaded = await loadCostModel(db, businessId);
  const p = loaded.preparations.get(id);
  if (!p) throw notFound('That preparation');
  const names = { itemName: loaded.itemName, measureName: (m: string) => loaded.measures.get(m)?.name ?? null };
  const extra = await db('preparations').where({ business_id: businessId, id }).first('method');
  return {
    preparation: {
      ...summary(loaded, p),
      densityGPerMl: qty(p.row.density_g_per_ml),
      method: extra?.method ?? null,
      lines: p.lines.map((l, j) => {
        const c = p.lineCosts?.[j];
        const w = c ? writeLineCost(c) : null;
        return { ...presentLine(l, names), quantityInBaseUnit: w?.quantityInBaseUnit ?? null, baseUnit: w?.baseUnit ?? null, cost: w?.cost ?? null };
      }),
      measures: [...loaded.measures.values()].filter((m) => m.preparation_id === id).map((m) => ({ id: m.id, name: m.name, quantity: qty(m.quantity), unit: m.unit })),
    },
    allergenCaution: ALLERGEN_CAUTION,
  };
}

/**
 * Refuses lines that would make `selfId` (transitively) contain itself, naming the cycle by the
 * preparations' names: "Chai base → Chai mix → Chai base".
 */
async function checkNoCycle(db: Knex, businessId: string, selfId: string | null, selfName: string, lines: readonly LineIn[]) {
  if (!selfId) return; // a new preparation cannot be used by any other yet
  const [edges, preps] = await Promise.all([
    db('preparation_lines').where({ business_id: businessId }).whereNotNull('preparation_id').whereNot('parent_id', selfId).select('parent_id', 'preparation_id'),
    db('preparations').where({ business_id: businessId }).select('id', 'name'),
  ]);
  const names = new Map(preps.map((p) => [p.id as string, p.name as string]));
  names.set(selfId, selfName);
  const children = new Map<string, string[]>();
  for (const e of edges) children.set(e.parent_id, [...(children.get(e.parent_id) ?? []), e.preparation_id]);
  const pathTo = (from: string, seen: Set<string>): string[] | null => {
    if (from === selfId) return [from];
    if (seen.has(from)) return null;
    seen.add(from);
    for (const c of children.get(from) ?? []) {
      const rest = pathTo(c, seen);
      if (rest) return [from, ...rest];
    }
    return null;
  };
  const fields: Record<string, string> = {};
  lines.forEach((l, j) => {
    if (!l.preparationId) return;
    const path = pathTo(l.preparationId, new Set());
    if (path) fields[`lines[${j}].preparationId`] = `Preparation cycle: ${[selfId, ...path].map((id) => names.get(id)).join(' → ')}.`;
  });
  throwIfFields(fields);
}

async function validate(db: Knex, businessId: string, selfId: string | null, input: PreparationIn) {
  const fields = await checkLines(db, businessId, input.lines, (j) => `lines[${j}]`);
  throwIfFields(fields);
  await checkNoCycle(db, businessId, selfId, input.name, input.lines);
}

async function writeLines(trx: Knex, businessId: string, parentId: string, lines: readonly LineIn[]) {
  await trx('preparation_lines').where({ business_id: businessId, parent_id: parentId }).delete();
  await trx('preparation_lines').insert(lines.map((l, i) => ({ business_id: businessId, parent_id: parentId, ...lineColumns(l, i) })));
}

function columns(input: PreparationIn) {
  return { name: input.name, yield_quantity: input.yield.quantity, yield_unit: input.yield.unit, density_g_per_ml: input.densityGPerMl ?? null, method: input.method ?? null };
}

export async function createPreparation(db: Knex, businessId: string, input: PreparationIn) {
  await validate(db, businessId, null, input);
  const id = await guardWrite('A preparation', () =>
    db.transaction(async (trx) => {
      const [row] = await trx('preparations').insert({ business_id: businessId, ...columns(input) }).returning('id');
      await writeLines(trx, businessId, row.id, input.lines);
      if (input.measures?.length) {
        await trx('measures').insert(input.measures.map((m) => ({ business_id: businessId, preparation_id: row.id, name: m.name, quantity: m.quantity, unit: m.unit })));
      }
      return row.id as string;
    }),
  );
  return getPreparation(db, businessId, id);
}

export async function replacePreparation(db: Knex, businessId: string, id: string, input: PreparationIn) {
  if (!(await db('preparations').where({ business_id: businessId, id }).whereNull('archived_at').first('id'))) throw notFound('That preparation');
  if (input.lines.some((l) => l.preparationId === id)) {
    const j = input.lines.findIndex((l) => l.preparationId === id);
    throw invalidInput({ [`lines[${j}].preparationId`]: `Preparation cycle: ${input.name} → ${input.name}.` });
  }
  await validate(db, businessId, id, input);
  await guardWrite('A preparation', () =>
    db.transaction(async (trx) => {
      // Lock the business's preparations so two edits cannot together close a cycle.
      await trx.raw('select id from preparations where business_id = ? for update', [businessId]);
      await trx('preparations').where({ business_id: businessId, id }).update({ ...columns(input), updated_at: trx.fn.now() });
      await writeLines(trx, businessId, id, input.lines);
      if (input.measures) {
        for (const m of input.measures) {
          await trx('measures')
            .insert({ business_id: businessId, preparation_id: id, name: m.name, quantity: m.quantity, unit: m.unit })
            .onConflict(trx.raw('(coalesce(ingredient_id, preparation_id), lower(name))'))
            .merge({ quantity: m.quantity, unit: m.unit, updated_at: trx.fn.now() });
        }
      }
    }),
  );
  return getPreparation(db, businessId, id);
}

export async function deletePreparation(db: Knex, businessId: string, id: string) {
  const n = await guardWrite('That preparation', () => db('preparations').where({ business_id: businessId, id }).delete());
  if (!n) throw notFound('That preparation');
}
