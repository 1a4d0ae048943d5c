// Stock on hand with waste of drinks and preparations and the theoretical usage of till sales,
// against the real database. Every figure is worked by hand beside its check. Yield: usage from
// stock = what goes in the cup ÷ (yield ÷ 100) (yield % = edible ÷ as purchased: trade-checks.md,
// Cost control, secondary). Topping up to par in whole packs is common practice, no source.
// The café, its packs and its recipes are invented for the test.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { stockLevels } from '../../../server/stock/stock.service';
import { makeDrink, makeIngredient, makePreparation, makeSize } from '../../helpers/costing-factories';
import { suffix } from '../../helpers/factories';
import { makeOrderWorld, startOrdersApp, type OrdersContext } from '../orders/helpers';

let ctx: OrdersContext;
beforeAll(async () => {
  ctx = await startOrdersApp();
});
afterAll(() => ctx.close());

async function addPack(businessId: string, ingredientId: string, p: { description: string; count: string; quantity: string; unit: string; price: string }) {
  const [pack] = await ctx.db('packs').insert({ business_id: businessId, ingredient_id: ingredientId, description: p.description, count: p.count, quantity: p.quantity, unit: p.unit }).returning('id');
  await ctx.db('pack_prices').insert({ business_id: businessId, pack_id: pack.id, price: p.price, effective_from: '2020-01-01' });
  return pack.id as string;
}

