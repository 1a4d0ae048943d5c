import { afterAll, beforeAll, describe, expect, test } from 'vitest';
import { startTestApp, type TestContext } from '../../helpers/context';
import { makeBusiness, signIn, suffix } from '../../helpers/factories';
import { makeDocumentedDrink, makeDrink, makeIngredient, makePolicy, makePreparation, makeSize } from '../../helpers/costing-factories';
import { DOCUMENTED_REQUEST, DOCUMENTED_RESPONSE } from '../../helpers/costing-examples';

let ctx: TestContext;
beforeAll(async () => {
  ctx = await startTestApp();
});
afterAll(() => ctx.close());

async function business() {
  const biz = await makeBusiness(ctx.db);
  return { biz, owner: await signIn(ctx.app, biz.users.owner.email), barista: await signIn(ctx.app, biz.users.barista.email) };
}

test("a saved drink's costing equals the preview of the same data", async () => {
  const { biz, owner } = await business();
  const d = await makeDocumentedDrink(ctx.db, biz.businessId);
  const res = await owner.get(`/api/drinks/${d.drink.id}/costing`);
  expect(res.status).toBe(200);
  const preview = (await owner.post('/api/costing/preview', DOCUMENTED_REQUEST)).body;
  expect(preview).toStrictEqual(DOCUMENTED_RESPONSE);
  const size = res.body.sizes[0];
  const want = preview.sizes[0];
  expect(size.cost).toBe(want.cost);
  expect(size.suggestedPrice).toBe(want.suggestedPrice);
  expect(size.atSuggested).toStrictEqual(want.atSuggested);
  expect(size.atCurrent).toStrictEqual(want.atCurrent);
  expect(size.lines.map((l: { quantityInBaseUnit: string; baseUnit: string; cost: string }) => [l.quantityInBaseUnit, l.baseUnit, l.cost])).toStrictEqual(
    want.lines.map((l: { quantityInBaseUnit: string; baseUnit: string; cost: string }) => [l.quantityInBaseUnit, l.baseUnit, l.cost]),
  );
  expect(size.lines.map((l: { item: string }) => l.item)).toStrictEqual([d.beans.id, d.milk.id, d.syrup.id, d.cup.id]);
  expect(res.body.allergens).toStrictEqual(['milk']);
  expect(res.body.currency).toBe('GBP');
  expect(res.body.drinkId).toBe(d.drink.id);
  expect(size.drinkSizeId).toBe(d.drink.drinkSizeIds[0]);
});

test("a future-dated pack price is planned: today's cost is unchanged; costing as of that date uses it", async () => {
  const { biz, owner } = await business();
  const d = await makeDocumentedDrink(ctx.db, biz.businessId);
  const planned = await owner.post(`/api/packs/${d.milk.packId}/prices`, { price: '19.80', effectiveFrom: '2099-06-01' });
  expect(planned.status).toBe(201);
  const now = await owner.get(`/api/drinks/${d.drink.id}/costing`);
  expect(now.body.sizes[0].cost).toBe('0.7102');
  const later = await owner.get(`/api/drinks/${d.drink.id}/costing?asOf=2099-06-01`);
  // Milk doubles: 260 ml × 19.80 ÷ 12000 ml ÷ 0.92 = 0.466304…; with beans 0.40125, syrup 0.01428
  // and cup 0.0615 the unrounded sum is 0.943334… → 0.9433.
  expect(later.body.sizes[0].lines[1].cost).toBe('0.4663');
  expect(later.body.sizes[0].cost).toBe('0.9433');
  const ing = await owner.get(`/api/ingredients/${d.milk.id}`);
  expect(ing.body.ingredient.packs[0].price).toBe('9.90');
  expect(ing.body.ingredient.packs[0].plannedPrices).toStrictEqual([{ price: '19.80', effectiveFrom: '2099-06-01' }]);
});

test('a price change today becomes the cost; the history keeps both with their dates', async () => {
  const { biz, owner } = await business();
  const d = await makeDocumentedDrink(ctx.db, biz.businessId);
  expect((await owner.post(`/api/packs/${d.cup.packId}/prices`, { price: '0' })).status).toBe(201);
  const res = await owner.get(`/api/drinks/${d.drink.id}/costing`);
  expect(res.body.sizes[0].cost).toBe('0.6487');
  const history = await owner.get(`/api/packs/${d.cup.packId}/prices`);
  expect(history.body.prices.map((p: { price: string }) => p.price)).toStrictEqual(['0.00', '61.50']);
});

