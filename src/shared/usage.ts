import { D, type Dec } from './decimal';
import { conversionFactor, isUnitCode, UnitConversionError, type BaseUnit } from './units';

// Theoretical usage: how much of each ingredient leaves stock for a quantity of a recipe.
// Independent of prices on purpose: an ingredient with no price in force still leaves the
// shelf when a drink is made, so this does not go through the costing engine's model (which
// only holds items it could cost); it reads the same recipe structure with units.ts.

/** A line of a recipe: an item key, a quantity and a standard unit code or one of the item's measure keys. */
export interface UsageLine {
  item: string;
  quantity: Dec;
  unit: string;
}

interface UsageItemBase {
  key: string;
  /** Shown in problems. */
  name: string;
  baseUnit: BaseUnit;
  density: Dec | null;
  /** Named portions of the item (a shot, a pump) by key. */
  measures: ReadonlyMap<string, { quantity: Dec; unit: string }>;
}

export interface UsageIngredient extends UsageItemBase {
  kind: 'ingredient';
  /** Usable share of what leaves stock, in (0, 100]. */
  yieldPct: Dec;
}

export interface UsagePreparation extends UsageItemBase {
  kind: 'preparation';
  /** What one batch makes, in the preparation's base unit. */
  yieldInBase: Dec;
  lines: readonly UsageLine[];
}

export type UsageItem = UsageIngredient | UsagePreparation;

/** Ingredient key → quantity taken from stock, in the ingredient's base unit. */
export type Usage = Map<string, Dec>;

const HUNDRED = new D(100);

/** Adds `times` × `usage` into `into`. */
export function addUsage(into: Usage, usage: ReadonlyMap<string, Dec>, times: Dec = new D(1)): void {
  for (const [key, q] of usage) {
    const add = q.times(times);
    const before = into.get(key);
    into.set(key, before ? before.plus(add) : add);
  }
}

/**
 * Explodes recipe lines into the ingredients they take from stock. For each line:
 * - the quantity in the item's base unit: a standard unit by its exact factor (units.ts,
 *   mass ↔ volume through the item's density), a measure by its own quantity and unit first;
 * - an ingredient: stock usage = that quantity ÷ (yield ÷ 100), because a recipe line says what
 *   goes into the cup (the usable, edible portion) and the trimmings, spills or purge left
 *   behind come out of stock too (edible portion = as purchased × yield: tests/SOURCES.md,
 *   "Cost control");
 * - a preparation: each of its lines × (the quantity ÷ its batch yield in base units), nested
 *   preparations the same way, each preparation's usage per base unit worked out once.
 * A line that cannot be read (unknown item or measure, a unit that does not convert, a
 * preparation cycle) is left out and its problem reported, never guessed.
 */
export class UsageExploder {
  readonly #items: ReadonlyMap<string, UsageItem>;
  /** Usage of one base unit of a preparation, or why it cannot be worked out. */
  readonly #perUnit = new Map<string, { usage: Usage; problems: string[] }>();
  readonly #visiting = new Set<string>();

  constructor(items: Iterable<UsageItem>) {
    this.#items = new Map([...items].map((i) => [i.key, i]));
  }

  /** The stock usage of `lines` (once), with the problems of lines left out. */
  explode(lines: readonly UsageLine[]): { usage: Usage; problems: string[] } {
    const usage: Usage = new Map();
    const problems: string[] = [];
    for (const line of lines) this.#addLine(line, usage, problems);
    return { usage, problems };
  }

  /** The quantity of a line in its item's base unit. Throws UnitConversionError for a unit it cannot read. */
  inBaseUnit(item: UsageItem, quantity: Dec, unit: string): Dec {
    if (isUnitCode(unit)) return quantity.times(conversionFactor(unit, item.baseUnit, item.density));
    const m = item.measures.get(unit);
    if (!m) throw new UnitConversionError('unknown-unit', `Unknown unit or measure for ${item.name}.`);
    return quantity.times(m.quantity).times(conversionFactor(m.unit, item.baseUnit, item.density));
  }

  #addLine(line: UsageLine, into: Usage, problems: string[]): void {
    const item = this.#items.get(line.item);
    if (!item) {
      problems.push('A line uses an item that no longer exists.');
      return;
    }
    let base: Dec;
    try {
      base = this.inBaseUnit(item, line.quantity, line.unit);
    } catch (e) {
      if (!(e instanceof UnitConversionError)) throw e;
      problems.push(`${item.name}: ${e.message}`);
      return;
    }
    if (item.kind === 'ingredient') {
      addUsage(into, new Map([[item.key, base.times(HUNDRED).div(item.yieldPct)]]));
      return;
    }
    const per = this.#preparationPerUnit(item);
    addUsage(into, per.usage, base);
    problems.push(...per.problems);
  }

  #preparationPerUnit(prep: UsagePreparation): { usage: Usage; problems: string[] } {
    const known = this.#perUnit.get(prep.key);
    if (known) return known;
    if (this.#visiting.has(prep.key)) return { usage: new Map(), problems: [`${prep.name} uses itself through its lines.`] };
    this.#visiting.add(prep.key);
    const batch = this.explode(prep.lines);
    this.#visiting.delete(prep.key);
    const usage: Usage = new Map();
    addUsage(usage, batch.usage, new D(1).div(prep.yieldInBase));
    const out = { usage, problems: batch.problems };
    this.#perUnit.set(prep.key, out);
    return out;
  }
}

/**
 * Total stock usage of recipes sold or wasted `count` times each: Σ count × usage of one.
 * `recipes` maps a recipe key (a drink size) to its lines; counts of a key without lines are
 * reported. Each recipe is exploded once, whatever its count.
 */
export function usageOfCounts(
  exploder: UsageExploder,
  recipes: ReadonlyMap<string, readonly UsageLine[]>,
  counts: Iterable<{ recipe: string; count: Dec; label?: string }>,
): { usage: Usage; problems: string[] } {
  const memo = new Map<string, { usage: Usage; problems: string[] }>();
  const usage: Usage = new Map();
  const problems: string[] = [];
  for (const c of counts) {
    let one = memo.get(c.recipe);
    if (!one) {
      const lines = recipes.get(c.recipe);
      one = lines && lines.length ? exploder.explode(lines) : { usage: new Map(), problems: [`${c.label ?? 'A drink'} has no build: its usage is not counted.`] };
      memo.set(c.recipe, one);
      problems.push(...one.problems);
    }
    addUsage(usage, one.usage, c.count);
  }
  return { usage, problems: [...new Set(problems)] };
}
