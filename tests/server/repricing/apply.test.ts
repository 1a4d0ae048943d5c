import { afterAll, beforeAll, describe, expect, test } from 'vitest';
import { startTestApp, type TestContext } from '../../helpers/context';
import { makeBusiness, signIn, suffix, type Session } from '../../helpers/factories';
import { makeRepricingMenu } from './menu-fixture';

let ctx: TestContext;
beforeAll(async () => {
  ctx = await startTestApp();
});
afterAll(() => ctx.close());

async function setUp() {
  const biz = await makeBusiness(ctx.db);
  const owner = await signIn(ctx.app, biz.users.owner.email);
  const manager = await signIn(ctx.app, biz.users.manager.email);
  const m = await makeRepricingMenu(ctx.db, biz.businessId);
  return { biz, owner, manager, m };
}

const prices = async (db: TestContext['db'], ids: string[]) =>
  Object.fromEntries((await db('drink_sizes').whereIn('id', ids).select('id', 'price', 'price_version')).map((r) => [r.id, [r.price, r.price_version]]));

async function preview(s: Session, ingredientId: string, extra: object = {}) {
  const res = await s.post('/api/reprice/preview', { changes: [{ ingredientId, newPrice: '10.69' }], ...extra });
  expect(res.status, JSON.stringify(res.body)).toBe(200);
  return res.body;
}

test('applies the prices with exact history rows: old, new, effective date, who, why', async () => {
  const { biz, owner, m } = await setUp();
  const body = await preview(owner, m.milk.id);
  const [small, large] = m.latte.drinkSizeIds;
  const rowSmall = body.rows.find((r: { drinkSizeId: string }) => r.drinkSizeId === small);
  const res = await owner.post('/api/reprice/apply', {
    effectiveFrom: '2026-11-23',
    prices: [
      { drinkId: m.latte.id, size: `Small ${m.s}`, price: '3.20', priceVersion: rowSmall.priceVersion },
      { drinkId: m.latte.id, size: `Large ${m.s}`, price: '3.60' }, // the same price: kept, no history row
    ],
  });
  expect(res.status, JSON.stringify(res.body)).toBe(200);
  expect(res.body.applied).toEqual([{ drinkId: m.latte.id, drinkName: `Latte ${m.s}`, drinkSizeId: small, size: `Small ${m.s}`, oldPrice: '3.10', newPrice: '3.20', priceVersion: 1, effectiveFrom: '2026-11-23', planned: false }]);
  expect(await prices(ctx.db, [small, large])).toEqual({ [small]: ['3.2000', 1], [large]: ['3.6000', 0] });
  const history = await ctx.db('menu_price_history').where({ drink_size_id: small }).select('old_price', 'new_price', 'effective_from', 'reason', 'scenario_id', 'changed_by');
  expect(history).toEqual([{ old_price: '3.1000', new_price: '3.2000', effective_from: '2026-11-23', reason: 'Repricing', scenario_id: null, changed_by: biz.users.owner.id }]);

  const h = await owner.get(`/api/drinks/${m.latte.id}/price-history`);
  expect(h.status).toBe(200);
  expect(h.body.history).toEqual([expect.objectContaining({ size: `Small ${m.s}`, oldPrice: '3.10', newPrice: '3.20', effectiveFrom: '2026-11-23', reason: 'Repricing', changedBy: { id: biz.users.owner.id, name: `owner ${biz.users.owner.email.slice(6, 14)}` } })]);
});

test('all or nothing: a failure in the middle of the writes leaves every price and history as it was', async () => {
  const { owner, m } = await setUp();
  const ids = [...m.latte.drinkSizeIds, ...m.americano.drinkSizeIds];
  const before = await prices(ctx.db, ids);
  // A real PostgreSQL failure on the LAST row written, after three rows were updated. Rows are
  // written in lock order (drink id, then size position): the last is the later drink's Large.
  const fn = `fail_${suffix()}`;
  const failing = [m.latte, m.americano].sort((a, b) => (a.id < b.id ? -1 : 1))[1].drinkSizeIds[1];
  await ctx.db.raw(`create function ${fn}() returns trigger language plpgsql as $$ begin if new.id = '${failing}' then raise exception 'disk full (test)'; end if; return new; end $$`);
  await ctx.db.raw(`create trigger ${fn} before update on drink_sizes for each row execute function ${fn}()`);
  try {
    const res = await owner.post('/api/reprice/apply', {
      effectiveFrom: '2026-11-23',
      prices: [
        { drinkId: m.latte.id, size: `Small ${m.s}`, price: '3.30' },
        { drinkId: m.latte.id, size: `Large ${m.s}`, price: '3.80' },
        { drinkId: m.americano.id, size: `Small ${m.s}`, price: '2.70' },
        { drinkId: m.americano.id, size: `Large ${m.s}`, price: '3.10' },
      ],
    });
    expect(res.status).toBe(500);
  } finally {
    await ctx.db.raw(`drop trigger ${fn} on drink_sizes`);
    await ctx.db.raw(`drop function ${fn}()`);
  }
  expect(await prices(ctx.db, ids)).toEqual(before);
  expect(await ctx.db('menu_price_history').whereIn('drink_size_id', ids).count('* as n').first()).toEqual({ n: '0' });
});