test('the costing pack is the chosen one, else the most recently priced', async () => {
  const { biz, owner } = await business();
  const ing = await makeIngredient(ctx.db, biz.businessId, { baseUnit: 'g', pack: { quantity: '1', unit: 'kg', price: '10', effectiveFrom: '2024-01-01' } });
  const second = await owner.post(`/api/ingredients/${ing.id}/packs`, { description: '5 kg sack', quantity: '5', unit: 'kg', price: '40', effectiveFrom: '2024-02-01' });
  expect(second.status).toBe(201);
  let list = await owner.get(`/api/ingredients/${ing.id}`);
  expect(list.body.ingredient.costingPack.id).toBe(second.body.pack.id);
  expect(list.body.ingredient.unitCost).toBe('0.0080');
  const chosen = await owner.patch(`/api/ingredients/${ing.id}`, { costingPackId: ing.packId });
  expect(chosen.status).toBe(200);
  list = await owner.get('/api/ingredients');
  const row = list.body.ingredients.find((i: { id: string }) => i.id === ing.id);
  expect(row.costingPack.id).toBe(ing.packId);
  expect(row.unitCost).toBe('0.0100');
});

test('GET /api/ingredients has the contract fields, measure costs, and allergens', async () => {
  const { biz, owner } = await business();
  const d = await makeDocumentedDrink(ctx.db, biz.businessId);
  const res = await owner.get('/api/ingredients');
  expect(res.status).toBe(200);
  const beans = res.body.ingredients.find((i: { id: string }) => i.id === d.beans.id);
  expect(beans).toMatchObject({ category: 'other', baseUnit: 'g', costingPack: { id: d.beans.packId, price: '21.40', supplierName: null }, allergens: [] });
  // 21.40 ÷ 1000 g ÷ 0.96 = 0.0222916… per g; a 9 g shot = 0.200625 → 0.2006
  expect(beans.unitCost).toBe('0.0223');
  expect(beans.measures).toMatchObject([{ name: 'shot', quantity: '9', unit: 'g', cost: '0.2006' }]);
  expect(res.body.ingredients.find((i: { id: string }) => i.id === d.milk.id).allergens).toStrictEqual(['milk']);
  expect(res.body.allergenCaution).toMatch(/supplier/);
});

test('creating an ingredient with packs and measures in one request; bad units are refused naming the field', async () => {
  const { owner } = await business();
  const ok = await owner.post('/api/ingredients', {
    name: `Cocoa ${suffix()}`,
    category: 'powder',
    baseUnit: 'g',
    allergens: ['milk'],
    packs: [{ description: '1 kg tub', quantity: '1', unit: 'kg', price: '12.00' }],
    measures: [{ name: 'scoop', quantity: '28', unit: 'g' }],
  });
  expect(ok.status).toBe(201);
  expect(ok.body.ingredient.unitCost).toBe('0.0120');
  expect(ok.body.ingredient.measures[0]).toMatchObject({ name: 'scoop', cost: '0.3360' });
  const bad = await owner.post('/api/ingredients', { name: `Milk ${suffix()}`, category: 'dairy', baseUnit: 'ml', packs: [{ description: 'x', quantity: '1', unit: 'kg', price: '1' }] });
  expect(bad.status).toBe(400);
  expect(bad.body.error.fields['packs[0].unit']).toMatch(/density/);
});

