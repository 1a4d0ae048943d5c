import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { CostingInputError } from '../../src/shared/errors';
import { exactPriceFigures, priceFigures, suggestPrice, suggestUpcharge, taxOnTop, type PricingPolicy } from '../../src/shared/pricing';
import { Q } from './rational';

const ukPolicy: PricingPolicy = { targetMarginPct: '72', taxMode: 'inclusive', taxRatePct: '20', priceStep: '0.05', rounding: 'up' };
const noTax = (margin: string): PricingPolicy => ({ targetMarginPct: margin, taxMode: 'exclusive', taxRatePct: '0', rounding: 'none' });

function refusal(f: () => unknown): Record<string, string> {
  try {
    f();
  } catch (e) {
    if (e instanceof CostingInputError) return e.fields;
    throw e;
  }
  throw new Error('expected a CostingInputError');
}

describe('pricing against outside sources', () => {
  it('price from cost %: $4.00 at a 40 % cost (60 % margin) → $10.00 (GW ch. 2, primary)', () => {
    expect(suggestPrice('4.00', noTax('60'), 'USD')).toBe('10.00');
    const f = priceFigures('10.00', '4.00', noTax('60'), 'USD');
    expect(f.costPct).toBe('40.00'); // cost % = cost ÷ net sales (D&K ch. 8)
    expect(f.marginPct).toBe('60.00'); // margin = (price − cost) ÷ price, from memory
    expect(f.profit).toBe('6.00');
    // markup = (price − cost) ÷ cost = 150 % (from memory): profit ÷ cost
    expect(Q.of(f.profit).div('4.00').times('100').toFixedHalfUp(0)).toBe('150');
  });

  it('UK VAT fraction: 1/6 of a VAT-inclusive price at 20 % (HMRC, secondary); £3.60 → £0.60 VAT, £3.00 net', () => {
    const f = priceFigures('3.60', '1.00', ukPolicy, 'GBP');
    expect(f.tax).toBe('0.60');
    expect(f.netPrice).toBe('3.00');
    const exact = exactPriceFigures('3.60', '1.00', ukPolicy, 'GBP');
    expect(exact.tax.div('3.60').toDecimalPlaces(30).toFixed(30)).toBe(Q.of(1).div('6').toFixedHalfUp(30));
  });

  it('VAT fraction 1/21 at 5 % (HMRC, secondary): £2.10 inclusive → £0.10 VAT', () => {
    expect(priceFigures('2.10', '0.50', { ...ukPolicy, taxRatePct: '5' }, 'GBP').tax).toBe('0.10');
  });

  it('Massachusetts meals tax 6.25 %, rounding up when the third decimal is above 4 (MA DOR, M.G.L. c.64H §4, primary)', () => {
    expect(taxOnTop('4.50', '6.25', 'USD')).toBe('0.28'); // $0.28125
    expect(taxOnTop('4.56', '6.25', 'USD')).toBe('0.29'); // $0.285
  });

  it('tax-exclusive prices carry no tax inside them', () => {
    const f = priceFigures('4.50', '1.00', { ...ukPolicy, taxMode: 'exclusive', taxRatePct: '6.25' }, 'USD');
    expect(f).toEqual({ price: '4.50', netPrice: '4.50', tax: '0.00', marginPct: '77.78', costPct: '22.22', profit: '3.50' });
  });

  it('beverage cost of coffee drinks is commonly 15–30 % of net price (common practice, no source): 72 % margin fits', () => {
    const f = priceFigures(suggestPrice('0.7102', ukPolicy, 'GBP'), '0.7102', ukPolicy, 'GBP');
    expect(Number(f.costPct)).toBeGreaterThanOrEqual(15);
    expect(Number(f.costPct)).toBeLessThanOrEqual(30);
  });
});

