import type { Knex } from 'knex';
import { z } from 'zod';
import { D, dec } from '../../src/shared/decimal';
import { writeMoney } from '../../src/shared/money';
import { rules } from '../../src/shared/checks';
import { conversionFactor, UNIT_CODES, UnitConversionError, type BaseUnit } from '../../src/shared/units';
import { decimalString } from '../../src/shared/schemas/costing';
import { isoDate } from '../../src/shared/schemas/fields';
import { qty } from '../platform/present';
import { badRequest, conflict, invalidInput, notFound } from '../platform/errors';
import { assertMonthOpen } from './periods.service';
import { assertSite } from './sites';

export const countInSchema = z.object({ siteId: z.uuid('Choose a site.'), countDate: isoDate });
export const countListQuery = z.object({ siteId: z.uuid().optional() });
/** Whole packs with the open pack's fraction (3.4), or an amount in a unit (4500 ml) turned into packs. */
export const countLineSchema = z.union([
  z.object({ packs: decimalString(rules.nonNegative) }),
  z.object({ quantity: decimalString(rules.nonNegative), unit: z.enum(UNIT_CODES, { error: 'Choose a unit.' }) }),
]);

interface CountRow {
  id: string;
  site_id: string;
  site_name: string;
  count_date: string;
  status: 'open' | 'finished';
  finished_at: Date | null;
  started_by: string | null;
  finished_by: string | null;
}

function countOut(c: CountRow, value: string | null, lines: number) {
  return {
    id: c.id,
    siteId: c.site_id,
    siteName: c.site_name,
    countDate: c.count_date,
    status: c.status,
    finishedAt: c.finished_at ? new Date(c.finished_at).toISOString() : null,
    startedBy: c.started_by,
    finishedBy: c.finished_by,
    lineCount: lines,
    value,
  };
}

const countQuery = (db: Knex, businessId: string) =>
  db('stock_counts as c')
    .join('sites as s', 's.id', 'c.site_id')
    .leftJoin('users as u1', 'u1.id', 'c.started_by')
    .leftJoin('users as u2', 'u2.id', 'c.finished_by')
    .where('c.business_id', businessId)
    .select('c.id', 'c.site_id', 's.name as site_name', 'c.count_date', 'c.status', 'c.finished_at', 'u1.name as started_by', 'u2.name as finished_by');

/** Value and line count of each count, in one statement: packs × the price in force on its date (or frozen at close). */
async function countTotals(db: Knex, ids: string[]): Promise<Map<string, { value: string; lines: number }>> {
  if (!ids.length) return new Map();
  const { rows } = await db.raw(
    `select l.count_id, count(*)::int as lines, sum(l.packs * coalesce(l.frozen_price, pr.price, 0)) as value
       from stock_count_lines l join stock_counts c on c.id = l.count_id
       left join lateral (select pp.price from pack_prices pp where pp.pack_id = l.pack_id and pp.effective_from <= c.count_date
                          order by pp.effective_from desc, pp.created_at desc limit 1) pr on true
      where l.count_id = any(?::uuid[]) group by l.count_id`,
    [ids],
  );
  return new Map(rows.map((r: { count_id: string; lines: number; value: string }) => [r.count_id, { value: r.value, lines: r.lines }]));
}

async function currencyOf(db: Knex, businessId: string): Promise<string> {
  return (await db('businesses').where({ id: businessId }).first('currency')).currency;
}

export async function listCounts(db: Knex, businessId: string, q: z.infer<typeof countListQuery>) {
  if (q.siteId) await assertSite(db, businessId, q.siteId);
  const rows: CountRow[] = await countQuery(db, businessId).modify((x) => (q.siteId ? x.where('c.site_id', q.siteId) : x)).orderBy([{ column: 'c.count_date', order: 'desc' }, { column: 'c.created_at', order: 'desc' }]).limit(200);
  const [totals, currency] = await Promise.all([countTotals(db, rows.map((r) => r.id)), currencyOf(db, businessId)]);
  return { counts: rows.map((r) => countOut(r, writeMoney(totals.get(r.id)?.value ?? '0', currency), totals.get(r.id)?.lines ?? 0)), currency };
}

