import type { Knex } from 'knex';
import { INGREDIENT_CATEGORIES } from '../../src/shared/categories';
import { z } from 'zod';
import { ALLERGEN_CAUTION, ALLERGEN_CODES } from '../../src/shared/allergens';
import { rules } from '../../src/shared/checks';
import { costLines } from '../../src/shared/costing';
import { dec } from '../../src/shared/decimal';
import { writeCost } from '../../src/shared/money';
import { BASE_UNITS, conversionFactor, UNIT_CODES, UnitConversionError, type BaseUnit } from '../../src/shared/units';
import { invalidInput, notFound } from '../platform/errors';
import { loadCostModel, type CostedIngredient, type LoadedCostModel } from './cost-model.service';
import { decimalString, name, optionalText, today } from './shared';
import { guardWrite } from '../platform/db-errors';
import { isoDate } from '../../src/shared/schemas/fields';
import { money, qty } from '../platform/present';

export const CATEGORIES = INGREDIENT_CATEGORIES;
const unitCode = z.enum(UNIT_CODES, { error: (issue) => `Unknown unit "${String(issue.input)}".` });

export const measureInSchema = z.object({ name: name('measure'), quantity: decimalString(rules.positive), unit: unitCode });

export const packInSchema = z.object({
  supplierId: z.uuid('Choose a supplier.').nullish(),
  description: z.string({ error: 'Describe the pack.' }).trim().min(1, 'Describe the pack.').max(200),
  supplierCode: optionalText(60),
  count: decimalString(rules.positive).nullish(),
  quantity: decimalString(rules.positive),
  unit: unitCode,
  purchaseTaxPct: decimalString(rules.nonNegative).nullish(),
  price: decimalString(rules.nonNegative),
  effectiveFrom: isoDate.nullish(),
});
export const packPatchSchema = packInSchema.omit({ price: true, effectiveFrom: true }).partial();
export const priceInSchema = z.object({ price: decimalString(rules.nonNegative), effectiveFrom: isoDate.nullish(), note: optionalText(500) });

const ingredientFields = {
  name: name('ingredient'),
  category: z.enum(CATEGORIES, { error: `Choose a category: ${CATEGORIES.join(', ')}.` }),
  baseUnit: z.enum(BASE_UNITS, { error: 'The base unit must be g, ml or each.' }),
  densityGPerMl: decimalString(rules.positive).nullish(),
  yieldPct: decimalString(rules.yieldPct).nullish(),
  allergens: z.array(z.enum(ALLERGEN_CODES, { error: (issue) => `Unknown allergen "${String(issue.input)}".` })).max(14).nullish(),
  notes: optionalText(),
};
export const ingredientInSchema = z.object({
  ...ingredientFields,
  packs: z.array(packInSchema).max(50).nullish(),
  measures: z.array(measureInSchema).max(50).nullish(),
});
export const ingredientPatchSchema = z.object({ ...ingredientFields, costingPackId: z.uuid('Choose one of the ingredient’s packs.').nullable() }).partial();

type PackIn = z.output<typeof packInSchema>;
type IngredientIn = z.output<typeof ingredientInSchema>;

function unitProblem(unit: string, baseUnit: BaseUnit, density: string | null | undefined): string | null {
  try {
    conversionFactor(unit, baseUnit, density ? dec(density) : null);
    return null;
  } catch (e) {
    if (e instanceof UnitConversionError) return e.message;
    throw e;
  }
}

async function checkSupplier(db: Knex, businessId: string, supplierId: string | null | undefined, field: string) {
  if (!supplierId) return;
  if (!(await db('suppliers').where({ business_id: businessId, id: supplierId }).first('id'))) throw invalidInput({ [field]: 'That supplier was not found.' });
}

