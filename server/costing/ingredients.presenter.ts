import type { IngredientCategory } from '../../src/shared/categories';
import type { IngredientDetail, IngredientSummary, Pack, packPriceSchema } from '../../src/shared/contract/costing';
import { costLines } from '../../src/shared/costing';
import { writeCost } from '../../src/shared/money';
import type { z } from 'zod';
import { money, qty } from '../platform/present';
import type { CostedIngredient, LoadedCostModel } from './cost-model.service';
import { allergenCodes, unitOf } from './costing.presenter';
import type { loadIngredientExtras, PackPriceRow } from './ingredients.repo';
import type { MeasureRow } from './measures.repo';

/** An ingredient as lists show it: its usable cost per base unit and each measure's cost, from the cost model. */
export function presentIngredientSummary(loaded: LoadedCostModel, e: CostedIngredient): IngredientSummary {
  const currency = loaded.currency;
  const measures = [...loaded.measures.values()]
    .filter((m) => m.ingredient_id === e.row.id)
    .map((m) => ({
      id: m.id,
      name: m.name,
      quantity: qty(m.quantity) as string,
      unit: unitOf(m.unit)!,
      cost: e.unitCost ? writeCost(costLines(loaded.model, [{ item: e.row.id, quantity: '1', unit: m.id }]).cost) : null,
    }));
  return {
    id: e.row.id,
    name: e.row.name,
    category: e.row.category as IngredientCategory,
    baseUnit: e.row.base_unit,
    densityGPerMl: qty(e.row.density_g_per_ml),
    yieldPct: qty(e.row.yield_pct),
    unitCost: e.unitCost ? writeCost(e.unitCost) : null,
    costingPack: e.costingPack
      ? { id: e.costingPack.id, description: e.costingPack.description, price: money(e.costingPack.price, currency), supplierName: e.costingPack.supplier_name }
      : null,
    allergens: allergenCodes(e.row.allergens),
    measures,
    problem: e.problem,
  };
}

type Extras = Awaited<ReturnType<typeof loadIngredientExtras>>;

/** The ingredient's page: the list fields, its notes, and each live pack with its price today and the planned ones. */
export function presentIngredientDetail(
  loaded: LoadedCostModel,
  e: CostedIngredient,
  extras: Extras,
  planned: readonly { pack_id: string; price: string; effective_from: string }[],
): IngredientDetail {
  const currency = loaded.currency;
  return {
    ...presentIngredientSummary(loaded, e),
    notes: extras.notes,
    costingPackId: extras.costingPackId,
    packs: e.packs.map(
      (p): Pack => ({
        id: p.id,
        supplierId: p.supplier_id,
        supplierName: p.supplier_name,
        description: p.description,
        supplierCode: extras.packs.get(p.id)?.supplier_code ?? null,
        count: qty(p.count) as string,
        quantity: qty(p.quantity) as string,
        unit: unitOf(p.unit)!,
        purchaseTaxPct: qty(extras.packs.get(p.id)?.purchase_tax_pct),
        price: money(p.price, currency),
        priceFrom: p.effective_from,
        plannedPrices: planned.filter((x) => x.pack_id === p.id).map((x) => ({ price: money(x.price, currency) as string, effectiveFrom: x.effective_from })),
        isCostingPack: e.costingPack?.id === p.id,
      }),
    ),
  };
}

export function presentPackPrice(r: PackPriceRow, currency: string): z.output<typeof packPriceSchema> {
  return { id: r.id, price: money(r.price, currency) as string, effectiveFrom: r.effective_from, source: r.source, note: r.note, createdAt: new Date(r.created_at).toISOString() };
}

export function presentMeasure(m: MeasureRow) {
  return { id: m.id, ingredientId: m.ingredient_id, preparationId: m.preparation_id, name: m.name, quantity: qty(m.quantity) as string, unit: unitOf(m.unit)! };
}
