import { isAllergenCode, sortAllergens, type AllergenCode } from './allergens';
import { readDecimal, rules } from './checks';
import { D, type Dec } from './decimal';
import { FieldErrors } from './errors';
import { writeCost, writeQuantity } from './money';
import { exactPriceFigures, grossForTargetMargin, readPolicy, roundPrice, writePriceFigures, type PriceFigures, type PricingPolicy } from './pricing';
import { BASE_UNIT_OF, conversionFactor, isBaseUnit, isUnitCode, UNITS, UnitConversionError, type BaseUnit } from './units';

export { CostingInputError } from './errors';

/** A named portion of an item, e.g. a shot = 9 g of beans, a pump = 7.5 ml of syrup. */
export interface MeasureInput {
  quantity: string;
  /** A standard unit code (see units.ts). */
  unit: string;
}

export interface PackInput {
  /** Packs in a case; default 1. */
  count?: string | null;
  /** Quantity in one pack. */
  quantity: string;
  unit: string;
  /** Price paid for `count` packs; 0 is allowed (a free sample). */
  price: string;
}

export interface IngredientInput {
  /** Unique among ingredients and preparations (the server uses the row id). */
  key: string;
  baseUnit: string;
  densityGPerMl?: string | null;
  /** Usable share of what is bought, in (0, 100]; default 100. */
  yieldPct?: string | null;
  pack: PackInput;
  measures?: Record<string, MeasureInput> | null;
  allergens?: readonly string[] | null;
}

export interface LineInput {
  /** Key of an ingredient or a preparation. */
  item: string;
  quantity: string;
  /** A standard unit code or a measure of the item. */
  unit: string;
}

export interface PreparationInput {
  key: string;
  /** What one batch makes; its unit's dimension decides the preparation's base unit. */
  yield: MeasureInput;
  /** Needed only when the preparation is used by mass but yields a volume, or the reverse. */
  densityGPerMl?: string | null;
  measures?: Record<string, MeasureInput> | null;
  lines: readonly LineInput[];
}

export interface SizeInput {
  name: string;
  currentPrice?: string | null;
  lines: readonly LineInput[];
}

export interface CostPreviewRequest {
  currency: string;
  policy: PricingPolicy;
  ingredients: readonly IngredientInput[];
  preparations?: readonly PreparationInput[] | null;
  sizes: readonly SizeInput[];
}

export interface LineCostOut {
  item: string;
  quantityInBaseUnit: string;
  baseUnit: BaseUnit;
  cost: string;
}

export interface SizeCostOut {
  name: string;
  cost: string;
  lines: LineCostOut[];
  suggestedPrice: string;
  atSuggested: PriceFigures;
  atCurrent: PriceFigures | null;
}

export interface CostPreviewResponse {
  currency: string;
  sizes: SizeCostOut[];
  allergens: AllergenCode[];
}

/** One item of a cost model, with everything needed to cost a line of it. */
export interface CostedItem {
  readonly key: string;
  readonly kind: 'ingredient' | 'preparation';
  readonly baseUnit: BaseUnit;
  readonly density: Dec | null;
  /** Cost of one base unit (g, ml or each), unrounded. */
  readonly unitCost: Dec;
  readonly measures: ReadonlyMap<string, { quantity: Dec; unit: string }>;
  /** Allergens of the item, through its preparation lines. */
  readonly allergens: ReadonlySet<AllergenCode>;
}

/**
 * Ingredients and preparations with their unit costs worked out once (each preparation's
 * unit cost is computed a single time however often it is used), ready to cost any number of
 * lines. Build with {@link buildCostModel}.
 */
export interface CostModel {
  readonly items: ReadonlyMap<string, CostedItem>;
}

/** A line costed, unrounded. */
export interface LineCost {
  readonly item: string;
  readonly quantityInBaseUnit: Dec;
  readonly baseUnit: BaseUnit;
  readonly cost: Dec;
}

export interface LinesCost {
  lines: LineCost[];
  /** Sum of the unrounded line costs. */
  cost: Dec;
}

