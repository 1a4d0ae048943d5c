import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { ALLERGEN_CODES } from '../../src/shared/allergens';
import { costPreview, type CostPreviewRequest, type IngredientInput, type LineInput, type PreparationInput } from '../../src/shared/costing';
import type { PricingPolicy } from '../../src/shared/pricing';
import { Q, referenceFactors } from './rational';

// Independent reference: the specified computation in exact BigInt rationals, with unit factors
// derived from their definitions (NIST HB44 App. C; UK WMA 1985) in rational.ts.
const F = referenceFactors();
const DIM: Record<string, 'mass' | 'volume' | 'count'> = {
  g: 'mass', kg: 'mass', oz: 'mass', lb: 'mass', ml: 'volume', l: 'volume', tsp: 'volume', tbsp: 'volume', fl_oz_us: 'volume',
  fl_oz_imp: 'volume', cup_us: 'volume', pt_us: 'volume', pt_imp: 'volume', qt_us: 'volume', gal_us: 'volume', gal_imp: 'volume', each: 'count',
};
const UNITS_OF = { mass: ['g', 'kg', 'oz', 'lb'], volume: ['ml', 'l', 'tsp', 'tbsp', 'fl_oz_us', 'fl_oz_imp', 'cup_us', 'pt_us', 'pt_imp', 'qt_us', 'gal_us', 'gal_imp'], count: ['each'] };
const BASE = { mass: 'g', volume: 'ml', count: 'each' } as const;

interface RefItem { base: 'g' | 'ml' | 'each'; density: Q | null; unitCost: Q; measures: Record<string, { q: Q; unit: string }>; allergens: Set<string> }

function factor(unit: string, base: string, density: Q | null): Q {
  const from = DIM[unit];
  const to = DIM[base];
  if (from === to) return F[unit];
  if (!density) throw new Error('generator made a line without a density');
  return from === 'mass' ? F[unit].div(density) : F[unit].times(density);
}

function lineRef(items: Map<string, RefItem>, line: LineInput) {
  const it = items.get(line.item) as RefItem;
  const m = it.measures[line.unit];
  const inBase = m ? Q.of(line.quantity).times(m.q).times(factor(m.unit, it.base, it.density)) : Q.of(line.quantity).times(factor(line.unit, it.base, it.density));
  return { item: line.item, inBase, base: it.base, cost: inBase.times(it.unitCost) };
}

function quantityOut(q: Q): string {
  const s = q.toFixedHalfUp(12);
  return s.includes('.') ? s.replace(/0+$/, '').replace(/\.$/, '') : s;
}

