import type { AllergenCode } from '../../src/shared/allergens';
import type { CupSize, LineOut } from '../../src/shared/contract/costing';
import { isUnitCode, type UnitCode } from '../../src/shared/units';
import { qty } from '../platform/present';
import type { LineRow } from './cost-model.repo';
import type { SizeRow } from './sizes.repo';

// Small shapes every costing response shares: a cup size, a stored line, a unit.

export function presentSize(r: SizeRow): CupSize {
  return { id: r.id, name: r.name, volumeMl: qty(r.volume_ml) as string, position: r.position };
}

/** A stored unit column as the contract's unit code (the column only ever holds one). */
export function unitOf(unit: string | null): UnitCode | null {
  return unit !== null && isUnitCode(unit) ? unit : null;
}

/** Stored allergen codes (checked on the way in) as the contract's codes. */
export const allergenCodes = (codes: readonly string[]) => [...codes].sort() as AllergenCode[];

export interface LineNames {
  itemName(id: string): string;
  measureName(id: string): string | null;
}

/** A stored line for the API, with the item's and the measure's names. */
export function presentLine(l: LineRow, names: LineNames): LineOut {
  const itemId = (l.ingredient_id ?? l.preparation_id) as string;
  return {
    id: l.id,
    ingredientId: l.ingredient_id,
    preparationId: l.preparation_id,
    itemName: names.itemName(itemId),
    quantity: qty(l.quantity) as string,
    unit: unitOf(l.unit),
    measureId: l.measure_id,
    measureName: l.measure_id ? names.measureName(l.measure_id) : null,
  };
}
