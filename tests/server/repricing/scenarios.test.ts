import { parse } from 'csv-parse/sync';
import { afterAll, beforeAll, expect, test } from 'vitest';
import { ALLERGEN_CAUTION } from '../../../src/shared/allergens';
import { startTestApp, type TestContext } from '../../helpers/context';
import { makeBusiness, signIn } from '../../helpers/factories';
import { makeRepricingMenu } from './menu-fixture';

let ctx: TestContext;
beforeAll(async () => {
  ctx = await startTestApp();
});
afterAll(() => ctx.close());

async function setUp() {
  const biz = await makeBusiness(ctx.db);
  const owner = await signIn(ctx.app, biz.users.owner.email);
  const m = await makeRepricingMenu(ctx.db, biz.businessId);
  return { biz, owner, m };
}

test('draft scenarios are saved, listed, compared side by side, and change nothing live', async () => {
  const { owner, m } = await setUp();
  const changes = [{ ingredientId: m.milk.id, newPrice: '10.69' }];
  const [small, large] = m.latte.drinkSizeIds;
  const absorb = await owner.post('/api/reprice/scenarios', { name: `Absorb it ${m.s}`, changes });
  const passOn = await owner.post('/api/reprice/scenarios', {
    name: `Pass it on ${m.s}`,
    changes,
    decisions: [
      { drinkSizeId: small, choice: 'price', price: '3.20' },
      { drinkSizeId: large, choice: 'price', price: '3.75' },
    ],
  });
  const largeOnly = await owner.post('/api/reprice/scenarios', { name: `Large sizes only ${m.s}`, changes, decisions: [{ drinkSizeId: large, choice: 'price', price: '3.75' }] });
  for (const r of [absorb, passOn, largeOnly]) expect(r.status, JSON.stringify(r.body)).toBe(201);
  expect(absorb.body.scenario).toMatchObject({ status: 'draft', changes, decisions: [], keepLadder: false });

  const dup = await owner.post('/api/reprice/scenarios', { name: `Absorb it ${m.s}`, changes });
  expect(dup.status).toBe(409);
  expect(dup.body.error.code).toBe('name_taken');

  const list = await owner.get('/api/reprice/scenarios');
  expect(list.body.scenarios.map((s: { name: string }) => s.name).sort()).toEqual([`Absorb it ${m.s}`, `Large sizes only ${m.s}`, `Pass it on ${m.s}`]);

  const ids = [absorb.body.scenario.id, passOn.body.scenario.id, largeOnly.body.scenario.id];
  const cmp = await owner.get(`/api/reprice/compare?ids=${ids.join(',')}`);
  expect(cmp.status, JSON.stringify(cmp.body)).toBe(200);
  expect(cmp.body.scenarios.map((s: { name: string }) => s.name)).toEqual([`Absorb it ${m.s}`, `Pass it on ${m.s}`, `Large sizes only ${m.s}`]);
  const rowLarge = cmp.body.rows.find((r: { drinkSizeId: string }) => r.drinkSizeId === large);
  expect(rowLarge.cells.map((c: { newPrice: string }) => c.newPrice)).toEqual(['3.60', '3.75', '3.75']);
  const rowSmall = cmp.body.rows.find((r: { drinkSizeId: string }) => r.drinkSizeId === small);
  expect(rowSmall.cells.map((c: { newPrice: string }) => c.newPrice)).toEqual(['3.10', '3.20', '3.10']);
  expect(cmp.body.scenarios.map((s: { totals: { pricesChanged: number } }) => s.totals.pricesChanged)).toEqual([0, 2, 1]);

  // Nothing live changed: prices and costs as they were, no history.
  const live = await ctx.db('drink_sizes').whereIn('id', [small, large]).orderBy('price').select('price', 'price_version');
  expect(live).toEqual([{ price: '3.1000', price_version: 0 }, { price: '3.6000', price_version: 0 }]);
  expect(await ctx.db('menu_price_history').whereIn('drink_size_id', [small, large]).count('* as n').first()).toEqual({ n: '0' });
  expect(await ctx.db('pack_prices').where({ pack_id: m.milk.packId }).select('price')).toEqual([{ price: '9.9000' }]);

  const del = await owner.delete(`/api/reprice/scenarios/${ids[0]}`);
  expect(del.status).toBe(204);
  expect((await owner.get(`/api/reprice/scenarios/${ids[0]}`)).status).toBe(404);
});