function packColumns(p: Partial<PackIn>) {
  const out: Record<string, unknown> = {};
  if (p.supplierId !== undefined) out.supplier_id = p.supplierId ?? null;
  if (p.description !== undefined) out.description = p.description;
  if (p.supplierCode !== undefined) out.supplier_code = p.supplierCode ?? null;
  if (p.count !== undefined) out.count = p.count ?? '1';
  if (p.quantity !== undefined) out.quantity = p.quantity;
  if (p.unit !== undefined) out.unit = p.unit;
  if (p.purchaseTaxPct !== undefined) out.purchase_tax_pct = p.purchaseTaxPct ?? '0';
  return out;
}

async function insertPack(trx: Knex, businessId: string, ingredientId: string, p: PackIn, userId: string) {
  const [pack] = await trx('packs').insert({ business_id: businessId, ingredient_id: ingredientId, ...packColumns(p) }).returning('id');
  await trx('pack_prices').insert({ business_id: businessId, pack_id: pack.id, price: p.price, effective_from: p.effectiveFrom ?? today(), created_by: userId });
  return pack.id as string;
}

function presentListItem(loaded: LoadedCostModel, e: CostedIngredient) {
  const currency = loaded.currency;
  const measures = [...loaded.measures.values()]
    .filter((m) => m.ingredient_id === e.row.id)
    .map((m) => ({
      id: m.id,
      name: m.name,
      quantity: qty(m.quantity),
      unit: m.unit,
      cost: e.unitCost ? writeCost(costLines(loaded.model, [{ item: e.row.id, quantity: '1', unit: m.id }]).cost) : null,
    }));
  return {
    id: e.row.id,
    name: e.row.name,
    category: e.row.category,
    baseUnit: e.row.base_unit,
    densityGPerMl: qty(e.row.density_g_per_ml),
    yieldPct: qty(e.row.yield_pct),
    unitCost: e.unitCost ? writeCost(e.unitCost) : null,
    costingPack: e.costingPack
      ? { id: e.costingPack.id, description: e.costingPack.description, price: money(e.costingPack.price, currency), supplierName: e.costingPack.supplier_name }
      : null,
    allergens: [...e.row.allergens].sort(),
    measures,
    problem: e.problem,
  };
}

export async function listIngredients(db: Knex, businessId: string) {
  const loaded = await loadCostModel(db, businessId);
  return { ingredients: [...loaded.ingredients.values()].map((e) => presentListItem(loaded, e)), allergenCaution: ALLERGEN_CAUTION };
}

export async function getIngredient(db: Knex, businessId: string, id: string) {
  const loaded = await loadCostModel(db, businessId);
  const e = loaded.ingredients.get(id);
  if (!e) throw notFound('That ingredient');
  const [extra, planned] = await Promise.all([
    db('ingredients').where({ business_id: businessId, id }).first('notes', 'costing_pack_id'),
    db('pack_prices as pp')
      .join('packs as p', 'p.id', 'pp.pack_id')
      .where({ 'pp.business_id': businessId, 'p.ingredient_id': id })
      .where('pp.effective_from', '>', loaded.asOf)
      .orderBy('pp.effective_from')
      .select('pp.pack_id', 'pp.price', 'pp.effective_from'),
  ]);
  const packExtra = await db('packs').where({ business_id: businessId, ingredient_id: id }).whereNull('archived_at').select('id', 'supplier_code', 'purchase_tax_pct');
  const extraById = new Map(packExtra.map((p) => [p.id, p]));
  const currency = loaded.currency;
  return {
    ingredient: {
      ...presentListItem(loaded, e),
      notes: extra?.notes ?? null,
      costingPackId: extra?.costing_pack_id ?? null,
      packs: e.packs.map((p) => ({
        id: p.id,
        supplierId: p.supplier_id,
        supplierName: p.supplier_name,
        description: p.description,
        supplierCode: extraById.get(p.id)?.supplier_code ?? null,
        count: qty(p.count),
        quantity: qty(p.quantity),
        unit: p.unit,
        purchaseTaxPct: qty(extraById.get(p.id)?.purchase_tax_pct),
        price: money(p.price, currency),
        priceFrom: p.effective_from,
        plannedPrices: planned.filter((x) => x.pack_id === p.id).map((x) => ({ price: money(x.price, currency), effectiveFrom: x.effective_from })),
        isCostingPack: e.costingPack?.id === p.id,
      })),
    },
    allergenCaution: ALLERGEN_CAUTION,
  };
}

