import { dec, type Dec } from '../../src/shared/decimal';
import { conversionFactor, UnitConversionError } from '../../src/shared/units';
import type { UsageItem, UsageLine } from '../../src/shared/usage';
import type { LoadedCostModel } from '../costing/cost-model.service';
import type { LineRow, MeasureRow } from '../costing/cost-model.repo';
import { groupBy } from '../../src/shared/collections';

/** A stored line (build or preparation line) as the usage explosion reads it: unit = unit code or measure id. */
export function usageLine(l: LineRow): UsageLine {
  return { item: (l.ingredient_id ?? l.preparation_id) as string, quantity: dec(l.quantity), unit: (l.unit ?? l.measure_id) as string };
}

const measureMap = (rows: readonly MeasureRow[] | undefined) => new Map((rows ?? []).map((m) => [m.id, { quantity: dec(m.quantity), unit: m.unit }]));

/**
 * The recipe structure of a loaded cost model as usage items: every live ingredient (priced or
 * not) with its yield and measures, every preparation with its batch yield in base units and
 * its lines. A preparation whose yield unit is not a standard unit is left out (its uses are
 * reported as problems by the exploder).
 */
export function usageItems(loaded: LoadedCostModel): UsageItem[] {
  const measuresOf = groupBy([...loaded.measures.values()], (m) => (m.ingredient_id ?? m.preparation_id) as string);
  const out: UsageItem[] = [];
  for (const { row } of loaded.ingredients.values()) {
    out.push({
      kind: 'ingredient', key: row.id, name: row.name, baseUnit: row.base_unit, density: row.density_g_per_ml === null ? null : dec(row.density_g_per_ml),
      yieldPct: dec(row.yield_pct), measures: measureMap(measuresOf.get(row.id)),
    });
  }
  for (const p of loaded.preparations.values()) {
    if (!p.baseUnit) continue;
    const yieldInBase = dec(p.row.yield_quantity).times(conversionFactor(p.row.yield_unit, p.baseUnit, null));
    if (!yieldInBase.gt(0)) continue;
    out.push({
      kind: 'preparation', key: p.row.id, name: p.row.name, baseUnit: p.baseUnit, density: p.row.density_g_per_ml === null ? null : dec(p.row.density_g_per_ml),
      yieldInBase, measures: measureMap(measuresOf.get(p.row.id)), lines: p.lines.map(usageLine),
    });
  }
  return out;
}

/** Base units of an ingredient in one stocked pack line: pack count × pack quantity in the base unit; null when the pack's unit does not convert. */
export function baseUnitsPerPack(pack: { pack_count: string; pack_quantity: string; pack_unit: string }, item: UsageItem): Dec | null {
  try {
    const per = dec(pack.pack_count).times(dec(pack.pack_quantity)).times(conversionFactor(pack.pack_unit, item.baseUnit, item.density));
    return per.gt(0) ? per : null;
  } catch (e) {
    if (!(e instanceof UnitConversionError)) throw e;
    return null;
  }
}
