import type { CostPreviewRequest, IngredientInput, LineInput, PreparationInput } from '../../../shared/costing';
import { dec, isDecimalString } from '../../../shared/decimal';
import type { BuildDetails } from '../api/get-build-details';
import type { IngredientDetail, IngredientSummary, LineIn, PreparationDetail, PreparationSummary } from '../../../shared/contract/costing';
import type { PricingPolicy } from '../../../shared/pricing';
import type { FormLine, LineItem } from './lines-editor';

/** The item keys the lines name, split into ingredient and preparation ids. */
export function itemIds(lines: readonly FormLine[]): { ingredientIds: string[]; preparationIds: string[] } {
  const ingredientIds = new Set<string>();
  const preparationIds = new Set<string>();
  for (const l of lines) {
    if (l.item.startsWith('i:')) ingredientIds.add(l.item.slice(2));
    if (l.item.startsWith('p:')) preparationIds.add(l.item.slice(2));
  }
  return { ingredientIds: [...ingredientIds], preparationIds: [...preparationIds] };
}

/** The line editor's items: every ingredient and preparation, with measures where known. */
export function lineItems(ingredients: readonly IngredientSummary[], preparations: readonly PreparationSummary[], details?: BuildDetails): Map<string, LineItem> {
  const items = new Map<string, LineItem>();
  for (const i of ingredients)
    items.set(`i:${i.id}`, { key: `i:${i.id}`, label: i.name, name: i.name, baseUnit: i.baseUnit, density: i.densityGPerMl, measures: i.measures });
  const ingredientNames = new Set(ingredients.map((i) => i.name.toLowerCase()));
  for (const p of preparations) {
    const d = details?.preparations.get(p.id);
    // A preparation reads "(made here)" only where an ingredient has the same name.
    const label = ingredientNames.has(p.name.toLowerCase()) ? `${p.name} (made here)` : p.name;
    items.set(`p:${p.id}`, { key: `p:${p.id}`, label, name: p.name, baseUnit: p.baseUnit, density: d?.densityGPerMl ?? null, measures: d?.measures ?? null });
  }
  return items;
}

/** A form line as the API stores it, or null when it is not complete yet. */
export function toLineIn(l: FormLine): LineIn | null {
  if (!l.item || !l.unit || !isDecimalString(l.quantity) || !dec(l.quantity).gt(0)) return null;
  const [kind, id] = [l.item.slice(0, 2), l.item.slice(2)];
  const [ukind, unit] = [l.unit.slice(0, 2), l.unit.slice(2)];
  return {
    ingredientId: kind === 'i:' ? id : null,
    preparationId: kind === 'p:' ? id : null,
    quantity: l.quantity,
    unit: ukind === 'u:' ? (unit as LineIn['unit']) : null,
    measureId: ukind === 'm:' ? unit : null,
  };
}

/** A saved line back into the form's keys. */
export function fromLineOut(l: { ingredientId: string | null; preparationId: string | null; quantity: string; unit: string | null; measureId: string | null }): FormLine {
  return {
    item: l.ingredientId ? `i:${l.ingredientId}` : `p:${l.preparationId}`,
    quantity: l.quantity,
    unit: l.measureId ? `m:${l.measureId}` : `u:${l.unit}`,
  };
}

function ingredientInput(d: IngredientDetail): IngredientInput | string {
  const pack = d.packs.find((p) => p.isCostingPack);
  if (!pack || pack.price === null) return d.problem ?? `${d.name} has no pack with a price yet: add one on its ingredient page.`;
  return {
    key: d.id,
    baseUnit: d.baseUnit,
    densityGPerMl: d.densityGPerMl,
    yieldPct: d.yieldPct ?? '100',
    pack: { count: pack.count, quantity: pack.quantity, unit: pack.unit, price: pack.price },
    measures: Object.fromEntries(d.measures.map((m) => [m.name, { quantity: m.quantity, unit: m.unit }])),
    allergens: d.allergens,
  };
}

function preparationInput(p: PreparationDetail): PreparationInput {
  return {
    key: p.id,
    yield: p.yield,
    densityGPerMl: p.densityGPerMl,
    measures: Object.fromEntries(p.measures.map((m) => [m.name, { quantity: m.quantity, unit: m.unit }])),
    lines: p.lines.map((l) => ({ item: (l.ingredientId ?? l.preparationId) as string, quantity: l.quantity, unit: (l.measureName ?? l.unit) as string })),
  };
}

