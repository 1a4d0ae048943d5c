import convert from 'convert-units';
import { describe, expect, it } from 'vitest';
import { D } from '../../src/shared/decimal';
import { BASE_UNIT_OF, conversionFactor, toBaseUnit, UNIT_CODES, UNITS, UnitConversionError, type UnitCode } from '../../src/shared/units';
import { Q, referenceFactors } from './rational';

describe('unit factors', () => {
  it('has exactly the units of the costing table, each with a base unit of its dimension', () => {
    expect(UNIT_CODES.sort()).toEqual(
      ['cup_us', 'each', 'fl_oz_imp', 'fl_oz_us', 'g', 'gal_imp', 'gal_us', 'kg', 'l', 'lb', 'ml', 'oz', 'pt_imp', 'pt_us', 'qt_us', 'tbsp', 'tsp'].sort(),
    );
    for (const code of UNIT_CODES) expect(['g', 'ml', 'each']).toContain(BASE_UNIT_OF[UNITS[code].dimension]);
  });

  // NIST Handbook 44, Appendix C (trade-checks.md: secondary for HB44, primary for the pound),
  // and the UK Weights and Measures Act 1985, Schedule 1 (imperial).
  it.each([
    ['fl_oz_us', '29.5735295625'], // HB44: 1 US fl oz = 1/128 US gal = 29.573 529 562 5 ml exactly
    ['gal_us', '3785.411784'], // HB44: 1 US gal = 231 in³ = 3.785 411 784 l exactly
    ['cup_us', '236.5882365'], // HB44: 1 cup = 8 fl oz
    ['tbsp', '14.78676478125'], // HB44: 1 tbsp = 1/2 fl oz
    ['tsp', '4.92892159375'], // HB44: 1 tsp = 1/3 tbsp
    ['pt_us', '473.176473'], // HB44: 1 liquid pint = 16 fl oz
    ['qt_us', '946.352946'], // HB44: 1 liquid quart = 2 pints
    ['lb', '453.59237'], // HB44: 1 avoirdupois pound = 0.453 592 37 kg exactly (primary)
    ['oz', '28.349523125'], // HB44: 1 avoirdupois ounce = 1/16 lb
    ['gal_imp', '4546.09'], // WMA 1985 Sch. 1: gallon = 4.546 09 litres
    ['pt_imp', '568.26125'], // WMA 1985 Sch. 1: pint = 1/8 gallon
    ['fl_oz_imp', '28.4130625'], // WMA 1985 Sch. 1: fluid ounce = 1/20 pint
    ['kg', '1000'],
    ['l', '1000'],
  ] as const)('%s = %s of the base unit (NIST HB44 App. C / UK WMA 1985)', (code, expected) => {
    expect(UNITS[code].factor).toBe(expected);
  });

  it('every factor equals its derivation from the definitions (inch = 2.54 cm, gallon = 231 in³, pound = 0.45359237 kg; NIST HB44 App. C; UK WMA 1985)', () => {
    const ref = referenceFactors();
    for (const code of UNIT_CODES) {
      expect(Q.of(UNITS[code].factor).cmp(ref[code]), code).toBe(0);
    }
  });

  // Cross-check with the npm package convert-units 2.3.4 where its definitions match ours: its
  // "imperial" volume system is US customary (fl-oz anchored at 33.8140226 per litre; tsp = 1/6
  // fl oz, Tbs = 1/2 fl oz, cup = 8 fl oz, pnt, qt, gal US). It has no imperial (UK) volumes, so
  // fl_oz_imp, pt_imp and gal_imp are checked only against the Act above. Its factors are
  // rounded (e.g. 453.592 g per lb), hence a relative tolerance of 1e-6.
  const convertUnitsName: Partial<Record<UnitCode, string>> = {
    g: 'g', kg: 'kg', oz: 'oz', lb: 'lb', ml: 'ml', l: 'l', tsp: 'tsp', tbsp: 'Tbs',
    fl_oz_us: 'fl-oz', cup_us: 'cup', pt_us: 'pnt', qt_us: 'qt', gal_us: 'gal',
  };
  it.each(Object.entries(convertUnitsName))('%s agrees with convert-units "%s" within 1e-6 (npm convert-units 2.3.4)', (code, theirs) => {
    const unit = UNITS[code as UnitCode];
    const base = BASE_UNIT_OF[unit.dimension];
    const theirFactor = convert(1).from(theirs).to(base);
    const relative = new D(unit.factor).minus(theirFactor).abs().div(unit.factor);
    expect(relative.lt('1e-6'), `${code}: ours ${unit.factor}, convert-units ${theirFactor}`).toBe(true);
  });

  it('cup sizes in ml match trade-checks.md (US 8/12/16/20 fl oz; imperial 8/12/16 fl oz; HB44, WMA)', () => {
    const ml = (n: string, unit: UnitCode) => toBaseUnit(new D(n), unit, 'ml').toDecimalPlaces(2).toFixed(2);
    expect(['8', '12', '16', '20'].map((n) => ml(n, 'fl_oz_us'))).toEqual(['236.59', '354.88', '473.18', '591.47']);
    expect(['8', '12', '16'].map((n) => ml(n, 'fl_oz_imp'))).toEqual(['227.30', '340.96', '454.61']);
  });
});

describe('conversion to an item base unit', () => {
  it('converts within a dimension exactly', () => {
    expect(toBaseUnit(new D('2'), 'l', 'ml').toFixed()).toBe('2000');
    expect(toBaseUnit(new D('1'), 'lb', 'g').toFixed()).toBe('453.59237');
    expect(toBaseUnit(new D('3'), 'tsp', 'ml').toFixed()).toBe('14.78676478125');
  });

  it('goes between mass and volume through the density (CRC: 1000 g of 1:1 syrup at 1.2296 g/ml = 813.3 ml, secondary)', () => {
    expect(toBaseUnit(new D('1000'), 'g', 'ml', new D('1.2296')).toDecimalPlaces(1).toFixed(1)).toBe('813.3');
    expect(toBaseUnit(new D('2'), 'ml', 'g', new D('1.03')).toFixed()).toBe('2.06');
  });

  it('1 US gallon of whole milk = 16 × 244 g = 3904 g (FDC 171265, secondary: 1 cup = 244 g)', () => {
    const density = new D(244).div(UNITS.cup_us.factor);
    expect(toBaseUnit(new D(1), 'gal_us', 'g', density).toSignificantDigits(30).toFixed()).toBe('3904');
  });

  it('refuses mass ↔ volume without a density, count ↔ anything, and unknown units', () => {
    const problem = (f: () => unknown) => {
      try {
        f();
      } catch (e) {
        if (e instanceof UnitConversionError) return e.problem;
        throw e;
      }
      return 'none';
    };
    expect(problem(() => conversionFactor('g', 'ml', null))).toBe('no-density');
    expect(problem(() => conversionFactor('fl_oz_us', 'g', undefined))).toBe('no-density');
    expect(problem(() => conversionFactor('each', 'g', new D(1)))).toBe('incompatible');
    expect(problem(() => conversionFactor('kg', 'each', new D(1)))).toBe('incompatible');
    expect(problem(() => conversionFactor('pinch', 'g', null))).toBe('unknown-unit');
    expect(problem(() => conversionFactor('toString', 'g', null))).toBe('unknown-unit');
  });
});