test('a refused row refuses the whole apply (400 naming it) and writes nothing', async () => {
  const { owner, m } = await setUp();
  const before = await prices(ctx.db, m.latte.drinkSizeIds);
  const res = await owner.post('/api/reprice/apply', {
    effectiveFrom: '2026-11-23',
    prices: [
      { drinkId: m.latte.id, size: `Small ${m.s}`, price: '3.30' },
      { drinkId: m.teaDrink.id, size: `Large ${m.s}`, price: '2.40' },
      { drinkId: m.latte.id, size: `Large ${m.s}`, price: '3.805' },
    ],
  });
  expect(res.status).toBe(400);
  expect(res.body.error.fields).toEqual({ 'prices[2].price': 'Enter the price to 2 decimal places at most (GBP).' });
  const res2 = await owner.post('/api/reprice/apply', { effectiveFrom: '2026-11-23', prices: [{ drinkId: m.latte.id, size: `Small ${m.s}`, price: '3.30' }, { drinkId: m.teaDrink.id, size: `Large ${m.s}`, price: '2.40' }] });
  expect(res2.status).toBe(400);
  expect(res2.body.error.fields).toEqual({ 'prices[1].size': `That drink is not offered in "Large ${m.s}".` });
  expect(await prices(ctx.db, m.latte.drinkSizeIds)).toEqual(before);
});

describe('two people applying at once', () => {
  test('the second gets 409 with a message, and the first one’s prices stand', async () => {
    const { owner, manager, m } = await setUp();
    const seenByOwner = await preview(owner, m.milk.id);
    const seenByManager = await preview(manager, m.milk.id);
    const body = (seen: typeof seenByOwner, price: string) => ({
      effectiveFrom: '2026-11-23',
      prices: seen.rows.filter((r: { drinkId: string }) => r.drinkId === m.latte.id).map((r: { drinkId: string; size: string; priceVersion: number }) => ({ drinkId: r.drinkId, size: r.size, price, priceVersion: r.priceVersion })),
    });
    // Sent together: the rows are locked, so one waits for the other and then sees the new versions.
    const [a, b] = await Promise.all([owner.post('/api/reprice/apply', body(seenByOwner, '3.95')), manager.post('/api/reprice/apply', body(seenByManager, '3.75'))]);
    const statuses = [a.status, b.status].sort();
    expect(statuses).toEqual([200, 409]);
    const loser = a.status === 409 ? a : b;
    const winnerPrice = a.status === 200 ? '3.9500' : '3.7500';
    expect(loser.body.error.code).toBe('price_changed');
    expect(loser.body.error.message).toMatch(/^Someone else changed prices of .* since you looked\. Nothing was applied/);
    expect(loser.body.error.message).toContain(`Latte ${m.s} (Small ${m.s})`);
    expect(loser.body.error.message).toContain(`Latte ${m.s} (Large ${m.s})`);
    const now = await prices(ctx.db, m.latte.drinkSizeIds);
    expect(Object.values(now)).toEqual([[winnerPrice, 1], [winnerPrice, 1]]);
    expect(await ctx.db('menu_price_history').whereIn('drink_size_id', m.latte.drinkSizeIds).count('* as n').first()).toEqual({ n: '2' });
  });

  test('a price edited in the drink editor after the preview also gives 409', async () => {
    const { owner, m } = await setUp();
    const seen = await preview(owner, m.milk.id);
    await ctx.db('drink_sizes').where({ id: m.foamBrew.drinkSizeIds[0] }).update({ price: '3.85', price_version: ctx.db.raw('price_version + 1') });
    const row = seen.rows.find((r: { drinkId: string }) => r.drinkId === m.foamBrew.id);
    const res = await owner.post('/api/reprice/apply', { effectiveFrom: '2026-11-23', prices: [{ drinkId: m.foamBrew.id, size: row.size, price: '4.00', priceVersion: row.priceVersion }] });
    expect(res.status).toBe(409);
    expect((await prices(ctx.db, m.foamBrew.drinkSizeIds))[m.foamBrew.drinkSizeIds[0]]).toEqual(['3.8500', 1]);
  });
});

