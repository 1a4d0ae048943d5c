import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { startTestApp, type TestContext } from '../../helpers/context';
import { signIn, type Session } from '../../helpers/factories';
import { makeBooksCafe, makeCount } from '../books/scenario';

let ctx: TestContext;
beforeAll(async () => {
  ctx = await startTestApp();
});
afterAll(() => ctx.close());

type Cafe = Awaited<ReturnType<typeof makeBooksCafe>>;
const pack = (i: { packId: string | null }) => i.packId as string;

/** A café whose first site stocks its milk, beans and cups, with an owner signed in. */
async function stockedCafe(): Promise<{ cafe: Cafe; site: string; owner: Session; url: string }> {
  const cafe = await makeBooksCafe(ctx.db);
  const site = cafe.f.siteIds[0];
  await ctx.db('stock_items').insert([cafe.milk, cafe.beans, cafe.cups].map((i) => ({ business_id: cafe.biz, site_id: site, pack_id: pack(i) })));
  return { cafe, site, owner: await signIn(ctx.app, cafe.f.users.owner.email), url: `/api/sites/${site}/storage-areas` };
}

const names = async (s: Session, url: string) => ((await s.get(url)).body.areas as { name: string }[]).map((a) => a.name);
const areaRows = (site: string) => ctx.db('storage_areas').where({ site_id: site }).orderBy('position').select('id', 'name', 'position');

