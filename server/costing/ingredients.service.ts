import type { z } from 'zod';
import { ALLERGEN_CAUTION } from '../../src/shared/allergens';
import type { ingredientInSchema, ingredientPatchSchema, IngredientDetail, IngredientSummary, Pack, packInSchema, packPatchSchema, priceInSchema } from '../../src/shared/contract/costing';
import type { BaseUnit } from '../../src/shared/units';
import { businessToday } from '../platform/clock';
import { deleteUnlessReferenced, guardWrite } from '../platform/db-errors';
import type { AppDeps } from '../platform/deps';
import { invalidInput, notFound } from '../platform/errors';
import { findBusinessMoney } from './cost-model.repo';
import { loadCostModel } from './cost-model.service';
import { presentIngredientDetail, presentIngredientSummary, presentPackPrice } from './ingredients.presenter';
import {
  archiveIngredient,
  archivePack,
  deleteIngredient,
  deletePack,
  findLiveIngredient,
  findLivePack,
  insertIngredient,
  insertPack,
  insertPackPrice,
  isLivePackOf,
  knownSupplierIds,
  listPackPrices,
  listPlannedPrices,
  loadIngredientExtras,
  lockLiveIngredient,
  updateIngredient,
  updatePack,
  type IngredientColumns,
  type PackColumns,
} from './ingredients.repo';
import { refuseIfUsed, throwIfFields, unitProblem } from './lines.service';
import { insertMeasures } from './measures.repo';

type IngredientIn = z.output<typeof ingredientInSchema>;
type IngredientPatch = z.output<typeof ingredientPatchSchema>;
type PackIn = z.output<typeof packInSchema>;

function ingredientColumns(i: IngredientPatch): IngredientColumns {
  const out: IngredientColumns = {};
  if (i.name !== undefined) out.name = i.name;
  if (i.category !== undefined) out.category = i.category;
  if (i.baseUnit !== undefined) out.base_unit = i.baseUnit;
  if (i.densityGPerMl !== undefined) out.density_g_per_ml = i.densityGPerMl ?? null;
  if (i.yieldPct !== undefined) out.yield_pct = i.yieldPct ?? '100';
  if (i.allergens !== undefined) out.allergens = i.allergens ?? [];
  if (i.notes !== undefined) out.notes = i.notes ?? null;
  if (i.costingPackId !== undefined) out.costing_pack_id = i.costingPackId;
  return out;
}

function packColumns(p: Partial<PackIn>): PackColumns {
  const out: PackColumns = {};
  if (p.supplierId !== undefined) out.supplier_id = p.supplierId ?? null;
  if (p.description !== undefined) out.description = p.description;
  if (p.supplierCode !== undefined) out.supplier_code = p.supplierCode ?? null;
  if (p.count !== undefined) out.count = p.count ?? '1';
  if (p.quantity !== undefined) out.quantity = p.quantity;
  if (p.unit !== undefined) out.unit = p.unit;
  if (p.purchaseTaxPct !== undefined) out.purchase_tax_pct = p.purchaseTaxPct ?? '0';
  return out;
}

/** Refuses a supplier id that is not one of the business's, as a bad value of that field. */
async function checkSuppliers({ db }: AppDeps, businessId: string, ids: readonly { field: string; id: string | null | undefined }[]) {
  const wanted = ids.filter((x): x is { field: string; id: string } => Boolean(x.id));
  const known = await knownSupplierIds(db, businessId, wanted.map((x) => x.id));
  throwIfFields(Object.fromEntries(wanted.filter((x) => !known.has(x.id)).map((x) => [x.field, 'That supplier was not found.'])));
}

function checkUnits(units: readonly { field: string; unit: string }[], baseUnit: BaseUnit, density: string | null | undefined) {
  const fields: Record<string, string> = {};
  for (const u of units) {
    const problem = unitProblem(u.unit, baseUnit, density);
    if (problem) fields[u.field] = problem;
  }
  throwIfFields(fields);
}

export async function list(deps: AppDeps, businessId: string): Promise<{ ingredients: IngredientSummary[]; allergenCaution: string }> {
  const loaded = await loadCostModel(deps.db, businessId, { asOf: await businessToday(deps.db, deps.clock, businessId) });
  return { ingredients: [...loaded.ingredients.values()].map((e) => presentIngredientSummary(loaded, e)), allergenCaution: ALLERGEN_CAUTION };
}

export async function get(deps: AppDeps, businessId: string, id: string): Promise<{ ingredient: IngredientDetail; allergenCaution: string }> {
  const { db } = deps;
  const asOf = await businessToday(db, deps.clock, businessId);
  const loaded = await loadCostModel(db, businessId, { asOf });
  const e = loaded.ingredients.get(id);
  if (!e) throw notFound('That ingredient');
  const [extras, planned] = await Promise.all([loadIngredientExtras(db, businessId, id), listPlannedPrices(db, businessId, id, asOf)]);
  return { ingredient: presentIngredientDetail(loaded, e, extras, planned), allergenCaution: ALLERGEN_CAUTION };
}

