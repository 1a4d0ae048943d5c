import { parse } from 'csv-parse/sync';
import Decimal from 'decimal.js';
import { afterAll, beforeAll, describe, expect, test } from 'vitest';
import { startTestApp, type TestContext } from '../../helpers/context';
import { makeBusiness, signIn } from '../../helpers/factories';
import { makeRepricingMenu } from './menu-fixture';

// Menu prices applied with an effective date after today are planned: today's menu price and
// margin stay, and everything that reads prices on a date sees the new price from that date.

let ctx: TestContext;
beforeAll(async () => {
  ctx = await startTestApp();
});
afterAll(() => ctx.close());

/** A date `n` days from today (UTC), as YYYY-MM-DD: the tests do not depend on the day they run. */
const day = (n: number) => new Date(Date.now() + n * 86_400_000).toISOString().slice(0, 10);
const TODAY = day(0);

// Cost per cup by hand from the fixture (bought quantity = used ÷ yield):
// beans 21.40 per kg at 96 % yield, one shot 9 g → 9 ÷ 0.96 × 0.0214 = 0.200625;
// milk 9.90 per 6 × 2 l at 92 % yield, 200 ml → 200 ÷ 0.92 × 9.90 ÷ 12000 = 0.179347826…;
// cup 61.50 per 50 × 20 → 0.0615.
const shot = new Decimal(9).div('0.96').times('21.40').div(1000);
const cup = new Decimal('61.50').div(1000);
const LATTE_SMALL = shot.plus(new Decimal(200).div('0.92').times('9.90').div(12000)).plus(cup); // 0.441472826… → "0.4415"
const AMERICANO_SMALL = shot.times(2).plus(cup); // 0.46275 → "0.4628"
const LATER = day(14);

async function setUp() {
  const biz = await makeBusiness(ctx.db);
  const owner = await signIn(ctx.app, biz.users.owner.email);
  const m = await makeRepricingMenu(ctx.db, biz.businessId);
  return { biz, owner, m };
}

type MenuBody = { drinks: { id: string; sizes: { drinkSizeId: string; currentPrice: string | null; cost: string; marginPct: string | null }[] }[] };
const sizeOf = (body: MenuBody, drinkId: string, i: number) => body.drinks.find((d) => d.id === drinkId)!.sizes[i];

/**
 * Margin on the net price, prices including 20 % VAT (the fixture's policy):
 * margin = (price ÷ 1.2 − cost) ÷ (price ÷ 1.2) × 100, to 2 places half up, on the unrounded cost.
 * Formula: /work/shared/trade-checks.md "Margin = (price − cost) ÷ price" (from memory); computed
 * here with decimal.js, not with our pricing code.
 */
const marginAt = (price: string, cost: Decimal) => {
  const net = new Decimal(price).div('1.2');
  return net.minus(cost).div(net).times(100).toDecimalPlaces(2, Decimal.ROUND_HALF_UP).toFixed(2);
};

