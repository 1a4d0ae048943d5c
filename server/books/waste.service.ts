import type { Knex } from 'knex';
import { z } from 'zod';
import { monthBounds, monthString } from '../../src/shared/books';
import { D, dec, type Dec } from '../../src/shared/decimal';
import { writeMoney } from '../../src/shared/money';
import { rules } from '../../src/shared/checks';
import { UNIT_CODES, yieldBaseUnit } from '../../src/shared/units';
import type { BuildLineRow, LineRow } from '../costing/cost-model.repo';
import { decimalString } from '../../src/shared/schemas/costing';
import { groupBy } from '../../src/shared/collections';
import { isoDate } from '../../src/shared/schemas/fields';
import { qty } from '../platform/present';
import { badRequest, notFound } from '../platform/errors';
import { wasteInRange, type WasteRow } from './cogs.repo';
import { CategorySplitter, loadMonthCosting } from './month-costing';
import { assertMonthOpen } from './periods.service';
import { assertSite } from './sites';

export const wasteInSchema = z.object({
  siteId: z.uuid('Choose a site.'),
  occurredOn: isoDate,
  item: z.object({ kind: z.enum(['ingredient', 'preparation', 'drinkSize']), id: z.uuid('Choose what was wasted.') }),
  quantity: decimalString(rules.positive),
  /** A standard unit for an ingredient or preparation; cups (null) for a drink. */
  unit: z.enum(UNIT_CODES).nullish(),
  reason: z.string({ error: 'Say why it was wasted.' }).trim().min(1, 'Say why it was wasted.').max(200),
});

export const wasteListQuery = z.object({ siteId: z.uuid().optional(), month: monthString });

export interface WasteValue {
  total: Dec | null;
  byCategory: Map<string, Dec>;
  problem: string | null;
}

/**
 * Values waste entries at cost on the day each happened: an ingredient or preparation by its
 * quantity and unit, a drink by its build × the cups wasted, each split by ingredient category.
 * Entries are few, so this runs in JavaScript with one cost model per price range of the month.
 */
export async function valueWaste(db: Knex, businessId: string, month: string, rows: readonly WasteRow[], knownVersion?: string): Promise<Map<string, WasteValue>> {
  const out = new Map<string, WasteValue>();
  if (!rows.length) return out;
  const sizeIds = [...new Set(rows.map((r) => r.drink_size_id).filter((x): x is string => Boolean(x)))];
  const [costing, builds] = await Promise.all([
    loadMonthCosting(db, businessId, month, knownVersion),
    sizeIds.length
      ? (db('build_lines').whereIn('drink_size_id', sizeIds).orderBy('position').select('id', 'drink_size_id', 'position', 'ingredient_id', 'preparation_id', 'quantity', 'unit', 'measure_id') as Promise<BuildLineRow[]>)
      : Promise.resolve([] as BuildLineRow[]),
  ]);
  const buildOf = groupBy(builds, (b) => b.drink_size_id);
  const splitters = new Map(costing.ranges.map((r) => [r.loaded, new CategorySplitter(r.loaded)]));
  for (const w of rows) {
    const splitter = splitters.get(costing.at(w.occurred_on)) as CategorySplitter;
    let result;
    if (w.drink_size_id) {
      const lines = buildOf.get(w.drink_size_id) ?? [];
      result = lines.length ? splitter.split(lines) : { ok: false as const, problem: 'The drink has no build to cost.' };
      if (result.ok) for (const [k, v] of result.byCategory) result.byCategory.set(k, v.times(dec(w.quantity)));
    } else {
      const line: LineRow = { id: w.id, position: 0, ingredient_id: w.ingredient_id, preparation_id: w.preparation_id, quantity: w.quantity, unit: w.unit ?? 'each', measure_id: null };
      result = splitter.split([line]);
    }
    if (result.ok) {
      let total = new D(0);
      for (const v of result.byCategory.values()) total = total.plus(v);
      out.set(w.id, { total, byCategory: result.byCategory, problem: null });
    } else out.set(w.id, { total: null, byCategory: new Map(), problem: result.problem });
  }
  return out;
}

export async function listWaste(db: Knex, businessId: string, q: z.infer<typeof wasteListQuery>) {
  const { first, last } = monthBounds(q.month);
  if (q.siteId) await assertSite(db, businessId, q.siteId);
  const [rows, business] = await Promise.all([wasteInRange(db, businessId, q.siteId ?? null, first, last), db('businesses').where({ id: businessId }).first('currency')]);
  const values = await valueWaste(db, businessId, q.month, rows);
  const names = await itemNames(db, rows);
  const recorded = await db('waste_entries as w').leftJoin('users as u', 'u.id', 'w.recorded_by').whereIn('w.id', rows.map((r) => r.id)).select('w.id', 'u.name');
  const by = new Map(recorded.map((r) => [r.id, r.name as string | null]));
  let total = new D(0);
  const entries = rows.map((r) => {
    const v = values.get(r.id) as WasteValue;
    if (v.total) total = total.plus(v.total);
    return {
      id: r.id,
      siteId: r.site_id,
      occurredOn: r.occurred_on,
      item: { kind: r.drink_size_id ? 'drinkSize' : r.preparation_id ? 'preparation' : 'ingredient', id: (r.drink_size_id ?? r.preparation_id ?? r.ingredient_id) as string, name: names.get((r.drink_size_id ?? r.preparation_id ?? r.ingredient_id) as string) ?? '' },
      quantity: qty(r.quantity),
      unit: r.unit,
      reason: r.reason,
      value: v.total ? writeMoney(v.total, business.currency) : null,
      problem: v.problem,
      recordedBy: by.get(r.id) ?? null,
    };
  });
  return { month: q.month, currency: business.currency as string, entries, total: writeMoney(total, business.currency) };
}

