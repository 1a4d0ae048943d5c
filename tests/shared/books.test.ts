import { describe, expect, it } from 'vitest';
import { D } from '../../src/shared/decimal';
import {
  addMonths,
  assembleCogs,
  averageInventory,
  costOfGoods,
  costPctOfSales,
  costVariance,
  inventoryTurnover,
  monthBounds,
  neutraliseCsvCell,
  nextDay,
  percentOf,
} from '../../src/shared/books';

describe('cost of goods, periodic method', () => {
  // JONES — T. Jones, Culinary Calculations, 2nd ed., Wiley, inventory example (secondary:
  // quoted in /work/shared/trade-checks.md). Formula from D&K ch. 8.
  it('reproduces the JONES worked example: 3,700 + 14,400 − 4,500 = 13,600, 25 % of 54,400', () => {
    const cogs = costOfGoods('3700', '14400', '4500');
    expect(cogs.toFixed()).toBe('13600');
    expect(costPctOfSales(cogs, '54400')?.toFixed()).toBe('25');
  });

  it('JONES: average inventory 4,100 and turnover 3.32 (secondary)', () => {
    const avg = averageInventory('3700', '4500');
    expect(avg.toFixed()).toBe('4100');
    expect(inventoryTurnover('13600', avg)?.toDecimalPlaces(2).toFixed()).toBe('3.32');
  });

  it('variance = actual − theoretical (D&K ch. 10), as a % of theoretical', () => {
    expect(costVariance('13600', '12800').toFixed()).toBe('800');
    expect(percentOf('800', '12800')?.toFixed()).toBe('6.25');
    expect(percentOf('1', '0')).toBeNull();
    expect(costPctOfSales('10', '0')).toBeNull();
    expect(inventoryTurnover('10', '0')).toBeNull();
  });
});

describe('assembleCogs', () => {
  it('puts JONES into one category and derives every figure', () => {
    const { rows, totals } = assembleCogs([{ category: 'coffee', opening: '3700', purchases: '14400', closing: '4500', theoretical: '13000', waste: '120' }], '54400', 'USD');
    expect(rows).toEqual([
      { category: 'coffee', opening: '3700.00', purchases: '14400.00', closing: '4500.00', actual: '13600.00', theoretical: '13000.00', variance: '600.00', variancePct: '4.62', waste: '120.00' },
    ]);
    expect(totals).toEqual({
      opening: '3700.00', purchases: '14400.00', closing: '4500.00', actual: '13600.00', theoretical: '13000.00', variance: '600.00', variancePct: '4.62', waste: '120.00', netSales: '54400.00', cogsPctOfSales: '25.00',
    });
  });

  it('rounds each category first so totals are the sums of the printed rows (computed here)', () => {
    const { rows, totals } = assembleCogs(
      [
        { category: 'dairy', opening: '10.005', purchases: '0.004', closing: '1', theoretical: '8.125', waste: '0' },
        { category: 'coffee', opening: '20.005', purchases: '0', closing: '0.004', theoretical: '0', waste: '0.5' },
        { category: 'tea', opening: '0', purchases: '0', closing: '0', theoretical: '0.004', waste: '0' },
      ],
      '100',
      'GBP',
    );
    // 0.004 rounds to 0.00 everywhere in tea: the row is left out.
    expect(rows.map((r) => r.category)).toEqual(['coffee', 'dairy']);
    const coffee = rows[0];
    const dairy = rows[1];
    expect(coffee).toMatchObject({ opening: '20.01', closing: '0.00', actual: '20.01', theoretical: '0.00', variance: '20.01', variancePct: null, waste: '0.50' });
    expect(dairy).toMatchObject({ opening: '10.01', purchases: '0.00', closing: '1.00', actual: '9.01', theoretical: '8.13', variance: '0.88' });
    for (const key of ['opening', 'purchases', 'closing', 'actual', 'theoretical', 'variance', 'waste'] as const) {
      expect(totals[key]).toBe(new D(coffee[key]).plus(dairy[key]).toFixed(2));
    }
    expect(totals.cogsPctOfSales).toBe('29.02');
  });

  it('writes negative variances and zero sales', () => {
    const { rows, totals } = assembleCogs([{ category: 'dairy', opening: '5', purchases: '5', closing: '5', theoretical: '7.5', waste: '0' }], '0', 'GBP');
    expect(rows[0].variance).toBe('-2.50');
    expect(rows[0].variancePct).toBe('-33.33');
    expect(totals.cogsPctOfSales).toBeNull();
    expect(totals.netSales).toBe('0.00');
  });
});

describe('months', () => {
  it('knows month lengths, leap years included (Gregorian calendar)', () => {
    expect(monthBounds('2026-11')).toEqual({ first: '2026-11-01', last: '2026-11-30', previousLast: '2026-10-31' });
    expect(monthBounds('2028-02')).toEqual({ first: '2028-02-01', last: '2028-02-29', previousLast: '2028-01-31' });
    expect(monthBounds('2026-01').previousLast).toBe('2025-12-31');
    expect(() => monthBounds('2026-13')).toThrow();
    expect(addMonths('2026-01', -1)).toBe('2025-12');
    expect(addMonths('2026-11', 2)).toBe('2027-01');
    expect(nextDay('2026-02-28')).toBe('2026-03-01');
  });
});

describe('CSV injection (OWASP, CSV Injection guidance)', () => {
  it('prefixes a quote to cells starting with = + - @ tab or CR', () => {
    expect(neutraliseCsvCell('=SUM(A1:A2)')).toBe("'=SUM(A1:A2)");
    expect(neutraliseCsvCell('+cmd')).toBe("'+cmd");
    expect(neutraliseCsvCell('-2+3')).toBe("'-2+3");
    expect(neutraliseCsvCell('@SUM(1)')).toBe("'@SUM(1)");
    expect(neutraliseCsvCell('\tx')).toBe("'\tx");
    expect(neutraliseCsvCell('\rx')).toBe("'\rx");
  });
  it('keeps plain numbers, negative ones included, and ordinary text', () => {
    expect(neutraliseCsvCell('-12.50')).toBe('-12.50');
    expect(neutraliseCsvCell('12.50')).toBe('12.50');
    expect(neutraliseCsvCell('Hill Farm Dairy')).toBe('Hill Farm Dairy');
    expect(neutraliseCsvCell('')).toBe('');
    expect(neutraliseCsvCell('-')).toBe("'-");
  });
});
