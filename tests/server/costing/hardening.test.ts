// The costing routes against bad input, other businesses' ids, history that must be kept, and
// the business's own calendar day (hardening issue items 4, 5, 6 and 12; the one clock).
import { afterAll, beforeAll, describe, expect, test } from 'vitest';
import { randomUUID } from 'node:crypto';
import { fixedClock } from '../../../server/platform/clock';
import { startTestApp, type TestContext } from '../../helpers/context';
import { makeBusiness, signIn, suffix } from '../../helpers/factories';
import { makeDrink, makeIngredient, makePreparation, makeSize, makeSupplier } from '../../helpers/costing-factories';
import { DOCUMENTED_REQUEST, DOCUMENTED_RESPONSE } from '../../helpers/costing-examples';

let ctx: TestContext;
beforeAll(async () => {
  ctx = await startTestApp();
});
afterAll(() => ctx.close());

async function business() {
  const biz = await makeBusiness(ctx.db);
  return { biz, owner: await signIn(ctx.app, biz.users.owner.email) };
}

const fieldsOf = (res: { status: number; body: { error?: { code: string; fields?: Record<string, string> } } }) => {
  expect(res.status, JSON.stringify(res.body)).toBe(400);
  expect(res.body.error?.code).toBe('invalid_input');
  return res.body.error?.fields ?? {};
};

/** An order row with one line for the pack, as the purchasing side stores it. */
async function orderWith(businessId: string, siteId: string, supplierId: string, packId: string) {
  const [o] = await ctx.db('purchase_orders')
    .insert({ business_id: businessId, site_id: siteId, supplier_id: supplierId, number: `H-${suffix()}`, status: 'placed', currency: 'GBP', payment_terms: 'account', subtotal: '21.40', total: '21.40' })
    .returning('id');
  await ctx.db('purchase_order_lines').insert({ business_id: businessId, order_id: o.id, pack_id: packId, description: 'Beans 1 kg', quantity: '1', unit_price: '21.40', line_total: '21.40' });
  return o.id as string;
}

describe('every figure fits the column it is stored in', () => {
  test('a yield with more decimal places than its column is refused, not stored as 0', async () => {
    const { biz, owner } = await business();
    const name = `Oat drink ${suffix()}`;
    // yield_pct is numeric(7, 4): 0.00001 would be rounded to 0 and the ingredient could never be costed.
    const created = await owner.post('/api/ingredients', { name, category: 'plant-milk', baseUnit: 'ml', yieldPct: '0.00001' });
    expect(fieldsOf(created).yieldPct).toMatch(/4 decimal places/);
    expect(await ctx.db('ingredients').where({ business_id: biz.businessId, name }).first()).toBeUndefined();
    const ing = await makeIngredient(ctx.db, biz.businessId);
    expect(Object.keys(fieldsOf(await owner.patch(`/api/ingredients/${ing.id}`, { yieldPct: '0.00001' })))).toEqual(['yieldPct']);
    expect((await ctx.db('ingredients').where({ id: ing.id }).first('yield_pct')).yield_pct).toBe('100.0000');
  });

  test('a price too large for its column is a 400 naming it, and no price is written', async () => {
    const { biz, owner } = await business();
    const ing = await makeIngredient(ctx.db, biz.businessId);
    // pack_prices.price is numeric(14, 4): at most 10 digits before the point.
    const res = await owner.post(`/api/packs/${ing.packId}/prices`, { price: '99999999999' });
    expect(fieldsOf(res).price).toMatch(/at most 10 digits/);
    expect(await ctx.db('pack_prices').where({ pack_id: ing.packId }).count('* as n')).toEqual([{ n: '1' }]);
    expect(Object.keys(fieldsOf(await owner.post('/api/sizes', { name: `Huge ${suffix()}`, volumeMl: '1e400' })))).toEqual(['volumeMl']);
  });

  test('year 0000 and impossible days are refused as dates', async () => {
    const { biz, owner } = await business();
    const ing = await makeIngredient(ctx.db, biz.businessId);
    for (const effectiveFrom of ['0000-01-01', '2026-02-30']) {
      expect(Object.keys(fieldsOf(await owner.post(`/api/packs/${ing.packId}/prices`, { price: '11', effectiveFrom })))).toEqual(['effectiveFrom']);
    }
  });

  test('the preview answers its documented example exactly and holds each figure to the column it would be stored in', async () => {
    const { owner } = await business();
    const ok = await owner.post('/api/costing/preview', DOCUMENTED_REQUEST);
    expect(ok.status).toBe(200);
    expect(ok.body).toStrictEqual(DOCUMENTED_RESPONSE);
    const tiny = structuredClone(DOCUMENTED_REQUEST) as unknown as { ingredients: { yieldPct?: string }[]; policy: Record<string, unknown> };
    tiny.ingredients[1].yieldPct = '0.00001';
    expect(Object.keys(fieldsOf(await owner.post('/api/costing/preview', tiny)))).toEqual(['ingredients[1].yieldPct']);
    // A number where the policy's object-level check reads a decimal string: a 400, never a 500.
    const step = structuredClone(DOCUMENTED_REQUEST) as unknown as { policy: Record<string, unknown> };
    step.policy.priceStep = 5;
    expect(fieldsOf(await owner.post('/api/costing/preview', step))).toHaveProperty(['policy.priceStep']);
  });

  test('a name with a NUL character is refused naming it', async () => {
    const { owner } = await business();
    expect(Object.keys(fieldsOf(await owner.post('/api/sizes', { name: 'Reg\u0000ular', volumeMl: '341' })))).toEqual(['name']);
  });
});