describe('stock on hand with waste and till sales since the last count', () => {
  it('takes off drink and preparation waste and the theoretical usage of sales, through the recipes, from the right pack', async () => {
    const w = await makeOrderWorld(ctx, { terms: 'account' });
    const b = w.biz.businessId;
    const db = ctx.db;
    const site = w.siteId;
    const s = suffix();
    const milkId = (await db('packs').where({ id: w.milk }).first('ingredient_id')).ingredient_id as string; // 12 × 1 l = 12 000 ml a pack

    // Beans at 96 % yield, 6 × 1 kg = 6000 g a pack, a shot of 9 g.
    const beans = await makeIngredient(db, b, { name: `Beans ${s}`, baseUnit: 'g', yieldPct: '96', pack: { count: '6', quantity: '1', unit: 'kg', price: '90', supplierId: w.supplierId }, measures: [{ name: 'shot', quantity: '9', unit: 'g' }] });
    // Sugar: a 10 × 1 kg case and a 25 kg sack, the sack being its costing pack; both stocked.
    const sugar = await makeIngredient(db, b, { name: `Sugar ${s}`, baseUnit: 'g', pack: { count: '10', quantity: '1', unit: 'kg', price: '12' } });
    const sack = await addPack(b, sugar.id, { description: '25 kg sack', count: '1', quantity: '25', unit: 'kg', price: '24' });
    await db('ingredients').where({ id: sugar.id }).update({ costing_pack_id: sack });
    // Vanilla pods: costing pack a tub of 50 (not stocked here), stocked as a box of 10.
    const pods = await makeIngredient(db, b, { name: `Vanilla pods ${s}`, baseUnit: 'each', pack: { count: '1', quantity: '10', unit: 'each', price: '30' } });
    const tub = await addPack(b, pods.id, { description: 'tub of 50', count: '1', quantity: '50', unit: 'each', price: '120' });
    await db('ingredients').where({ id: pods.id }).update({ costing_pack_id: tub });
    // Water: used in the syrup, not stocked at the site, so not tracked.
    const water = await makeIngredient(db, b, { name: `Water ${s}`, baseUnit: 'ml', pack: null });

    // Syrup: a 1 l batch of 800 g sugar, 2 pods, 500 ml water; a pump is 10 ml.
    const syrup = await makePreparation(db, b, {
      name: `Vanilla syrup ${s}`, yieldQuantity: '1', yieldUnit: 'l',
      lines: [{ ingredientId: sugar.id, quantity: '800', unit: 'g' }, { ingredientId: pods.id, quantity: '2', unit: 'each' }, { ingredientId: water.id, quantity: '500', unit: 'ml' }],
      measures: [{ name: 'pump', quantity: '10', unit: 'ml' }],
    });
    // Sweet cream: a 400 ml batch of 300 ml milk and 100 ml of the syrup (nested).
    const cream = await makePreparation(db, b, {
      name: `Sweet cream ${s}`, yieldQuantity: '400', yieldUnit: 'ml',
      lines: [{ ingredientId: milkId, quantity: '300', unit: 'ml' }, { preparationId: syrup.id, quantity: '100', unit: 'ml' }],
    });
    const sizeId = await makeSize(db, b, { name: `Tall ${s}`, volumeMl: '350' });
    const latte = await makeDrink(db, b, { name: `Vanilla latte ${s}`, sizes: [{ sizeId, lines: [
      { ingredientId: beans.id, quantity: '18', unit: 'g' }, { ingredientId: milkId, quantity: '250', unit: 'ml' }, { preparationId: syrup.id, quantity: '2', measureId: syrup.measures.pump },
    ] }] });
    const creamDrink = await makeDrink(db, b, { name: `Cream top ${s}`, sizes: [{ sizeId, lines: [
      { ingredientId: beans.id, quantity: '2', measureId: beans.measures.shot }, { preparationId: cream.id, quantity: '40', unit: 'ml' },
    ] }] });
    const [latteSize, creamSize] = [latte.drinkSizeIds[0], creamDrink.drinkSizeIds[0]];

    const level = (packId: string, par: string, reorderPoint: string) => w.manager.put(`/api/sites/${site}/stock/${packId}`, { par, reorderPoint });
    for (const [packId, par, rp] of [[w.milk, '6', '4.5'], [w.oat, '4', '1'], [beans.packId, '3', '1'], [sugar.packId, '4', '1'], [sack, '2', '0'], [pods.packId, '2', '0']] as const) {
      expect((await level(packId as string, par, rp)).status).toBe(200);
    }

    // The count, finished an hour ago, dated 2026-11-30.
    const [count] = await db('stock_counts').insert({ business_id: b, site_id: site, count_date: '2026-11-30', status: 'finished', finished_at: db.raw("now() - interval '1 hour'") }).returning('id');
    await db('stock_count_lines').insert([
      { business_id: b, count_id: count.id, pack_id: w.milk, packs: '4' }, { business_id: b, count_id: count.id, pack_id: w.oat, packs: '3' },
      { business_id: b, count_id: count.id, pack_id: beans.packId, packs: '2' }, { business_id: b, count_id: count.id, pack_id: sugar.packId, packs: '3' },
      { business_id: b, count_id: count.id, pack_id: sack, packs: '1' }, { business_id: b, count_id: count.id, pack_id: pods.packId, packs: '1' },
    ]);

    // A delivery since: 2 packs of milk, through the real order flow.
    const created = await w.manager.post('/api/purchase-orders', { siteId: site, supplierId: w.supplierId, lines: [{ packId: w.milk, quantity: '2' }] });
    expect(created.status, JSON.stringify(created.body)).toBe(201);
    expect((await w.manager.post(`/api/purchase-orders/${created.body.id}/place`)).status).toBe(200);
    const received = await w.manager.post(`/api/purchase-orders/${created.body.id}/receive`, { receivedOn: '2026-12-01', lines: [{ lineId: created.body.lines[0].id, quantityReceived: '2', unitPrice: '9.60' }] });
    expect(received.status, JSON.stringify(received.body)).toBe(200);

    // Waste since: 2.8 l of milk poured away, 2 lattes remade, 200 ml of sweet cream out of date.
    // Before the count (not counted): 5 lattes.
    await db('waste_entries').insert([
      { business_id: b, site_id: site, occurred_on: '2026-12-01', ingredient_id: milkId, quantity: '2.8', unit: 'l', reason: 'out of date' },
      { business_id: b, site_id: site, occurred_on: '2026-12-01', drink_size_id: latteSize, quantity: '2', unit: null, reason: 'remade' },
      { business_id: b, site_id: site, occurred_on: '2026-12-01', preparation_id: cream.id, quantity: '200', unit: 'ml', reason: 'out of date' },
      { business_id: b, site_id: site, occurred_on: '2026-11-30', drink_size_id: latteSize, quantity: '5', unit: null, reason: 'remade', created_at: db.raw("now() - interval '2 hours'") },
    ]);

    // Till sales: an accepted import (lattes 25 + 15, cream 40), a manual day (lattes 20); not counted:
    // a discarded import's line, a sale on the count's own day (before the count), a sale at the other site.
    const imp = async (status: string) => (await db('sales_imports').insert({ business_id: b, site_id: site, file_sha256: `${status}${s}`.padEnd(64, '0'), filename: 'till.csv', status }).returning('id'))[0].id;
    const accepted = await imp('accepted');
    const discarded = await imp('discarded');
    const sale = (soldOn: string, drinkSizeId: string, quantity: string, importId: string | null, siteId = site) => ({ business_id: b, site_id: siteId, import_id: importId, sold_on: soldOn, drink_size_id: drinkSizeId, quantity, net_sales: '1' });
    await db('sales_lines').insert([
      sale('2026-12-01', latteSize, '25', accepted), sale('2026-12-02', latteSize, '15', accepted), sale('2026-12-01', creamSize, '40', accepted),
      sale('2026-12-02', latteSize, '20', null),
      sale('2026-12-02', latteSize, '100', discarded), sale('2026-11-30', latteSize, '100', null), sale('2026-12-02', latteSize, '100', accepted, w.biz.siteIds[1]),
    ]);

    // Per cup, from stock:
    //   latte: beans 18 ÷ 0.96 = 18.75 g; milk 250 ml; 2 pumps = 20 ml syrup = 0.02 batch → sugar 16 g, pods 0.04, water 10 ml.
    //   cream top: beans 2 × 9 = 18 g ÷ 0.96 = 18.75 g; 40 ml sweet cream = 0.1 batch → milk 30 ml, syrup 10 ml (0.01 batch) → sugar 8 g, pods 0.02, water 5 ml.
    // Sales since: lattes 25 + 15 + 20 = 60, cream tops 40:
    //   beans 60 × 18.75 + 40 × 18.75 = 1875 g; milk 60 × 250 + 40 × 30 = 16 200 ml; sugar 960 + 320 = 1280 g; pods 2.4 + 0.8 = 3.2.
    // Waste since: milk 2800 ml + 2 lattes (500 ml) + 200 ml sweet cream (0.5 batch: 150 ml milk, 50 ml syrup) = 3450 ml;
    //   beans 2 × 18.75 = 37.5 g; sugar 2 × 16 + 50 ml syrup × 0.8 g/ml = 32 + 40 = 72 g; pods 0.08 + 0.1 = 0.18.
    const { levels, countedOn } = await stockLevels(db, b, site);
    const by = new Map(levels.map((l) => [l.item.pack_id, l]));
    const figures = (packId: string) => {
      const l = by.get(packId);
      if (!l) throw new Error(`pack ${packId} is not stocked`);
      const m = l.movements;
      return { counted: m.counted.toFixed(), received: m.received.toFixed(), waste: m.waste.toFixed(), sales: m.sales.toFixed(), onHand: l.onHand.toFixed() };
    };
    expect(countedOn).toBe('2026-11-30');
    // Milk, 12 000 ml a pack: 4 + 2 − 3450 / 12 000 (0.2875) − 16 200 / 12 000 (1.35) = 4.3625.
    expect(figures(w.milk)).toEqual({ counted: '4', received: '2', waste: '0.2875', sales: '1.35', onHand: '4.3625' });
    // Beans, 6000 g a pack: 2 − 37.5 / 6000 (0.00625) − 1875 / 6000 (0.3125) = 1.68125.
    expect(figures(beans.packId as string)).toEqual({ counted: '2', received: '0', waste: '0.00625', sales: '0.3125', onHand: '1.68125' });
    // Sugar comes out of its costing pack, the 25 kg sack: 1 − 72 / 25 000 (0.00288) − 1280 / 25 000 (0.0512) = 0.94592;
    // the 10 × 1 kg case is untouched.
    expect(figures(sack)).toEqual({ counted: '1', received: '0', waste: '0.00288', sales: '0.0512', onHand: '0.94592' });
    expect(figures(sugar.packId as string)).toEqual({ counted: '3', received: '0', waste: '0', sales: '0', onHand: '3' });
    // Pods: the costing tub is not stocked here, so the box of 10 (the first stocked pack): 1 − 0.18 / 10 − 3.2 / 10 = 0.662.
    expect(figures(pods.packId as string)).toEqual({ counted: '1', received: '0', waste: '0.018', sales: '0.32', onHand: '0.662' });
    expect(figures(w.oat)).toEqual({ counted: '3', received: '0', waste: '0', sales: '0', onHand: '3' });

    // The API writes on hand to 4 places (1.68125 → 1.6813 halves up).
    const stock = (await w.manager.get(`/api/sites/${site}/stock`)).body;
    const item = (packId: string) => stock.items.find((i: { packId: string }) => i.packId === packId);
    expect(item(w.milk)).toMatchObject({ onHand: '4.3625', atOrBelowReorder: true, suggested: '2', movements: { counted: '4', received: '2', waste: '0.2875', sales: '1.35' } });
    expect(item(beans.packId as string)).toMatchObject({ onHand: '1.6813', movements: { waste: '0.0063', sales: '0.3125' } });
    expect(item(pods.packId as string)).toMatchObject({ onHand: '0.662' });
    expect(stock.notes).toEqual([]);

    // Suggested order for the dairy: without the sales milk would be 4 + 2 − 0.2875 = 5.7125, above its reorder point 4.5;
    // with them 4.3625 is at or below it, so ceil(6 − 4.3625) = 2 packs at 9.60 = 19.20. Oat drink (3, reorder point 1): nothing.
    const s2 = (await w.manager.get(`/api/sites/${site}/suggested-order?supplierId=${w.supplierId}`)).body;
    expect(s2.lines.map((l: { packId: string; onHand: string; quantity: string; lineTotal: string }) => [l.packId, l.onHand, l.quantity, l.lineTotal])).toEqual([
      [w.milk, '4.3625', '2', '19.20'],
    ]);
  });

  it('reports a drink sold without a build and a line whose unit does not convert, and counts the rest', async () => {
    const w = await makeOrderWorld(ctx, { terms: 'account' });
    const b = w.biz.businessId;
    const db = ctx.db;
    const s = suffix();
    const milkId = (await db('packs').where({ id: w.milk }).first('ingredient_id')).ingredient_id as string;
    expect((await w.manager.put(`/api/sites/${w.siteId}/stock/${w.milk}`, { par: '6', reorderPoint: '2' })).status).toBe(200);
    const sizeId = await makeSize(db, b, { name: `Small ${s}` });
    // 120 ml of milk is fine; 10 g of milk cannot be read (milk has no density here).
    const flat = await makeDrink(db, b, { name: `Flat ${s}`, sizes: [{ sizeId, lines: [{ ingredientId: milkId, quantity: '120', unit: 'ml' }, { ingredientId: milkId, quantity: '10', unit: 'g' }] }] });
    const bare = await makeDrink(db, b, { name: `Bare ${s}`, sizes: [{ sizeId, lines: [] }] });
    await db('stock_counts').insert({ business_id: b, site_id: w.siteId, count_date: '2026-11-30', status: 'finished', finished_at: db.raw("now() - interval '1 hour'") }).returning('id')
      .then(([c]) => db('stock_count_lines').insert({ business_id: b, count_id: c.id, pack_id: w.milk, packs: '2' }));
    await db('sales_lines').insert([
      { business_id: b, site_id: w.siteId, sold_on: '2026-12-01', drink_size_id: flat.drinkSizeIds[0], quantity: '50', net_sales: '1' },
      { business_id: b, site_id: w.siteId, sold_on: '2026-12-01', drink_size_id: bare.drinkSizeIds[0], quantity: '7', net_sales: '1' },
    ]);
    const stock = (await w.manager.get(`/api/sites/${w.siteId}/stock`)).body;
    // 50 × 120 ml = 6000 ml = 0.5 of a 12 000 ml pack: 2 − 0.5 = 1.5.
    expect(stock.items.find((i: { packId: string }) => i.packId === w.milk)).toMatchObject({ onHand: '1.5', movements: { sales: '0.5' } });
    expect(stock.notes).toEqual([`Bare ${s} (Small ${s}) has no build: its usage is not counted.`, expect.stringMatching(/^Whole milk [^:]+: .*density/)]);
  });
});
