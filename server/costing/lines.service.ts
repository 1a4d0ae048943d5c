import { dec } from '../../src/shared/decimal';
import { conversionFactor, isBaseUnit, UnitConversionError, yieldBaseUnit, type BaseUnit } from '../../src/shared/units';
import type { Knex } from 'knex';
import { conflict, invalidInput } from '../platform/errors';
import { liveUsesOf, loadLineRefs, type LineItemRow, type LineValues } from './lines.repo';

/** The base unit lines of an item are converted to: an ingredient's own, a preparation's yield's. */
export function itemBaseUnit(item: Pick<LineItemRow, 'unit' | 'kind'>): BaseUnit | null {
  if (item.kind === 'ingredient') return isBaseUnit(item.unit) ? item.unit : null;
  return yieldBaseUnit(item.unit);
}

/** Why a unit cannot measure an item (mass ↔ volume needs a density), or null. */
export function unitProblem(unit: string, baseUnit: BaseUnit, density: string | null | undefined): string | null {
  try {
    conversionFactor(unit, baseUnit, density ? dec(density) : null);
    return null;
  } catch (e) {
    if (e instanceof UnitConversionError) return e.message;
    throw e;
  }
}

/**
 * Checks each line against the business's rows: the item is a live one of this business (an
 * unknown id, or another business's, is refused like a bad value), the measure is the item's,
 * and the unit converts to the item's base unit. Field messages keyed `<prefix>[j].field`.
 */
export async function checkLines(db: Knex, businessId: string, lines: readonly LineValues[], prefix: (j: number) => string): Promise<Record<string, string>> {
  const { items, measures } = await loadLineRefs(db, businessId, lines);
  const fields: Record<string, string> = {};
  lines.forEach((l, j) => {
    const at = prefix(j);
    const itemId = (l.ingredientId ?? l.preparationId) as string;
    const item = items.get(itemId);
    if (!item) {
      fields[`${at}.${l.ingredientId ? 'ingredientId' : 'preparationId'}`] = l.ingredientId ? 'That ingredient was not found.' : 'That preparation was not found.';
      return;
    }
    let unit = l.unit as string;
    let field = 'unit';
    if (l.measureId) {
      const m = measures.get(l.measureId);
      if (!m || (m.ingredient_id ?? m.preparation_id) !== itemId) {
        fields[`${at}.measureId`] = `That measure is not one of ${item.name}'s.`;
        return;
      }
      unit = m.unit;
      field = 'measureId';
    }
    const base = itemBaseUnit(item);
    if (!base) return;
    const problem = unitProblem(unit, base, item.density_g_per_ml);
    if (problem) fields[`${at}.${field}`] = `${item.name}: ${problem}`;
  });
  return fields;
}

export function throwIfFields(fields: Record<string, string>) {
  if (Object.keys(fields).length) throw invalidInput(fields);
}

/** Refuses to remove an item a live drink, preparation or modifier still uses, naming them. */
export async function refuseIfUsed(db: Knex, businessId: string, item: { ingredientId?: string; preparationId?: string }, what: string) {
  const uses = await liveUsesOf(db, businessId, item);
  if (uses.length === 0) return;
  const shown = uses.length > 5 ? `${uses.slice(0, 5).join(', ')} and ${uses.length - 5} more` : uses.join(', ');
  throw conflict('in_use', `${what} is still used by ${shown}. Take it out of those first.`);
}