describe('a pack that history remembers is archived, not lost (item 6)', () => {
  test('deleting a pack on a purchase order archives it; then its ingredient is archived and its supplier says why it stays', async () => {
    const { biz, owner } = await business();
    const b = biz.businessId;
    const supplierId = await makeSupplier(ctx.db, b);
    const ing = await makeIngredient(ctx.db, b, { pack: { quantity: '1', unit: 'kg', price: '21.40', supplierId } });
    const onOrder = ing.packId as string;
    const spare = (await owner.post(`/api/ingredients/${ing.id}/packs`, { description: '5 kg sack', quantity: '5', unit: 'kg', price: '95', effectiveFrom: '2020-01-01' })).body.pack.id;
    expect((await owner.patch(`/api/ingredients/${ing.id}`, { costingPackId: onOrder })).status).toBe(200);
    const orderId = await orderWith(b, biz.siteIds[0], supplierId, onOrder);

    const del = await owner.delete(`/api/packs/${onOrder}`);
    expect(del.status, JSON.stringify(del.body)).toBe(204);
    const kept = await ctx.db('packs').where({ id: onOrder }).first('archived_at');
    expect(kept.archived_at).not.toBeNull();
    expect(await ctx.db('purchase_order_lines').where({ order_id: orderId }).pluck('pack_id')).toEqual([onOrder]);
    // Gone from the ingredient's packs and from its costing: the other pack sets the cost now.
    const detail = (await owner.get(`/api/ingredients/${ing.id}`)).body.ingredient;
    expect(detail.packs.map((p: { id: string }) => p.id)).toEqual([spare]);
    expect(detail.costingPackId).toBeNull();
    expect(detail.costingPack.id).toBe(spare);
    // 95 ÷ 5000 g = 0.019 a gram.
    expect(detail.unitCost).toBe('0.0190');
    for (const res of [await owner.get(`/api/packs/${onOrder}/prices`), await owner.patch(`/api/packs/${onOrder}`, { description: 'x' }), await owner.delete(`/api/packs/${onOrder}`)]) {
      expect(res.status).toBe(404);
    }
    expect(fieldsOf(await owner.patch(`/api/ingredients/${ing.id}`, { costingPackId: onOrder }))).toHaveProperty(['costingPackId']);

    // A pack nothing remembers is deleted outright.
    expect((await owner.delete(`/api/packs/${spare}`)).status).toBe(204);
    expect(await ctx.db('packs').where({ id: spare }).first()).toBeUndefined();

    // The ingredient's remaining (archived) pack is on an order: the ingredient is archived too.
    expect((await owner.delete(`/api/ingredients/${ing.id}`)).status).toBe(204);
    expect((await ctx.db('ingredients').where({ id: ing.id }).first('archived_at')).archived_at).not.toBeNull();
    expect((await owner.get(`/api/ingredients/${ing.id}`)).status).toBe(404);
    expect((await owner.get('/api/ingredients')).body.ingredients.map((i: { id: string }) => i.id)).not.toContain(ing.id);

    // The supplier has an order, which keeps naming it: a 409 that says so.
    const supplier = await owner.delete(`/api/suppliers/${supplierId}`);
    expect(supplier.status).toBe(409);
    expect(supplier.body.error).toMatchObject({ code: 'in_use' });
    expect(supplier.body.error.message).toMatch(/purchase orders/);
  });

  test('a supplier whose only pack was archived (counted, never ordered) can be removed; the pack keeps its history', async () => {
    const { biz, owner } = await business();
    const b = biz.businessId;
    const supplierId = await makeSupplier(ctx.db, b);
    const ing = await makeIngredient(ctx.db, b, { pack: { quantity: '1', unit: 'kg', price: '10', supplierId } });
    const [count] = await ctx.db('stock_counts').insert({ business_id: b, site_id: biz.siteIds[0], count_date: '2026-11-30' }).returning('id');
    await ctx.db('stock_count_lines').insert({ business_id: b, count_id: count.id, pack_id: ing.packId, packs: '2.5' });
    expect((await owner.delete(`/api/packs/${ing.packId}`)).status).toBe(204);
    const res = await owner.delete(`/api/suppliers/${supplierId}`);
    expect(res.status, JSON.stringify(res.body)).toBe(204);
    expect(await ctx.db('packs').where({ id: ing.packId }).first('supplier_id', 'archived_at')).toMatchObject({ supplier_id: null, archived_at: expect.any(Date) });
    expect(await ctx.db('stock_count_lines').where({ count_id: count.id }).pluck('pack_id')).toEqual([ing.packId]);
  });

  test('an ingredient a live drink uses is a 409 naming the drink; once only a retired drink uses it, it is archived', async () => {
    const { biz, owner } = await business();
    const b = biz.businessId;
    const sizeId = await makeSize(ctx.db, b);
    const ing = await makeIngredient(ctx.db, b);
    const name = `Cortado ${suffix()}`;
    const drink = await makeDrink(ctx.db, b, { name, sizes: [{ sizeId, lines: [{ ingredientId: ing.id, quantity: '18', unit: 'g' }] }] });
    const used = await owner.delete(`/api/ingredients/${ing.id}`);
    expect(used.status).toBe(409);
    expect(used.body.error.message).toContain(name);
    expect((await owner.delete(`/api/drinks/${drink.id}`)).status).toBe(204);
    expect((await owner.delete(`/api/ingredients/${ing.id}`)).status).toBe(204);
    // The retired drink's build still points at it.
    expect((await ctx.db('ingredients').where({ id: ing.id }).first('archived_at')).archived_at).not.toBeNull();
    expect(await ctx.db('build_lines').where({ drink_size_id: drink.drinkSizeIds[0] }).pluck('ingredient_id')).toEqual([ing.id]);
  });

  test('a preparation that waste was logged against is archived when deleted; the waste keeps it', async () => {
    const { biz, owner } = await business();
    const b = biz.businessId;
    const sugar = await makeIngredient(ctx.db, b);
    const prep = await makePreparation(ctx.db, b, { yieldQuantity: '1', yieldUnit: 'l', lines: [{ ingredientId: sugar.id, quantity: '1', unit: 'kg' }] });
    await ctx.db('waste_entries').insert({ business_id: b, site_id: biz.siteIds[0], occurred_on: '2026-11-30', preparation_id: prep.id, quantity: '0.5', unit: 'l', reason: 'Spilt' });
    expect((await owner.delete(`/api/preparations/${prep.id}`)).status).toBe(204);
    expect((await ctx.db('preparations').where({ id: prep.id }).first('archived_at')).archived_at).not.toBeNull();
    expect((await owner.get(`/api/preparations/${prep.id}`)).status).toBe(404);
    expect(await ctx.db('waste_entries').where({ business_id: b }).pluck('preparation_id')).toEqual([prep.id]);
    // Only the archived preparation uses the sugar now: it goes too, archived (the preparation's lines still name it).
    expect((await owner.delete(`/api/ingredients/${sugar.id}`)).status).toBe(204);
    expect((await ctx.db('ingredients').where({ id: sugar.id }).first('archived_at')).archived_at).not.toBeNull();
  });
});

