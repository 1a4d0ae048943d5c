// Theoretical usage through recipes. Each expected value is worked by hand beside its check;
// the unit factors and densities come from the sources named in /work/shared/trade-checks.md.
import { describe, expect, it } from 'vitest';
import { D } from '../../src/shared/decimal';
import { usageOfCounts, UsageExploder, type UsageIngredient, type UsageItem, type UsageLine, type UsagePreparation } from '../../src/shared/usage';

const d = (s: string) => new D(s);
const none = new Map<string, { quantity: InstanceType<typeof D>; unit: string }>();

function ingredient(key: string, baseUnit: 'g' | 'ml' | 'each', yieldPct = '100', opts: Partial<UsageIngredient> = {}): UsageIngredient {
  return { kind: 'ingredient', key, name: key, baseUnit, density: null, yieldPct: d(yieldPct), measures: none, ...opts };
}

function preparation(key: string, baseUnit: 'g' | 'ml' | 'each', yieldInBase: string, lines: UsageLine[], opts: Partial<UsagePreparation> = {}): UsagePreparation {
  return { kind: 'preparation', key, name: key, baseUnit, density: null, yieldInBase: d(yieldInBase), measures: none, lines, ...opts };
}

const line = (item: string, quantity: string, unit: string): UsageLine => ({ item, quantity: d(quantity), unit });

/** Usage as plain strings, for readable comparisons. */
const plain = (u: Map<string, InstanceType<typeof D>>) => Object.fromEntries([...u].map(([k, v]) => [k, v.toFixed()]));

// An invented menu: a house vanilla syrup (1 l batch: 800 g sugar, 2 pods, 500 ml water),
// a sweet cream (400 ml batch: 300 ml milk, 100 ml of the syrup), beans at 96 % yield.
const menu: UsageItem[] = [
  ingredient('beans', 'g', '96', { measures: new Map([['shot', { quantity: d('9'), unit: 'g' }]]) }),
  ingredient('milk', 'ml'),
  ingredient('sugar', 'g'),
  ingredient('pods', 'each'),
  ingredient('water', 'ml'),
  preparation('syrup', 'ml', '1000', [line('sugar', '800', 'g'), line('pods', '2', 'each'), line('water', '500', 'ml')], {
    measures: new Map([['pump', { quantity: d('10'), unit: 'ml' }]]),
  }),
  preparation('cream', 'ml', '400', [line('milk', '300', 'ml'), line('syrup', '100', 'ml')]),
];