test('a preparation cycle is refused with 400 naming it', async () => {
  const { biz, owner } = await business();
  const sugar = await makeIngredient(ctx.db, biz.businessId);
  const a = await makePreparation(ctx.db, biz.businessId, { name: `Base ${suffix()}`, yieldQuantity: '1', yieldUnit: 'kg', lines: [{ ingredientId: sugar.id, quantity: '1', unit: 'kg' }] });
  const bName = `Mix ${suffix()}`;
  const b = await makePreparation(ctx.db, biz.businessId, { name: bName, yieldQuantity: '1', yieldUnit: 'kg', lines: [{ preparationId: a.id, quantity: '500', unit: 'g' }] });
  const aName = (await ctx.db('preparations').where({ id: a.id }).first('name')).name;
  const res = await owner.put(`/api/preparations/${a.id}`, { name: aName, yield: { quantity: '1', unit: 'kg' }, lines: [{ ingredientId: sugar.id, quantity: '1', unit: 'kg' }, { preparationId: b.id, quantity: '100', unit: 'g' }] });
  expect(res.status).toBe(400);
  expect(res.body.error.fields['lines[1].preparationId']).toBe(`Preparation cycle: ${aName} → ${bName} → ${aName}.`);
  const self = await owner.put(`/api/preparations/${a.id}`, { name: aName, yield: { quantity: '1', unit: 'kg' }, lines: [{ preparationId: a.id, quantity: '1', unit: 'g' }] });
  expect(self.status).toBe(400);
  expect(self.body.error.fields['lines[0].preparationId']).toMatch(/cycle/);
  // Nothing was written.
  expect(await ctx.db('preparation_lines').where({ parent_id: a.id }).count('* as n')).toEqual([{ n: '1' }]);
});

test('a preparation costs per batch and per unit, nested in another', async () => {
  const { biz, owner } = await business();
  const sugar = await makeIngredient(ctx.db, biz.businessId, { pack: { count: '10', quantity: '1', unit: 'kg', price: '11.90' } });
  const created = await owner.post('/api/preparations', { name: `Syrup ${suffix()}`, yield: { quantity: '1.25', unit: 'l' }, lines: [{ ingredientId: sugar.id, quantity: '1', unit: 'kg' }], measures: [{ name: 'pump', quantity: '7.5', unit: 'ml' }] });
  expect(created.status).toBe(201);
  // 1 kg at 1.19 a kg = 1.19 a batch of 1250 ml → 0.000952 a ml (the documented house syrup).
  expect(created.body.preparation).toMatchObject({ batchCost: '1.1900', unitCost: '0.0010', baseUnit: 'ml' });
  const outer = await owner.post('/api/preparations', { name: `Double ${suffix()}`, yield: { quantity: '1', unit: 'l' }, lines: [{ preparationId: created.body.preparation.id, quantity: '2', unit: 'l' }] });
  expect(outer.status).toBe(201);
  expect(outer.body.preparation.batchCost).toBe('1.9040');
});

describe('drinks', () => {
  test('PUT replaces the whole drink with its sizes in one transaction; a bad line writes nothing', async () => {
    const { biz, owner } = await business();
    const small = await makeSize(ctx.db, biz.businessId, { name: `Small ${suffix()}`, volumeMl: '227' });
    const large = await makeSize(ctx.db, biz.businessId, { name: `Large ${suffix()}`, volumeMl: '455', position: 2 });
    const milk = await makeIngredient(ctx.db, biz.businessId, { baseUnit: 'ml', pack: { quantity: '1', unit: 'l', price: '1.20' } });
    const beans = await makeIngredient(ctx.db, biz.businessId, { pack: { quantity: '1', unit: 'kg', price: '20' } });
    const name = `Flat ${suffix()}`;
    const body = {
      name,
      category: 'Espresso',
      temperature: 'hot',
      sizes: [
        { sizeId: small, currentPrice: '3.00', lines: [{ ingredientId: beans.id, quantity: '18', unit: 'g' }, { ingredientId: milk.id, quantity: '150', unit: 'ml' }] },
        { sizeId: large, currentPrice: '3.60', lines: [{ ingredientId: beans.id, quantity: '27', unit: 'g' }, { ingredientId: milk.id, quantity: '330', unit: 'ml' }] },
      ],
    };
    const created = await owner.post('/api/drinks', body);
    expect(created.status).toBe(201);
    const id = created.body.drink.id;
    const bad = await owner.put(`/api/drinks/${id}`, { ...body, name: 'Renamed', sizes: [{ ...body.sizes[0], lines: [{ ingredientId: milk.id, quantity: '10', unit: 'g' }] }] });
    expect(bad.status).toBe(400);
    expect(bad.body.error.fields['sizes[0].lines[0].unit']).toMatch(/density/);
    expect((await owner.get(`/api/drinks/${id}`)).body.drink.name).toBe(name);
    const put = await owner.put(`/api/drinks/${id}`, { ...body, sizes: [{ ...body.sizes[1], currentPrice: '3.80' }] });
    expect(put.status).toBe(200);
    expect(put.body.drink.sizes).toHaveLength(1);
    expect(put.body.drink.sizes[0]).toMatchObject({ sizeId: large, currentPrice: '3.80', priceVersion: 1 });
    const history = await ctx.db('menu_price_history').where({ drink_size_id: put.body.drink.sizes[0].id }).orderBy('changed_at').select('old_price', 'new_price');
    expect(history.map((h) => [h.old_price, h.new_price])).toStrictEqual([[null, '3.6000'], ['3.6000', '3.8000']]);
  });

  test("copy a size's build to another", async () => {
    const { biz, owner } = await business();
    const small = await makeSize(ctx.db, biz.businessId, { name: `Small ${suffix()}` });
    const large = await makeSize(ctx.db, biz.businessId, { name: `Large ${suffix()}`, position: 2 });
    const beans = await makeIngredient(ctx.db, biz.businessId);
    const d = await makeDrink(ctx.db, biz.businessId, { sizes: [{ sizeId: small, price: '3.00', lines: [{ ingredientId: beans.id, quantity: '18', unit: 'g' }] }] });
    const res = await owner.post(`/api/drinks/${d.id}/copy-build`, { fromSizeId: small, toSizeId: large });
    expect(res.status).toBe(200);
    expect(res.body.drink.sizes.map((s: { sizeId: string; lines: { quantity: string }[] }) => [s.sizeId, s.lines.map((l) => l.quantity)])).toStrictEqual([
      [small, ['18']],
      [large, ['18']],
    ]);
  });
});

