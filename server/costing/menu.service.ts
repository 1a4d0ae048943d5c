import type { Knex } from 'knex';
import { ALLERGEN_CAUTION } from '../../src/shared/allergens';
import { writeLineCost } from '../../src/shared/costing';
import { dec } from '../../src/shared/decimal';
import { writeCost, writeMoney, writePercent } from '../../src/shared/money';
import { exactMarginPct, parsePolicy, priceFigures, suggestPrice, type ParsedPolicy } from '../../src/shared/pricing';
import { UNITS, isUnitCode } from '../../src/shared/units';
import { notFound } from '../platform/errors';
import { loadMenuRows, type BuildLineRow, type DrinkSizeRow, type MenuRows } from './cost-model.repo';
import { loadCostModel, type CostModelOptions, type LoadedCostModel } from './cost-model.service';
import { today } from './shared';
import { groupBy } from '../../src/shared/collections';
import { cacheFor, costingVersion } from '../platform/versions';


/** The preview's figures for one saved cup size: cost, lines, suggested price, figures at both prices. */
export function costSavedSize(loaded: LoadedCostModel, category: string, size: DrinkSizeRow, lines: BuildLineRow[]) {
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

/** GET /api/drinks/:id/costing: the preview's response for a saved drink, plus ids. */
export async function drinkCosting(db: Knex, businessId: string, drinkId: string, options: CostModelOptions = {}) {
  // Menu prices in force on the same date as the pack prices (planned ones included).
  const rows = await loadMenuRows(db, businessId, drinkId, options.asOf);
  const drink = rows.drinks[0];
  if (!drink) throw notFound('That drink');
  const loaded = await loadCostModel(db, businessId, options);
  const linesBySize = groupBy(rows.lines, (l) => l.drink_size_id);
  const sizes = rows.sizes.map((s) => costSavedSize(loaded, drink.category, s, linesBySize.get(s.id) ?? []));
  return {
    drinkId: drink.id,
    name: drink.name,
    category: drink.category,
    currency: loaded.currency,
    asOf: loaded.asOf,
    policy: loaded.policyFor(drink.category),
    sizes,
    allergens: loaded.allergensOf(rows.lines.map((l) => (l.ingredient_id ?? l.preparation_id) as string)),
    allergenCaution: ALLERGEN_CAUTION,
  };
}

/**
 * GET /api/menu/costing: every live drink × size costed from ONE cost model and three menu
 * queries, with the margin at the current price against the category's target.
 */
export async function menuCosting(db: Knex, businessId: string, options: CostModelOptions = {}): Promise<MenuCosting> {
  const compute = async () => {
    const [rows, loaded] = await Promise.all([loadMenuRows(db, businessId, undefined, options.asOf), loadCostModel(db, businessId, options)]);
    return menuCostingFrom(loaded, rows);
  };
  if (options.priceOverrides) return compute();
  // An unchanged menu is not costed again: the result is kept per business and date while the
  // business's costing version stays the same (read first; see versions.ts).
  const version = await costingVersion(db, businessId);
  return cacheFor<MenuCosting>(db, 'menu-costing', MENU_CACHE_LIMIT).get(`${businessId}|${options.asOf ?? today()}`, version, compute);
}

/** Menus kept per database handle (a business and a date each). */
const MENU_CACHE_LIMIT = 200;

export type MenuCosting = ReturnType<typeof menuCostingFrom>;

/** The pure half of {@link menuCosting}: every drink × size costed from a built model and the menu rows. */
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

/** GET /api/cards: the drinks a barista can open. */
export async function listCards(db: Knex, businessId: string) {
  const rows = await db('drinks as d')
    .leftJoin('drink_sizes as ds', 'ds.drink_id', 'd.id')
    .leftJoin('cup_sizes as cs', 'cs.id', 'ds.size_id')
    .where('d.business_id', businessId)
    .whereNull('d.archived_at')
    .orderBy([{ column: 'd.category' }, { column: 'd.name' }, { column: 'cs.position' }, { column: 'cs.volume_ml' }])
    .select('d.id', 'd.name', 'd.category', 'd.temperature', 'cs.name as size_name');
  const cards = new Map<string, { id: string; name: string; category: string; temperature: string; sizes: string[] }>();
  for (const r of rows) {
    let c = cards.get(r.id);
    if (!c) cards.set(r.id, (c = { id: r.id, name: r.name, category: r.category, temperature: r.temperature, sizes: [] }));
    if (r.size_name) c.sizes.push(r.size_name);
  }
  return { cards: [...cards.values()] };
}

/** GET /api/drinks/:id/card: the build per size and the allergens, with no cost anywhere. */
export async function drinkCard(db: Knex, businessId: string, drinkId: string) {
  const drink = await db('drinks').where({ business_id: businessId, id: drinkId }).whereNull('archived_at').first('id', 'name', 'category', 'temperature', 'notes');
  if (!drink) throw notFound('That drink');
  const [rows, loaded, modifierLines] = await Promise.all([
    loadMenuRows(db, businessId, drinkId),
    loadCostModel(db, businessId),
    db('modifier_lines as ml')
      .join('modifiers as m', 'm.id', 'ml.modifier_id')
      .where('ml.business_id', businessId)
      .where('ml.action', 'add')
      .whereNull('m.archived_at')
      .orderBy('m.name')
      .select('m.id', 'm.name', 'ml.ingredient_id', 'ml.preparation_id'),
  ]);
  const linesBySize = groupBy(rows.lines, (l) => l.drink_size_id);
  const label = (l: BuildLineRow) => {
    if (l.measure_id) return loaded.measures.get(l.measure_id)?.name ?? 'measure';
    return l.unit && isUnitCode(l.unit) ? UNITS[l.unit].symbol : (l.unit ?? '');
  };
  const modifiers = new Map<string, { id: string; name: string; items: string[] }>();
  for (const m of modifierLines) {
    let e = modifiers.get(m.id);
    if (!e) modifiers.set(m.id, (e = { id: m.id, name: m.name, items: [] }));
    e.items.push(m.ingredient_id ?? m.preparation_id);
  }
  return {
    card: {
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
    },
  };
}