async function itemNames(db: Knex, rows: readonly WasteRow[]): Promise<Map<string, string>> {
  const ing = rows.map((r) => r.ingredient_id).filter(Boolean) as string[];
  const prep = rows.map((r) => r.preparation_id).filter(Boolean) as string[];
  const size = rows.map((r) => r.drink_size_id).filter(Boolean) as string[];
  const [a, b, c] = await Promise.all([
    ing.length ? db('ingredients').whereIn('id', ing).select('id', 'name') : [],
    prep.length ? db('preparations').whereIn('id', prep).select('id', 'name') : [],
    size.length ? db('drink_sizes as ds').join('drinks as d', 'd.id', 'ds.drink_id').join('cup_sizes as cs', 'cs.id', 'ds.size_id').whereIn('ds.id', size).select('ds.id', db.raw("d.name || ' (' || cs.name || ')' as name")) : [],
  ]);
  return new Map([...a, ...b, ...c].map((r: { id: string; name: string }) => [r.id, r.name]));
}

export async function recordWaste(db: Knex, businessId: string, userId: string, input: z.infer<typeof wasteInSchema>) {
  const table = { ingredient: 'ingredients', preparation: 'preparations', drinkSize: 'drink_sizes' }[input.item.kind];
  if (input.item.kind !== 'drinkSize' && !input.unit) throw badRequest('invalid_input', 'Choose the unit of what was wasted.');
  return db.transaction(async (trx) => {
    await assertSite(trx, businessId, input.siteId);
    const item = await trx(table).where({ id: input.item.id, business_id: businessId }).first('id');
    if (!item) throw notFound('That item');
    await assertMonthOpen(trx, businessId, input.occurredOn);
    const [row] = await trx('waste_entries')
      .insert({
        business_id: businessId,
        site_id: input.siteId,
        occurred_on: input.occurredOn,
        ingredient_id: input.item.kind === 'ingredient' ? input.item.id : null,
        preparation_id: input.item.kind === 'preparation' ? input.item.id : null,
        drink_size_id: input.item.kind === 'drinkSize' ? input.item.id : null,
        quantity: input.quantity,
        unit: input.item.kind === 'drinkSize' ? null : input.unit,
        reason: input.reason,
        recorded_by: userId,
      })
      .returning(['id', 'occurred_on']);
    return { entry: { id: row.id as string, occurredOn: row.occurred_on as string } };
  });
}

export async function deleteWaste(db: Knex, businessId: string, id: string) {
  await db.transaction(async (trx) => {
    const row = await trx('waste_entries').where({ id, business_id: businessId }).forUpdate().first('occurred_on');
    if (!row) throw notFound('That waste entry');
    await assertMonthOpen(trx, businessId, row.occurred_on);
    await trx('waste_entries').where({ id }).del();
  });
}

/**
 * What waste can be recorded against, without any cost: the roles that record waste
 * (baristas among them) may not read costs.
 */
export async function wasteChoices(db: Knex, businessId: string) {
  const [ingredients, preparations, sizes] = await Promise.all([
    db('ingredients').where({ business_id: businessId }).whereNull('archived_at').orderBy('name').select('id', 'name', 'base_unit'),
    db('preparations').where({ business_id: businessId }).whereNull('archived_at').orderBy('name').select('id', 'name', 'yield_unit'),
    db('drink_sizes as ds').join('drinks as d', 'd.id', 'ds.drink_id').join('cup_sizes as cs', 'cs.id', 'ds.size_id')
      .where('ds.business_id', businessId).whereNull('d.archived_at')
      .orderBy([{ column: 'd.name' }, { column: 'cs.position' }])
      .select('ds.id', 'd.name as drink_name', 'cs.name as size_name'),
  ]);
  return {
    choices: [
      ...ingredients.map((i) => ({ kind: 'ingredient' as const, id: i.id as string, name: i.name as string, baseUnit: i.base_unit as string })),
      ...preparations.map((p) => ({ kind: 'preparation' as const, id: p.id as string, name: p.name as string, baseUnit: yieldBaseUnit(p.yield_unit) ?? undefined })),
      ...sizes.map((s) => ({ kind: 'drinkSize' as const, id: s.id as string, name: `${s.drink_name} (${s.size_name})` })),
    ],
  };
}