/** One line unit of an item: base quantity in one of that unit, and the cost of one of that unit. */
interface PerUnit {
  readonly factor: Dec;
  readonly cost: Dec;
  /**
   * Lines of this item and unit already costed, by their quantity string (checked when first
   * seen). A menu repeats the same few quantities thousands of times, and a costed line is
   * immutable, so it is shared instead of being multiplied out again.
   */
  readonly byQuantity: Map<string, CostedLine>;
}

interface ModelItem extends CostedItem {
  /** Per line unit: its factor and cost, or why the unit is refused for this item. */
  readonly perUnit: Map<string, PerUnit | string>;
}

interface InternalModel extends CostModel {
  readonly items: Map<string, ModelItem>;
  /** Keys whose cost could not be worked out; their problems are already recorded. */
  readonly broken: Set<string>;
}

const HUNDRED = new D(100);

function readDensity(value: string | null | undefined, path: string, errors: FieldErrors): Dec | null {
  return value === undefined || value === null ? null : readDecimal(value, rules.positive, path, errors);
}

function readMeasures(
  measures: Record<string, MeasureInput> | null | undefined,
  baseUnit: BaseUnit,
  density: Dec | null,
  path: string,
  errors: FieldErrors,
): Map<string, { quantity: Dec; unit: string }> {
  const out = new Map<string, { quantity: Dec; unit: string }>();
  for (const [name, m] of Object.entries(measures ?? {})) {
    const at = `${path}.measures.${name}`;
    if (isUnitCode(name)) {
      errors.add(at, `"${name}" is a standard unit; give the measure another name.`);
      continue;
    }
    const quantity = readDecimal(m?.quantity, rules.positive, `${at}.quantity`, errors);
    let unitOk = true;
    try {
      conversionFactor(m?.unit, baseUnit, density);
    } catch (e) {
      if (!(e instanceof UnitConversionError)) throw e;
      errors.add(`${at}.unit`, e.message);
      unitOk = false;
    }
    if (quantity && unitOk) out.set(name, { quantity, unit: m.unit });
  }
  return out;
}

function readAllergens(codes: readonly string[] | null | undefined, path: string, errors: FieldErrors): Set<AllergenCode> {
  const out = new Set<AllergenCode>();
  (codes ?? []).forEach((code, i) => {
    if (isAllergenCode(code)) out.add(code);
    else errors.add(`${path}.allergens[${i}]`, `Unknown allergen "${code}": use one of the 14 in EU Regulation 1169/2011 Annex II.`);
  });
  return out;
}

/**
 * Usable unit cost of an ingredient, per base unit:
 * pack price ÷ (pack count × pack quantity in the base unit) ÷ (yield ÷ 100),
 * computed as price × 100 ÷ (count × quantity × factor × yield) with one division.
 * Edible-portion cost = as-purchased cost ÷ yield (trade practice; Dittmer & Keefe ch. 8 describe
 * standard yields).
 */
function ingredientItem(ing: IngredientInput, i: number, errors: FieldErrors): ModelItem | null {
  const path = `ingredients[${i}]`;
  const before = Object.keys(errors.fields).length;
  const baseUnit = ing.baseUnit;
  if (!isBaseUnit(baseUnit)) errors.add(`${path}.baseUnit`, 'The base unit must be g, ml or each.');
  const density = readDensity(ing.densityGPerMl, `${path}.densityGPerMl`, errors);
  const yieldPct = ing.yieldPct === undefined || ing.yieldPct === null ? HUNDRED : readDecimal(ing.yieldPct, rules.yieldPct, `${path}.yieldPct`, errors);
  const pack = ing.pack ?? ({} as PackInput);
  const count = pack.count === undefined || pack.count === null ? new D(1) : readDecimal(pack.count, rules.positive, `${path}.pack.count`, errors);
  const quantity = readDecimal(pack.quantity, rules.positive, `${path}.pack.quantity`, errors);
  const price = readDecimal(pack.price, rules.nonNegative, `${path}.pack.price`, errors);
  const allergens = readAllergens(ing.allergens, path, errors);
  if (!isBaseUnit(baseUnit)) return null;
  let factor: Dec | null = null;
  try {
    factor = conversionFactor(pack.unit, baseUnit, density);
  } catch (e) {
    if (!(e instanceof UnitConversionError)) throw e;
    errors.add(`${path}.pack.unit`, e.message);
  }
  const measures = readMeasures(ing.measures, baseUnit, density, path, errors);
  if (Object.keys(errors.fields).length > before || !factor || !yieldPct || !count || !quantity || !price) return null;
  const unitCost = price.times(HUNDRED).div(count.times(quantity).times(factor).times(yieldPct));
  return { key: ing.key, kind: 'ingredient', baseUnit, density, unitCost, measures, allergens, perUnit: new Map() };
}

