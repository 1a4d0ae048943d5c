import type { z } from 'zod';
import { ALLERGEN_CAUTION } from '../../src/shared/allergens';
import type { preparationInSchema } from '../../src/shared/contract/costing';
import { businessToday } from '../platform/clock';
import { deleteUnlessReferenced, guardWrite } from '../platform/db-errors';
import type { AppDeps } from '../platform/deps';
import { invalidInput, notFound } from '../platform/errors';
import { loadCostModel } from './cost-model.service';
import { checkLines, refuseIfUsed, throwIfFields } from './lines.service';
import type { LineValues } from './lines.repo';
import { insertMeasures, upsertPreparationMeasures } from './measures.repo';
import { presentPreparationDetail, presentPreparationSummary } from './preparations.presenter';
import {
  archivePreparation,
  deletePreparation,
  findLivePreparation,
  findMethod,
  insertPreparation,
  listPreparationEdges,
  listPreparationNames,
  lockLivePreparation,
  lockPreparations,
  replacePreparationLines,
  updatePreparation,
  type PreparationColumns,
} from './preparations.repo';

type PreparationIn = z.output<typeof preparationInSchema>;

function columns(input: PreparationIn): PreparationColumns {
  return { name: input.name, yield_quantity: input.yield.quantity, yield_unit: input.yield.unit, density_g_per_ml: input.densityGPerMl ?? null, method: input.method ?? null };
}

const measureColumns = (input: PreparationIn) => (input.measures ?? []).map((m) => ({ name: m.name, quantity: m.quantity, unit: m.unit }));

export async function list(deps: AppDeps, businessId: string) {
  const loaded = await loadCostModel(deps.db, businessId, { asOf: await businessToday(deps.db, deps.clock, businessId) });
  return { preparations: [...loaded.preparations.values()].map((p) => presentPreparationSummary(loaded, p)), allergenCaution: ALLERGEN_CAUTION };
}

export async function get(deps: AppDeps, businessId: string, id: string) {
  const loaded = await loadCostModel(deps.db, businessId, { asOf: await businessToday(deps.db, deps.clock, businessId) });
  const p = loaded.preparations.get(id);
  if (!p) throw notFound('That preparation');
  return { preparation: presentPreparationDetail(loaded, p, await findMethod(deps.db, businessId, id)), allergenCaution: ALLERGEN_CAUTION };
}

/**
 * Refuses lines that would make `selfId` (transitively) contain itself, naming the cycle by the
 * preparations' names: "Chai base → Chai mix → Chai base".
 */
async function checkNoCycle({ db }: AppDeps, businessId: string, selfId: string, selfName: string, lines: readonly LineValues[]) {
  const [edges, preps] = await Promise.all([listPreparationEdges(db, businessId, selfId), listPreparationNames(db, businessId)]);
  const names = new Map(preps.map((p) => [p.id, p.name]));
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

export async function create(deps: AppDeps, businessId: string, input: PreparationIn) {
  // A new preparation cannot be used by any other yet: no cycle to look for.
  throwIfFields(await checkLines(deps.db, businessId, input.lines, (j) => `lines[${j}]`));
  const id = await guardWrite('A preparation', () =>
    deps.db.transaction(async (trx) => {
      const created = await insertPreparation(trx, businessId, columns(input));
      await replacePreparationLines(trx, businessId, created, input.lines);
      await insertMeasures(trx, businessId, { preparationId: created }, measureColumns(input));
      return created;
    }),
  );
  return get(deps, businessId, id);
}

export async function replace(deps: AppDeps, businessId: string, id: string, input: PreparationIn) {
  if (!(await findLivePreparation(deps.db, businessId, id))) throw notFound('That preparation');
  const own = input.lines.findIndex((l) => l.preparationId === id);
  if (own >= 0) throw invalidInput({ [`lines[${own}].preparationId`]: `Preparation cycle: ${input.name} → ${input.name}.` });
  throwIfFields(await checkLines(deps.db, businessId, input.lines, (j) => `lines[${j}]`));
  await checkNoCycle(deps, businessId, id, input.name, input.lines);
  await guardWrite('A preparation', () =>
    deps.db.transaction(async (trx) => {
      await lockPreparations(trx, businessId);
      await updatePreparation(trx, businessId, id, columns(input));
      await replacePreparationLines(trx, businessId, id, input.lines);
      if (input.measures) await upsertPreparationMeasures(trx, businessId, id, measureColumns(input));
    }),
  );
  return get(deps, businessId, id);
}

/**
 * Removes a preparation that no live drink, preparation or modifier uses; one that waste or a
 * retired drink's build still remembers is archived instead.
 */
export async function remove({ db }: AppDeps, businessId: string, id: string) {
  await db.transaction(async (trx) => {
    if (!(await lockLivePreparation(trx, businessId, id))) throw notFound('That preparation');
    await refuseIfUsed(trx, businessId, { preparationId: id }, 'This preparation');
    const deleted = await deleteUnlessReferenced(trx, (sp) => deletePreparation(sp, businessId, id));
    if (deleted === 'referenced') await archivePreparation(trx, businessId, id);
  });
}
