import type { Knex } from 'knex';
import { z } from 'zod';
import { rules } from '../../src/shared/checks';
import { writeCost, writeMoney } from '../../src/shared/money';
import { suggestUpcharge } from '../../src/shared/pricing';
import { notFound } from '../platform/errors';
import type { LineRow } from './cost-model.repo';
import { loadCostModel, type LoadedCostModel } from './cost-model.service';
import { checkLines, lineColumns, lineInSchema, presentLine, throwIfFields } from './lines';
import { decimalString, name } from './shared';
import { groupBy } from '../../src/shared/collections';
import { guardWrite } from '../platform/db-errors';

export const modifierInSchema = z.object({
  name: name('modifier'),
  kind: z.enum(['add', 'swap'], { error: 'Choose an add-on or a swap.' }),
  upcharge: decimalString(rules.nonNegative).nullish(),
  lines: z.array(lineInSchema.and(z.object({ sizeId: z.uuid('Choose a cup size.'), action: z.enum(['add', 'remove'], { error: 'Choose add or remove.' }) }))).max(400),
});
type ModifierIn = z.output<typeof modifierInSchema>;

interface ModifierLineRow extends LineRow {
  modifier_id: string;
  size_id: string;
  action: 'add' | 'remove';
}

async function loadModifiers(db: Knex, businessId: string, id?: string) {
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
  const [modifiers, lines] = await Promise.all([mq, lq as Promise<(ModifierLineRow & { size_name: string })[]>]);
  return { modifiers, lines };
}

/**
 * A modifier per cup size: cost delta = cost of the added lines − cost of the removed ones, and
 * the upcharge that keeps the business's target margin on that delta (suggestUpcharge).
 */
function present(loaded: LoadedCostModel, m: { id: string; name: string; kind: string; upcharge: string | null }, lines: (ModifierLineRow & { size_name: string })[]) {
  const names = { itemName: loaded.itemName, measureName: (x: string) => loaded.measures.get(x)?.name ?? null };
  const policy = loaded.defaultPolicy;
  const sizes = [...groupBy(lines, (l) => l.size_id).values()].map((ls) => {
    const add = loaded.costStoredLines(ls.filter((l) => l.action === 'add'));
    const remove = loaded.costStoredLines(ls.filter((l) => l.action === 'remove'));
    const problem = !add.ok ? add.problem : !remove.ok ? remove.problem : null;
    const delta = add.ok && remove.ok ? add.cost.minus(remove.cost) : null;
    return {
      sizeId: ls[0].size_id,
      name: ls[0].size_name,
      lines: ls.map((l) => ({ ...presentLine(l, names), action: l.action })),
      costDelta: delta ? writeCost(delta) : null,
      suggestedUpcharge: delta ? suggestUpcharge(delta, policy, loaded.currency) : null,
      problem,
    };
  });
  return {
    id: m.id,
    name: m.name,
    kind: m.kind,
    upcharge: m.upcharge === null ? null : writeMoney(m.upcharge, loaded.currency),
    sizes,
    allergens: loaded.allergensOf(lines.filter((l) => l.action === 'add').map((l) => (l.ingredient_id ?? l.preparation_id) as string)),
  };
}

export async function listModifiers(db: Knex, businessId: string) {
  const [{ modifiers, lines }, loaded] = await Promise.all([loadModifiers(db, businessId), loadCostModel(db, businessId)]);
  const byModifier = groupBy(lines, (l) => l.modifier_id);
  return { modifiers: modifiers.map((m) => present(loaded, m, byModifier.get(m.id) ?? [])) };
}

export async function getModifier(db: Knex, businessId: string, id: string) {
  const [{ modifiers, lines }, loaded] = await Promise.all([loadModifiers(db, businessId, id), loadCostModel(db, businessId)]);
  if (!modifiers[0]) throw notFound('That modifier');
  return { modifier: present(loaded, modifiers[0], lines) };
}

async function validate(db: Knex, businessId: string, input: ModifierIn) {
  const fields = await checkLines(db, businessId, input.lines, (j) => `lines[${j}]`);
  const sizeIds = [...new Set(input.lines.map((l) => l.sizeId))];
  const known = new Set((await db('cup_sizes').where({ business_id: businessId }).whereIn('id', sizeIds).select('id')).map((r) => r.id));
  input.lines.forEach((l, j) => {
    if (!known.has(l.sizeId)) fields[`lines[${j}].sizeId`] = 'That cup size was not found.';
    if (input.kind === 'add' && l.action === 'remove') fields[`lines[${j}].action`] = 'An add-on only adds; make it a swap to remove something.';
  });
  throwIfFields(fields);
}

async function writeLines(trx: Knex, businessId: string, id: string, lines: ModifierIn['lines']) {
  await trx('modifier_lines').where({ business_id: businessId, modifier_id: id }).delete();
  if (lines.length) {
    await trx('modifier_lines').insert(lines.map((l, i) => ({ business_id: businessId, modifier_id: id, size_id: l.sizeId, action: l.action, ...lineColumns(l, i) })));
  }
}

export async function createModifier(db: Knex, businessId: string, input: ModifierIn) {
  await validate(db, businessId, input);
  const id = await guardWrite('A modifier', () =>
    db.transaction(async (trx) => {
      const [row] = await trx('modifiers').insert({ business_id: businessId, name: input.name, kind: input.kind, upcharge: input.upcharge ?? null }).returning('id');
      await writeLines(trx, businessId, row.id, input.lines);
      return row.id as string;
    }),
  );
  return getModifier(db, businessId, id);
}

export async function replaceModifier(db: Knex, businessId: string, id: string, input: ModifierIn) {
  if (!(await db('modifiers').where({ business_id: businessId, id }).whereNull('archived_at').first('id'))) throw notFound('That modifier');
  await validate(db, businessId, input);
  await guardWrite('A modifier', () =>
    db.transaction(async (trx) => {
      await trx('modifiers').where({ business_id: businessId, id }).update({ name: input.name, kind: input.kind, upcharge: input.upcharge ?? null, updated_at: trx.fn.now() });
      await writeLines(trx, businessId, id, input.lines);
    }),
  );
  return getModifier(db, businessId, id);
}

export async function deleteModifier(db: Knex, businessId: string, id: string) {
  const n = await db('modifiers').where({ business_id: businessId, id }).delete();
  if (!n) throw notFound('That modifier');
}