/**
 * Cost of `quantity` × `unit` of an item, memoising per (item, unit) the base quantity of one
 * unit and its cost: line cost = line quantity in the item's base unit × its unit cost, a
 * measure resolving to its quantity and unit first, mass ↔ volume through the density.
 * Returns a refusal message for the line's unit, or the costed line.
 */
function costOne(item: ModelItem, quantity: Dec, quantityText: string, unit: string): LineCost | string {
  let per = item.perUnit.get(unit);
  if (per === undefined) {
    per = unitFactor(item, unit);
    item.perUnit.set(unit, per);
  }
  if (typeof per === 'string') return per;
  const line = new CostedLine(item.key, item.baseUnit, quantity.times(per.cost), quantity, per.factor);
  per.byQuantity.set(quantityText, line);
  return line;
}

/** The line of `item` costed before with this very quantity string and unit, if any. */
function costedBefore(item: ModelItem, quantity: unknown, unit: string): CostedLine | undefined {
  const per = item.perUnit.get(unit);
  return per === undefined || typeof per === 'string' ? undefined : per.byQuantity.get(quantity as string);
}

/** A line's base quantity is worked out only when asked for: totals for a whole menu do not need it. */
class CostedLine implements LineCost {
  #inBase: Dec | undefined;
  constructor(
    readonly item: string,
    readonly baseUnit: BaseUnit,
    readonly cost: Dec,
    readonly quantity: Dec,
    private readonly factor: Dec,
  ) {}

  get quantityInBaseUnit(): Dec {
    this.#inBase ??= this.quantity.times(this.factor);
    return this.#inBase;
  }
}

function unitFactor(item: ModelItem, unit: string): PerUnit | string {
  try {
    let factor: Dec;
    if (isUnitCode(unit)) factor = conversionFactor(unit, item.baseUnit, item.density);
    else {
      const m = item.measures.get(unit);
      if (!m) return `Unknown unit or measure "${unit}" for ${item.key}.`;
      factor = m.quantity.times(conversionFactor(m.unit, item.baseUnit, item.density));
    }
    return { factor, cost: factor.times(item.unitCost), byQuantity: new Map() };
  } catch (e) {
    if (!(e instanceof UnitConversionError)) throw e;
    return `${item.key}: ${e.message}`;
  }
}

function costLinesInto(model: InternalModel, lines: readonly LineInput[], path: string, errors: FieldErrors): LinesCost | null {
  const out: LineCost[] = [];
  // Unset until the first line: 0 + x is x (a line cost has at most the precision's digits),
  // so the sum starts from the first line's cost without an addition.
  let total: Dec | null = null;
  let ok = true;
  (lines ?? []).forEach((line, j) => {
    const known = model.items.get(line?.item);
    // Hot path: the same item, quantity and unit were checked and costed before (the quantity
    // string is a key only once it was read as a positive decimal), so nothing to parse again.
    const hit = known && costedBefore(known, line.quantity, line.unit);
    if (hit) {
      out.push(hit);
      total = total === null ? hit.cost : total.plus(hit.cost);
      return;
    }
    const at = `${path}[${j}]`;
    const quantity = readDecimal(line?.quantity, rules.positive, `${at}.quantity`, errors);
    const item = known;
    if (!item) {
      ok = false;
      if (!model.broken.has(line?.item)) errors.add(`${at}.item`, `Unknown item "${line?.item}".`);
      return;
    }
    if (!quantity) {
      ok = false;
      return;
    }
    const costed = costOne(item, quantity, line.quantity, line.unit);
    if (typeof costed === 'string') {
      ok = false;
      errors.add(`${at}.unit`, costed);
      return;
    }
    out.push(costed);
    total = total === null ? costed.cost : total.plus(costed.cost);
  });
  return ok ? { lines: out, cost: total ?? new D(0) } : null;
}

