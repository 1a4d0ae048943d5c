import { describe, expect, it } from 'vitest';
import { D } from '../../src/shared/decimal';
import { currencyMinorUnits, isCurrencyCode, isDecimalString, roundToStep, writeCost, writeFixed, writeMoney, writePercent, writeQuantity } from '../../src/shared/money';

describe('money helpers', () => {
  it('reads minor units from Intl (ISO 4217 via CLDR: GBP 2, JPY 0, BHD 3)', () => {
    expect(currencyMinorUnits('GBP')).toBe(2);
    expect(currencyMinorUnits('USD')).toBe(2);
    expect(currencyMinorUnits('JPY')).toBe(0);
    expect(currencyMinorUnits('BHD')).toBe(3);
    expect(isCurrencyCode('GBP')).toBe(true);
    expect(isCurrencyCode('gbp')).toBe(false);
    expect(isCurrencyCode('GB')).toBe(false);
  });

  it('rounds halves up, from the unrounded value', () => {
    expect(writeMoney('2.875', 'GBP')).toBe('2.88');
    expect(writeMoney('2.874999', 'GBP')).toBe('2.87');
    expect(writeMoney('287.5', 'JPY')).toBe('288');
    expect(writeMoney('1.0005', 'BHD')).toBe('1.001');
    expect(writeCost('0.40125')).toBe('0.4013');
    expect(writePercent('75.3')).toBe('75.30');
    expect(writeFixed('-0.125', 2)).toBe('-0.13');
    expect(writeFixed('-0.004', 2)).toBe('0.00'); // never "-0.00" (found by the rational reference property)
  });

  it('writes a value exactly on a boundary the way exact arithmetic does, despite division error', () => {
    // 0.0214 ÷ 0.96 × 18 = 0.40125 exactly; 3.45 ÷ 1.2 = 2.875 exactly (computed here).
    expect(writeCost(new D('0.0214').div('0.96').times(18))).toBe('0.4013');
    expect(writeMoney(new D(1).div('1.2').times('3.45'), 'GBP')).toBe('2.88');
  });

  it('writes quantities as plain decimals without trailing zeros', () => {
    expect(writeQuantity('18.000')).toBe('18');
    expect(writeQuantity(new D('1e-7'))).toBe('0.0000001');
    expect(writeQuantity(new D('123456789012345678901234567890'))).toBe('123456789012345678901234567890');
    expect(writeQuantity(new D(10).div('1.03'))).toBe('9.708737864078');
  });

  it('rounds to a price step up (smallest multiple not below) or to the nearest (halves up)', () => {
    expect(roundToStep('3.0436', '0.05', 'up').toFixed(2)).toBe('3.05');
    expect(roundToStep('3.05', '0.05', 'up').toFixed(2)).toBe('3.05');
    expect(roundToStep('3.025', '0.05', 'nearest').toFixed(2)).toBe('3.05');
    expect(roundToStep('3.0249', '0.05', 'nearest').toFixed(2)).toBe('3.00');
    expect(roundToStep('3.01', '0.10', 'up').toFixed(2)).toBe('3.10');
  });

  it('accepts only plain decimal strings', () => {
    for (const ok of ['0', '12', '0.05', '-3.5', '007.10']) expect(isDecimalString(ok), ok).toBe(true);
    for (const bad of ['', '1e3', '.5', '5.', '+1', '1,000', ' 1', 'NaN', 'Infinity', '0x10', '1'.repeat(33), 12, null])
      expect(isDecimalString(bad), String(bad)).toBe(false);
  });
});
