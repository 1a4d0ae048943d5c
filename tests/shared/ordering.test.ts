// Ordering arithmetic. Weekdays of the dates used are checked against Python's
// datetime.date.isoweekday (ISO 8601 numbering, 1 = Monday), run while writing:
// 2000-01-01 → 6 (Saturday, as every published calendar has it), 2024-02-29 → 4,
// 2026-12-01 → 2, 2026-12-03 → 4, 2026-12-04 → 5, 2026-12-07 → 1, 2026-12-08 → 2,
// 2026-12-31 → 4, 2027-01-01 → 5. Cut-off and lead-time rules are common practice, no source.
import { describe, expect, it } from 'vitest';
import { addDays, isoWeekday, minimumShortfall, nextDeliveryDate, orderTotals, suggestedPacks, toMinorUnits } from '../../src/shared/ordering';

describe('isoWeekday and addDays', () => {
  it.each([
    ['2000-01-01', 6], ['2024-02-29', 4], ['2026-12-01', 2], ['2026-12-03', 4], ['2026-12-07', 1], ['2027-01-01', 5],
  ] as const)('%s is ISO weekday %i', (date, wd) => {
    expect(isoWeekday(date)).toBe(wd);
  });
  it('crosses month, year and leap days', () => {
    expect(addDays('2024-02-28', 1)).toBe('2024-02-29');
    expect(addDays('2026-12-31', 1)).toBe('2027-01-01');
    expect(addDays('2026-03-28', 2)).toBe('2026-03-30');
  });
});

describe('nextDeliveryDate', () => {
  const dairy = { deliveryDays: [2, 4], cutoff: '14:00', leadDays: 1 };
  it('before the cut-off: order day today, plus the lead, then the next delivery day', () => {
    // Tue 1 Dec 10:00 → order day Tue, +1 = Wed 2 Dec, next Tue/Thu = Thu 3 Dec.
    expect(nextDeliveryDate({ date: '2026-12-01', time: '10:00', ...dairy })).toBe('2026-12-03');
  });
  it('at or after the cut-off the order counts from the next day', () => {
    // Tue 1 Dec 14:00 → order day Wed 2 Dec, +1 = Thu 3 Dec, a delivery day.
    expect(nextDeliveryDate({ date: '2026-12-01', time: '14:00', ...dairy })).toBe('2026-12-03');
    // Thu 3 Dec 15:30 → order day Fri 4, +1 = Sat 5, next Tue/Thu = Tue 8 Dec.
    expect(nextDeliveryDate({ date: '2026-12-03', time: '15:30', ...dairy })).toBe('2026-12-08');
  });
  it('a lead of 0 can deliver on the order day; a long lead crosses the year', () => {
    expect(nextDeliveryDate({ date: '2026-12-03', time: '09:00', deliveryDays: [4], cutoff: '10:00', leadDays: 0 })).toBe('2026-12-03');
    // Thu 31 Dec 09:00, lead 1 → Fri 1 Jan 2027, a Friday delivery day.
    expect(nextDeliveryDate({ date: '2026-12-31', time: '09:00', deliveryDays: [5], cutoff: '12:00', leadDays: 1 })).toBe('2027-01-01');
  });
  it('no delivery days: no date; bad times are refused', () => {
    expect(nextDeliveryDate({ date: '2026-12-01', time: '10:00', deliveryDays: [], cutoff: '12:00', leadDays: 1 })).toBeNull();
    expect(() => nextDeliveryDate({ date: '2026-12-01', time: '25:00', ...dairy })).toThrow(RangeError);
  });
});

describe('suggestedPacks', () => {
  it.each([
    // onHand, par, reorder point → packs
    ['1.25', '6', '2', '5'], // ceil(4.75)
    ['2', '6', '2', '4'], // at the reorder point counts
    ['2.01', '6', '2', '0'], // above it: nothing
    ['0', '3', '1', '3'],
    ['-0.5', '3', '1', '4'], // waste recorded past the count: ceil(3.5)
    ['5', '4', '5', '0'], // at reorder but already above par
  ])('on hand %s, par %s, reorder %s → %s', (onHand, par, reorderPoint, packs) => {
    expect(suggestedPacks({ onHand, par, reorderPoint }).toFixed()).toBe(packs);
  });
});

describe('orderTotals and minor units', () => {
  it('rounds each line and its tax half up to the currency, then adds the delivery', () => {
    // 3 × 0.335 = 1.005 → 1.01; tax 20 % of 1.01 = 0.202 → 0.20; 1 × 2.50 = 2.50, tax 0.
    const t = orderTotals([{ quantity: '3', unitPrice: '0.335', taxPct: '20' }, { quantity: '1', unitPrice: '2.50', taxPct: '0' }], '4.5', 'GBP');
    expect(t).toEqual({ lines: [{ lineTotal: '1.01', tax: '0.20' }, { lineTotal: '2.50', tax: '0.00' }], subtotal: '3.51', tax: '0.20', deliveryCharge: '4.50', total: '8.21' });
  });
  it('uses the currency’s own minor unit (ISO 4217: JPY 0, BHD 3)', () => {
    expect(orderTotals([{ quantity: '2', unitPrice: '150.5', taxPct: '10' }], '0', 'JPY').total).toBe('331'); // 301 + (30.1 → 30)
    expect(toMinorUnits('77.00', 'GBP')).toBe(7700);
    expect(toMinorUnits('332', 'JPY')).toBe(332);
    expect(toMinorUnits('1.234', 'BHD')).toBe(1234);
    expect(() => toMinorUnits('1.005', 'GBP')).toThrow(RangeError);
  });
  it('reports how far short of the minimum an order is', () => {
    expect(minimumShortfall('48.00', '50', 'GBP')).toBe('2.00');
    expect(minimumShortfall('50.00', '50', 'GBP')).toBeNull();
  });
});
