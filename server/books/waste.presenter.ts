import { D, type Dec } from '../../src/shared/decimal';
import { writeMoney } from '../../src/shared/money';
import { baseUnitOf, isUnitCode } from '../../src/shared/units';
import type { WasteChoice, WasteEntry } from '../../src/shared/contract/books';
import { qty } from '../platform/present';
import type { Audience } from './audience';
import type { WasteRow } from './cogs.repo';
import type { wasteChoiceRows } from './waste.repo';

/** An entry's value at cost by ingredient category, or why it cannot be costed. */
export interface WasteValue {
  total: Dec | null;
  byCategory: Map<string, Dec>;
  problem: string | null;
}

/**
 * The month's waste. Each entry's value at cost, why one could not be costed and the month's
 * total go only to an audience that reads costs.
 */
export function presentWasteList(
  month: string,
  currency: string,
  rows: readonly WasteRow[],
  names: Map<string, string>,
  by: Map<string, string | null>,
  values: Map<string, WasteValue>,
  audience: Audience,
): { month: string; currency: string; entries: WasteEntry[]; total?: string } {
  let total = new D(0);
  const entries = rows.map((r) => {
    const itemId = (r.drink_size_id ?? r.preparation_id ?? r.ingredient_id) as string;
    const entry: WasteEntry = {
      id: r.id,
      siteId: r.site_id,
      occurredOn: r.occurred_on,
      item: { kind: r.drink_size_id ? 'drinkSize' : r.preparation_id ? 'preparation' : 'ingredient', id: itemId, name: names.get(itemId) ?? '' },
      quantity: qty(r.quantity) as string,
      unit: r.unit,
      reason: r.reason,
      recordedBy: by.get(r.id) ?? null,
    };
    if (audience.currency !== null) {
      const v = values.get(r.id);
      if (v?.total) total = total.plus(v.total);
      entry.value = v?.total ? writeMoney(v.total, audience.currency) : null;
      entry.problem = v?.problem ?? null;
    }
    return entry;
  });
  return audience.currency !== null ? { month, currency, entries, total: writeMoney(total, audience.currency) } : { month, currency, entries };
}

/** A preparation's base unit follows its yield's unit (l → ml, kg → g). */
const yieldBaseUnit = (unit: string) => (isUnitCode(unit) ? baseUnitOf(unit) : undefined);

export function presentWasteChoices({ ingredients, preparations, sizes }: Awaited<ReturnType<typeof wasteChoiceRows>>): WasteChoice[] {
  return [
    ...ingredients.map((i) => ({ kind: 'ingredient' as const, id: i.id, name: i.name, baseUnit: i.base_unit })),
    ...preparations.map((p) => ({ kind: 'preparation' as const, id: p.id, name: p.name, baseUnit: yieldBaseUnit(p.yield_unit) })),
    ...sizes.map((s) => ({ kind: 'drinkSize' as const, id: s.id, name: `${s.drink_name} (${s.size_name})` })),
  ];
}