function reference(req: CostPreviewRequest) {
  const items = new Map<string, RefItem>();
  for (const ing of req.ingredients) {
    const density = ing.densityGPerMl ? Q.of(ing.densityGPerMl) : null;
    const p = ing.pack;
    const perBase = Q.of(p.count ?? '1').times(p.quantity).times(factor(p.unit, ing.baseUnit, density));
    const unitCost = Q.of(p.price).div(perBase).div(Q.of(ing.yieldPct ?? '100').div('100'));
    const measures = Object.fromEntries(Object.entries(ing.measures ?? {}).map(([k, v]) => [k, { q: Q.of(v.quantity), unit: v.unit }]));
    items.set(ing.key, { base: ing.baseUnit as RefItem['base'], density, unitCost, measures, allergens: new Set(ing.allergens ?? []) });
  }
  for (const prep of req.preparations ?? []) {
    const base = BASE[DIM[prep.yield.unit]];
    const lines = prep.lines.map((l) => lineRef(items, l));
    const total = lines.reduce((s, l) => s.plus(l.cost), Q.of(0));
    const allergens = new Set(lines.flatMap((l) => [...(items.get(l.item) as RefItem).allergens]));
    const measures = Object.fromEntries(Object.entries(prep.measures ?? {}).map(([k, v]) => [k, { q: Q.of(v.quantity), unit: v.unit }]));
    const density = prep.densityGPerMl ? Q.of(prep.densityGPerMl) : null;
    items.set(prep.key, { base, density, unitCost: total.div(Q.of(prep.yield.quantity).times(F[prep.yield.unit])), measures, allergens });
  }
  const pol = req.policy;
  const incl = pol.taxMode === 'inclusive';
  const taxFactor = incl ? Q.of(pol.taxRatePct).div('100').plus('1') : Q.of(1);
  const money = (q: Q) => q.toFixedHalfUp(2);
  const figures = (price: Q, cost: Q) => {
    const net = price.div(taxFactor);
    return {
      price: money(price),
      netPrice: money(net),
      tax: money(price.minus(net)),
      marginPct: net.isZero() ? null : net.minus(cost).div(net).times('100').toFixedHalfUp(2),
      costPct: net.isZero() ? null : cost.div(net).times('100').toFixedHalfUp(2),
      profit: money(net.minus(cost)),
    };
  };
  const used = new Set<string>();
  const sizes = req.sizes.map((size) => {
    const lines = size.lines.map((l) => lineRef(items, l));
    lines.forEach((l) => (items.get(l.item) as RefItem).allergens.forEach((a) => used.add(a)));
    const cost = lines.reduce((s, l) => s.plus(l.cost), Q.of(0));
    const gross = cost.div(Q.of(1).minus(Q.of(pol.targetMarginPct).div('100'))).times(taxFactor);
    let price: Q;
    if (pol.rounding === 'none') price = Q.of(gross.toFixedHalfUp(2));
    else {
      const step = Q.of(pol.priceStep as string);
      const k = pol.rounding === 'up' ? gross.div(step).ceil() : gross.div(step).roundHalfUp();
      price = step.times(Q.of(k));
    }
    const atSuggested = figures(price, cost);
    return {
      name: size.name,
      cost: cost.toFixedHalfUp(4),
      lines: lines.map((l) => ({ item: l.item, quantityInBaseUnit: quantityOut(l.inBase), baseUnit: l.base, cost: l.cost.toFixedHalfUp(4) })),
      suggestedPrice: atSuggested.price,
      atSuggested,
      atCurrent: size.currentPrice ? figures(Q.of(size.currentPrice), cost) : null,
    };
  });
  return { currency: req.currency, sizes, allergens: [...used].sort() };
}

const decimal = (min: number, max: number, places: number) =>
  fc.integer({ min, max }).map((n) => Q.of(BigInt(n)).div(Q.of(10n ** BigInt(places))).toFixedHalfUp(places));

