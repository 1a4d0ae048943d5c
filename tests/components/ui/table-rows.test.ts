import { describe, expect, test } from 'vitest';
import { matchesSearch, sortRows, type SortValue } from '../../../src/components/ui/table-rows';

const by = (values: SortValue[], direction: 'asc' | 'desc' = 'asc') => sortRows(values, (v) => v, direction);

describe('sortRows', () => {
  test('decimal strings compare as numbers, not as text', () => {
    // As text "10.5" < "9.75" and "1.10" < "1.9"; as numbers it is the other way round (worked by hand).
    expect(by(['9.75', '10.5', '1.9', '1.10', '-0.60', '0'])).toEqual(['-0.60', '0', '1.10', '1.9', '9.75', '10.5']);
    expect(by(['9.75', '10.5', '1.9', '1.10', '-0.60', '0'], 'desc')).toEqual(['10.5', '9.75', '1.9', '1.10', '0', '-0.60']);
  });

  test('decimal strings compare exactly where JS numbers cannot tell them apart', () => {
    // Both parse to the same double (0.1 + 1e-21 is below the double's resolution at 0.1); decimal.js keeps every digit.
    expect(Number('0.100000000000000000001')).toBe(Number('0.1'));
    expect(by(['0.100000000000000000001', '0.1'])).toEqual(['0.1', '0.100000000000000000001']);
    expect(by(['12345678901234567890.02', '12345678901234567890.01'])).toEqual(['12345678901234567890.01', '12345678901234567890.02']);
  });

  test('equal decimals written differently keep their order (stable)', () => {
    const rows = [{ id: 'a', v: '2.50' }, { id: 'b', v: '2.5' }, { id: 'c', v: '1' }];
    expect(sortRows(rows, (r) => r.v, 'asc').map((r) => r.id)).toEqual(['c', 'a', 'b']);
    expect(sortRows(rows, (r) => r.v, 'desc').map((r) => r.id)).toEqual(['a', 'b', 'c']);
  });

  test('blanks go last in both directions', () => {
    expect(by(['3.20', null, '0.99', '', undefined, '12'])).toEqual(['0.99', '3.20', '12', null, '', undefined]);
    expect(by(['3.20', null, '0.99', '', undefined, '12'], 'desc')).toEqual(['12', '3.20', '0.99', null, '', undefined]);
    expect(by([null, 2, Number.NaN, 1])).toEqual([1, 2, null, Number.NaN]);
  });

  test('whole numbers and decimal strings mix in one column', () => {
    expect(by([3, '2.5', 1, '10'])).toEqual([1, '2.5', 3, '10']);
  });

  test('text sorts by the locale, case-insensitively, with digit runs read as numbers', () => {
    expect(by(['oat milk', 'Espresso', 'almond syrup', 'Cortado'])).toEqual(['almond syrup', 'Cortado', 'Espresso', 'oat milk']);
    expect(by(['PO-0010', 'PO-0002', 'PO-0001'])).toEqual(['PO-0001', 'PO-0002', 'PO-0010']);
    // ISO dates (YYYY-MM-DD) sort in calendar order.
    expect(by(['2026-12-01', '2026-02-28', '2025-12-31'], 'desc')).toEqual(['2026-12-01', '2026-02-28', '2025-12-31']);
  });

  test('a column with any text in it sorts as text throughout, so the order is consistent', () => {
    expect(by(['10', 'n/a', '9'])).toEqual(['9', '10', 'n/a']);
  });

  test('does not change the rows it is given', () => {
    const rows = ['2', '1'];
    by(rows);
    expect(rows).toEqual(['2', '1']);
  });
});

describe('matchesSearch', () => {
  test('every word must occur somewhere, in any case, accents ignored', () => {
    expect(matchesSearch('', 'anything')).toBe(true);
    expect(matchesSearch('  ', 'anything')).toBe(true);
    expect(matchesSearch('flat reg', 'Flat white', 'Regular')).toBe(true);
    expect(matchesSearch('flat large', 'Flat white', 'Regular')).toBe(false);
    expect(matchesSearch('creme', 'Crème fraîche')).toBe(true);
    expect(matchesSearch('oat', null, undefined, 'Oat milk')).toBe(true);
  });
});

describe('compareSortValues (the DataTable column order)', () => {
  test('orders decimal strings exactly, whole numbers numerically and text by the locale with digit runs as numbers', async () => {
    const { compareSortValues } = await import('../../../src/components/ui/table-rows');
    const sorted = (vs: (string | number)[]) => [...vs].sort(compareSortValues);
    // 0.1 + 0.2 ≠ 0.3 in binary floats; as decimals "0.30000000000000001" > "0.3" exactly.
    expect(sorted(['0.30000000000000001', '0.3', '-0.60', '10.05', '2'])).toEqual(['-0.60', '0.3', '0.30000000000000001', '2', '10.05']);
    expect(sorted([10, 9, 100])).toEqual([9, 10, 100]);
    expect(sorted(['Size 10', 'Size 9', 'oat drink', 'Oat drink 2'])).toEqual(['oat drink', 'Oat drink 2', 'Size 9', 'Size 10']);
  });
});
