import { afterAll, beforeAll, expect, test } from 'vitest';
import { startTestApp, type TestContext } from '../../helpers/context';
import { makeBusiness, signIn } from '../../helpers/factories';
import { makeDrink, makeIngredient, makeSize } from '../../helpers/costing-factories';

let ctx: TestContext;
beforeAll(async () => {
  ctx = await startTestApp();
});
afterAll(() => ctx.close());

test('a barista reads what waste can be recorded against, with no cost, and records it', async () => {
  const biz = await makeBusiness(ctx.db);
  const milk = await makeIngredient(ctx.db, biz.businessId, { name: 'Whole milk', baseUnit: 'ml', pack: { quantity: '2', unit: 'l', price: '2.40' } });
  const size = await makeSize(ctx.db, biz.businessId, { name: 'Regular' });
  await makeDrink(ctx.db, biz.businessId, { name: 'Flat white', sizes: [{ sizeId: size, price: '3.20', lines: [{ ingredientId: milk.id, quantity: '150', unit: 'ml' }] }] });
  const barista = await signIn(ctx.app, biz.users.barista.email);
  const res = await barista.get('/api/waste/choices');
  expect(res.status).toBe(200);
  expect(res.body.choices).toEqual([
    { kind: 'ingredient', id: milk.id, name: 'Whole milk', baseUnit: 'ml' },
    { kind: 'drinkSize', id: expect.any(String), name: 'Flat white (Regular)' },
  ]);
  expect(JSON.stringify(res.body)).not.toMatch(/cost|price/i);
  const rec = await barista.post('/api/waste', { siteId: biz.siteIds[0], occurredOn: '2026-11-20', item: { kind: 'ingredient', id: milk.id }, quantity: '250', unit: 'ml', reason: 'Spilled or dropped' });
  expect(rec.status).toBe(201);
  // The barista's list shows what was wasted and why, and no money at all.
  const list = await barista.get(`/api/waste?month=2026-11&siteId=${biz.siteIds[0]}`);
  expect(list.body.entries).toHaveLength(1);
  expect(list.body.entries[0]).toMatchObject({ quantity: '250', unit: 'ml', reason: 'Spilled or dropped', item: { name: 'Whole milk' } });
  expect(Object.keys(list.body).sort()).toEqual(['currency', 'entries', 'month']);
  expect(Object.keys(list.body.entries[0])).not.toContain('value');
  // The owner's shows its value: 2.40 for 2000 ml at 100 % yield → 0.0012 a ml; 250 ml → 0.30.
  const owner = await signIn(ctx.app, biz.users.owner.email);
  const valued = await owner.get(`/api/waste?month=2026-11&siteId=${biz.siteIds[0]}`);
  expect(valued.body.entries[0].value).toBe('0.30');
  expect(valued.body.total).toBe('0.30');
});