describe('a future-dated apply', () => {
  test("leaves today's menu price and margin unchanged; the menu costing on that date shows the new price", async () => {
    const { owner, m } = await setUp();
    const [small] = m.latte.drinkSizeIds;
    const before = await owner.get('/api/menu/costing');
    expect(before.status).toBe(200);
    const smallBefore = sizeOf(before.body, m.latte.id, 0);
    expect(smallBefore.currentPrice).toBe('3.10');

    const res = await owner.post('/api/reprice/apply', { effectiveFrom: LATER, prices: [{ drinkId: m.latte.id, size: `Small ${m.s}`, price: '3.40', priceVersion: 0 }] });
    expect(res.status, JSON.stringify(res.body)).toBe(200);
    expect(res.body).toMatchObject({ effectiveFrom: LATER, planned: true });
    expect(res.body.applied).toEqual([{ drinkId: m.latte.id, drinkName: `Latte ${m.s}`, drinkSizeId: small, size: `Small ${m.s}`, oldPrice: '3.10', newPrice: '3.40', priceVersion: 1, effectiveFrom: LATER, planned: true }]);

    // The stored menu price is today's; the version moved (the version check covers plans).
    expect(await ctx.db('drink_sizes').where({ id: small }).first('price', 'price_version')).toEqual({ price: '3.1000', price_version: 1 });
    const now = await owner.get('/api/menu/costing');
    expect(sizeOf(now.body, m.latte.id, 0)).toEqual(smallBefore);
    expect(smallBefore.cost).toBe(LATTE_SMALL.toFixed(4));
    expect(sizeOf(now.body, m.latte.id, 0).marginPct).toBe(marginAt('3.10', LATTE_SMALL));

    // On the date, and after it, the new price with its margin; the day before, the old one.
    for (const date of [LATER, day(30)]) {
      const then = await owner.get(`/api/menu/costing?asOf=${date}`);
      expect(then.status).toBe(200);
      const s = sizeOf(then.body, m.latte.id, 0);
      expect(s.currentPrice).toBe('3.40');
      expect(s.marginPct).toBe(marginAt('3.40', LATTE_SMALL));
      expect(sizeOf(then.body, m.latte.id, 1).currentPrice).toBe('3.60'); // Large was not changed
    }
    expect(sizeOf((await owner.get(`/api/menu/costing?asOf=${day(13)}`)).body, m.latte.id, 0).currentPrice).toBe('3.10');
    // The drink's own costing follows the same date.
    const drink = await owner.get(`/api/drinks/${m.latte.id}/costing?asOf=${LATER}`);
    expect(drink.body.sizes[0].atCurrent.marginPct).toBe(marginAt('3.40', LATTE_SMALL));
    expect((await owner.get(`/api/drinks/${m.latte.id}/costing`)).body.sizes[0].atCurrent.marginPct).toBe(marginAt('3.10', LATTE_SMALL));
  });

  test('two planned applies at once: the second gets 409 and the first plan stands', async () => {
    const { biz, owner, m } = await setUp();
    const manager = await signIn(ctx.app, biz.users.manager.email);
    const body = (price: string) => ({ effectiveFrom: LATER, prices: [{ drinkId: m.americano.id, size: `Small ${m.s}`, price, priceVersion: 0 }] });
    const [a, b] = await Promise.all([owner.post('/api/reprice/apply', body('2.70')), manager.post('/api/reprice/apply', body('2.80'))]);
    expect([a.status, b.status].sort()).toEqual([200, 409]);
    const loser = a.status === 409 ? a : b;
    expect(loser.body.error.code).toBe('price_changed');
    const plans = await ctx.db('menu_price_history').where({ drink_size_id: m.americano.drinkSizeIds[0] }).select('new_price', 'status');
    expect(plans).toEqual([{ new_price: a.status === 200 ? '2.7000' : '2.8000', status: 'planned' }]);
  });

  test('a new apply for the same date replaces the earlier plan; a later plan waits its turn', async () => {
    const { owner, m } = await setUp();
    const id = m.teaDrink.drinkSizeIds[0];
    const apply = (effectiveFrom: string, price: string) => owner.post('/api/reprice/apply', { effectiveFrom, prices: [{ drinkId: m.teaDrink.id, size: `Small ${m.s}`, price }] });
    expect((await apply(LATER, '2.30')).status).toBe(200);
    expect((await apply(day(28), '2.50')).status).toBe(200);
    const again = await apply(LATER, '2.40');
    expect(again.body.applied).toEqual([expect.objectContaining({ oldPrice: '2.20', newPrice: '2.40', priceVersion: 3 })]);
    const rows = await ctx.db('menu_price_history').where({ drink_size_id: id }).orderBy('changed_at').select('new_price', 'status');
    expect(rows).toEqual([{ new_price: '2.3000', status: 'cancelled' }, { new_price: '2.5000', status: 'planned' }, { new_price: '2.4000', status: 'planned' }]);
    const priceOn = async (date: string) => (await owner.get(`/api/price-list?date=${date}`)).body.drinks.find((d: { id: string }) => d.id === m.teaDrink.id).sizes[0].price;
    expect([await priceOn(TODAY), await priceOn(LATER), await priceOn(day(27)), await priceOn(day(28))]).toEqual(['2.20', '2.40', '2.40', '2.50']);
  });
});