describe('storage areas', () => {
  it('are created in order, renamed, reordered and listed with the packs they hold', async () => {
    const { cafe, site, owner, url } = await stockedCafe();
    expect((await owner.get(url)).body).toEqual({ areas: [] });

    const fridge = await owner.post(url, { name: '  Walk-in fridge ' });
    expect(fridge.status, JSON.stringify(fridge.body)).toBe(201);
    // The name is trimmed; the first area goes first, each new one after the last.
    expect(fridge.body.area).toEqual({ id: expect.any(String), name: 'Walk-in fridge', position: 0, packCount: 0 });
    const shelf = (await owner.post(url, { name: 'Back shelf' })).body.area;
    const bar = (await owner.post(url, { name: 'Under the bar' })).body.area;
    expect(shelf.position).toBe(1);
    expect(bar.position).toBe(2);

    const renamed = await owner.patch(`${url}/${fridge.body.area.id}`, { name: 'Milk fridge' });
    expect(renamed.status).toBe(200);
    expect(renamed.body.area).toMatchObject({ id: fridge.body.area.id, name: 'Milk fridge' });
    // Renaming to its own name in another case is allowed (it is the same area).
    expect((await owner.patch(`${url}/${shelf.id}`, { name: 'Back Shelf' })).status).toBe(200);

    const order = await owner.put(`${url}/order`, { areaIds: [bar.id, fridge.body.area.id, shelf.id] });
    expect(order.status, JSON.stringify(order.body)).toBe(200);
    expect(order.body.areas.map((a: { name: string; position: number }) => [a.name, a.position])).toEqual([['Under the bar', 0], ['Milk fridge', 1], ['Back Shelf', 2]]);
    expect(await names(owner, url)).toEqual(['Under the bar', 'Milk fridge', 'Back Shelf']);

    // Two packs into the fridge, one under the bar: the list counts them, the stock list names the area.
    const assign = (packId: string, storageAreaId: string | null) => owner.put(`/api/sites/${site}/stock/${packId}/storage-area`, { storageAreaId });
    const put = await assign(pack(cafe.milk), fridge.body.area.id);
    expect(put.status, JSON.stringify(put.body)).toBe(200);
    expect(put.body).toEqual({ item: { packId: pack(cafe.milk), storageArea: { id: fridge.body.area.id, name: 'Milk fridge' } } });
    await assign(pack(cafe.cups), fridge.body.area.id);
    await assign(pack(cafe.beans), bar.id);
    await assign(pack(cafe.cups), null);
    await assign(pack(cafe.cups), fridge.body.area.id);
    expect((await owner.get(url)).body.areas.map((a: { name: string; packCount: number }) => [a.name, a.packCount])).toEqual([['Under the bar', 1], ['Milk fridge', 2], ['Back Shelf', 0]]);
    const stock = await owner.get(`/api/sites/${site}/stock`);
    const areaOf = (packId: string) => stock.body.items.find((i: { packId: string }) => i.packId === packId).storageArea;
    expect(areaOf(pack(cafe.milk))).toEqual({ id: fridge.body.area.id, name: 'Milk fridge' });
    expect(areaOf(pack(cafe.beans))).toEqual({ id: bar.id, name: 'Under the bar' });

    // Taking a pack out of every area.
    expect((await assign(pack(cafe.cups), null)).body.item.storageArea).toBeNull();
    const again = await owner.get(`/api/sites/${site}/stock`);
    expect(again.body.items.find((i: { packId: string }) => i.packId === pack(cafe.cups)).storageArea).toBeNull();

    // The count sheet walks the areas in the new order, by their new names.
    const count = await owner.post('/api/stock-counts', { siteId: site, countDate: '2026-10-31' });
    const sheet = await owner.get(`/api/stock-counts/${count.body.count.id}`);
    expect(sheet.body.areas.map((a: { name: string; items: { packId: string }[] }) => [a.name, a.items.map((i) => i.packId)])).toEqual([
      ['Under the bar', [pack(cafe.beans)]],
      ['Milk fridge', [pack(cafe.milk)]],
      ['Not in an area', [pack(cafe.cups)]],
    ]);
  });

  it('moves a pack\'s line in an open count with it, and leaves a finished count as it was taken', async () => {
    const { cafe, site, owner, url } = await stockedCafe();
    const fridge = (await owner.post(url, { name: 'Fridge' })).body.area;
    const bar = (await owner.post(url, { name: 'Bar' })).body.area;
    await owner.put(`/api/sites/${site}/stock/${pack(cafe.milk)}/storage-area`, { storageAreaId: fridge.id });
    const finished = await makeCount(ctx.db, cafe.f, site, '2026-10-15', [{ packId: pack(cafe.milk), packs: '2' }]);
    await ctx.db('stock_count_lines').where({ count_id: finished }).update({ storage_area_id: fridge.id });
    const open = (await owner.post('/api/stock-counts', { siteId: site, countDate: '2026-10-31' })).body.count.id;
    expect((await owner.put(`/api/stock-counts/${open}/lines/${pack(cafe.milk)}`, { packs: '3' })).status).toBe(200);

    await owner.put(`/api/sites/${site}/stock/${pack(cafe.milk)}/storage-area`, { storageAreaId: bar.id });
    const areaOfMilk = async (countId: string) =>
      ((await owner.get(`/api/stock-counts/${countId}`)).body.areas as { name: string; items: { packId: string }[] }[]).find((a) => a.items.some((i) => i.packId === pack(cafe.milk)))?.name;
    expect(await areaOfMilk(open)).toBe('Bar');
    expect(await areaOfMilk(finished)).toBe('Fridge');
  });

  it('deleting an area leaves its packs stocked with no area, and past count lines without one', async () => {
    const { cafe, site, owner, url } = await stockedCafe();
    const fridge = (await owner.post(url, { name: 'Fridge' })).body.area;
    const bar = (await owner.post(url, { name: 'Bar' })).body.area;
    await owner.put(`/api/sites/${site}/stock/${pack(cafe.milk)}/storage-area`, { storageAreaId: fridge.id });
    await owner.put(`/api/sites/${site}/stock/${pack(cafe.beans)}/storage-area`, { storageAreaId: bar.id });
    const past = await makeCount(ctx.db, cafe.f, site, '2026-10-15', [{ packId: pack(cafe.milk), packs: '2' }]);
    await ctx.db('stock_count_lines').where({ count_id: past }).update({ storage_area_id: fridge.id });

    const del = await owner.delete(`${url}/${fridge.id}`);
    expect(del.status).toBe(204);
    expect(await names(owner, url)).toEqual(['Bar']);
    const items = (await owner.get(`/api/sites/${site}/stock`)).body.items as { packId: string; storageArea: unknown }[];
    expect(items).toHaveLength(3);
    expect(items.find((i) => i.packId === pack(cafe.milk))?.storageArea).toBeNull();
    expect(items.find((i) => i.packId === pack(cafe.beans))?.storageArea).toEqual({ id: bar.id, name: 'Bar' });
    expect(await ctx.db('stock_count_lines').where({ count_id: past }).first('storage_area_id', 'packs')).toEqual({ storage_area_id: null, packs: '2.000000' });
    expect((await owner.delete(`${url}/${fridge.id}`)).status).toBe(404);

    // The reorder list is now exactly the one area left.
    expect((await owner.put(`${url}/order`, { areaIds: [bar.id] })).status).toBe(200);
  });

  it('refuses a duplicate name (any case) with 409 naming `name`, and bad input with 400, changing nothing', async () => {
    const { cafe, site, owner, url } = await stockedCafe();
    const fridge = (await owner.post(url, { name: 'Fridge' })).body.area;
    const bar = (await owner.post(url, { name: 'Bar' })).body.area;
    await owner.put(`/api/sites/${site}/stock/${pack(cafe.milk)}/storage-area`, { storageAreaId: fridge.id });
    const before = await areaRows(site);

    const dup = await owner.post(url, { name: ' fridge' });
    expect(dup.status).toBe(409);
    expect(dup.body.error).toMatchObject({ code: 'name_taken', fields: { name: expect.stringContaining('already has a storage area') } });
    const dupRename = await owner.patch(`${url}/${bar.id}`, { name: 'FRIDGE' });
    expect(dupRename.status).toBe(409);
    expect(dupRename.body.error.fields).toHaveProperty('name');

    for (const body of [{}, { name: '' }, { name: '   ' }, { name: 'x'.repeat(61) }, { name: 42 }]) {
      const res = await owner.post(url, body);
      expect(res.status, JSON.stringify(body)).toBe(400);
      expect(Object.keys(res.body.error.fields)).toEqual(['name']);
      expect((await owner.patch(`${url}/${bar.id}`, body)).status, JSON.stringify(body)).toBe(Object.keys(body).length ? 400 : 200);
    }
    // 60 characters is the limit, not over it.
    expect((await owner.post(`/api/sites/${cafe.f.siteIds[1]}/storage-areas`, { name: 'y'.repeat(60) })).status).toBe(201);

    // An order that is not exactly the site's areas: one missing, one extra, a repeat, not uuids.
    const otherSiteArea = (await owner.post(`/api/sites/${cafe.f.siteIds[1]}/storage-areas`, { name: 'Fridge' })).body.area;
    for (const areaIds of [[bar.id], [bar.id, fridge.id, otherSiteArea.id], [bar.id, fridge.id, bar.id], [bar.id, 'not-an-id'], 'both']) {
      const res = await owner.put(`${url}/order`, { areaIds });
      expect(res.status, JSON.stringify(areaIds)).toBe(400);
      expect(Object.keys(res.body.error.fields)[0]).toMatch(/^areaIds/);
    }

    // Assigning an area of another site, an unknown area, or not a uuid: 400 naming storageAreaId.
    for (const storageAreaId of [otherSiteArea.id, '00000000-0000-4000-8000-000000000000', 'fridge', undefined]) {
      const res = await owner.put(`/api/sites/${site}/stock/${pack(cafe.beans)}/storage-area`, { storageAreaId });
      expect(res.status, String(storageAreaId)).toBe(400);
      expect(Object.keys(res.body.error.fields)).toEqual(['storageAreaId']);
    }
    // A pack the site does not stock is not found.
    expect((await owner.put(`/api/sites/${site}/stock/${pack(cafe.sugar)}/storage-area`, { storageAreaId: bar.id })).status).toBe(404);

    expect(await areaRows(site)).toEqual(before);
    const milk = await ctx.db('stock_items').where({ site_id: site }).select('pack_id', 'storage_area_id');
    expect(milk.filter((m) => m.storage_area_id !== null)).toEqual([{ pack_id: pack(cafe.milk), storage_area_id: fridge.id }]);
  });

  it('are 404 for another business, by site, area or pack, and leave that business as it was', async () => {
    const mine = await stockedCafe();
    const theirs = await stockedCafe();
    const theirArea = (await theirs.owner.post(theirs.url, { name: 'Fridge' })).body.area;
    await theirs.owner.put(`/api/sites/${theirs.site}/stock/${pack(theirs.cafe.milk)}/storage-area`, { storageAreaId: theirArea.id });
    const myArea = (await mine.owner.post(mine.url, { name: 'Bar' })).body.area;

    expect((await mine.owner.get(theirs.url)).status).toBe(404);
    expect((await mine.owner.post(theirs.url, { name: 'Mine now' })).status).toBe(404);
    expect((await mine.owner.patch(`${theirs.url}/${theirArea.id}`, { name: 'Mine now' })).status).toBe(404);
    expect((await mine.owner.put(`${theirs.url}/order`, { areaIds: [theirArea.id] })).status).toBe(404);
    expect((await mine.owner.delete(`${theirs.url}/${theirArea.id}`)).status).toBe(404);
    expect((await mine.owner.put(`/api/sites/${theirs.site}/stock/${pack(theirs.cafe.milk)}/storage-area`, { storageAreaId: null })).status).toBe(404);
    // Their area through my site's URL: not one of my site's areas.
    expect((await mine.owner.patch(`${mine.url}/${theirArea.id}`, { name: 'Mine now' })).status).toBe(404);
    expect((await mine.owner.delete(`${mine.url}/${theirArea.id}`)).status).toBe(404);
    const cross = await mine.owner.put(`/api/sites/${mine.site}/stock/${pack(mine.cafe.milk)}/storage-area`, { storageAreaId: theirArea.id });
    expect(cross.status).toBe(400);
    expect(cross.body.error.fields).toHaveProperty('storageAreaId');
    // My area on their pack: their site is not found for me.
    expect((await mine.owner.put(`/api/sites/${theirs.site}/stock/${pack(theirs.cafe.milk)}/storage-area`, { storageAreaId: myArea.id })).status).toBe(404);

    expect(await areaRows(theirs.site)).toEqual([{ id: theirArea.id, name: 'Fridge', position: 0 }]);
    expect((await ctx.db('stock_items').where({ site_id: theirs.site, pack_id: pack(theirs.cafe.milk) }).first('storage_area_id')).storage_area_id).toBe(theirArea.id);
  });

  it('are read by every role and changed by the owner and manager only', async () => {
    const { cafe, site, owner, url } = await stockedCafe();
    const area = (await owner.post(url, { name: 'Fridge' })).body.area;
    const as = async (role: 'manager' | 'barista' | 'bookkeeper') => signIn(ctx.app, cafe.f.users[role].email);
    const manager = await as('manager');
    expect((await manager.post(url, { name: 'Bar' })).status).toBe(201);
    expect((await manager.put(`/api/sites/${site}/stock/${pack(cafe.milk)}/storage-area`, { storageAreaId: area.id })).status).toBe(200);
    for (const role of ['barista', 'bookkeeper'] as const) {
      const s = await as(role);
      expect((await s.get(url)).body.areas.map((a: { name: string }) => a.name)).toEqual(['Fridge', 'Bar']);
      expect((await s.get(`/api/sites/${site}/stock`)).body.items.find((i: { packId: string }) => i.packId === pack(cafe.milk)).storageArea).toEqual({ id: area.id, name: 'Fridge' });
      expect((await s.post(url, { name: `By ${role}` })).status).toBe(403);
      expect((await s.patch(`${url}/${area.id}`, { name: `By ${role}` })).status).toBe(403);
      expect((await s.put(`${url}/order`, { areaIds: [] })).status).toBe(403);
      expect((await s.delete(`${url}/${area.id}`)).status).toBe(403);
      expect((await s.put(`/api/sites/${site}/stock/${pack(cafe.milk)}/storage-area`, { storageAreaId: null })).status).toBe(403);
    }
    expect(await names(owner, url)).toEqual(['Fridge', 'Bar']);
  });
});