describe('exploding recipe lines to stock usage', () => {
  it('divides an ingredient line by its yield: what goes in the cup is the usable share of what leaves stock', () => {
    // Yield % = edible ÷ as purchased (trade-checks.md, Cost control, secondary), so as purchased = edible ÷ yield.
    // 2 shots × 9 g = 18 g in the cup; 18 ÷ 0.96 = 18.75 g from stock.
    const r = new UsageExploder(menu).explode([line('beans', '2', 'shot')]);
    expect(plain(r.usage)).toEqual({ beans: '18.75' });
    expect(r.problems).toEqual([]);
  });

  it('gives back the as-purchased quantity of the yield example in trade-checks.md', () => {
    // trade-checks.md (secondary): 5.2 kg bought → 4.6 kg usable; yield = 4.6 ÷ 5.2, kept unrounded.
    const yieldPct = d('4.6').div('5.2').times(100);
    const r = new UsageExploder([ingredient('veg', 'g', '100', { yieldPct })]).explode([line('veg', '4.6', 'kg')]);
    expect((r.usage.get('veg') as InstanceType<typeof D>).toSignificantDigits(30).toFixed()).toBe('5200');
  });

  it('converts standard units exactly: 8 US fl oz is 236.5882365 ml', () => {
    // NIST Handbook 44, Appendix C: 1 cup = 8 fl oz = 236.588 236 5 ml exactly.
    const r = new UsageExploder(menu).explode([line('milk', '8', 'fl_oz_us')]);
    expect(plain(r.usage)).toEqual({ milk: '236.5882365' });
  });

  it('explodes a preparation per unit of its batch yield, nested preparations included', () => {
    // 2 pumps of syrup = 20 ml of a 1000 ml batch = 0.02 batch: sugar 800 × 0.02 = 16 g, pods 2 × 0.02 = 0.04, water 10 ml.
    const exploder = new UsageExploder(menu);
    expect(plain(exploder.explode([line('syrup', '2', 'pump')]).usage)).toEqual({ sugar: '16', pods: '0.04', water: '10' });
    // 40 ml of sweet cream = 0.1 batch: milk 30 ml and 10 ml of syrup (0.01 of its batch): sugar 8 g, pods 0.02, water 5 ml.
    expect(plain(exploder.explode([line('cream', '40', 'ml')]).usage)).toEqual({ milk: '30', sugar: '8', pods: '0.02', water: '5' });
  });

  it('goes from mass to volume through the density: a syrup yielding 1 kg used by the ml', () => {
    // 1:1 by weight sugar syrup (50 °Brix) at 20 °C: 1.2296 g/ml (CRC, trade-checks.md, secondary).
    // 20 ml × 1.2296 = 24.592 g of a 1000 g batch of 500 g sugar + 500 g water: 12.296 g of each.
    const items = [ingredient('sugar', 'g'), ingredient('water', 'g'), preparation('simple', 'g', '1000', [line('sugar', '500', 'g'), line('water', '500', 'g')], { density: d('1.2296') })];
    expect(plain(new UsageExploder(items).explode([line('simple', '20', 'ml')]).usage)).toEqual({ sugar: '12.296', water: '12.296' });
  });

  it('leaves out lines it cannot read and says why, never guessing', () => {
    const items = [
      ...menu,
      preparation('loopA', 'ml', '100', [line('loopB', '10', 'ml'), line('milk', '50', 'ml')]),
      preparation('loopB', 'ml', '100', [line('loopA', '10', 'ml')]),
    ];
    const exploder = new UsageExploder(items);
    const r = exploder.explode([line('sugar', '5', 'ml'), line('beans', '1', 'scoop'), line('gone', '1', 'g'), line('milk', '100', 'ml')]);
    expect(plain(r.usage)).toEqual({ milk: '100' });
    expect(r.problems).toEqual([expect.stringMatching(/^sugar: .*density/), expect.stringMatching(/^beans: Unknown unit or measure/), 'A line uses an item that no longer exists.']);
    const loop = exploder.explode([line('loopA', '100', 'ml')]);
    // loopA's own milk still counts (50 ml per batch of 100 ml → 50 ml); the loop back into itself is reported.
    expect(plain(loop.usage)).toEqual({ milk: '50' });
    expect(loop.problems).toEqual(['loopA uses itself through its lines.']);
  });
});

describe('usage of many cups', () => {
  it('is the sum of cups × the usage of one, each recipe exploded once', () => {
    const exploder = new UsageExploder(menu);
    const recipes = new Map<string, UsageLine[]>([
      ['latte', [line('beans', '18', 'g'), line('milk', '250', 'ml'), line('syrup', '2', 'pump')]],
      ['cream', [line('beans', '2', 'shot'), line('cream', '40', 'ml')]],
    ]);
    const r = usageOfCounts(exploder, recipes, [
      { recipe: 'latte', count: d('41') },
      { recipe: 'cream', count: d('40') },
      { recipe: 'latte', count: d('20') },
      { recipe: 'nothing', count: d('3'), label: 'Tea (small)' },
    ]);
    // Latte 61 cups: beans 61 × 18.75 = 1143.75, milk 61 × 250 = 15 250, sugar 61 × 16 = 976, pods 61 × 0.04 = 2.44, water 610.
    // Cream 40 cups: beans 40 × 18.75 = 750, milk 40 × 30 = 1200, sugar 320, pods 0.8, water 200.
    expect(plain(r.usage)).toEqual({ beans: '1893.75', milk: '16450', sugar: '1296', pods: '3.24', water: '810' });
    expect(r.problems).toEqual(['Tea (small) has no build: its usage is not counted.']);
  });
});