export interface PreviewSize {
  name: string;
  currentPrice?: string | null;
  lines: readonly FormLine[];
}

export interface PreviewPlan {
  request: CostPreviewRequest | null;
  /** Why a size is left out of the request (incomplete lines, an item without a price). */
  problems: Map<string, string>;
  /** Still fetching some item's detail. */
  waiting: boolean;
}

/**
 * The preview request for the sizes being edited, built from the form and each
 * item's saved detail (costing pack, yield, density, measures, and the lines of
 * preparations inside it), so the preview costs exactly what saving would.
 */
export function planPreview({ currency, policy, sizes, details, extraPreparations = [] }: {
  currency: string;
  policy: PricingPolicy;
  sizes: readonly PreviewSize[];
  details: BuildDetails | undefined;
  /** A preparation being edited, costed as typed instead of as saved. */
  extraPreparations?: readonly PreparationInput[];
}): PreviewPlan {
  const problems = new Map<string, string>();
  const ingredients = new Map<string, IngredientInput>();
  const preparations = new Map<string, PreparationInput>();
  for (const p of extraPreparations) preparations.set(p.key, p);
  const out: CostPreviewRequest['sizes'][number][] = [];
  let waiting = false;

  // Adds an item (and what it is made of) to the request; returns a problem or null.
  const need = (id: string, kind: 'i' | 'p', seen: Set<string>): string | null => {
    if (ingredients.has(id) || preparations.has(id) || seen.has(id)) return null;
    seen.add(id);
    if (kind === 'i') {
      const d = details?.ingredients.get(id);
      if (!d) return 'loading';
      const input = ingredientInput(d);
      if (typeof input === 'string') return input;
      ingredients.set(id, input);
      return null;
    }
    const d = details?.preparations.get(id);
    if (!d) return 'loading';
    for (const l of d.lines) {
      const problem = need((l.ingredientId ?? l.preparationId) as string, l.ingredientId ? 'i' : 'p', seen);
      if (problem) return problem === 'loading' ? problem : `${d.name}: ${problem}`;
    }
    preparations.set(id, preparationInput(d));
    return null;
  };

  const measureName = (item: string, measureId: string): string | null => {
    const d = item.startsWith('i:') ? details?.ingredients.get(item.slice(2)) : details?.preparations.get(item.slice(2));
    return d?.measures.find((m) => m.id === measureId)?.name ?? null;
  };

  // What a preparation being edited is made of must be costed too.
  let shared: string | null = null;
  for (const x of extraPreparations)
    for (const l of x.lines) {
      if (shared || preparations.has(l.item)) continue;
      const known = details?.ingredients.has(l.item) ? 'i' : 'p';
      shared = need(l.item, known, new Set());
    }

  for (const size of sizes) {
    if (shared) {
      if (shared === 'loading') waiting = true;
      problems.set(size.name, shared === 'loading' ? 'Working out the cost…' : shared);
      continue;
    }
    if (size.lines.length === 0) {
      problems.set(size.name, 'Add the lines of this build to see its cost.');
      continue;
    }
    const lines: LineInput[] = [];
    let problem: string | null = null;
    for (const l of size.lines) {
      if (!toLineIn(l)) {
        problem = 'Finish every line (item, quantity, unit) to see the cost.';
        break;
      }
      const p = extraPreparations.some((x) => `p:${x.key}` === l.item) ? null : need(l.item.slice(2), l.item.startsWith('i:') ? 'i' : 'p', new Set());
      if (p) {
        problem = p;
        break;
      }
      const unit = l.unit.startsWith('m:') ? measureName(l.item, l.unit.slice(2)) : l.unit.slice(2);
      if (!unit) {
        problem = 'loading';
        break;
      }
      lines.push({ item: l.item.slice(2), quantity: l.quantity, unit });
    }
    if (problem === 'loading') {
      waiting = true;
      problems.set(size.name, 'Working out the cost…');
    } else if (problem) problems.set(size.name, problem);
    else {
      const price = size.currentPrice && isDecimalString(size.currentPrice) && dec(size.currentPrice).gt(0) ? size.currentPrice : null;
      out.push({ name: size.name, currentPrice: price, lines });
    }
  }
  const request =
    out.length === 0 ? null : { currency, policy, ingredients: [...ingredients.values()], preparations: [...preparations.values()], sizes: out };
  return { request, problems, waiting };
}
