import { UNITS, UNIT_CODES, type BaseUnit, type UnitCode } from '../../../shared/units';

const dimensionOf = { g: 'mass', ml: 'volume', each: 'count' } as const;

/** Standard units a line of an item may use: its own dimension, and mass ↔ volume when it has a density. */
export function unitsFor(baseUnit: BaseUnit | null | undefined, density: string | null | undefined): UnitCode[] {
  if (!baseUnit) return [...UNIT_CODES];
  const dim = dimensionOf[baseUnit];
  return UNIT_CODES.filter((u) => {
    const d = UNITS[u].dimension;
    return d === dim || (Boolean(density) && dim !== 'count' && d !== 'count');
  });
}

/** What sits beside a number field: "ml", "US fl oz". */
export function unitSymbol(unit: string | null | undefined): string {
  if (!unit) return '';
  return unit in UNITS ? UNITS[unit as UnitCode].symbol : unit;
}

export const BASE_UNIT_LABELS: Record<BaseUnit, string> = { g: 'grams (g)', ml: 'millilitres (ml)', each: 'each (counted)' };
