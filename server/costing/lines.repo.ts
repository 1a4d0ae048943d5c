import type { Knex } from 'knex';

/** A line of a preparation, build or modifier as the API sends it, before it is stored. */
export interface LineValues {
  ingredientId?: string | null;
  preparationId?: string | null;
  quantity: string;
  unit?: string | null;
  measureId?: string | null;
}

export interface LineItemRow {
  id: string;
  name: string;
  /** An ingredient's base unit, or a preparation's yield unit. */
  unit: string;
  density_g_per_ml: string | null;
  kind: 'ingredient' | 'preparation';
}

export interface LineMeasureRow {
  id: string;
  name: string;
  ingredient_id: string | null;
  preparation_id: string | null;
  unit: string;
}

/** The live items and the measures these lines name, of one business only. */
export async function loadLineRefs(db: Knex, businessId: string, lines: readonly LineValues[]) {
  const ids = (pick: (l: LineValues) => string | null | undefined) => [...new Set(lines.map(pick).filter((x): x is string => Boolean(x)))];
  const [ingIds, prepIds, measureIds] = [ids((l) => l.ingredientId), ids((l) => l.preparationId), ids((l) => l.measureId)];
  const [ings, preps, measures] = await Promise.all([
    ingIds.length
      ? db('ingredients').where({ business_id: businessId }).whereIn('id', ingIds).whereNull('archived_at').select('id', 'name', 'base_unit as unit', 'density_g_per_ml', db.raw("'ingredient' as kind"))
      : [],
    prepIds.length
      ? db('preparations').where({ business_id: businessId }).whereIn('id', prepIds).whereNull('archived_at').select('id', 'name', 'yield_unit as unit', 'density_g_per_ml', db.raw("'preparation' as kind"))
      : [],
    measureIds.length ? db('measures').where({ business_id: businessId }).whereIn('id', measureIds).select('id', 'name', 'ingredient_id', 'preparation_id', 'unit') : [],
  ]);
  return {
    items: new Map<string, LineItemRow>([...ings, ...preps].map((r: LineItemRow) => [r.id, r])),
    measures: new Map<string, LineMeasureRow>(measures.map((m: LineMeasureRow) => [m.id, m])),
  };
}

/** Columns of a line row. */
export function lineColumns(l: LineValues, position: number) {
  return { position, ingredient_id: l.ingredientId ?? null, preparation_id: l.preparationId ?? null, quantity: l.quantity, unit: l.unit ?? null, measure_id: l.measureId ?? null };
}

/**
 * The names of the live drinks, preparations and modifiers with a line using an item (an
 * ingredient or a preparation), sorted: what must change before the item can go.
 */
export async function liveUsesOf(db: Knex, businessId: string, item: { ingredientId?: string; preparationId?: string }): Promise<string[]> {
  const column = item.ingredientId ? 'ingredient_id' : 'preparation_id';
  const id = item.ingredientId ?? item.preparationId;
  const result = await db.raw(
    `select d.name from build_lines l join drink_sizes ds on ds.id = l.drink_size_id join drinks d on d.id = ds.drink_id
       where l.business_id = :b and l.${column} = :id and d.archived_at is null
     union select p.name from preparation_lines l join preparations p on p.id = l.parent_id
       where l.business_id = :b and l.${column} = :id and p.archived_at is null
     union select m.name from modifier_lines l join modifiers m on m.id = l.modifier_id
       where l.business_id = :b and l.${column} = :id and m.archived_at is null
     order by 1`,
    { b: businessId, id },
  );
  return result.rows.map((r: { name: string }) => r.name);
}
