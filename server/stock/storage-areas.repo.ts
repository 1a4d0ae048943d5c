import type { Knex } from 'knex';

type Db = Knex | Knex.Transaction;

export interface StorageAreaRow {
  id: string;
  name: string;
  position: number;
  pack_count: number;
}

/**
 * The site's storage areas in their order, each with how many of the site's live stocked
 * packs it holds (the packs the stock list and the count sheet show).
 */
export async function areasOfSite(db: Db, businessId: string, siteId: string): Promise<StorageAreaRow[]> {
  return db('storage_areas as a')
    .leftJoin('stock_items as s', 's.storage_area_id', 'a.id')
    .leftJoin('packs as p', (j) => j.on('p.id', 's.pack_id').andOnNull('p.archived_at'))
    .where({ 'a.business_id': businessId, 'a.site_id': siteId })
    .groupBy('a.id')
    .orderBy([{ column: 'a.position' }, { column: 'a.name' }])
    .select('a.id', 'a.name', 'a.position', db.raw('count(p.id)::int as pack_count'));
}

export async function findArea(db: Db, businessId: string, siteId: string, areaId: string, lock = false): Promise<{ id: string; name: string; position: number } | undefined> {
  const q = db('storage_areas').where({ business_id: businessId, site_id: siteId, id: areaId }).first('id', 'name', 'position');
  return lock ? q.forUpdate() : q;
}

/** Another area of the site with this name, ignoring case (so "Fridge" and "fridge" are one place). */
export async function areaNamed(db: Db, siteId: string, name: string, exceptId?: string): Promise<{ id: string } | undefined> {
  const q = db('storage_areas').where({ site_id: siteId }).whereRaw('lower(name) = lower(?)', [name]).first('id');
  if (exceptId) q.whereNot({ id: exceptId });
  return q;
}

export async function nextPosition(db: Db, siteId: string): Promise<number> {
  const row = await db('storage_areas').where({ site_id: siteId }).max<{ max: number | null }>('position as max').first();
  return row?.max === null || row?.max === undefined ? 0 : row.max + 1;
}

/** Locks the site's area rows, so two reorders (or a reorder and an add) do not interleave. */
export async function lockAreaIds(trx: Knex.Transaction, businessId: string, siteId: string): Promise<string[]> {
  const rows: { id: string }[] = await trx('storage_areas').where({ business_id: businessId, site_id: siteId }).forUpdate().select('id');
  return rows.map((r) => r.id);
}