describe('scheduled prices', () => {
  test('are listed soonest first and can be cancelled before their date (owner, manager)', async () => {
    const { biz, owner, m } = await setUp();
    const [small, large] = m.latte.drinkSizeIds;
    const res = await owner.post('/api/reprice/apply', {
      effectiveFrom: LATER,
      prices: [{ drinkId: m.latte.id, size: `Small ${m.s}`, price: '3.40' }, { drinkId: m.latte.id, size: `Large ${m.s}`, price: '3.90' }],
    });
    expect(res.status).toBe(200);
    const list = await owner.get('/api/reprice/scheduled');
    expect(list.status).toBe(200);
    expect(list.body.scheduled.map((x: { drinkSizeId: string; currentPrice: string; oldPrice: string; newPrice: string; effectiveFrom: string }) => [x.drinkSizeId, x.currentPrice, x.oldPrice, x.newPrice, x.effectiveFrom])).toEqual([
      [small, '3.10', '3.10', '3.40', LATER],
      [large, '3.60', '3.60', '3.90', LATER],
    ]);
    expect(list.body.scheduled[0]).toMatchObject({ drinkName: `Latte ${m.s}`, size: `Small ${m.s}`, reason: 'Repricing', scheduledBy: { id: biz.users.owner.id } });

    const barista = await signIn(ctx.app, biz.users.barista.email);
    const bookkeeper = await signIn(ctx.app, biz.users.bookkeeper.email);
    const entry = list.body.scheduled[0].id;
    expect((await barista.post(`/api/reprice/scheduled/${entry}/cancel`, {})).status).toBe(403);
    expect((await bookkeeper.post(`/api/reprice/scheduled/${entry}/cancel`, {})).status).toBe(403);
    const stranger = await signIn(ctx.app, (await makeBusiness(ctx.db)).users.owner.email);
    expect((await stranger.post(`/api/reprice/scheduled/${entry}/cancel`, {})).status).toBe(404);

    const manager = await signIn(ctx.app, biz.users.manager.email);
    const cancel = await manager.post(`/api/reprice/scheduled/${entry}/cancel`, {});
    expect(cancel.status, JSON.stringify(cancel.body)).toBe(200);
    expect(cancel.body).toEqual({ id: entry, status: 'cancelled', effectiveFrom: LATER });
    expect((await owner.get('/api/reprice/scheduled')).body.scheduled.map((x: { drinkSizeId: string }) => x.drinkSizeId)).toEqual([large]);
    // On the date the Small keeps its price; the Large plan still holds. Versions: plan +1, cancel +1.
    const then = await owner.get(`/api/menu/costing?asOf=${LATER}`);
    expect([sizeOf(then.body, m.latte.id, 0).currentPrice, sizeOf(then.body, m.latte.id, 1).currentPrice]).toEqual(['3.10', '3.90']);
    expect(await ctx.db('drink_sizes').where({ id: small }).first('price', 'price_version')).toEqual({ price: '3.1000', price_version: 2 });
    const twice = await owner.post(`/api/reprice/scheduled/${entry}/cancel`, {});
    expect(twice.status).toBe(409);
    expect(twice.body.error).toMatchObject({ code: 'not_planned', message: 'That planned price was already cancelled.' });
  });

  test('a plan whose date has come is in force without any job, cannot be cancelled, and the next write folds it in', async () => {
    const { biz, owner, m } = await setUp();
    const id = m.americano.drinkSizeIds[0];
    // A plan made earlier for today (written directly: the API would apply a today-dated price at once).
    const [planned] = await ctx.db('menu_price_history')
      .insert({ business_id: biz.businessId, drink_size_id: id, old_price: '2.50', new_price: '2.65', effective_from: TODAY, reason: 'Repricing', status: 'planned', changed_by: biz.users.owner.id })
      .returning('id');
    const menu = await owner.get('/api/menu/costing');
    const s = sizeOf(menu.body, m.americano.id, 0);
    expect(s.currentPrice).toBe('2.65');
    expect(s.cost).toBe(AMERICANO_SMALL.toFixed(4));
    expect(s.marginPct).toBe(marginAt('2.65', AMERICANO_SMALL)); // (2.208333… − 0.46275) ÷ 2.208333… = 79.045… %
    expect((await owner.get('/api/price-list')).body).toMatchObject({ effectiveFrom: TODAY });
    const cancel = await owner.post(`/api/reprice/scheduled/${planned.id}/cancel`, {});
    expect(cancel.status).toBe(409);
    expect(cancel.body.error.message).toBe(`That price is already in force (from ${TODAY}): apply a new price instead.`);
    const history = await owner.get(`/api/drinks/${m.americano.id}/price-history`);
    expect(history.body.history[0]).toMatchObject({ newPrice: '2.65', status: 'applied', planned: false });

    // An apply today on the same drink first folds the plan into the menu price: old price 2.65.
    const res = await owner.post('/api/reprice/apply', { effectiveFrom: TODAY, prices: [{ drinkId: m.americano.id, size: `Large ${m.s}`, price: '3.05' }] });
    expect(res.status, JSON.stringify(res.body)).toBe(200);
    expect(await ctx.db('drink_sizes').where({ id }).first('price', 'price_version')).toEqual({ price: '2.6500', price_version: 0 });
    expect(await ctx.db('menu_price_history').where({ id: planned.id }).first('status', 'old_price')).toEqual({ status: 'applied', old_price: '2.5000' });
  });
});

