import type { Knex } from 'knex';
import type { z } from 'zod';
import type { packStorageAreaSchema, storageAreaInSchema, storageAreaPatchSchema } from '../../src/shared/schemas/stock';
import { AppError, invalidInput, notFound } from '../platform/errors';
import { areaNamed, areasOfSite, findArea, lockAreaIds, nextPosition, type StorageAreaRow } from './storage-areas.repo';

const presentArea = (a: StorageAreaRow) => ({ id: a.id, name: a.name, position: a.position, packCount: a.pack_count });

const nameTaken = () => {
  const message = 'This site already has a storage area with that name.';
  return new AppError(409, 'name_taken', message, { name: message });
};

/** 404 unless the site is this business's; locks its row when asked, so writes to its areas queue. */
async function siteOf(db: Knex | Knex.Transaction, businessId: string, siteId: string, lock = false) {
  const q = db('sites').where({ business_id: businessId, id: siteId }).first('id');
  const site = await (lock ? q.forUpdate() : q);
  if (!site) throw notFound('That site');
}

async function areaOut(db: Knex | Knex.Transaction, businessId: string, siteId: string, areaId: string) {
  const area = (await areasOfSite(db, businessId, siteId)).find((a) => a.id === areaId);
  if (!area) throw notFound('That storage area');
  return presentArea(area);
}

export async function listAreas(db: Knex, businessId: string, siteId: string) {
  await siteOf(db, businessId, siteId);
  return { areas: (await areasOfSite(db, businessId, siteId)).map(presentArea) };
}

/** A new area goes last; names are unique at a site whatever their case. */
export async function createArea(db: Knex, businessId: string, siteId: string, input: z.infer<typeof storageAreaInSchema>) {
  return db.transaction(async (trx) => {
    await siteOf(trx, businessId, siteId, true);
    if (await areaNamed(trx, siteId, input.name)) throw nameTaken();
    const [row] = await trx('storage_areas').insert({ business_id: businessId, site_id: siteId, name: input.name, position: await nextPosition(trx, siteId) }).returning('id');
    return { area: await areaOut(trx, businessId, siteId, row.id) };
  });
}

export async function updateArea(db: Knex, businessId: string, siteId: string, areaId: string, input: z.infer<typeof storageAreaPatchSchema>) {
  return db.transaction(async (trx) => {
    await siteOf(trx, businessId, siteId, true);
    const area = await findArea(trx, businessId, siteId, areaId, true);
    if (!area) throw notFound('That storage area');
    if (input.name !== undefined && input.name !== area.name) {
      if (await areaNamed(trx, siteId, input.name, areaId)) throw nameTaken();
      await trx('storage_areas').where({ id: areaId }).update({ name: input.name });
    }
    return { area: await areaOut(trx, businessId, siteId, areaId) };
  });
}

/** Sets the order of every area of the site at once; a list that is not exactly the site's areas changes nothing. */
export async function reorderAreas(db: Knex, businessId: string, siteId: string, areaIds: string[]) {
  return db.transaction(async (trx) => {
    await siteOf(trx, businessId, siteId, true);
    const current = new Set(await lockAreaIds(trx, businessId, siteId));
    if (areaIds.length !== current.size || areaIds.some((id) => !current.has(id))) {
      throw invalidInput({ areaIds: `List every storage area of this site exactly once (it has ${current.size}); reload the page if someone else changed them.` });
    }
    for (const [position, id] of areaIds.entries()) await trx('storage_areas').where({ id }).update({ position });
    return { areas: (await areasOfSite(trx, businessId, siteId)).map(presentArea) };
  });
}

/**
 * Deletes an area. Its packs stay stocked, with no area (the foreign key sets it null), and
 * so do the lines of counts that were taken there.
 */
export async function deleteArea(db: Knex, businessId: string, siteId: string, areaId: string) {
  await db.transaction(async (trx) => {
    await siteOf(trx, businessId, siteId, true);
    const area = await findArea(trx, businessId, siteId, areaId, true);
    if (!area) throw notFound('That storage area');
    await trx('storage_areas').where({ id: areaId }).delete();
  });
}

/**
 * Puts a pack stocked at the site into one of the site's areas (or none). The lines of the
 * site's open counts follow it, so a count under way shows the pack where it now is; finished
 * counts keep the area they were taken in.
 */
export async function assignPackArea(db: Knex, businessId: string, siteId: string, packId: string, input: z.infer<typeof packStorageAreaSchema>) {
  return db.transaction(async (trx) => {
    await siteOf(trx, businessId, siteId);
    const item = await trx('stock_items').where({ business_id: businessId, site_id: siteId, pack_id: packId }).forUpdate().first('id');
    if (!item) throw notFound('That pack at this site');
    let area: { id: string; name: string } | null = null;
    if (input.storageAreaId !== null) {
      const found = await findArea(trx, businessId, siteId, input.storageAreaId);
      if (!found) throw invalidInput({ storageAreaId: 'Choose a storage area of this site, or none.' });
      area = { id: found.id, name: found.name };
    }
    await trx('stock_items').where({ id: item.id }).update({ storage_area_id: area?.id ?? null, updated_at: trx.fn.now() });
    await trx('stock_count_lines')
      .whereIn('count_id', trx('stock_counts').where({ business_id: businessId, site_id: siteId, status: 'open' }).select('id'))
      .where({ pack_id: packId })
      .update({ storage_area_id: area?.id ?? null });
    return { item: { packId, storageArea: area } };
  });
}