function buildInto(ingredients: readonly IngredientInput[], preparations: readonly PreparationInput[], errors: FieldErrors): InternalModel {
  const items = new Map<string, ModelItem>();
  const broken = new Set<string>();
  const seen = new Set<string>();
  const claimKey = (key: unknown, path: string): boolean => {
    if (typeof key !== 'string' || key === '') {
      errors.add(path, 'Every ingredient and preparation needs a key.');
      return false;
    }
    if (seen.has(key)) {
      errors.add(path, `The key "${key}" is used more than once among ingredients and preparations.`);
      return false;
    }
    seen.add(key);
    return true;
  };
  (ingredients ?? []).forEach((ing, i) => {
    if (!claimKey(ing?.key, `ingredients[${i}].key`)) return;
    const item = ingredientItem(ing, i, errors);
    if (item) items.set(ing.key, item);
    else broken.add(ing.key);
  });
  const preps = new Map<string, { prep: PreparationInput; index: number }>();
  (preparations ?? []).forEach((prep, index) => {
    if (claimKey(prep?.key, `preparations[${index}].key`)) preps.set(prep.key, { prep, index });
  });
  const model: InternalModel = { items, broken };
  const state = new Map<string, 'visiting' | 'done'>();
  const stack: string[] = [];

  /**
   * Preparation unit cost = sum of its line costs ÷ its yield in its base unit (g, ml or each,
   * from the yield's unit). Depth-first so that nested preparations are costed first, once.
   */
  const visit = (key: string): void => {
    const entry = preps.get(key) as { prep: PreparationInput; index: number };
    const { prep, index } = entry;
    const path = `preparations[${index}]`;
    state.set(key, 'visiting');
    stack.push(key);
    let ok = true;
    (prep.lines ?? []).forEach((line, j) => {
      const dep = line?.item;
      if (!preps.has(dep)) return;
      if (state.get(dep) === 'visiting') {
        const cycle = [...stack.slice(stack.indexOf(dep)), dep].join(' → ');
        errors.add(`${path}.lines[${j}].item`, `Preparation cycle: ${cycle}.`);
        ok = false;
      } else if (!state.has(dep)) visit(dep);
    });
    stack.pop();
    state.set(key, 'done');
    const before = Object.keys(errors.fields).length;
    const yieldUnit = prep.yield?.unit;
    const yieldQty = readDecimal(prep.yield?.quantity, rules.positive, `${path}.yield.quantity`, errors);
    if (!isUnitCode(yieldUnit)) errors.add(`${path}.yield.unit`, `Unknown unit "${yieldUnit}".`);
    const density = readDensity(prep.densityGPerMl, `${path}.densityGPerMl`, errors);
    if (!(prep.lines ?? []).length) errors.add(`${path}.lines`, 'A preparation needs at least one line.');
    const costed = ok ? costLinesInto(model, prep.lines, `${path}.lines`, errors) : null;
    if (!isUnitCode(yieldUnit)) {
      broken.add(key);
      return;
    }
    const baseUnit = BASE_UNIT_OF[UNITS[yieldUnit].dimension];
    const measures = readMeasures(prep.measures, baseUnit, density, path, errors);
    if (!costed || !yieldQty || Object.keys(errors.fields).length > before) {
      broken.add(key);
      return;
    }
    const allergens = new Set<AllergenCode>();
    for (const l of costed.lines) for (const a of (items.get(l.item) as ModelItem).allergens) allergens.add(a);
    const yieldInBase = yieldQty.times(conversionFactor(yieldUnit, baseUnit, null));
    items.set(key, {
      key,
      kind: 'preparation',
      baseUnit,
      density,
      unitCost: costed.cost.div(yieldInBase),
      measures,
      allergens,
      perUnit: new Map(),
    });
  };
  for (const key of preps.keys()) if (!state.has(key)) visit(key);
  return model;
}