export async function createIngredient(db: Knex, businessId: string, userId: string, input: IngredientIn) {
  const fields: Record<string, string> = {};
  (input.packs ?? []).forEach((p, i) => {
    const problem = unitProblem(p.unit, input.baseUnit, input.densityGPerMl);
    if (problem) fields[`packs[${i}].unit`] = problem;
  });
  (input.measures ?? []).forEach((m, i) => {
    const problem = unitProblem(m.unit, input.baseUnit, input.densityGPerMl);
    if (problem) fields[`measures[${i}].unit`] = problem;
  });
  if (Object.keys(fields).length) throw invalidInput(fields);
  for (const [i, p] of (input.packs ?? []).entries()) await checkSupplier(db, businessId, p.supplierId, `packs[${i}].supplierId`);
  const id = await guardWrite('An ingredient', () =>
    db.transaction(async (trx) => {
      const [row] = await trx('ingredients')
        .insert({
          business_id: businessId,
          name: input.name,
          category: input.category,
          base_unit: input.baseUnit,
          density_g_per_ml: input.densityGPerMl ?? null,
          yield_pct: input.yieldPct ?? '100',
          allergens: input.allergens ?? [],
          notes: input.notes ?? null,
        })
        .returning('id');
      for (const p of input.packs ?? []) await insertPack(trx, businessId, row.id, p, userId);
      if (input.measures?.length) {
        await trx('measures').insert(input.measures.map((m) => ({ business_id: businessId, ingredient_id: row.id, name: m.name, quantity: m.quantity, unit: m.unit })));
      }
      return row.id as string;
    }),
  );
  return getIngredient(db, businessId, id);
}

export async function updateIngredient(db: Knex, businessId: string, id: string, input: z.output<typeof ingredientPatchSchema>) {
  const current = await db('ingredients').where({ business_id: businessId, id }).whereNull('archived_at').first('id');
  if (!current) throw notFound('That ingredient');
  if (input.costingPackId) {
    const pack = await db('packs').where({ business_id: businessId, ingredient_id: id, id: input.costingPackId }).first('id');
    if (!pack) throw invalidInput({ costingPackId: 'Choose one of this ingredient’s packs.' });
  }
  const patch: Record<string, unknown> = { updated_at: db.fn.now() };
  if (input.name !== undefined) patch.name = input.name;
  if (input.category !== undefined) patch.category = input.category;
  if (input.baseUnit !== undefined) patch.base_unit = input.baseUnit;
  if (input.densityGPerMl !== undefined) patch.density_g_per_ml = input.densityGPerMl ?? null;
  if (input.yieldPct !== undefined) patch.yield_pct = input.yieldPct ?? '100';
  if (input.allergens !== undefined) patch.allergens = input.allergens ?? [];
  if (input.notes !== undefined) patch.notes = input.notes ?? null;
  if (input.costingPackId !== undefined) patch.costing_pack_id = input.costingPackId;
  await guardWrite('An ingredient', () => db('ingredients').where({ business_id: businessId, id }).update(patch));
  return getIngredient(db, businessId, id);
}

export async function deleteIngredient(db: Knex, businessId: string, id: string) {
  // Packs and measures go with it; a line using it (RESTRICT) answers 409.
  const n = await guardWrite('That ingredient', () => db('ingredients').where({ business_id: businessId, id }).delete());
  if (!n) throw notFound('That ingredient');
}