test('menu costing marks sizes below the target margin (the category override applies)', async () => {
  const { biz, owner } = await business();
  const d = await makeDocumentedDrink(ctx.db, biz.businessId);
  const cheap = await makeDrink(ctx.db, biz.businessId, { name: `Cheap ${suffix()}`, category: 'Espresso', sizes: [{ sizeId: d.sizeId, price: '2.00', lines: [{ ingredientId: d.beans.id, quantity: '2', measureId: d.beans.measures.shot }, { ingredientId: d.milk.id, quantity: '260', unit: 'ml' }] }] });
  await makePolicy(ctx.db, biz.businessId, { category: 'Tea', targetMarginPct: '80' });
  const res = await owner.get('/api/menu/costing');
  expect(res.status).toBe(200);
  expect(res.body.currency).toBe('GBP');
  const documented = res.body.drinks.find((x: { id: string }) => x.id === d.drink.id);
  // 3.45 inclusive at 20 %: margin 75.30 % ≥ 72 %.
  expect(documented.sizes[0]).toMatchObject({ cost: '0.7102', currentPrice: '3.45', marginPct: '75.30', suggestedPrice: '3.05', belowTarget: false });
  const low = res.body.drinks.find((x: { id: string }) => x.id === cheap.id);
  // cost 0.40125 + 0.23315… = 0.6344; net 2.00 ÷ 1.2 = 1.6667; margin = 61.94 % < 72 %
  expect(low.sizes[0]).toMatchObject({ cost: '0.6344', currentPrice: '2.00', marginPct: '61.94', belowTarget: true });
  // Move the documented drink to Tea (target 80 %): 75.30 % is now below target.
  await ctx.db('drinks').where({ id: d.drink.id }).update({ category: 'Tea' });
  const again = (await owner.get('/api/menu/costing')).body.drinks.find((x: { id: string }) => x.id === d.drink.id);
  expect(again.targetMarginPct).toBe('80');
  expect(again.sizes[0].belowTarget).toBe(true);
});

test('the card has the build and allergens but no cost fields; a barista reads it', async () => {
  const { biz, barista } = await business();
  const d = await makeDocumentedDrink(ctx.db, biz.businessId);
  const res = await barista.get(`/api/drinks/${d.drink.id}/card`);
  expect(res.status).toBe(200);
  const text = JSON.stringify(res.body);
  for (const word of ['cost', 'price', 'margin', 'profit', 'upcharge', '9.9', '3.45']) expect(text.toLowerCase()).not.toContain(word);
  expect(res.body.card.allergens).toStrictEqual(['milk']);
  expect(res.body.card.allergenCaution).toMatch(/specification/);
  expect(res.body.card.sizes[0].lines.map((l: { quantity: string; unit: string }) => `${l.quantity} ${l.unit}`)).toStrictEqual(['2 shot', '260 ml', '2 pump', '1 each']);
  const cards = await barista.get('/api/cards');
  expect(cards.body.cards.map((c: { id: string }) => c.id)).toContain(d.drink.id);
  expect((await barista.get(`/api/drinks/${d.drink.id}/costing`)).status).toBe(403);
});

