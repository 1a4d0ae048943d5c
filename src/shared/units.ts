import { D, type Dec } from './decimal';

/** What a unit measures. Each dimension has one base unit: g, ml or each. */
export type Dimension = 'mass' | 'volume' | 'count';
/** The unit every quantity of an item is reduced to before it is costed. */
export type BaseUnit = 'g' | 'ml' | 'each';

export const BASE_UNIT_OF: Readonly<Record<Dimension, BaseUnit>> = { mass: 'g', volume: 'ml', count: 'each' };

export interface UnitDefinition {
  readonly dimension: Dimension;
  /** Exact size of one of this unit in the dimension's base unit (g, ml or each), as a decimal string. */
  readonly factor: string;
  /** Short symbol shown beside a number field. */
  readonly symbol: string;
  /** Plain English name. */
  readonly label: string;
  /** Where the exact factor comes from. */
  readonly source: string;
}

const HB44 = 'NIST Handbook 44, Appendix C';
const WMA = 'UK Weights and Measures Act 1985, Schedule 1';
const SI = 'SI prefix (exact)';

/**
 * The standard units, with exact factors to the base unit.
 *
 * US customary units follow NIST Handbook 44, Appendix C (General Tables of Units of
 * Measurement): the avoirdupois pound is exactly 453.59237 g and the ounce 1/16 of it; the US
 * gallon is 231 cubic inches (inch = 2.54 cm exactly) = 3785.411784 ml, the fluid ounce 1/128 of
 * it, the cup 8 fl oz, the tablespoon 1/2 fl oz and the teaspoon 1/6 fl oz. Imperial units follow
 * the UK Weights and Measures Act 1985 (gallon = 4.54609 l; pint = 1/8 gallon; fluid ounce =
 * 1/160 gallon), which HB44 Appendix C repeats. Nutrition-label "metric" cups and spoons
 * (21 CFR 101.9) are deliberately absent: they are not for costing.
 */
export const UNITS = {
  g: { dimension: 'mass', factor: '1', symbol: 'g', label: 'gram', source: SI },
  kg: { dimension: 'mass', factor: '1000', symbol: 'kg', label: 'kilogram', source: SI },
  oz: { dimension: 'mass', factor: '28.349523125', symbol: 'oz', label: 'ounce (avoirdupois)', source: HB44 },
  lb: { dimension: 'mass', factor: '453.59237', symbol: 'lb', label: 'pound (avoirdupois)', source: HB44 },
  ml: { dimension: 'volume', factor: '1', symbol: 'ml', label: 'millilitre', source: SI },
  l: { dimension: 'volume', factor: '1000', symbol: 'l', label: 'litre', source: SI },
  tsp: { dimension: 'volume', factor: '4.92892159375', symbol: 'tsp', label: 'teaspoon (US customary)', source: HB44 },
  tbsp: { dimension: 'volume', factor: '14.78676478125', symbol: 'tbsp', label: 'tablespoon (US customary)', source: HB44 },
  fl_oz_us: { dimension: 'volume', factor: '29.5735295625', symbol: 'US fl oz', label: 'fluid ounce (US)', source: HB44 },
  fl_oz_imp: { dimension: 'volume', factor: '28.4130625', symbol: 'imp fl oz', label: 'fluid ounce (imperial)', source: WMA },
  cup_us: { dimension: 'volume', factor: '236.5882365', symbol: 'US cup', label: 'cup (US customary)', source: HB44 },
  pt_us: { dimension: 'volume', factor: '473.176473', symbol: 'US pt', label: 'pint (US liquid)', source: HB44 },
  pt_imp: { dimension: 'volume', factor: '568.26125', symbol: 'imp pt', label: 'pint (imperial)', source: WMA },
  qt_us: { dimension: 'volume', factor: '946.352946', symbol: 'US qt', label: 'quart (US liquid)', source: HB44 },
  gal_us: { dimension: 'volume', factor: '3785.411784', symbol: 'US gal', label: 'gallon (US)', source: HB44 },
  gal_imp: { dimension: 'volume', factor: '4546.09', symbol: 'imp gal', label: 'gallon (imperial)', source: WMA },
  each: { dimension: 'count', factor: '1', symbol: 'each', label: 'each', source: 'count' },
} as const satisfies Record<string, UnitDefinition>;

export type UnitCode = keyof typeof UNITS;
export const UNIT_CODES = Object.keys(UNITS) as [UnitCode, ...UnitCode[]];
export const BASE_UNITS = ['g', 'ml', 'each'] as const satisfies readonly BaseUnit[];

const FACTORS = new Map<string, Dec>(UNIT_CODES.map((code) => [code, new D(UNITS[code].factor)]));

export function isUnitCode(value: string): value is UnitCode {
  return Object.prototype.hasOwnProperty.call(UNITS, value);
}

export function isBaseUnit(value: string): value is BaseUnit {
  return value === 'g' || value === 'ml' || value === 'each';
}

/** The base unit of a unit's dimension, e.g. `l` → `ml`, `lb` → `g`. */
export function baseUnitOf(unit: UnitCode): BaseUnit {
  return BASE_UNIT_OF[UNITS[unit].dimension];
}

/** A preparation's base unit follows its yield's unit (l → ml, kg → g); null for an unknown unit. */
export function yieldBaseUnit(unit: string): BaseUnit | null {
  return isUnitCode(unit) ? baseUnitOf(unit) : null;
}

export type ConversionProblem = 'unknown-unit' | 'no-density' | 'incompatible';

/** Why a quantity could not be put in an item's base unit. */
export class UnitConversionError extends Error {
  constructor(
    readonly problem: ConversionProblem,
    message: string,
  ) {
    super(message);
    this.name = 'UnitConversionError';
  }
}

/**
 * How many of `baseUnit` one `unit` is, for an item of the given density.
 *
 * Same dimension: the exact factor from {@link UNITS}. Mass ↔ volume goes through the density
 * in grams per millilitre: 1 g of a volume-based item is 1 ÷ density ml; 1 ml of a mass-based
 * item is density g. Refuses (throws {@link UnitConversionError}) an unknown unit, a mass ↔
 * volume step without a density, and anything to or from a count.
 */
export function conversionFactor(unit: string, baseUnit: BaseUnit, densityGPerMl: Dec | null | undefined): Dec {
  if (!isUnitCode(unit)) throw new UnitConversionError('unknown-unit', `Unknown unit "${unit}".`);
  const factor = FACTORS.get(unit) as Dec;
  const from = UNITS[unit].dimension;
  const to = UNITS[baseUnit].dimension;
  if (from === to) return factor;
  if (from === 'count' || to === 'count') {
    throw new UnitConversionError('incompatible', `Cannot convert ${UNITS[unit].label} (${from}) to ${baseUnit} (${to}).`);
  }
  if (!densityGPerMl || !densityGPerMl.gt(0)) {
    throw new UnitConversionError(
      'no-density',
      `${UNITS[unit].symbol} is a ${from}, but the item is measured in ${baseUnit} (${to}): add a density (g per ml) to convert.`,
    );
  }
  return from === 'mass' ? factor.div(densityGPerMl) : factor.times(densityGPerMl);
}

/** `quantity` of `unit` expressed in `baseUnit` (see {@link conversionFactor}). */
export function toBaseUnit(quantity: Dec, unit: string, baseUnit: BaseUnit, densityGPerMl?: Dec | null): Dec {
  return quantity.times(conversionFactor(unit, baseUnit, densityGPerMl));
}
