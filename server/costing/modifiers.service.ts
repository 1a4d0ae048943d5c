import type { z } from 'zod';
import type { Modifier, modifierInSchema } from '../../src/shared/contract/costing';
import { groupBy } from '../../src/shared/collections';
import { businessToday } from '../platform/clock';
import { guardWrite } from '../platform/db-errors';
import type { AppDeps } from '../platform/deps';
import { notFound } from '../platform/errors';
import { loadCostModel } from './cost-model.service';
import { checkLines, throwIfFields } from './lines.service';
import { presentModifier } from './modifiers.presenter';
import { deleteModifier, findLiveModifier, insertModifier, loadModifiers, replaceModifierLines, updateModifier, type ModifierColumns } from './modifiers.repo';
import { knownSizeIds } from './sizes.repo';

type ModifierIn = z.output<typeof modifierInSchema>;

async function loadCosted(deps: AppDeps, businessId: string, id?: string) {
  const asOf = await businessToday(deps.db, deps.clock, businessId);
  const [{ modifiers, lines }, loaded] = await Promise.all([loadModifiers(deps.db, businessId, id), loadCostModel(deps.db, businessId, { asOf })]);
  const byModifier = groupBy(lines, (l) => l.modifier_id);
  return modifiers.map((m) => presentModifier(loaded, m, byModifier.get(m.id) ?? []));
}

export async function list(deps: AppDeps, businessId: string): Promise<Modifier[]> {
  return loadCosted(deps, businessId);
}

export async function get(deps: AppDeps, businessId: string, id: string): Promise<Modifier> {
  const [modifier] = await loadCosted(deps, businessId, id);
  if (!modifier) throw notFound('That modifier');
  return modifier;
}

/** Each line's cup size is this business's and its item a live one; an add-on only adds. */
async function validate({ db }: AppDeps, businessId: string, input: ModifierIn) {
  const fields = await checkLines(db, businessId, input.lines, (j) => `lines[${j}]`);
  const known = await knownSizeIds(db, businessId, input.lines.map((l) => l.sizeId));
  input.lines.forEach((l, j) => {
    if (!known.has(l.sizeId)) fields[`lines[${j}].sizeId`] = 'That cup size was not found.';
    if (input.kind === 'add' && l.action === 'remove') fields[`lines[${j}].action`] = 'An add-on only adds; make it a swap to remove something.';
  });
  throwIfFields(fields);
}

const columns = (input: ModifierIn): ModifierColumns => ({ name: input.name, kind: input.kind, upcharge: input.upcharge ?? null });

export async function create(deps: AppDeps, businessId: string, input: ModifierIn): Promise<Modifier> {
  await validate(deps, businessId, input);
  const id = await guardWrite('A modifier', () =>
    deps.db.transaction(async (trx) => {
      const created = await insertModifier(trx, businessId, columns(input));
      await replaceModifierLines(trx, businessId, created, input.lines);
      return created;
    }),
  );
  return get(deps, businessId, id);
}

export async function replace(deps: AppDeps, businessId: string, id: string, input: ModifierIn): Promise<Modifier> {
  if (!(await findLiveModifier(deps.db, businessId, id))) throw notFound('That modifier');
  await validate(deps, businessId, input);
  await guardWrite('A modifier', () =>
    deps.db.transaction(async (trx) => {
      await updateModifier(trx, businessId, id, columns(input));
      await replaceModifierLines(trx, businessId, id, input.lines);
    }),
  );
  return get(deps, businessId, id);
}

export async function remove({ db }: AppDeps, businessId: string, id: string): Promise<void> {
  if (!(await deleteModifier(db, businessId, id))) throw notFound('That modifier');
}
