import type { Knex } from 'knex';
import type { BaseUnit } from '../../src/shared/units';

// Plain rows for stock counts: the count, its sheet, its lines and its value.

export interface CountRow {
  id: string;
  site_id: string;
  site_name: string;
  count_date: string;
  status: 'open' | 'finished';
  finished_at: Date | null;
  started_by: string | null;
  finished_by: string | null;
}

const countQuery = (db: Knex, businessId: string) =>
  db('stock_counts as c')
    .join('sites as s', 's.id', 'c.site_id')
    .leftJoin('users as u1', 'u1.id', 'c.started_by')
    .leftJoin('users as u2', 'u2.id', 'c.finished_by')
    .where('c.business_id', businessId)
    .select('c.id', 'c.site_id', 's.name as site_name', 'c.count_date', 'c.status', 'c.finished_at', 'u1.name as started_by', 'u2.name as finished_by');

/** The newest 200 counts of the business, or of one site. */
export async function listCountRows(db: Knex, businessId: string, siteId: string | null): Promise<CountRow[]> {
  return countQuery(db, businessId)
    .modify((x) => (siteId ? x.where('c.site_id', siteId) : x))
    .orderBy([{ column: 'c.count_date', order: 'desc' }, { column: 'c.created_at', order: 'desc' }])
    .limit(200);
}

/** One count of the business, locked for the transaction when asked. */
export async function findCountRow(db: Knex, businessId: string, id: string, lock = false): Promise<CountRow | undefined> {
  const q = countQuery(db, businessId).where('c.id', id);
  if (lock) q.forUpdate('c');
  return q.first();
}

export interface CountTotals {
  lines: number;
  /** Σ packs × the price in force on the count date (or frozen at close). */
  value: string;
}

/** Value and line count of each count, in one statement. */
export async function countTotals(db: Knex, ids: string[]): Promise<Map<string, CountTotals>> {
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

export async function insertCount(db: Knex, businessId: string, siteId: string, countDate: string, userId: string): Promise<string> {
  const [row] = await db('stock_counts').insert({ business_id: businessId, site_id: siteId, count_date: countDate, started_by: userId }).returning('id');
  return row.id as string;
}

export interface SheetRow {
  pack_id: string;
  description: string;
  count: string;
  quantity: string;
  unit: string;
  ingredient_name: string;
  category: string;
  base_unit: BaseUnit;
  area_id: string | null;
  area_name: string | null;
  price: string | null;
  packs: string | null;
  frozen_price: string | null;
}

/**
 * The count sheet's lines: every pack stocked at the site (or, when the site lists none yet,
 * every live pack of the business), with what has been counted, the price in force on the
 * count date and the storage area; packs counted that are not on the list still show.
 */
export async function sheetRows(db: Knex, businessId: string, count: Pick<CountRow, 'id' | 'site_id' | 'count_date'>): Promise<SheetRow[]> {
  const stocked = await db('stock_items').where({ site_id: count.site_id }).count<{ n: string }[]>('* as n');
  const useStock = Number(stocked[0].n) > 0;
  const { rows } = (await db.raw(
    `with sheet as (
        ${useStock ? 'select si.pack_id, si.storage_area_id from stock_items si where si.site_id = :site' : 'select p.id as pack_id, null::uuid as storage_area_id from packs p join ingredients i on i.id = p.ingredient_id where p.business_id = :biz and p.archived_at is null and i.archived_at is null'}
        union
        select l.pack_id, l.storage_area_id from stock_count_lines l where l.count_id = :count and not exists (
          ${useStock ? 'select 1 from stock_items si where si.site_id = :site and si.pack_id = l.pack_id' : 'select 1 from packs p where p.id = l.pack_id and p.archived_at is null'})
     )
     select p.id as pack_id, p.description, p.count, p.quantity, p.unit, i.name as ingredient_name, i.category, i.base_unit,
            a.id as area_id, a.name as area_name, pr.price, l.packs, l.frozen_price
       from sheet
       join packs p on p.id = sheet.pack_id
       join ingredients i on i.id = p.ingredient_id
       left join stock_count_lines l on l.count_id = :count and l.pack_id = p.id
       left join storage_areas a on a.id = coalesce(l.storage_area_id, sheet.storage_area_id)
       left join lateral (select pp.price from pack_prices pp where pp.pack_id = p.id and pp.effective_from <= :date
                          order by pp.effective_from desc, pp.created_at desc limit 1) pr on true
      order by a.position nulls last, a.name nulls last, i.name, p.description`,
    { site: count.site_id, biz: businessId, count: count.id, date: count.count_date },
  )) as { rows: SheetRow[] };
  return rows;
}

export interface CountedPack {
  id: string;
  count: string;
  quantity: string;
  unit: string;
  base_unit: BaseUnit;
  density_g_per_ml: string | null;
}

export async function findPack(db: Knex, businessId: string, packId: string): Promise<CountedPack | undefined> {
  return db('packs as p').join('ingredients as i', 'i.id', 'p.ingredient_id').where({ 'p.id': packId, 'p.business_id': businessId })
    .first('p.id', 'p.count', 'p.quantity', 'p.unit', 'i.base_unit', 'i.density_g_per_ml');
}

/** Writes one pack's count (replacing an earlier one), in the storage area the site keeps it in. */
export async function upsertCountLine(db: Knex, businessId: string, count: Pick<CountRow, 'id' | 'site_id'>, packId: string, packs: string, userId: string): Promise<void> {
  const area = await db('stock_items').where({ site_id: count.site_id, pack_id: packId }).first('storage_area_id');
  await db('stock_count_lines')
    .insert({ business_id: businessId, count_id: count.id, pack_id: packId, storage_area_id: area?.storage_area_id ?? null, packs, counted_by: userId, counted_at: db.fn.now() })
    .onConflict(['count_id', 'pack_id'])
    .merge(['packs', 'counted_by', 'counted_at']);
  await db('stock_counts').where({ id: count.id }).update({ updated_at: db.fn.now() });
}

export async function markFinished(db: Knex, id: string, userId: string): Promise<void> {
  await db('stock_counts').where({ id }).update({ status: 'finished', finished_at: db.fn.now(), finished_by: userId, updated_at: db.fn.now() });
}

export async function deleteCountRow(db: Knex, id: string): Promise<void> {
  await db('stock_counts').where({ id }).del();
}