describe('a tidy ladder', () => {
  test('every size moves by the largest change chosen, so the step between sizes stays', async () => {
    const { owner, m } = await setUp();
    // Latte: Small 3.10, Large 3.60, a step of 0.50. Small is typed up to 3.25 (+0.15), Large kept:
    // with the ladder, Large moves by the same 0.15 to 3.75 and the step stays 0.50.
    const body = await preview(owner, m.milk.id, { decisions: [{ drinkSizeId: m.latte.drinkSizeIds[0], choice: 'price', price: '3.25' }], keepLadder: true });
    const row = (id: string) => body.rows.find((r: { drinkSizeId: string }) => r.drinkSizeId === id);
    expect(row(m.latte.drinkSizeIds[0]).newPrice).toBe('3.25');
    expect(row(m.latte.drinkSizeIds[1]).newPrice).toBe('3.75');
    expect(body.prices.map((p: { size: string; price: string }) => [p.size, p.price]).sort()).toEqual([[`Large ${m.s}`, '3.75'], [`Small ${m.s}`, '3.25']]);
    // Without the ladder only Small moves.
    const plain = await preview(owner, m.milk.id, { decisions: [{ drinkSizeId: m.latte.drinkSizeIds[0], choice: 'price', price: '3.25' }] });
    expect(plain.prices.map((p: { size: string; price: string }) => [p.size, p.price])).toEqual([[`Small ${m.s}`, '3.25']]);
    // The largest change wins: Small +0.15 and Large +0.30 → both +0.30 (3.40 and 3.90).
    const both = await preview(owner, m.milk.id, {
      decisions: [{ drinkSizeId: m.latte.drinkSizeIds[0], choice: 'price', price: '3.25' }, { drinkSizeId: m.latte.drinkSizeIds[1], choice: 'price', price: '3.90' }],
      keepLadder: true,
    });
    expect(both.prices.map((p: { size: string; price: string }) => [p.size, p.price]).sort()).toEqual([[`Large ${m.s}`, '3.90'], [`Small ${m.s}`, '3.40']]);
    // The apply with keepLadder does the same from the Small price alone.
    const res = await owner.post('/api/reprice/apply', { effectiveFrom: '2026-11-23', keepLadder: true, prices: [{ drinkId: m.latte.id, size: `Small ${m.s}`, price: '3.25' }] });
    expect(res.status, JSON.stringify(res.body)).toBe(200);
    expect(res.body.applied.map((a: { size: string; newPrice: string }) => [a.size, a.newPrice])).toEqual([
      [`Small ${m.s}`, '3.25'],
      [`Large ${m.s}`, '3.75'],
    ]);
  });
});

test('applying a saved scenario marks it applied, names it in the history, and uses its snapshot for the version check', async () => {
  const { owner, m } = await setUp();
  const save = await owner.post('/api/reprice/scenarios', {
    name: `Pass it on ${m.s}`,
    changes: [{ ingredientId: m.milk.id, newPrice: '10.69' }],
    decisions: [{ drinkSizeId: m.foamBrew.drinkSizeIds[0], choice: 'price', price: '3.95' }],
  });
  expect(save.status, JSON.stringify(save.body)).toBe(201);
  const id = save.body.scenario.id;
  expect(save.body.impact.prices).toEqual([expect.objectContaining({ drinkId: m.foamBrew.id, oldPrice: '3.80', price: '3.95' })]);
  // Someone changes that price after the scenario was saved: applying it is refused.
  await ctx.db('drink_sizes').where({ id: m.foamBrew.drinkSizeIds[0] }).update({ price_version: ctx.db.raw('price_version + 1') });
  const stale = await owner.post('/api/reprice/apply', { effectiveFrom: '2026-11-23', scenarioId: id, prices: [{ drinkId: m.foamBrew.id, size: `Small ${m.s}`, price: '3.95' }] });
  expect(stale.status).toBe(409);
  // Saved again, it applies.
  const resave = await owner.put(`/api/reprice/scenarios/${id}`, { name: `Pass it on ${m.s}`, changes: [{ ingredientId: m.milk.id, newPrice: '10.69' }], decisions: [{ drinkSizeId: m.foamBrew.drinkSizeIds[0], choice: 'price', price: '3.95' }] });
  expect(resave.status).toBe(200);
  const ok = await owner.post('/api/reprice/apply', { effectiveFrom: '2026-11-23', scenarioId: id, prices: [{ drinkId: m.foamBrew.id, size: `Small ${m.s}`, price: '3.95' }] });
  expect(ok.status, JSON.stringify(ok.body)).toBe(200);
  const h = await ctx.db('menu_price_history').where({ drink_size_id: m.foamBrew.drinkSizeIds[0] }).first('scenario_id', 'reason');
  expect(h).toEqual({ scenario_id: id, reason: `Repricing: Pass it on ${m.s}` });
  const again = await owner.post('/api/reprice/apply', { effectiveFrom: '2026-11-23', scenarioId: id, prices: [{ drinkId: m.foamBrew.id, size: `Small ${m.s}`, price: '3.95' }] });
  expect(again.status).toBe(409);
  expect(again.body.error.code).toBe('already_applied');
  const got = await owner.get(`/api/reprice/scenarios/${id}`);
  expect(got.body.scenario).toMatchObject({ status: 'applied', effectiveFrom: '2026-11-23' });
});
