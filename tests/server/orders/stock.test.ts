// Stock on hand and the suggested order. Worked by hand beside each check; rounding up to
// whole packs is common practice, no source.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { makeOrderWorld, startOrdersApp, type OrdersContext } from './helpers';

let ctx: OrdersContext;
beforeAll(async () => {
  ctx = await startOrdersApp();
});
afterAll(() => ctx.close());

describe('stock on hand', () => {
  it('is the last count plus deliveries since, minus ingredient waste since', async () => {
    const w = await makeOrderWorld(ctx, { terms: 'account' });
    const b = w.biz.businessId;
    expect((await w.manager.put(`/api/sites/${w.siteId}/stock/${w.milk}`, { par: '6', reorderPoint: '2' })).status).toBe(200);
    expect((await w.manager.put(`/api/sites/${w.siteId}/stock/${w.oat}`, { par: '4', reorderPoint: '1' })).status).toBe(200);
    const bad = await w.manager.put(`/api/sites/${w.siteId}/stock/${w.oat}`, { par: '1', reorderPoint: '2' });
    expect(bad.body.error.fields.reorderPoint).toMatch(/not be above the par/);
    const [count] = await ctx.db('stock_counts').insert({ business_id: b, site_id: w.siteId, count_date: '2026-11-30', status: 'finished', finished_at: ctx.db.raw("now() - interval '1 hour'") }).returning('id');
    await ctx.db('stock_count_lines').insert([{ business_id: b, count_id: count.id, pack_id: w.milk, packs: '1.5' }, { business_id: b, count_id: count.id, pack_id: w.oat, packs: '3' }]);
    const ing = (await ctx.db('packs').where({ id: w.milk }).first('ingredient_id')).ingredient_id;
    // 3 l of milk poured away: a pack holds 12 × 1 l = 12 000 ml, so 3000 / 12 000 = 0.25 packs.
    await ctx.db('waste_entries').insert({ business_id: b, site_id: w.siteId, occurred_on: '2026-12-01', ingredient_id: ing, quantity: '3', unit: 'l', reason: 'out of date' });
    const stock = (await w.manager.get(`/api/sites/${w.siteId}/stock`)).body;
    const milk = stock.items.find((i: { packId: string }) => i.packId === w.milk);
    const oat = stock.items.find((i: { packId: string }) => i.packId === w.oat);
    // 1.5 − 0.25 = 1.25 packs: at or below the reorder point 2, so ceil(6 − 1.25) = 5 packs.
    expect(milk).toMatchObject({ onHand: '1.25', par: '6', reorderPoint: '2', atOrBelowReorder: true, suggested: '5' });
    // 3 packs is above the reorder point 1: nothing suggested.
    expect(oat).toMatchObject({ onHand: '3', atOrBelowReorder: false, suggested: '0' });
    expect(stock.countedOn).toBe('2026-11-30');

    const s = (await w.manager.get(`/api/sites/${w.siteId}/suggested-order?supplierId=${w.supplierId}`)).body;
    expect(s.lines).toEqual([expect.objectContaining({ packId: w.milk, onHand: '1.25', par: '6', quantity: '5', unitPrice: '9.60', lineTotal: '48.00' })]);
    // 5 × 9.60 = 48.00 goods against a minimum of 50.00: 2.00 short. Delivery 5.00 → total 53.00.
    expect([s.subtotal, s.minimumShortfall, s.deliveryCharge, s.total]).toEqual(['48.00', '2.00', '5.00', '53.00']);
    expect([2, 4]).toContain(new Date(`${s.nextDelivery}T12:00:00Z`).getUTCDay());
  });
});