export async function create(deps: AppDeps, businessId: string, userId: string, input: IngredientIn) {
  const packs = input.packs ?? [];
  const measures = input.measures ?? [];
  checkUnits(
    [...packs.map((p, i) => ({ field: `packs[${i}].unit`, unit: p.unit })), ...measures.map((m, i) => ({ field: `measures[${i}].unit`, unit: m.unit }))],
    input.baseUnit,
    input.densityGPerMl,
  );
  await checkSuppliers(deps, businessId, packs.map((p, i) => ({ field: `packs[${i}].supplierId`, id: p.supplierId })));
  const today = await businessToday(deps.db, deps.clock, businessId);
  const id = await guardWrite('An ingredient', () =>
    deps.db.transaction(async (trx) => {
      const ingredientId = await insertIngredient(trx, businessId, { yield_pct: '100', allergens: [], ...ingredientColumns(input) });
      for (const p of packs) {
        const packId = await insertPack(trx, businessId, ingredientId, packColumns(p));
        await insertPackPrice(trx, businessId, { pack_id: packId, price: p.price, effective_from: p.effectiveFrom ?? today, created_by: userId });
      }
      await insertMeasures(trx, businessId, { ingredientId }, measures.map((m) => ({ name: m.name, quantity: m.quantity, unit: m.unit })));
      return ingredientId;
    }),
  );
  return get(deps, businessId, id);
}

export async function update(deps: AppDeps, businessId: string, id: string, input: IngredientPatch) {
  if (!(await findLiveIngredient(deps.db, businessId, id))) throw notFound('That ingredient');
  if (input.costingPackId && !(await isLivePackOf(deps.db, businessId, id, input.costingPackId))) {
    throw invalidInput({ costingPackId: 'Choose one of this ingredient’s packs.' });
  }
  await guardWrite('An ingredient', () => updateIngredient(deps.db, businessId, id, ingredientColumns(input)));
  return get(deps, businessId, id);
}

/**
 * Removes an ingredient that no live drink, preparation or modifier uses. One that something
 * still remembers (a pack on an order, a delivery or a count, waste, a retired drink's build) is
 * archived instead, with its packs: gone from lists and pickers, kept by history.
 */
export async function remove({ db }: AppDeps, businessId: string, id: string) {
  await db.transaction(async (trx) => {
    if (!(await lockLiveIngredient(trx, businessId, id))) throw notFound('That ingredient');
    await refuseIfUsed(trx, businessId, { ingredientId: id }, 'This ingredient');
    const deleted = await deleteUnlessReferenced(trx, (sp) => deleteIngredient(sp, businessId, id));
    if (deleted === 'referenced') await archiveIngredient(trx, businessId, id);
  });
}

async function presentPack(deps: AppDeps, businessId: string, ingredientId: string, packId: string): Promise<Pack> {
  const pack = (await get(deps, businessId, ingredientId)).ingredient.packs.find((p) => p.id === packId);
  if (!pack) throw notFound('That pack');
  return pack;
}

export async function addPack(deps: AppDeps, businessId: string, userId: string, ingredientId: string, p: PackIn): Promise<Pack> {
  const ing = await findLiveIngredient(deps.db, businessId, ingredientId);
  if (!ing) throw notFound('That ingredient');
  checkUnits([{ field: 'unit', unit: p.unit }], ing.base_unit, ing.density_g_per_ml);
  await checkSuppliers(deps, businessId, [{ field: 'supplierId', id: p.supplierId }]);
  const today = await businessToday(deps.db, deps.clock, businessId);
  const packId = await deps.db.transaction(async (trx) => {
    const created = await insertPack(trx, businessId, ingredientId, packColumns(p));
    await insertPackPrice(trx, businessId, { pack_id: created, price: p.price, effective_from: p.effectiveFrom ?? today, created_by: userId });
    return created;
  });
  return presentPack(deps, businessId, ingredientId, packId);
}

export async function changePack(deps: AppDeps, businessId: string, packId: string, p: z.output<typeof packPatchSchema>): Promise<Pack> {
  const row = await findLivePack(deps.db, businessId, packId);
  if (!row) throw notFound('That pack');
  if (p.unit) checkUnits([{ field: 'unit', unit: p.unit }], row.base_unit, row.density_g_per_ml);
  await checkSuppliers(deps, businessId, [{ field: 'supplierId', id: p.supplierId }]);
  await updatePack(deps.db, businessId, packId, packColumns(p));
  return presentPack(deps, businessId, row.ingredient_id, packId);
}

/**
 * Removes a pack. One that a purchase order, a delivery, a stock count (anything) still refers
 * to is archived instead: it leaves the ingredient's packs, the pickers and the costing, and
 * stops being its costing pack, while the orders and counts that name it keep it.
 */
export async function removePack({ db }: AppDeps, businessId: string, packId: string) {
  await db.transaction(async (trx) => {
    if (!(await findLivePack(trx, businessId, packId))) throw notFound('That pack');
    const deleted = await deleteUnlessReferenced(trx, (sp) => deletePack(sp, businessId, packId));
    if (deleted === 'referenced') await archivePack(trx, businessId, packId);
  });
}

export async function listPrices({ db }: AppDeps, businessId: string, packId: string) {
  if (!(await findLivePack(db, businessId, packId))) throw notFound('That pack');
  const [rows, business] = await Promise.all([listPackPrices(db, businessId, packId), findBusinessMoney(db, businessId)]);
  return rows.map((r) => presentPackPrice(r, business.currency));
}

/** A price change is a new dated row: history is never overwritten, and a future date is a planned price. */
export async function addPrice(deps: AppDeps, businessId: string, userId: string, packId: string, input: z.output<typeof priceInSchema>) {
  const { db } = deps;
  const row = await findLivePack(db, businessId, packId);
  if (!row) throw notFound('That pack');
  const effectiveFrom = input.effectiveFrom ?? (await businessToday(db, deps.clock, businessId));
  const price = await insertPackPrice(db, businessId, { pack_id: packId, price: input.price, effective_from: effectiveFrom, note: input.note ?? null, created_by: userId });
  const business = await findBusinessMoney(db, businessId);
  return { price: presentPackPrice(price, business.currency), pack: await presentPack(deps, businessId, row.ingredient_id, packId) };
}