async function ingredientOfPack(db: Knex, businessId: string, packId: string) {
  const row = await db('packs as p')
    .join('ingredients as i', 'i.id', 'p.ingredient_id')
    .where({ 'p.business_id': businessId, 'p.id': packId })
    .whereNull('p.archived_at')
    .first('p.ingredient_id', 'p.unit', 'i.base_unit', 'i.density_g_per_ml');
  if (!row) throw notFound('That pack');
  return row as { ingredient_id: string; unit: string; base_unit: BaseUnit; density_g_per_ml: string | null };
}

async function presentPack(db: Knex, businessId: string, ingredientId: string, packId: string) {
  const { ingredient } = await getIngredient(db, businessId, ingredientId);
  return ingredient.packs.find((p) => p.id === packId) ?? null;
}

export async function addPack(db: Knex, businessId: string, userId: string, ingredientId: string, p: PackIn) {
  const ing = await db('ingredients').where({ business_id: businessId, id: ingredientId }).whereNull('archived_at').first('base_unit', 'density_g_per_ml');
  if (!ing) throw notFound('That ingredient');
  const problem = unitProblem(p.unit, ing.base_unit, ing.density_g_per_ml);
  if (problem) throw invalidInput({ unit: problem });
  await checkSupplier(db, businessId, p.supplierId, 'supplierId');
  const packId = await db.transaction((trx) => insertPack(trx, businessId, ingredientId, p, userId));
  return { pack: await presentPack(db, businessId, ingredientId, packId) };
}

export async function updatePack(db: Knex, businessId: string, packId: string, p: z.output<typeof packPatchSchema>) {
  const row = await ingredientOfPack(db, businessId, packId);
  if (p.unit) {
    const problem = unitProblem(p.unit, row.base_unit, row.density_g_per_ml);
    if (problem) throw invalidInput({ unit: problem });
  }
  await checkSupplier(db, businessId, p.supplierId, 'supplierId');
  await db('packs').where({ business_id: businessId, id: packId }).update({ ...packColumns(p), updated_at: db.fn.now() });
  return { pack: await presentPack(db, businessId, row.ingredient_id, packId) };
}

export async function deletePack(db: Knex, businessId: string, packId: string) {
  const n = await db('packs').where({ business_id: businessId, id: packId }).delete();
  if (!n) throw notFound('That pack');
}

export async function listPackPrices(db: Knex, businessId: string, packId: string) {
  await ingredientOfPack(db, businessId, packId);
  const { currency } = await db('businesses').where({ id: businessId }).first('currency');
  const rows = await db('pack_prices').where({ business_id: businessId, pack_id: packId }).orderBy([{ column: 'effective_from', order: 'desc' }, { column: 'created_at', order: 'desc' }]).select('id', 'price', 'effective_from', 'source', 'note', 'created_at');
  return { prices: rows.map((r) => ({ id: r.id, price: money(r.price, currency), effectiveFrom: r.effective_from, source: r.source, note: r.note, createdAt: new Date(r.created_at).toISOString() })) };
}

/** A price change is a new dated row: history is never overwritten, and a future date is a planned price. */
export async function addPackPrice(db: Knex, businessId: string, userId: string, packId: string, input: z.output<typeof priceInSchema>) {
  const row = await ingredientOfPack(db, businessId, packId);
  const [price] = await db('pack_prices')
    .insert({ business_id: businessId, pack_id: packId, price: input.price, effective_from: input.effectiveFrom ?? today(), note: input.note ?? null, created_by: userId })
    .returning(['id', 'price', 'effective_from', 'source', 'note', 'created_at']);
  const { currency } = await db('businesses').where({ id: businessId }).first('currency');
  return {
    price: { id: price.id, price: money(price.price, currency), effectiveFrom: price.effective_from, source: price.source, note: price.note, createdAt: new Date(price.created_at).toISOString() },
    pack: await presentPack(db, businessId, row.ingredient_id, packId),
  };
}
