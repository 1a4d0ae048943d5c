import type { Knex } from 'knex';
import { buildCostModel, CostingInputError, costLines, type CostModel, type IngredientInput, type LineCost, type LineInput, type PreparationInput } from '../../src/shared/costing';
import { isAllergenCode, sortAllergens, type AllergenCode } from '../../src/shared/allergens';
import { dec, type Dec } from '../../src/shared/decimal';
import { minorUnitStep } from '../../src/shared/money';
import type { PricingPolicy } from '../../src/shared/pricing';
import { yieldBaseUnit, type BaseUnit } from '../../src/shared/units';
import { businessToday, systemClock } from '../platform/clock';
import { loadCostRows, type CostRows, type IngredientRow, type LineRow, type MeasureRow, type PackPriceRow, type PolicyRow, type PreparationLineRow, type PreparationRow } from './cost-model.repo';
import { groupBy } from '../../src/shared/collections';

export interface CostModelOptions {
  /** Prices in force on this date (YYYY-MM-DD); default the business's today (see {@link dayOrToday}). */
  asOf?: string;
  /**
   * Prices to use instead of the stored ones, keyed by pack id (that pack's price) or by
   * ingredient id (the price of the ingredient's costing pack): for "what if" repricing.
   * A price is for the whole pack line (count × quantity), as stored.
   */
  priceOverrides?: ReadonlyMap<string, string>;
}

export interface CostedIngredient {
  row: IngredientRow;
  packs: PackPriceRow[];
  /** The pack that sets the cost (owner's choice, else the most recently priced), with the price used. */
  costingPack: (PackPriceRow & { price: string }) | null;
  /** Usable cost per base unit, unrounded; null when it cannot be worked out (see `problem`). */
  unitCost: Dec | null;
  problem: string | null;
}

export interface CostedPreparation {
  row: PreparationRow;
  baseUnit: BaseUnit | null;
  lines: PreparationLineRow[];
  batchCost: Dec | null;
  unitCost: Dec | null;
  lineCosts: LineCost[] | null;
  problem: string | null;
}

/** A stored line (build, preparation or modifier line) costed, or why it could not be. */
export type StoredLinesCost = { ok: true; cost: Dec; lines: LineCost[] } | { ok: false; problem: string };

export interface LoadedCostModel {
  businessId: string;
  currency: string;
  asOf: string;
  /** The engine's model: item keys are ingredient and preparation ids, measure keys are measure ids. */
  model: CostModel;
  ingredients: ReadonlyMap<string, CostedIngredient>;
  preparations: ReadonlyMap<string, CostedPreparation>;
  measures: ReadonlyMap<string, MeasureRow>;
  /** The business's default policy (a stored row or the documented default). */
  defaultPolicy: PricingPolicy;
  policyIsSet: boolean;
  overrides: ReadonlyMap<string, PricingPolicy>;
  policyFor(category: string | null | undefined): PricingPolicy;
  /** Name of an ingredient or preparation by id. */
  itemName(id: string): string;
  /** Costs stored lines against the model; never throws for bad data, it reports the problem. */
  costStoredLines(lines: readonly LineRow[]): StoredLinesCost;
  /**
   * Sorted allergens of items (ingredient or preparation ids), through preparations, from the
   * stored rows: an item that cannot be costed (no price yet) still declares its allergens.
   */
  allergensOf(itemIds: Iterable<string>): AllergenCode[];
}

/** The line as the engine reads it: item = row id, unit = unit code or measure id. */
export function engineLine(l: LineRow): LineInput {
  return { item: (l.ingredient_id ?? l.preparation_id) as string, quantity: l.quantity, unit: (l.unit ?? l.measure_id) as string };
}

export function policyFromRow(r: PolicyRow): PricingPolicy {
  return { targetMarginPct: dec(r.target_margin_pct).toFixed(), taxMode: r.tax_mode, taxRatePct: dec(r.tax_rate_pct).toFixed(), priceStep: dec(r.price_step).toFixed(), rounding: r.rounding };
}

/** Used until the owner saves a policy: margin 70 %, the business's tax mode, no tax, a step of 5 minor units, rounding up. */
export function defaultPolicy(currency: string, taxMode: 'inclusive' | 'exclusive'): PricingPolicy {
  return { targetMarginPct: '70', taxMode, taxRatePct: '0', priceStep: minorUnitStep(currency).times(5).toFixed(), rounding: 'up' };
}

