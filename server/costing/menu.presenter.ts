import { ALLERGEN_CAUTION } from '../../src/shared/allergens';
import type { CardSummary, DrinkCosting, RecipeCard, SizeCosting } from '../../src/shared/contract/costing';
import { groupBy } from '../../src/shared/collections';
import { writeLineCost } from '../../src/shared/costing';
import { dec } from '../../src/shared/decimal';
import { writeCost, writeMoney, writePercent } from '../../src/shared/money';
import { exactMarginPct, parsePolicy, priceFigures, suggestPrice, type ParsedPolicy } from '../../src/shared/pricing';
import { isUnitCode, UNITS } from '../../src/shared/units';
import type { BuildLineRow, DrinkSizeRow, MenuRows } from './cost-model.repo';
import type { LoadedCostModel } from './cost-model.service';
import type { DrinkDetailRow, listAddedItems, listCardRows } from './drinks.repo';

/** The preview's figures for one saved cup size: cost, lines, suggested price, figures at both prices. */
export function costSavedSize(loaded: LoadedCostModel, category: string, size: DrinkSizeRow, lines: BuildLineRow[]): SizeCosting {
  const { currency } = loaded;
  const policy = loaded.policyFor(category);
  const base = { drinkSizeId: size.id, sizeId: size.size_id, name: size.size_name };
  const costed = loaded.costStoredLines(lines);
  if (!costed.ok) return { ...base, cost: null, lines: [], suggestedPrice: null, atSuggested: null, atCurrent: null, problem: costed.problem };
  const suggested = suggestPrice(costed.cost, policy, currency);
  return {
    ...base,
    cost: writeCost(costed.cost),
    lines: costed.lines.map((l, i) => ({ lineId: lines[i].id, ...writeLineCost(l), itemName: loaded.itemName(l.item) })),
    suggestedPrice: suggested,
    atSuggested: priceFigures(suggested, costed.cost, policy, currency),
    atCurrent: size.price === null ? null : priceFigures(size.price, costed.cost, policy, currency),
    problem: null,
  };
}

/** A saved drink costed as the preview costs it, plus ids. */
export function presentDrinkCosting(loaded: LoadedCostModel, rows: MenuRows): DrinkCosting {
  const drink = rows.drinks[0];
  const linesBySize = groupBy(rows.lines, (l) => l.drink_size_id);
  return {
    drinkId: drink.id,
    name: drink.name,
    category: drink.category,
    currency: loaded.currency,
    asOf: loaded.asOf,
    policy: loaded.policyFor(drink.category),
    sizes: rows.sizes.map((s) => costSavedSize(loaded, drink.category, s, linesBySize.get(s.id) ?? [])),
    allergens: loaded.allergensOf(rows.lines.map((l) => (l.ingredient_id ?? l.preparation_id) as string)),
    allergenCaution: ALLERGEN_CAUTION,
  };
}

export type MenuCosting = ReturnType<typeof menuCostingFrom>;

/** Every drink × size costed from a built model and the menu rows, with the margin at the current price against the target. */
export function menuCostingFrom(loaded: LoadedCostModel, rows: MenuRows) {
  const { currency } = loaded;
  const linesBySize = groupBy(rows.lines, (l) => l.drink_size_id);
  const sizesByDrink = groupBy(rows.sizes, (s) => s.drink_id);
  // A menu has a handful of categories: read each one's policy once, not once per drink.
  const policies = new Map<string, { parsed: ParsedPolicy; targetMarginPct: string }>();
  const policyOf = (category: string) => {
    let hit = policies.get(category);
    if (!hit) {
      const policy = loaded.policyFor(category);
      policies.set(category, (hit = { parsed: parsePolicy(policy, currency), targetMarginPct: dec(policy.targetMarginPct).toFixed() }));
    }
    return hit;
  };
  const drinks = rows.drinks.map((d) => {
    const { parsed, targetMarginPct } = policyOf(d.category);
    const sizes = (sizesByDrink.get(d.id) ?? []).map((s) => {
      const base = { drinkSizeId: s.id, sizeId: s.size_id, name: s.size_name, currentPrice: s.price === null ? null : writeMoney(s.price, currency) };
      const costed = loaded.costStoredLines(linesBySize.get(s.id) ?? []);
      if (!costed.ok) return { ...base, cost: null, marginPct: null, suggestedPrice: null, belowTarget: false, problem: costed.problem };
      const margin = s.price === null ? null : exactMarginPct(s.price, costed.cost, parsed);
      return {
        ...base,
        cost: writeCost(costed.cost),
        marginPct: margin ? writePercent(margin) : null,
        suggestedPrice: suggestPrice(costed.cost, parsed, currency),
        // Compared unrounded: 71.996 % is below a 72 % target even though it is written "72.00".
        belowTarget: Boolean(margin && margin.lt(parsed.margin)),
        problem: null,
      };
    });
    return { id: d.id, name: d.name, category: d.category, temperature: d.temperature, targetMarginPct, sizes };
  });
  return { currency, asOf: loaded.asOf, drinks };
}

export function presentCards(rows: Awaited<ReturnType<typeof listCardRows>>): CardSummary[] {
  const cards = new Map<string, CardSummary>();
  for (const r of rows) {
    let c = cards.get(r.id);
    if (!c) cards.set(r.id, (c = { id: r.id, name: r.name, category: r.category, temperature: r.temperature, sizes: [] }));
    if (r.size_name) c.sizes.push(r.size_name);
  }
  return [...cards.values()];
}

/** The build per size and the allergens, with no cost anywhere: what a barista reads. */
export function presentCard(drink: DrinkDetailRow, rows: MenuRows, loaded: LoadedCostModel, added: Awaited<ReturnType<typeof listAddedItems>>): RecipeCard {
  const linesBySize = groupBy(rows.lines, (l) => l.drink_size_id);
  const label = (l: BuildLineRow) => {
    if (l.measure_id) return loaded.measures.get(l.measure_id)?.name ?? 'measure';
    return l.unit && isUnitCode(l.unit) ? UNITS[l.unit].symbol : (l.unit ?? '');
  };
  const modifiers = new Map<string, { id: string; name: string; items: string[] }>();
  for (const m of added) {
    let e = modifiers.get(m.id);
    if (!e) modifiers.set(m.id, (e = { id: m.id, name: m.name, items: [] }));
    e.items.push((m.ingredient_id ?? m.preparation_id) as string);
  }
  return {
    id: drink.id,
    name: drink.name,
    category: drink.category,
    temperature: drink.temperature,
    notes: drink.notes,
    sizes: rows.sizes.map((s) => ({
      sizeId: s.size_id,
      name: s.size_name,
      volumeMl: dec(s.volume_ml).toFixed(),
      lines: (linesBySize.get(s.id) ?? []).map((l) => ({
        itemName: loaded.itemName((l.ingredient_id ?? l.preparation_id) as string),
        quantity: dec(l.quantity).toFixed(),
        unit: l.measure_id ? (loaded.measures.get(l.measure_id)?.name ?? null) : l.unit,
        unitLabel: label(l),
      })),
    })),
    allergens: loaded.allergensOf(rows.lines.map((l) => (l.ingredient_id ?? l.preparation_id) as string)),
    modifiers: [...modifiers.values()].map((m) => ({ id: m.id, name: m.name, allergens: loaded.allergensOf(m.items) })),
    allergenCaution: ALLERGEN_CAUTION,
  };
}
