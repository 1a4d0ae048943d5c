import type { Knex } from 'knex';
import type { z } from 'zod';
import type { Role } from '../../src/shared/capabilities';
import { monthBounds } from '../../src/shared/books';
import type { WasteChoice, WasteEntry, wasteInSchema } from '../../src/shared/contract/books';
import { D, dec } from '../../src/shared/decimal';
import { groupBy } from '../../src/shared/collections';
import type { LineRow } from '../costing/cost-model.repo';
import type { AppDeps } from '../platform/deps';
import { invalidInput, notFound } from '../platform/errors';
import { assertOwnedId } from '../platform/ownership';
import { audienceOf } from './audience';
import { currencyOf } from './books.repo';
import { wasteInRange, type WasteRow } from './cogs.repo';
import { CategorySplitter, loadMonthCosting } from './month-costing';
import { assertMonthOpen } from './periods.service';
import { siteFromInput } from './sites';
import { presentWasteChoices, presentWasteList, type WasteValue } from './waste.presenter';
import { buildLinesOf, deleteWasteRow, insertWaste, lockWaste, recordedBy, WASTE_TABLES, wasteChoiceRows, wasteItemNames } from './waste.repo';

/**
 * Values waste entries at cost on the day each happened: an ingredient or preparation by its
 * quantity and unit, a drink by its build × the cups wasted, each split by ingredient category.
 * Entries are few, so this runs in JavaScript with one cost model per price range of the month.
 */
export async function valueWaste(db: Knex, businessId: string, month: string, rows: readonly WasteRow[], knownVersion?: string): Promise<Map<string, WasteValue>> {
  const out = new Map<string, WasteValue>();
  if (!rows.length) return out;
  const sizeIds = [...new Set(rows.map((r) => r.drink_size_id).filter((x): x is string => Boolean(x)))];
  const [costing, builds] = await Promise.all([loadMonthCosting(db, businessId, month, knownVersion), buildLinesOf(db, sizeIds)]);
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

/** The month's waste at a site or every site; valued (and totalled) only for a reader of costs. */
export async function listWaste({ db }: AppDeps, user: { role: Role; businessId: string }, q: { month: string; siteId?: string }): Promise<{ month: string; currency: string; entries: WasteEntry[]; total?: string }> {
  const { first, last } = monthBounds(q.month);
  if (q.siteId) await siteFromInput(db, user.businessId, q.siteId);
  const [rows, currency, audience] = await Promise.all([wasteInRange(db, user.businessId, q.siteId ?? null, first, last), currencyOf(db, user.businessId), audienceOf(db, user)]);
  const ids = (pick: (r: WasteRow) => string | null) => rows.map(pick).filter((x): x is string => Boolean(x));
  const [names, by, values] = await Promise.all([
    wasteItemNames(db, { ingredients: ids((r) => r.ingredient_id), preparations: ids((r) => r.preparation_id), sizes: ids((r) => r.drink_size_id) }),
    recordedBy(db, rows.map((r) => r.id)),
    audience.currency !== null ? valueWaste(db, user.businessId, q.month, rows) : Promise.resolve(new Map<string, WasteValue>()),
  ]);
  return presentWasteList(q.month, currency, rows, names, by, values, audience);
}

const ITEM_MESSAGE = { ingredient: 'Choose one of your ingredients.', preparation: 'Choose one of your preparations.', drinkSize: 'Choose one of your drinks and sizes.' } as const;

export async function recordWaste({ db }: AppDeps, businessId: string, userId: string, input: z.output<typeof wasteInSchema>): Promise<{ id: string; occurredOn: string }> {
  if (input.item.kind !== 'drinkSize' && !input.unit) throw invalidInput({ unit: 'Choose the unit of what was wasted.' });
  return db.transaction(async (trx) => {
    await siteFromInput(trx, businessId, input.siteId);
    await assertOwnedId(trx, businessId, WASTE_TABLES[input.item.kind], 'item.id', input.item.id, ITEM_MESSAGE[input.item.kind]);
    await assertMonthOpen(trx, businessId, input.occurredOn);
    const row = await insertWaste(trx, {
      business_id: businessId,
      site_id: input.siteId,
      occurred_on: input.occurredOn,
      ingredient_id: input.item.kind === 'ingredient' ? input.item.id : null,
      preparation_id: input.item.kind === 'preparation' ? input.item.id : null,
      drink_size_id: input.item.kind === 'drinkSize' ? input.item.id : null,
      quantity: input.quantity,
      unit: input.item.kind === 'drinkSize' ? null : (input.unit ?? null),
      reason: input.reason,
      recorded_by: userId,
    });
    return { id: row.id, occurredOn: row.occurred_on };
  });
}

export async function deleteWaste({ db }: AppDeps, businessId: string, id: string): Promise<void> {
  await db.transaction(async (trx) => {
    const row = await lockWaste(trx, businessId, id);
    if (!row) throw notFound('That waste entry');
    await assertMonthOpen(trx, businessId, row.occurred_on);
    await deleteWasteRow(trx, id);
  });
}

/** What waste can be recorded against, without any cost: the roles that record waste (baristas among them) may not read costs. */
export async function wasteChoices({ db }: AppDeps, businessId: string): Promise<WasteChoice[]> {
  return presentWasteChoices(await wasteChoiceRows(db, businessId));
}