test('the price list: every drink and size with its price, allergen marks, the caution and the date effective; CSV too', async () => {
  const { owner, biz, m } = await setUp();
  const apply = await owner.post('/api/reprice/apply', { effectiveFrom: '2026-11-16', prices: [{ drinkId: m.latte.id, size: `Small ${m.s}`, price: '3.20' }] });
  expect(apply.status).toBe(200);
  const res = await owner.get('/api/price-list');
  expect(res.status).toBe(200);
  expect(res.body.effectiveFrom).toBe('2026-11-16');
  expect(res.body.allergenCaution).toBe(ALLERGEN_CAUTION);
  expect(res.body.business.currency).toBe('GBP');
  const latte = res.body.drinks.find((d: { id: string }) => d.id === m.latte.id);
  expect(latte.sizes.map((s: { name: string; price: string }) => [s.name, s.price])).toEqual([[`Small ${m.s}`, '3.20'], [`Large ${m.s}`, '3.60']]);
  expect(latte.allergens).toEqual(['milk']);
  // Milk reaches the foam brew two preparations deep.
  expect(res.body.drinks.find((d: { id: string }) => d.id === m.foamBrew.id).allergens).toEqual(['milk']);
  expect(res.body.drinks.find((d: { id: string }) => d.id === m.americano.id).allergens).toEqual([]);
  expect(res.body.modifiers.find((x: { id: string }) => x.id === m.oatSwap)).toMatchObject({ upcharge: '0.40', allergens: ['cereals-containing-gluten'] });

  // A barista may read and print it too.
  const barista = await signIn(ctx.app, biz.users.barista.email);
  expect((await barista.get('/api/price-list')).status).toBe(200);

  const csv = await owner.get('/api/price-list.csv');
  expect(csv.status).toBe(200);
  expect(csv.headers['content-type']).toMatch(/^text\/csv/);
  // Read back with csv-parse (an RFC 4180 reader from npm), not with our own code.
  const records = parse(csv.text, { columns: true }) as Record<string, string>[];
  expect(records.find((r) => r.drink === `Latte ${m.s}` && r.size === `Small ${m.s}`)).toEqual({
    drink: `Latte ${m.s}`, category: 'Espresso', temperature: 'hot', size: `Small ${m.s}`, volume_ml: '227', price: '3.20', currency: 'GBP', allergens: 'Milk', effective_from: '2026-11-16',
  });
  expect(records.find((r) => r.drink === `Oat swap ${m.s}`)).toMatchObject({ category: 'Add-on', price: '0.40', allergens: 'Cereals containing gluten (wheat, rye, barley, oats)' });
});

test('price history: newest first, per size, and other businesses get 404', async () => {
  const { owner, m } = await setUp();
  await owner.post('/api/reprice/apply', { effectiveFrom: '2026-11-09', prices: [{ drinkId: m.teaDrink.id, size: `Small ${m.s}`, price: '2.30' }] });
  await owner.post('/api/reprice/apply', { effectiveFrom: '2026-11-20', prices: [{ drinkId: m.teaDrink.id, size: `Small ${m.s}`, price: '2.40' }] });
  const h = await owner.get(`/api/drinks/${m.teaDrink.id}/price-history`);
  expect(h.body.history.map((x: { oldPrice: string; newPrice: string; effectiveFrom: string }) => [x.oldPrice, x.newPrice, x.effectiveFrom])).toEqual([
    ['2.30', '2.40', '2026-11-20'],
    ['2.20', '2.30', '2026-11-09'],
  ]);
  const other = await makeBusiness(ctx.db);
  const stranger = await signIn(ctx.app, other.users.owner.email);
  expect((await stranger.get(`/api/drinks/${m.teaDrink.id}/price-history`)).status).toBe(404);
});
