import type { Knex } from 'knex';
import { z } from 'zod';
import { rules } from '../../src/shared/checks';
import { decimalString } from '../../src/shared/schemas/costing';
import { dec } from '../../src/shared/decimal';
import { conversionFactor, UNIT_CODES, UnitConversionError, type BaseUnit } from '../../src/shared/units';
import { invalidInput } from '../platform/errors';
import type { LineRow } from './cost-model.repo';
import { yieldBaseUnit } from './shared';
import { qty } from '../platform/present';

/** A line as the API takes it: one item (ingredient or preparation), a quantity, and a unit or a measure. */
export const lineInSchema = z
  .object({
    ingredientId: z.uuid('Choose an ingredient.').nullish(),
    preparationId: z.uuid('Choose a preparation.').nullish(),
    quantity: decimalString(rules.positive),
    unit: z.enum(UNIT_CODES, { error: (issue) => `Unknown unit "${String(issue.input)}".` }).nullish(),
    measureId: z.uuid('Choose a measure.').nullish(),
  })
  .superRefine((l, ctx) => {
    if (!l.ingredientId === !l.preparationId) ctx.addIssue({ code: 'custom', path: ['ingredientId'], message: 'Choose one ingredient or one preparation.' });
    if (!l.unit === !l.measureId) ctx.addIssue({ code: 'custom', path: ['unit'], message: 'Choose a unit or a measure (not both).' });
  });
export type LineIn = z.output<typeof lineInSchema>;

interface ItemInfo {
  name: string;
  baseUnit: BaseUnit | null;
  density: string | null;
}

/** The rows a line may refer to, for one business. */
export async function loadLineRefs(db: Knex, businessId: string, lines: readonly LineIn[]) {
  const ingIds = [...new Set(lines.map((l) => l.ingredientId).filter(Boolean))] as string[];
  const prepIds = [...new Set(lines.map((l) => l.preparationId).filter(Boolean))] as string[];
  const measureIds = [...new Set(lines.map((l) => l.measureId).filter(Boolean))] as string[];
  const [ings, preps, measures] = await Promise.all([
    ingIds.length ? db('ingredients').where({ business_id: businessId }).whereIn('id', ingIds).whereNull('archived_at').select('id', 'name', 'base_unit', 'density_g_per_ml') : [],
    prepIds.length ? db('preparations').where({ business_id: businessId }).whereIn('id', prepIds).whereNull('archived_at').select('id', 'name', 'yield_unit', 'density_g_per_ml') : [],
    measureIds.length ? db('measures').where({ business_id: businessId }).whereIn('id', measureIds).select('id', 'name', 'ingredient_id', 'preparation_id', 'quantity', 'unit') : [],
  ]);
  const items = new Map<string, ItemInfo>();
  for (const i of ings) items.set(i.id, { name: i.name, baseUnit: i.base_unit, density: i.density_g_per_ml });
  for (const p of preps) items.set(p.id, { name: p.name, baseUnit: yieldBaseUnit(String(p.yield_unit)), density: p.density_g_per_ml });
  return { items, measures: new Map(measures.map((m) => [m.id as string, m])) };
}

/**
 * Checks each line against the business's rows: the item exists here, the measure is the
 * item's, and the unit converts to the item's base unit (mass ↔ volume needs a density).
 * Returns field messages keyed `<prefix>[j].field`.
 */
export async function checkLines(db: Knex, businessId: string, lines: readonly LineIn[], prefix: (j: number) => string): Promise<Record<string, string>> {
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
    if (!item.baseUnit) return;
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
    try {
      conversionFactor(unit, item.baseUnit, item.density === null ? null : dec(item.density));
    } catch (e) {
      if (!(e instanceof UnitConversionError)) throw e;
      fields[`${at}.${field}`] = `${item.name}: ${e.message}`;
    }
  });
  return fields;
}

export function throwIfFields(fields: Record<string, string>) {
  if (Object.keys(fields).length) throw invalidInput(fields);
}

/** Columns of a line row from an API line. */
export function lineColumns(l: LineIn, position: number) {
  return { position, ingredient_id: l.ingredientId ?? null, preparation_id: l.preparationId ?? null, quantity: l.quantity, unit: l.unit ?? null, measure_id: l.measureId ?? null };
}

/** A stored line for the API, with the item's and the measure's names. */
export function presentLine(l: LineRow, names: { itemName(id: string): string; measureName(id: string): string | null }) {
  const itemId = (l.ingredient_id ?? l.preparation_id) as string;
  return {
    id: l.id,
    ingredientId: l.ingredient_id,
    preparationId: l.preparation_id,
    itemName: names.itemName(itemId),
    quantity: qty(l.quantity) as string,
    unit: l.unit,
    measureId: l.measure_id,
    measureName: l.measure_id ? names.measureName(l.measure_id) : null,
  };
}
