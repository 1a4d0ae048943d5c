import type { PreparationDetail, PreparationSummary } from '../../src/shared/contract/costing';
import { writeLineCost } from '../../src/shared/costing';
import { writeCost } from '../../src/shared/money';
import { qty } from '../platform/present';
import type { CostedPreparation, LoadedCostModel } from './cost-model.service';
import { presentLine, unitOf } from './costing.presenter';

export function presentPreparationSummary(loaded: LoadedCostModel, p: CostedPreparation): PreparationSummary {
  return {
    id: p.row.id,
    name: p.row.name,
    yield: { quantity: qty(p.row.yield_quantity) as string, unit: unitOf(p.row.yield_unit)! },
    baseUnit: p.baseUnit,
    batchCost: p.batchCost ? writeCost(p.batchCost) : null,
    unitCost: p.unitCost ? writeCost(p.unitCost) : null,
    allergens: loaded.allergensOf([p.row.id]),
    problem: p.problem,
  };
}

/** The preparation's page: its lines costed, its method and measures. */
export function presentPreparationDetail(loaded: LoadedCostModel, p: CostedPreparation, method: string | null): PreparationDetail {
  const names = { itemName: loaded.itemName, measureName: (m: string) => loaded.measures.get(m)?.name ?? null };
  return {
    ...presentPreparationSummary(loaded, p),
    densityGPerMl: qty(p.row.density_g_per_ml),
    method,
    lines: p.lines.map((l, j) => {
      const c = p.lineCosts?.[j];
      const w = c ? writeLineCost(c) : null;
      return { ...presentLine(l, names), quantityInBaseUnit: w?.quantityInBaseUnit ?? null, baseUnit: w?.baseUnit ?? null, cost: w?.cost ?? null };
    }),
    measures: [...loaded.measures.values()].filter((m) => m.preparation_id === p.row.id).map((m) => ({ id: m.id, name: m.name, quantity: qty(m.quantity) as string, unit: unitOf(m.unit)! })),
  };
}