test('the price list on a chosen date: prices in force then, "effective from", the next change; CSV too', async () => {
  const { owner, m } = await setUp();
  expect((await owner.post('/api/reprice/apply', { effectiveFrom: LATER, prices: [{ drinkId: m.latte.id, size: `Small ${m.s}`, price: '3.40' }] })).status).toBe(200);
  const now = await owner.get('/api/price-list');
  expect(now.body).toMatchObject({ date: TODAY, effectiveFrom: null, nextChangeFrom: LATER });
  const latte = (body: { drinks: { id: string; sizes: { price: string }[] }[] }) => body.drinks.find((d) => d.id === m.latte.id)!.sizes.map((s) => s.price);
  expect(latte(now.body)).toEqual(['3.10', '3.60']);
  const then = await owner.get(`/api/price-list?date=${LATER}`);
  expect(then.body).toMatchObject({ date: LATER, effectiveFrom: LATER, nextChangeFrom: null, generatedOn: TODAY });
  expect(latte(then.body)).toEqual(['3.40', '3.60']);
  expect((await owner.get('/api/price-list?date=2026-02-30')).status).toBe(400);

  const csv = await owner.get(`/api/price-list.csv?date=${LATER}`);
  expect(csv.status).toBe(200);
  expect(csv.headers['content-disposition']).toBe(`attachment; filename="price-list-${LATER}.csv"`);
  // Read back with csv-parse (an RFC 4180 reader from npm).
  const records = parse(csv.text, { columns: true }) as Record<string, string>[];
  expect(records.find((r) => r.drink === `Latte ${m.s}` && r.size === `Small ${m.s}`)).toMatchObject({ price: '3.40', effective_from: LATER });
  const today = parse((await owner.get('/api/price-list.csv')).text, { columns: true }) as Record<string, string>[];
  expect(today.find((r) => r.drink === `Latte ${m.s}` && r.size === `Small ${m.s}`)).toMatchObject({ price: '3.10', effective_from: '' });
});

test('the price history marks planned entries as planned, and cancelled ones as cancelled', async () => {
  const { owner, m } = await setUp();
  const apply = (effectiveFrom: string, price: string) => owner.post('/api/reprice/apply', { effectiveFrom, prices: [{ drinkId: m.teaDrink.id, size: `Small ${m.s}`, price }] });
  expect((await apply(TODAY, '2.30')).status).toBe(200);
  expect((await apply(LATER, '2.45')).status).toBe(200);
  expect((await apply(day(21), '2.60')).status).toBe(200);
  const scheduled = (await owner.get('/api/reprice/scheduled')).body.scheduled;
  expect((await owner.post(`/api/reprice/scheduled/${scheduled[1].id}/cancel`, {})).status).toBe(200);
  const h = await owner.get(`/api/drinks/${m.teaDrink.id}/price-history`);
  expect(h.body.history.map((x: { oldPrice: string; newPrice: string; effectiveFrom: string; status: string; planned: boolean }) => [x.oldPrice, x.newPrice, x.effectiveFrom, x.status, x.planned])).toEqual([
    ['2.45', '2.60', day(21), 'cancelled', false],
    ['2.30', '2.45', LATER, 'planned', true],
    ['2.20', '2.30', TODAY, 'applied', false],
  ]);
  expect(h.body.history[0].cancelledAt).toEqual(expect.any(String));
});