function chooseCostingPack(ing: IngredientRow, packs: PackPriceRow[], overrides?: ReadonlyMap<string, string>): (PackPriceRow & { price: string }) | null {
  const priced = packs.map((p) => {
    const o = overrides?.get(p.id);
    return o !== undefined ? { ...p, price: o } : p;
  });
  let chosen = ing.costing_pack_id ? priced.find((p) => p.id === ing.costing_pack_id && p.price !== null) : undefined;
  if (!chosen) {
    // The most recently priced: latest effective date in force, then the latest entered.
    for (const p of priced) {
      if (p.price === null) continue;
      if (
        !chosen ||
        (p.effective_from ?? '') > (chosen.effective_from ?? '') ||
        ((p.effective_from ?? '') === (chosen.effective_from ?? '') && (p.priced_at?.getTime() ?? 0) > (chosen.priced_at?.getTime() ?? 0))
      ) {
        chosen = p;
      }
    }
  }
  if (!chosen) return null;
  const o = overrides?.get(ing.id);
  return { ...chosen, price: o ?? (chosen.price as string) };
}

function measuresOf(list: MeasureRow[] | undefined) {
  const out: Record<string, { quantity: string; unit: string }> = {};
  for (const m of list ?? []) out[m.id] = { quantity: dec(m.quantity).toFixed(), unit: m.unit };
  return out;
}

const ITEM_PATH = /^(ingredients|preparations)\[(\d+)\]/;

/**
 * Loads everything needed to cost a business's menu with a fixed handful of queries and
 * builds ONE cost model (each ingredient and preparation costed once). Items that cannot be
 * costed (no price in force, bad stored data) are left out of the model and carry a `problem`;
 * lines that use them report it instead of throwing.
 */
export async function loadCostModel(db: Knex, businessId: string, options: CostModelOptions = {}): Promise<LoadedCostModel> {
  const asOf = await dayOrToday(db, businessId, options.asOf);
  return buildLoadedCostModel(await loadCostRows(db, businessId, asOf), { ...options, asOf });
}

/**
 * The day asked for, else the business's today in its own time zone. Costing's services always
 * ask with the day from `deps.clock` (so tests can pin it); the default, read from the system
 * clock, is for callers in other domains that do not pass a day yet.
 */
export async function dayOrToday(db: Knex, businessId: string, asOf: string | undefined): Promise<string> {
  return asOf ?? businessToday(db, systemClock, businessId);
}

/**
 * The pure half of {@link loadCostModel}: builds the model from rows already loaded (with
 * loadCostRows for `rows.asOf`), applying `options.priceOverrides`. No I/O: the bench times it.
 */
