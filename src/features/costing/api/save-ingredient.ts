import { useMutation, useQueryClient } from '@tanstack/react-query';
import { ApiError, isApiError } from '../../../lib/api-client';
import { call } from '../../../lib/contract';
import type { AllergenCode } from '../../../shared/allergens';
import type { IngredientCategory } from '../../../shared/categories';
import {
  addIngredientMeasure,
  addPack,
  addPackPrice,
  createIngredient as createIngredientEntry,
  deleteMeasure,
  deletePack,
  updateIngredient as updateIngredientEntry,
  updateMeasure,
  updatePack,
  type IngredientDetail,
  type MeasureOut,
  type Pack,
} from '../../../shared/contract/costing';
import { dec, isDecimalString } from '../../../shared/decimal';
import type { BaseUnit, UnitCode } from '../../../shared/units';
import { invalidateCosting } from './keys';

export interface PackValues {
  /** Set for a pack already saved. */
  id?: string;
  supplierId: string | null;
  description: string;
  supplierCode: string | null;
  count: string;
  quantity: string;
  unit: UnitCode;
  purchaseTaxPct: string;
  price: string;
}

export interface MeasureValues {
  id?: string;
  name: string;
  quantity: string;
  unit: UnitCode;
}

export interface IngredientValues {
  name: string;
  category: IngredientCategory;
  baseUnit: BaseUnit;
  densityGPerMl: string | null;
  yieldPct: string;
  allergens: AllergenCode[];
  notes: string | null;
  packs: PackValues[];
  measures: MeasureValues[];
  /** Index into `packs` of the pack that sets the cost, or null for the most recently priced. */
  costingPackIndex: number | null;
}

/** Runs one call and files its field errors under `prefix` (a pack's "unit" becomes "packs[1].unit"). */
async function under<T>(prefix: string, call: () => Promise<T>): Promise<T> {
  try {
    return await call();
  } catch (err) {
    if (!isApiError(err) || Object.keys(err.fields).length === 0) throw err;
    const fields = Object.fromEntries(Object.entries(err.fields).map(([k, v]) => [`${prefix}.${k}`, v]));
    throw new ApiError(err.status, err.code, err.message, fields, err.requestId);
  }
}

const packFields = (p: PackValues) => ({
  supplierId: p.supplierId,
  description: p.description,
  supplierCode: p.supplierCode,
  count: p.count,
  quantity: p.quantity,
  unit: p.unit,
  purchaseTaxPct: p.purchaseTaxPct,
});

const ingredientFields = (v: IngredientValues) => ({
  name: v.name,
  category: v.category,
  baseUnit: v.baseUnit,
  densityGPerMl: v.densityGPerMl,
  yieldPct: v.yieldPct,
  allergens: v.allergens,
  notes: v.notes,
});

export async function createIngredient(v: IngredientValues) {
  const body = await call(createIngredientEntry, {
    body: {
      ...ingredientFields(v),
      packs: v.packs.map((p) => ({ ...packFields(p), price: p.price })),
      measures: v.measures.map(({ name, quantity, unit }) => ({ name, quantity, unit })),
    },
  });
  // The server picks the most recently priced pack unless told otherwise.
  const chosen = v.costingPackIndex === null ? undefined : body.ingredient.packs[v.costingPackIndex];
  if (!chosen) return body;
  return call(updateIngredientEntry, { params: { id: body.ingredient.id }, body: { costingPackId: chosen.id } });
}

/** "1.50" and "1.5" are the same amount: compared as decimals, never as floats. */
function sameDecimal(a: string | null | undefined, b: string | null | undefined): boolean {
  if (a == null || b == null || !isDecimalString(a) || !isDecimalString(b)) return (a ?? '') === (b ?? '');
  return dec(a).eq(dec(b));
}

function packChanged(p: PackValues, old: Pack): boolean {
  return (
    (p.supplierId ?? null) !== (old.supplierId ?? null) ||
    p.description !== old.description ||
    (p.supplierCode ?? '') !== (old.supplierCode ?? '') ||
    !sameDecimal(p.count, old.count) ||
    !sameDecimal(p.quantity, old.quantity) ||
    p.unit !== old.unit ||
    !sameDecimal(p.purchaseTaxPct, old.purchaseTaxPct ?? '0')
  );
}

function measureChanged(m: MeasureValues, old: MeasureOut): boolean {
  return m.name !== old.name || !sameDecimal(m.quantity, old.quantity) || m.unit !== old.unit;
}

/**
 * Saves an edited ingredient: its own fields, then each pack and measure that
 * was added, changed or removed, then the costing pack. A price change is a new
 * dated price (history is kept), never an overwrite.
 */
export async function updateIngredient({ original, values: v }: { original: IngredientDetail; values: IngredientValues }) {
  const id = original.id;
  await call(updateIngredientEntry, { params: { id }, body: ingredientFields(v) });
  const packIds: string[] = [];
  for (const [i, p] of v.packs.entries()) {
    const old = p.id ? original.packs.find((o) => o.id === p.id) : undefined;
    if (!old) {
      const { pack } = await under(`packs[${i}]`, () => call(addPack, { params: { id }, body: { ...packFields(p), price: p.price } }));
      packIds.push(pack.id);
      continue;
    }
    packIds.push(old.id);
    if (packChanged(p, old)) await under(`packs[${i}]`, () => call(updatePack, { params: { id: old.id }, body: packFields(p) }));
    if (!sameDecimal(p.price, old.price)) await under(`packs[${i}]`, () => call(addPackPrice, { params: { id: old.id }, body: { price: p.price } }));
  }
  // A pack an order or a count still names is archived by the server rather than deleted.
  const keptPacks = new Set(v.packs.map((p) => p.id).filter(Boolean));
  for (const old of original.packs) if (!keptPacks.has(old.id)) await call(deletePack, { params: { id: old.id } });

  for (const [i, m] of v.measures.entries()) {
    const old = m.id ? original.measures.find((o) => o.id === m.id) : undefined;
    const body = { name: m.name, quantity: m.quantity, unit: m.unit };
    if (!old) await under(`measures[${i}]`, () => call(addIngredientMeasure, { params: { id }, body }));
    else if (measureChanged(m, old)) await under(`measures[${i}]`, () => call(updateMeasure, { params: { id: old.id }, body }));
  }
  const keptMeasures = new Set(v.measures.map((m) => m.id).filter(Boolean));
  for (const old of original.measures) if (!keptMeasures.has(old.id)) await under('measures', () => call(deleteMeasure, { params: { id: old.id } }));

  const costingPackId = v.costingPackIndex === null ? null : (packIds[v.costingPackIndex] ?? null);
  return call(updateIngredientEntry, { params: { id }, body: { costingPackId } });
}

/** A save of several calls: a half-done one (details saved, a pack refused) still changed the lists. */
function useIngredientSave<T>(save: (input: T) => Promise<{ ingredient: IngredientDetail; allergenCaution: string }>) {
  const queryClient = useQueryClient();
  return useMutation({ mutationFn: save, onSettled: () => invalidateCosting(queryClient) });
}

export const useCreateIngredient = () => useIngredientSave(createIngredient);
export const useUpdateIngredient = () => useIngredientSave(updateIngredient);