describe('suggested price and rounding', () => {
  it('rounds the gross price up, to the nearest step, or to the minor unit (worked here: 1 × 120 ÷ 28 = 4.2857…)', () => {
    expect(suggestPrice('1', ukPolicy, 'GBP')).toBe('4.30');
    expect(suggestPrice('1', { ...ukPolicy, rounding: 'nearest' }, 'GBP')).toBe('4.30');
    expect(suggestPrice('1', { ...ukPolicy, rounding: 'nearest', priceStep: '0.10' }, 'GBP')).toBe('4.30');
    expect(suggestPrice('1', { ...ukPolicy, rounding: 'nearest', priceStep: '0.20' }, 'GBP')).toBe('4.20');
    expect(suggestPrice('1', { ...ukPolicy, rounding: 'none', priceStep: null }, 'GBP')).toBe('4.29');
    expect(suggestPrice('1', { ...ukPolicy, rounding: 'none' }, 'JPY')).toBe('4');
    expect(suggestPrice('120', { ...ukPolicy, priceStep: '10' }, 'JPY')).toBe('520'); // 514.29 → 520
  });

  it('a margin of 0 prices at cost plus tax', () => {
    expect(suggestPrice('2.50', { ...ukPolicy, targetMarginPct: '0', rounding: 'none' }, 'GBP')).toBe('3.00');
  });

  it('upcharge keeps the target margin on the extra cost: 0.21 ÷ 0.28 × 1.2 = 0.90 (computed here)', () => {
    expect(suggestUpcharge('0.21', ukPolicy, 'GBP')).toBe('0.90');
    expect(suggestUpcharge('0.2101', ukPolicy, 'GBP')).toBe('0.95');
    expect(suggestUpcharge('0.21', { ...ukPolicy, taxMode: 'exclusive' }, 'GBP')).toBe('0.75');
    expect(suggestUpcharge('0', ukPolicy, 'GBP')).toBe('0.00');
  });

  it('a zero net price has no margin or cost %', () => {
    expect(priceFigures('0', '0', ukPolicy, 'GBP')).toEqual({ price: '0.00', netPrice: '0.00', tax: '0.00', marginPct: null, costPct: null, profit: '0.00' });
  });

  it('property: a price rounded up never gives a margin below the target (exact rational check)', () => {
    const decimal = (maxUnits: number, places: number) =>
      fc.integer({ min: 0, max: maxUnits }).map((n) => Q.of(BigInt(n)).div(Q.of(10n ** BigInt(places))).toFixedHalfUp(places));
    fc.assert(
      fc.property(
        decimal(5_000_000, 4), // cost 0 … 500.0000
        fc.integer({ min: 0, max: 9_999 }).map((n) => Q.of(BigInt(n)).div('100').toFixedHalfUp(2)), // margin 0 … 99.99
        fc.constantFrom('0', '5', '20', '6.25', '17.5'),
        fc.constantFrom<PricingPolicy['taxMode']>('inclusive', 'exclusive'),
        fc.constantFrom('0.01', '0.05', '0.10', '0.25', '1'),
        (cost, margin, tax, taxMode, step) => {
          const policy: PricingPolicy = { targetMarginPct: margin, taxMode, taxRatePct: tax, priceStep: step, rounding: 'up' };
          const price = Q.of(suggestPrice(cost, policy, 'GBP'));
          const net = taxMode === 'inclusive' ? price.div(Q.of(tax).plus('100')).times('100') : price;
          if (net.isZero()) return Q.of(cost).isZero();
          const achieved = net.minus(cost).div(net).times('100');
          return achieved.cmp(margin) >= 0;
        },
      ),
      { numRuns: 500 },
    );
  });
});

describe('policy refusals name the field', () => {
  it.each([
    [{ targetMarginPct: '100' }, 'policy.targetMarginPct'],
    [{ targetMarginPct: '-1' }, 'policy.targetMarginPct'],
    [{ targetMarginPct: 'seventy' }, 'policy.targetMarginPct'],
    [{ taxRatePct: '-0.5' }, 'policy.taxRatePct'],
    [{ priceStep: '0' }, 'policy.priceStep'],
    [{ priceStep: null }, 'policy.priceStep'],
    [{ priceStep: '0.005' }, 'policy.priceStep'],
    [{ rounding: 'down' }, 'policy.rounding'],
    [{ taxMode: 'both' }, 'policy.taxMode'],
  ] as [Partial<Record<keyof PricingPolicy, unknown>>, string][])('%o → %s', (change, field) => {
    const fields = refusal(() => suggestPrice('1', { ...ukPolicy, ...change } as PricingPolicy, 'GBP'));
    expect(Object.keys(fields)).toEqual([field]);
  });

  it('refuses a step finer than the currency unit and an unknown currency', () => {
    expect(Object.keys(refusal(() => suggestPrice('1', { ...ukPolicy, priceStep: '0.05' }, 'JPY')))).toEqual(['policy.priceStep']);
    expect(Object.keys(refusal(() => suggestPrice('1', ukPolicy, 'pounds')))).toEqual(['currency']);
  });
});