async function findCount(db: Knex, businessId: string, id: string, lock = false): Promise<CountRow> {
  const q = countQuery(db, businessId).where('c.id', id);
  if (lock) q.forUpdate('c');
  const row = await q.first();
  if (!row) throw notFound('That count');
  return row;
}

export async function startCount(db: Knex, businessId: string, userId: string, input: z.infer<typeof countInSchema>) {
  return db.transaction(async (trx) => {
    await assertSite(trx, businessId, input.siteId);
    await assertMonthOpen(trx, businessId, input.countDate);
    const [row] = await trx('stock_counts').insert({ business_id: businessId, site_id: input.siteId, count_date: input.countDate, started_by: userId }).returning('id');
    return { count: countOut(await findCount(trx, businessId, row.id), '0', 0) };
  });
}

interface SheetRow {
  pack_id: string;
  description: string;
  count: string;
  quantity: string;
  unit: string;
  ingredient_name: string;
  category: string;
  base_unit: BaseUnit;
  density_g_per_ml: string | null;
  area_id: string | null;
  area_name: string | null;
  area_position: number | null;
  price: string | null;
  packs: string | null;
  frozen_price: string | null;
}

/**
 * The count sheet: every pack stocked at the site (or, when the site lists none yet, every
 * live pack of the business), grouped by storage area, with what has been counted so far and
 * the price in force on the count date. Packs counted that are not on the list still show.
 */
export async function getCountSheet(db: Knex, businessId: string, id: string) {
  const count = await findCount(db, businessId, id);
  const stocked = await db('stock_items').where({ site_id: count.site_id }).count<{ n: string }[]>('* as n');
  const useStock = Number(stocked[0].n) > 0;
  const { rows } = (await db.raw(
    `with sheet as (
        ${useStock ? 'select si.pack_id, si.storage_area_id from stock_items si where si.site_id = :site' : 'select p.id as pack_id, null::uuid as storage_area_id from packs p join ingredients i on i.id = p.ingredient_id where p.business_id = :biz and p.archived_at is null and i.archived_at is null'}
        union
        select l.pack_id, l.storage_area_id from stock_count_lines l where l.count_id = :count and not exists (
          ${useStock ? 'select 1 from stock_items si where si.site_id = :site and si.pack_id = l.pack_id' : 'select 1 from packs p where p.id = l.pack_id and p.archived_at is null'})
     )
     select p.id as pack_id, p.description, p.count, p.quantity, p.unit, i.name as ingredient_name, i.category, i.base_unit, i.density_g_per_ml,
            a.id as area_id, a.name as area_name, a.position as area_position, pr.price, l.packs, l.frozen_price
       from sheet
       join packs p on p.id = sheet.pack_id
       join ingredients i on i.id = p.ingredient_id
       left join stock_count_lines l on l.count_id = :count and l.pack_id = p.id
       left join storage_areas a on a.id = coalesce(l.storage_area_id, sheet.storage_area_id)
       left join lateral (select pp.price from pack_prices pp where pp.pack_id = p.id and pp.effective_from <= :date
                          order by pp.effective_from desc, pp.created_at desc limit 1) pr on true
      order by a.position nulls last, a.name nulls last, i.name, p.description`,
    { site: count.site_id, biz: businessId, count: id, date: count.count_date },
  )) as { rows: SheetRow[] };
  const currency = await currencyOf(db, businessId);
  const areas: { id: string | null; name: string; items: unknown[] }[] = [];
  let total = new D(0);
  let counted = 0;
  for (const r of rows) {
    let area = areas.find((a) => a.id === r.area_id);
    if (!area) areas.push((area = { id: r.area_id, name: r.area_name ?? 'Not in an area', items: [] }));
    const price = r.frozen_price ?? r.price;
    const value = r.packs !== null && price !== null ? dec(r.packs).times(dec(price)) : null;
    if (value) total = total.plus(value);
    if (r.packs !== null) counted++;
    area.items.push({
      packId: r.pack_id,
      ingredient: r.ingredient_name,
      category: r.category,
      description: r.description,
      pack: { count: qty(r.count), quantity: qty(r.quantity), unit: r.unit },
      baseUnit: r.base_unit,
      price: price === null ? null : writeMoney(price, currency),
      packs: qty(r.packs),
      value: value ? writeMoney(value, currency) : null,
    });
  }
  return { count: countOut(count, writeMoney(total, currency), counted), currency, areas };
}