describe("an id in a body is this business's, or a 400 naming the field (item 12)", () => {
  test('copying a build to a cup size of another business names toSizeId, and changes nothing', async () => {
    const { biz, owner } = await business();
    const other = await makeBusiness(ctx.db);
    const sizeId = await makeSize(ctx.db, biz.businessId);
    const foreign = await makeSize(ctx.db, other.businessId);
    const ing = await makeIngredient(ctx.db, biz.businessId);
    const drink = await makeDrink(ctx.db, biz.businessId, { sizes: [{ sizeId, lines: [{ ingredientId: ing.id, quantity: '18', unit: 'g' }] }] });
    for (const toSizeId of [foreign, randomUUID()]) {
      expect(Object.keys(fieldsOf(await owner.post(`/api/drinks/${drink.id}/copy-build`, { fromSizeId: sizeId, toSizeId })))).toEqual(['toSizeId']);
    }
    expect(await ctx.db('drink_sizes').where({ drink_id: drink.id }).pluck('size_id')).toEqual([sizeId]);
  });

  test("another business's supplier, cup size, ingredient and measure are refused naming each field", async () => {
    const { biz, owner } = await business();
    const other = await makeBusiness(ctx.db);
    const theirSupplier = await makeSupplier(ctx.db, other.businessId);
    const theirSize = await makeSize(ctx.db, other.businessId);
    const theirs = await makeIngredient(ctx.db, other.businessId, { measures: [{ name: 'shot', quantity: '9', unit: 'g' }] });
    const ours = await makeIngredient(ctx.db, biz.businessId);
    const sizeId = await makeSize(ctx.db, biz.businessId);

    expect(Object.keys(fieldsOf(await owner.post(`/api/ingredients/${ours.id}/packs`, { supplierId: theirSupplier, description: 'Tin', quantity: '1', unit: 'kg', price: '5' })))).toEqual(['supplierId']);
    expect(Object.keys(fieldsOf(await owner.patch(`/api/packs/${ours.packId}`, { supplierId: theirSupplier })))).toEqual(['supplierId']);
    const drink = { name: `Drink ${suffix()}`, category: 'Espresso', temperature: 'hot' };
    expect(Object.keys(fieldsOf(await owner.post('/api/drinks', { ...drink, sizes: [{ sizeId: theirSize, lines: [{ ingredientId: ours.id, quantity: '18', unit: 'g' }] }] })))).toEqual(['sizes[0].sizeId']);
    expect(Object.keys(fieldsOf(await owner.post('/api/drinks', { ...drink, sizes: [{ sizeId, lines: [{ ingredientId: theirs.id, quantity: '18', unit: 'g' }] }] })))).toEqual(['sizes[0].lines[0].ingredientId']);
    expect(Object.keys(fieldsOf(await owner.post('/api/drinks', { ...drink, sizes: [{ sizeId, lines: [{ ingredientId: ours.id, quantity: '2', measureId: theirs.measures.shot }] }] })))).toEqual(['sizes[0].lines[0].measureId']);
    expect(Object.keys(fieldsOf(await owner.post('/api/modifiers', { name: `Extra ${suffix()}`, kind: 'add', lines: [{ sizeId: theirSize, action: 'add', ingredientId: ours.id, quantity: '9', unit: 'g' }] })))).toEqual(['lines[0].sizeId']);
    expect(await ctx.db('drinks').where({ business_id: biz.businessId }).count('* as n')).toEqual([{ n: '0' }]);
  });
});

