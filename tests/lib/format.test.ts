import { describe, expect, it } from 'vitest';
import { currencyDecimals, formatDate, formatMoney, formatPercent, formatQuantity } from '../../src/lib/format';

// Expected strings follow the Unicode CLDR locale data shipped with Node's ICU
// (en-GB, en-US, de-DE number and currency patterns). Narrow no-break spaces
// (U+202F) and no-break spaces (U+00A0) are written out where CLDR puts them.
describe('formatMoney', () => {
  it('shows two decimals in the currency of the business (CLDR en-GB, en-US)', () => {
    expect(formatMoney('1234.5', 'GBP', { locale: 'en-GB' })).toBe('£1,234.50');
    expect(formatMoney('3.2', 'USD', { locale: 'en-US' })).toBe('$3.20');
  });

  it('shows four decimals when detail is asked for, rounding half away from zero (ECMA-402 default halfExpand)', () => {
    expect(formatMoney('0.12345', 'EUR', { locale: 'de-DE', detail: true })).toBe('0,1235\u00a0€');
    expect(formatMoney('0.4125', 'GBP', { locale: 'en-GB' })).toBe('£0.41');
    expect(formatMoney('0.125', 'GBP', { locale: 'en-GB' })).toBe('£0.13');
  });

  it('formats a decimal string exactly, with no float rounding (ECMA-402 2023, Intl.NumberFormat v3 string input)', () => {
    // 0.1 + 0.2 style errors would show here; as a float 12345678901234567.89 is 12345678901234568.
    expect(formatMoney('12345678901234567.89', 'GBP', { locale: 'en-GB' })).toBe('£12,345,678,901,234,567.89');
    expect(formatMoney('1.005', 'GBP', { locale: 'en-GB' })).toBe('£1.01'); // the float 1.005 is 1.00499999…
  });

  it("uses the currency's minor unit from ISO 4217 (JPY 0, GBP 2, BHD 3), two more in detail", () => {
    expect([currencyDecimals('JPY'), currencyDecimals('GBP'), currencyDecimals('BHD')]).toEqual([0, 2, 3]);
    expect(formatMoney('480', 'JPY', { locale: 'en-US' })).toBe('¥480');
    expect(formatMoney('12.3456', 'JPY', { locale: 'en-US', detail: true })).toBe('¥12.35');
    expect(formatMoney('1.2345', 'BHD', { locale: 'en-US' })).toBe('BHD 1.235');
  });

  it('refuses what is not a decimal string', () => {
    expect(() => formatMoney('1,50', 'GBP')).toThrow('Not a decimal string');
    expect(() => formatMoney('', 'GBP')).toThrow('Not a decimal string');
  });
});

describe('formatPercent and formatQuantity', () => {
  it('reads a ratio as a percentage', () => {
    expect(formatPercent('0.685', { locale: 'en-GB' })).toBe('68.5%');
    expect(formatPercent('0.7', { locale: 'de-DE', decimals: 0 })).toBe('70\u00a0%');
  });

  it('puts the unit beside a quantity', () => {
    expect(formatQuantity('1250.5', 'ml', { locale: 'en-GB' })).toBe('1,250.5 ml');
    expect(formatQuantity('18.0000', 'g', { locale: 'en-GB' })).toBe('18 g');
  });
});

describe('formatDate', () => {
  it('keeps a calendar date on its day in every time zone', () => {
    expect(formatDate('2025-03-01', { locale: 'en-GB' })).toBe('1 Mar 2025');
    expect(formatDate('2025-12-31', { locale: 'en-US' })).toBe('Dec 31, 2025');
  });
});