const requestArb: fc.Arbitrary<CostPreviewRequest> = fc
  .record({
    ingredients: fc.array(
      fc.record({
        dim: fc.constantFrom('mass', 'volume', 'count') as fc.Arbitrary<'mass' | 'volume' | 'count'>,
        density: fc.option(decimal(5000, 20000, 4), { nil: undefined }),
        yieldPct: fc.option(decimal(1, 10000, 2), { nil: undefined }),
        count: fc.option(decimal(1, 2400, 1), { nil: undefined }),
        quantity: decimal(1, 5_000_000, 3),
        price: decimal(0, 50_000, 2),
        packUnitPick: fc.nat(),
        measure: fc.option(decimal(1, 50_000, 3), { nil: undefined }),
        measureUnitPick: fc.nat(),
        allergens: fc.subarray([...ALLERGEN_CODES], { maxLength: 2 }),
      }),
      { minLength: 1, maxLength: 4 },
    ),
    prep: fc.option(fc.record({ yieldQ: decimal(1, 100_000, 3), yieldUnit: fc.constantFrom('l', 'ml', 'g', 'kg', 'gal_imp', 'each'), density: fc.option(decimal(8000, 15000, 4), { nil: undefined }), picks: fc.array(fc.tuple(fc.nat(), fc.nat(), decimal(1, 100_000, 2)), { minLength: 1, maxLength: 3 }) }), { nil: undefined }),
    lines: fc.array(fc.tuple(fc.nat(), fc.nat(), decimal(1, 50_000, 2)), { minLength: 1, maxLength: 6 }),
    margin: decimal(0, 9999, 2),
    tax: fc.constantFrom('0', '5', '20', '6.25', '8.875'),
    taxMode: fc.constantFrom('inclusive', 'exclusive') as fc.Arbitrary<PricingPolicy['taxMode']>,
    rounding: fc.constantFrom('up', 'nearest', 'none') as fc.Arbitrary<PricingPolicy['rounding']>,
    step: fc.constantFrom('0.01', '0.05', '0.10', '0.25', '1'),
    currentPrice: fc.option(decimal(1, 100_000, 2), { nil: undefined }),
  })
  .map((g) => {
    const unitsFor = (dim: 'mass' | 'volume' | 'count', density: string | undefined) =>
      dim === 'count' ? UNITS_OF.count : [...UNITS_OF[dim], ...(density ? UNITS_OF[dim === 'mass' ? 'volume' : 'mass'] : [])];
    const ingredients: IngredientInput[] = g.ingredients.map((x, i) => {
      const density = x.dim === 'count' ? undefined : x.density;
      const units = unitsFor(x.dim, density);
      const ing: IngredientInput = {
        key: `ing-${i}`,
        baseUnit: BASE[x.dim],
        densityGPerMl: density,
        yieldPct: x.yieldPct,
        pack: { count: x.count, quantity: x.quantity, unit: units[x.packUnitPick % units.length], price: x.price },
        allergens: x.allergens,
      };
      if (x.measure) ing.measures = { scoop: { quantity: x.measure, unit: UNITS_OF[x.dim][x.measureUnitPick % UNITS_OF[x.dim].length] } };
      return ing;
    });
    const choices = (list: { key: string; dim: 'mass' | 'volume' | 'count'; density?: string; measure: boolean }[]) =>
      list.flatMap((c) => [...unitsFor(c.dim, c.density), ...(c.measure ? ['scoop'] : [])].map((unit) => ({ item: c.key, unit })));
    const ingChoices = choices(g.ingredients.map((x, i) => ({ key: `ing-${i}`, dim: x.dim, density: x.dim === 'count' ? undefined : x.density, measure: !!x.measure })));
    const preparations: PreparationInput[] = [];
    let all = ingChoices;
    if (g.prep) {
      const lines = g.prep.picks.map(([a, _b, q]) => ({ ...ingChoices[a % ingChoices.length], quantity: q }));
      const dim = DIM[g.prep.yieldUnit];
      preparations.push({ key: 'prep', yield: { quantity: g.prep.yieldQ, unit: g.prep.yieldUnit }, densityGPerMl: dim === 'count' ? undefined : g.prep.density, lines });
      all = [...ingChoices, ...choices([{ key: 'prep', dim, density: dim === 'count' ? undefined : g.prep.density, measure: false }])];
    }
    const lines = g.lines.map(([a, _b, q]) => ({ ...all[a % all.length], quantity: q }));
    const policy: PricingPolicy = { targetMarginPct: g.margin, taxMode: g.taxMode, taxRatePct: g.tax, rounding: g.rounding, priceStep: g.rounding === 'none' ? undefined : g.step };
    return { currency: 'GBP', policy, ingredients, preparations, sizes: [{ name: 'Cup', currentPrice: g.currentPrice, lines }] };
  });

describe('exact rational reference', () => {
  it('costPreview equals the specified computation done in exact rationals', () => {
    fc.assert(
      fc.property(requestArb, (req) => {
        expect(costPreview(req)).toEqual(reference(req));
      }),
      { numRuns: 400 },
    );
  });

  it('agrees on values exactly on a rounding boundary (0.40125 → 0.4013; 2.875 → 2.88)', () => {
    const req: CostPreviewRequest = {
      currency: 'GBP',
      policy: { targetMarginPct: '0', taxMode: 'inclusive', taxRatePct: '20', rounding: 'none' },
      ingredients: [{ key: 'b', baseUnit: 'g', yieldPct: '96', pack: { quantity: '1', unit: 'kg', price: '21.40' } }],
      sizes: [{ name: 'Cup', currentPrice: '3.45', lines: [{ item: 'b', quantity: '18', unit: 'g' }] }],
    };
    const out = costPreview(req);
    expect(out).toEqual(reference(req));
    expect(out.sizes[0].lines[0].cost).toBe('0.4013');
    expect(out.sizes[0].atCurrent?.netPrice).toBe('2.88');
  });
});