/** Saves one pack's count (saved as you go). Refused on a finished count or in a closed month. */
export async function saveCountLine(db: Knex, businessId: string, userId: string, id: string, packId: string, input: z.infer<typeof countLineSchema>) {
  return db.transaction(async (trx) => {
    const count = await findCount(trx, businessId, id, true);
    if (count.status === 'finished') throw conflict('count_finished', 'This count is finished and can no longer change.');
    await assertMonthOpen(trx, businessId, count.count_date);
    const pack = await trx('packs as p').join('ingredients as i', 'i.id', 'p.ingredient_id').where({ 'p.id': packId, 'p.business_id': businessId })
      .first('p.id', 'p.count', 'p.quantity', 'p.unit', 'i.base_unit', 'i.density_g_per_ml');
    if (!pack) throw notFound('That pack');
    let packs: string;
    if ('packs' in input) packs = input.packs;
    else {
      try {
        const density = pack.density_g_per_ml === null ? null : dec(pack.density_g_per_ml);
        const inBase = dec(input.quantity).times(conversionFactor(input.unit, pack.base_unit, density));
        const packBase = dec(pack.count).times(dec(pack.quantity)).times(conversionFactor(pack.unit, pack.base_unit, density));
        packs = inBase.div(packBase).toDecimalPlaces(6).toFixed();
      } catch (e) {
        if (e instanceof UnitConversionError) throw invalidInput({ unit: e.message });
        throw e;
      }
    }
    if (dec(packs).gte('100000000')) throw badRequest('invalid_input', 'That is more packs than a count can hold.');
    const area = await trx('stock_items').where({ site_id: count.site_id, pack_id: packId }).first('storage_area_id');
    await trx('stock_count_lines')
      .insert({ business_id: businessId, count_id: id, pack_id: packId, storage_area_id: area?.storage_area_id ?? null, packs, counted_by: userId, counted_at: trx.fn.now() })
      .onConflict(['count_id', 'pack_id'])
      .merge(['packs', 'counted_by', 'counted_at']);
    await trx('stock_counts').where({ id }).update({ updated_at: trx.fn.now() });
    return { line: { packId, packs: qty(packs) } };
  });
}

export async function finishCount(db: Knex, businessId: string, userId: string, id: string) {
  return db.transaction(async (trx) => {
    const count = await findCount(trx, businessId, id, true);
    if (count.status === 'finished') throw conflict('count_finished', 'This count is already finished.');
    await assertMonthOpen(trx, businessId, count.count_date);
    await trx('stock_counts').where({ id }).update({ status: 'finished', finished_at: trx.fn.now(), finished_by: userId, updated_at: trx.fn.now() });
    const totals = await countTotals(trx, [id]);
    return { count: countOut(await findCount(trx, businessId, id), writeMoney(totals.get(id)?.value ?? '0', await currencyOf(trx, businessId)), totals.get(id)?.lines ?? 0) };
  });
}

export async function deleteCount(db: Knex, businessId: string, id: string) {
  await db.transaction(async (trx) => {
    const count = await findCount(trx, businessId, id, true);
    await assertMonthOpen(trx, businessId, count.count_date);
    await trx('stock_counts').where({ id }).del();
  });
}