export function buildLoadedCostModel(rows: CostRows, options: CostModelOptions = {}): LoadedCostModel {
  const { businessId, asOf } = rows;
  if (options.asOf !== undefined && options.asOf !== asOf) throw new Error(`The rows carry prices as of ${asOf}, not ${options.asOf}.`);
  const currency = rows.business.currency;

  const packsByIngredient = groupBy(rows.packs, (p) => p.ingredient_id);
  const measuresByItem = groupBy(rows.measures, (m) => (m.ingredient_id ?? m.preparation_id) as string);
  const linesByPrep = groupBy(rows.preparationLines, (l) => l.parent_id);

  const ingredients = new Map<string, CostedIngredient>();
  const ingredientInputs: IngredientInput[] = [];
  for (const row of rows.ingredients) {
    const packs = packsByIngredient.get(row.id) ?? [];
    const costingPack = chooseCostingPack(row, packs, options.priceOverrides);
    const entry: CostedIngredient = { row, packs, costingPack, unitCost: null, problem: costingPack ? null : packs.length ? `No price in force on ${asOf}.` : 'No pack yet: add a pack with its price.' };
    ingredients.set(row.id, entry);
    if (!costingPack) continue;
    ingredientInputs.push({
      key: row.id,
      baseUnit: row.base_unit,
      densityGPerMl: row.density_g_per_ml === null ? null : dec(row.density_g_per_ml).toFixed(),
      yieldPct: dec(row.yield_pct).toFixed(),
      pack: { count: dec(costingPack.count).toFixed(), quantity: dec(costingPack.quantity).toFixed(), unit: costingPack.unit, price: dec(costingPack.price).toFixed() },
      measures: measuresOf(measuresByItem.get(row.id)),
      allergens: row.allergens,
    });
  }

  const preparations = new Map<string, CostedPreparation>();
  let prepInputs: PreparationInput[] = [];
  for (const row of rows.preparations) {
    const lines = linesByPrep.get(row.id) ?? [];
    preparations.set(row.id, {
      row,
      baseUnit: yieldBaseUnit(row.yield_unit),
      lines,
      batchCost: null,
      unitCost: null,
      lineCosts: null,
      problem: null,
    });
    prepInputs.push({
      key: row.id,
      yield: { quantity: dec(row.yield_quantity).toFixed(), unit: row.yield_unit },
      densityGPerMl: row.density_g_per_ml === null ? null : dec(row.density_g_per_ml).toFixed(),
      measures: measuresOf(measuresByItem.get(row.id)),
      lines: lines.map(engineLine),
    });
  }

  const names = new Map<string, string>();
  for (const r of rows.ingredients) names.set(r.id, r.name);
  for (const r of rows.preparations) names.set(r.id, r.name);
  const nameOf = (id: string) => names.get(id) ?? 'an item that no longer exists';

  // Normally one pass. Bad stored items are dropped with their problem and the model rebuilt;
  // a preparation using a dropped item is dropped in the next pass.
  let ingInputs = ingredientInputs;
  let model: CostModel | null = null;
  for (let pass = 0; !model; pass++) {
    try {
      model = buildCostModel(ingInputs, prepInputs);
    } catch (e) {
      if (!(e instanceof CostingInputError) || pass > ingInputs.length + prepInputs.length) throw e;
      const dropI = new Set<number>();
      const dropP = new Set<number>();
      for (const [path, message] of Object.entries(e.fields)) {
        const m = ITEM_PATH.exec(path);
        if (!m) throw e;
        const index = Number(m[2]);
        const key = m[1] === 'ingredients' ? ingInputs[index].key : prepInputs[index].key;
        const readable = message.replaceAll(/[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}/g, (id) => nameOf(id));
        const target = m[1] === 'ingredients' ? ingredients.get(key) : preparations.get(key);
        if (target && !target.problem) target.problem = readable;
        (m[1] === 'ingredients' ? dropI : dropP).add(index);
      }
      ingInputs = ingInputs.filter((_, i) => !dropI.has(i));
      prepInputs = prepInputs.filter((_, i) => !dropP.has(i));
    }
  }
  const built = model;

  for (const [id, entry] of ingredients) entry.unitCost = built.items.get(id)?.unitCost ?? null;
  for (const [id, entry] of preparations) {
    const item = built.items.get(id);
    if (!item) {
      entry.problem ??= 'Cannot be costed: one of its lines cannot be.';
      continue;
    }
    entry.unitCost = item.unitCost;
    const costed = costLines(built, entry.lines.map(engineLine));
    entry.batchCost = costed.cost;
    entry.lineCosts = costed.lines;
  }

  const measures = new Map(rows.measures.map((m) => [m.id, m]));
  const stored = rows.policies.find((p) => p.category === null);
  const base = stored ? policyFromRow(stored) : defaultPolicy(currency, rows.business.tax_mode);
  const overrides = new Map(rows.policies.filter((p) => p.category !== null).map((p) => [p.category as string, policyFromRow(p)]));

  const costStoredLines = (lines: readonly LineRow[]): StoredLinesCost => {
    for (const l of lines) {
      const id = (l.ingredient_id ?? l.preparation_id) as string;
      if (!built.items.has(id)) {
        const p = ingredients.get(id)?.problem ?? preparations.get(id)?.problem ?? 'it was removed';
        return { ok: false, problem: `${nameOf(id)}: ${p}` };
      }
    }
    try {
      const r = costLines(built, lines.map(engineLine));
      return { ok: true, cost: r.cost, lines: r.lines };
    } catch (e) {
      if (!(e instanceof CostingInputError)) throw e;
      const first = Object.values(e.fields)[0] ?? 'A line cannot be costed.';
      return { ok: false, problem: first.replaceAll(/[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}/g, (id) => measures.get(id)?.name ?? nameOf(id)) };
    }
  };

  const allergenMemo = new Map<string, Set<AllergenCode>>();
  const allergensOfItem = (id: string, seen: Set<string>): Set<AllergenCode> => {
    const hit = allergenMemo.get(id);
    if (hit) return hit;
    const out = new Set<AllergenCode>();
    const ing = ingredients.get(id);
    if (ing) for (const a of ing.row.allergens) if (isAllergenCode(a)) out.add(a);
    const prep = preparations.get(id);
    if (prep && !seen.has(id)) {
      seen.add(id);
      for (const l of prep.lines) for (const a of allergensOfItem((l.ingredient_id ?? l.preparation_id) as string, seen)) out.add(a);
      seen.delete(id);
    }
    allergenMemo.set(id, out);
    return out;
  };

  return {
    allergensOf: (ids) => {
      const all: AllergenCode[] = [];
      for (const id of ids) all.push(...allergensOfItem(id, new Set()));
      return sortAllergens(all);
    },
    businessId,
    currency,
    asOf,
    model: built,
    ingredients,
    preparations,
    measures,
    defaultPolicy: base,
    policyIsSet: Boolean(stored),
    overrides,
    policyFor: (category) => (category ? overrides.get(category) : undefined) ?? base,
    itemName: nameOf,
    costStoredLines,
  };
}