describe("today is the business's own day, from the app's clock", () => {
  let pinned: TestContext;
  beforeAll(async () => {
    // 23:30 UTC on 30 June is already 1 July in London (BST) and still 30 June in New York.
    pinned = await startTestApp({}, undefined, fixedClock('2026-06-30T23:30:00Z'));
  });
  afterAll(() => pinned.close());

  test("a price with no date takes effect on the business's today, and a drink's new price is recorded on it", async () => {
    for (const [timeZone, today] of [['Europe/London', '2026-07-01'], ['America/New_York', '2026-06-30']] as const) {
      const biz = await makeBusiness(pinned.db);
      await pinned.db('businesses').where({ id: biz.businessId }).update({ time_zone: timeZone });
      const owner = await signIn(pinned.app, biz.users.owner.email);
      const ing = await makeIngredient(pinned.db, biz.businessId, { pack: { quantity: '1', unit: 'kg', price: '10', effectiveFrom: '2026-01-01' } });
      const res = await owner.post(`/api/packs/${ing.packId}/prices`, { price: '12' });
      expect(res.status).toBe(201);
      expect(res.body.price.effectiveFrom).toBe(today);
      // In force from today, so it is the price now, not a planned one.
      expect(res.body.pack).toMatchObject({ price: '12.00', priceFrom: today, plannedPrices: [] });
      const sizeId = await makeSize(pinned.db, biz.businessId);
      const drink = await owner.post('/api/drinks', { name: `Latte ${suffix()}`, category: 'Espresso', temperature: 'hot', sizes: [{ sizeId, currentPrice: '3.20', lines: [{ ingredientId: ing.id, quantity: '18', unit: 'g' }] }] });
      expect(drink.status).toBe(201);
      expect(await pinned.db('menu_price_history').where({ drink_size_id: drink.body.drink.sizes[0].id }).pluck('effective_from')).toEqual([today]);
      expect((await owner.get('/api/menu/costing')).body.asOf).toBe(today);
    }
  });
});
