import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { startTestApp, type TestContext } from '../../helpers/context';
import { signIn } from '../../helpers/factories';
import { makeBooksCafe } from './scenario';

let ctx: TestContext;
beforeAll(async () => {
  ctx = await startTestApp();
});
afterAll(() => ctx.close());

describe('stock counts', () => {
  it('lists the stocked packs by storage area, saves as you go in packs or units, values at the price on the count date, and finishes', async () => {
    const cafe = await makeBooksCafe(ctx.db);
    const site = cafe.f.siteIds[0];
    const [fridge] = await ctx.db('storage_areas').insert({ business_id: cafe.biz, site_id: site, name: 'Fridge', position: 1 }).returning('id');
    await ctx.db('stock_items').insert([
      { business_id: cafe.biz, site_id: site, pack_id: cafe.milk.packId, storage_area_id: fridge.id },
      { business_id: cafe.biz, site_id: site, pack_id: cafe.beans.packId },
    ]);
    const barista = await signIn(ctx.app, cafe.f.users.barista.email);
    const start = await barista.post('/api/stock-counts', { siteId: site, countDate: '2026-10-20' });
    expect(start.status, JSON.stringify(start.body)).toBe(201);
    const id = start.body.count.id;

    // 1.5 packs of beans; milk counted in millilitres: 4500 ml of 1 l packs = 4.5 packs.
    expect((await barista.put(`/api/stock-counts/${id}/lines/${cafe.beans.packId}`, { packs: '1.5' })).body.line).toEqual({ packId: cafe.beans.packId, packs: '1.5' });
    expect((await barista.put(`/api/stock-counts/${id}/lines/${cafe.milk.packId}`, { quantity: '4500', unit: 'ml' })).body.line.packs).toBe('4.5');
    const bad = await barista.put(`/api/stock-counts/${id}/lines/${cafe.milk.packId}`, { quantity: '2', unit: 'each' });
    expect(bad.status).toBe(400);

    // The barista's sheet has the packs counted and no money anywhere.
    const bare = await barista.get(`/api/stock-counts/${id}`);
    expect(bare.status).toBe(200);
    expect(bare.body.areas[1].items[0]).toMatchObject({ packs: '1.5', category: 'coffee' });
    expect(JSON.stringify(bare.body)).not.toMatch(/"(price|value)"/);
    expect(bare.body.count).toMatchObject({ lineCount: 2 });

    const owner = await signIn(ctx.app, cafe.f.users.owner.email);
    const sheet = await owner.get(`/api/stock-counts/${id}`);
    expect(sheet.status).toBe(200);
    expect(sheet.body.areas.map((a: { name: string }) => a.name)).toEqual(['Fridge', 'Not in an area']);
    // Beans on 2026-10-20 cost 24.00 a pack (the rise of the 16th): 1.5 × 24 = 36.00; milk 4.5 × 1.20 = 5.40.
    expect(sheet.body.areas[1].items[0]).toMatchObject({ packs: '1.5', price: '24.00', value: '36.00', category: 'coffee' });
    expect(sheet.body.areas[0].items[0]).toMatchObject({ packs: '4.5', price: '1.20', value: '5.40' });
    expect(sheet.body.count.value).toBe('41.40');

    const done = await barista.post(`/api/stock-counts/${id}/finish`);
    expect(done.body.count).toMatchObject({ status: 'finished', lineCount: 2 });
    expect(done.body.count).not.toHaveProperty('value');
    expect((await barista.get(`/api/stock-counts?siteId=${site}`)).body.counts[0]).not.toHaveProperty('value');
    expect((await owner.get(`/api/stock-counts?siteId=${site}`)).body.counts[0]).toMatchObject({ id, value: '41.40', lineCount: 2 });
    const late = await barista.put(`/api/stock-counts/${id}/lines/${cafe.beans.packId}`, { packs: '9' });
    expect(late.status).toBe(409);
    expect(late.body.error.code).toBe('count_finished');
  });
});

describe('waste log', () => {
  it('values each entry at cost on its day, a drink by its build', async () => {
    const cafe = await makeBooksCafe(ctx.db);
    const site = cafe.f.siteIds[0];
    const barista = await signIn(ctx.app, cafe.f.users.barista.email);
    const manager = await signIn(ctx.app, cafe.f.users.manager.email);
    const milk = { siteId: site, occurredOn: '2026-10-10', item: { kind: 'ingredient', id: cafe.milk.id }, quantity: '500', unit: 'ml', reason: 'Poured away' };
    expect((await barista.post('/api/waste', milk)).status).toBe(201);
    expect((await manager.post('/api/waste', milk)).status).toBe(403);
    expect((await barista.post('/api/waste', { ...milk, item: { kind: 'drinkSize', id: cafe.latteSizeId }, quantity: '3', unit: null, occurredOn: '2026-10-16', reason: 'Remade' })).status).toBe(201);
    const noUnit = await barista.post('/api/waste', { ...milk, unit: undefined });
    expect(noUnit.status).toBe(400);
    expect(Object.keys(noUnit.body.error.fields)).toEqual(['unit']);

    expect((await barista.get(`/api/waste?siteId=${site}&month=2026-10`)).body).not.toHaveProperty('total');
    const owner = await signIn(ctx.app, cafe.f.users.owner.email);
    const list = await owner.get(`/api/waste?siteId=${site}&month=2026-10`);
    expect(list.status).toBe(200);
    // 500 ml × 0.0012 = 0.60; 3 lattes on the 16th × (0.432 + 0.30 + 0.02 + 0.10) = 2.556 → 2.56.
    expect(list.body.entries.map((e: { value: string; reason: string }) => [e.reason, e.value])).toEqual([['Poured away', '0.60'], ['Remade', '2.56']]);
    expect(list.body.total).toBe('3.16');
  });
});
