import type { Drink, DrinkSummary } from '../../src/shared/contract/costing';
import { groupBy } from '../../src/shared/collections';
import { money, qty } from '../platform/present';
import type { MenuRows } from './cost-model.repo';
import { presentLine } from './costing.presenter';
import type { DrinkDetailRow } from './drinks.repo';

export function presentDrinkSummaries(rows: MenuRows, currency: string): DrinkSummary[] {
  const byDrink = groupBy(rows.sizes, (s) => s.drink_id);
  return rows.drinks.map((d) => ({
    id: d.id,
    name: d.name,
    category: d.category,
    temperature: d.temperature,
    sizes: (byDrink.get(d.id) ?? []).map((s) => ({ sizeId: s.size_id, name: s.size_name, currentPrice: money(s.price, currency) })),
  }));
}

/** A drink with its build per size, as the editor loads it. */
export function presentDrink(drink: DrinkDetailRow, rows: MenuRows, currency: string, names: { items: Map<string, string>; measures: Map<string, string> }): Drink {
  const lineNames = { itemName: (i: string) => names.items.get(i) ?? '', measureName: (m: string) => names.measures.get(m) ?? null };
  const bySize = groupBy(rows.lines, (l) => l.drink_size_id);
  return {
    id: drink.id,
    name: drink.name,
    category: drink.category,
    temperature: drink.temperature,
    notes: drink.notes,
    expectedWeeklyCups: drink.expected_weekly_cups,
    sizes: rows.sizes.map((s) => ({
      id: s.id,
      sizeId: s.size_id,
      name: s.size_name,
      volumeMl: qty(s.volume_ml) as string,
      currentPrice: money(s.price, currency),
      priceVersion: s.price_version,
      lines: (bySize.get(s.id) ?? []).map((l) => presentLine(l, lineNames)),
    })),
  };
}