test("another business's ids are 404, and its rows never show", async () => {
  const { biz } = await business();
  const other = await business();
  const d = await makeDocumentedDrink(ctx.db, biz.businessId);
  for (const path of [`/api/drinks/${d.drink.id}`, `/api/drinks/${d.drink.id}/costing`, `/api/drinks/${d.drink.id}/card`, `/api/ingredients/${d.milk.id}`, `/api/preparations/${d.syrup.id}`, `/api/packs/${d.milk.packId}/prices`]) {
    expect((await other.owner.get(path)).status, path).toBe(404);
  }
  expect((await other.owner.post(`/api/packs/${d.milk.packId}/prices`, { price: '1' })).status).toBe(404);
  expect((await other.owner.get('/api/ingredients')).body.ingredients).toStrictEqual([]);
  expect((await other.owner.get('/api/menu/costing')).body.drinks).toStrictEqual([]);
});

test('modifiers: a swap costs the difference and suggests an upcharge keeping the margin', async () => {
  const { biz, owner } = await business();
  const d = await makeDocumentedDrink(ctx.db, biz.businessId);
  const oat = await makeIngredient(ctx.db, biz.businessId, { baseUnit: 'ml', allergens: ['cereals-containing-gluten'], pack: { count: '6', quantity: '1', unit: 'l', price: '12.00' } });
  const res = await owner.post('/api/modifiers', {
    name: `Oat swap ${suffix()}`,
    kind: 'swap',
    lines: [
      { sizeId: d.sizeId, action: 'remove', ingredientId: d.milk.id, quantity: '260', unit: 'ml' },
      { sizeId: d.sizeId, action: 'add', ingredientId: oat.id, quantity: '260', unit: 'ml' },
    ],
  });
  expect(res.status).toBe(201);
  const size = res.body.modifier.sizes[0];
  // oat 260 × 2.00/1000 = 0.52; milk 0.233152…; delta 0.286847… → 0.2868.
  expect(size.costDelta).toBe('0.2868');
  // 0.286847… × 1.2 ÷ 0.28 = 1.2293… → up to the next 0.05 = 1.25
  expect(size.suggestedUpcharge).toBe('1.25');
  expect(res.body.modifier.allergens).toStrictEqual(['cereals-containing-gluten']);
});

test('pricing policy: default until saved, then the saved policy and overrides, with the tax caution', async () => {
  const { owner } = await business();
  const first = await owner.get('/api/pricing-policy');
  expect(first.body).toMatchObject({ currency: 'GBP', isSet: false, policy: { targetMarginPct: '70', taxMode: 'inclusive', taxRatePct: '0', priceStep: '0.05', rounding: 'up' }, overrides: [] });
  expect(first.body.caution).toMatch(/tax authority or an accountant/);
  const bad = await owner.put('/api/pricing-policy', { policy: { targetMarginPct: '72', taxMode: 'inclusive', taxRatePct: '20', priceStep: '0.005', rounding: 'up' } });
  expect(bad.status).toBe(400);
  expect(Object.keys(bad.body.error.fields)).toContain('policy.priceStep');
  const put = await owner.put('/api/pricing-policy', { policy: { targetMarginPct: '72', taxMode: 'inclusive', taxRatePct: '20', priceStep: '0.05', rounding: 'up' }, overrides: [{ category: 'Tea', targetMarginPct: '75', taxMode: 'inclusive', taxRatePct: '20', priceStep: '0.10', rounding: 'nearest' }] });
  expect(put.status).toBe(200);
  expect(put.body).toMatchObject({ isSet: true, policy: { targetMarginPct: '72', taxRatePct: '20' }, overrides: [{ category: 'Tea', targetMarginPct: '75', priceStep: '0.1', rounding: 'nearest' }] });
});