/**
 * Builds a {@link CostModel} from ingredients and preparations (keys unique across both),
 * working out each item's usable unit cost once:
 * - ingredient: pack price ÷ (pack count × pack quantity in the base unit) ÷ (yield ÷ 100);
 * - preparation: sum of its line costs ÷ its yield in its base unit, nested preparations first.
 * Throws a {@link CostingInputError} naming every refused field (`ingredients[i].…`,
 * `preparations[j].…`), including a preparation cycle ("a → b → a").
 */
export function buildCostModel(ingredients: readonly IngredientInput[], preparations: readonly PreparationInput[] = []): CostModel {
  const errors = new FieldErrors();
  const model = buildInto(ingredients, preparations, errors);
  errors.throwIfAny();
  return model;
}

/**
 * Costs a list of lines (a cup size's build, a modifier) against a model: each line cost =
 * quantity in the item's base unit × its unit cost; the total is the sum of the unrounded line
 * costs. Refusals are named `<path>[j].item|quantity|unit` and thrown as a CostingInputError.
 */
export function costLines(model: CostModel, lines: readonly LineInput[], path = 'lines'): LinesCost {
  const errors = new FieldErrors();
  const result = costLinesInto(asInternal(model), lines, path, errors);
  errors.throwIfAny();
  return result as LinesCost;
}

/** Sorted allergen codes of the items named by `lines` (or by keys), through preparations. */
export function allergensOf(model: CostModel, lines: Iterable<{ item: string } | string>): AllergenCode[] {
  const codes: AllergenCode[] = [];
  for (const l of lines) {
    const item = model.items.get(typeof l === 'string' ? l : l.item);
    if (item) codes.push(...item.allergens);
  }
  return sortAllergens(codes);
}

/** Writes a costed line: quantity as a plain decimal, cost to 4 places halves up. */
export function writeLineCost(line: LineCost): LineCostOut {
  return { item: line.item, quantityInBaseUnit: writeQuantity(line.quantityInBaseUnit), baseUnit: line.baseUnit, cost: writeCost(line.cost) };
}

function asInternal(model: CostModel): InternalModel {
  const m = model as InternalModel;
  if (!(m.broken instanceof Set)) throw new TypeError('Build the cost model with buildCostModel.');
  return m;
}

/**
 * The cost preview: for each cup size, its line costs, its cost (the sum of the unrounded
 * lines), the suggested price for the policy's target margin and the figures at that price and
 * at the current price; plus the sorted allergens of everything used.
 * Written out: costs to 4 places, money to the currency's minor units, percentages to 2
 * places, all halves up, each from unrounded values. Throws a CostingInputError naming every
 * refused field of the request.
 */
export function costPreview(request: CostPreviewRequest): CostPreviewResponse {
  const errors = new FieldErrors();
  const policy = readPolicy(request.policy, request.currency, errors);
  const model = buildInto(request.ingredients, request.preparations ?? [], errors);
  const sizes = (request.sizes ?? []).map((size, i) => {
    const costed = costLinesInto(model, size.lines, `sizes[${i}].lines`, errors);
    const current =
      size.currentPrice === undefined || size.currentPrice === null ? null : readDecimal(size.currentPrice, rules.positive, `sizes[${i}].currentPrice`, errors);
    return { size, costed, current };
  });
  errors.throwIfAny();
  const p = policy as NonNullable<typeof policy>;
  const used: string[] = [];
  const out = sizes.map(({ size, costed, current }) => {
    const { lines, cost } = costed as LinesCost;
    for (const l of lines) used.push(l.item);
    const suggested = roundPrice(grossForTargetMargin(cost, p), p);
    const atSuggested = writePriceFigures(exactPriceFigures(suggested, cost, p), p.currency);
    return {
      name: size.name,
      cost: writeCost(cost),
      lines: lines.map(writeLineCost),
      suggestedPrice: atSuggested.price,
      atSuggested,
      atCurrent: current ? writePriceFigures(exactPriceFigures(current, cost, p), p.currency) : null,
    };
  });
  return { currency: request.currency, sizes: out, allergens: allergensOf(model, used) };
}
