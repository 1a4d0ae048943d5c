import { afterAll, beforeAll, describe, expect, test } from 'vitest';
import { costPreview, type CostPreviewRequest, type LineInput } from '../../../src/shared/costing';
import { startTestApp, type TestContext } from '../../helpers/context';
import { makeBusiness, signIn, type Session } from '../../helpers/factories';
import { makeDocumentedDrink } from '../../helpers/costing-factories';
import { makeRepricingMenu } from './menu-fixture';

let ctx: TestContext;

beforeAll(async () => {
  ctx = await startTestApp();
});
afterAll(() => ctx.close());

async function ownerOfNewBusiness() {
  const biz = await makeBusiness(ctx.db);
  return { biz, owner: await signIn(ctx.app, biz.users.owner.email) };
}

const POLICY = { targetMarginPct: '72', taxMode: 'inclusive', taxRatePct: '20', priceStep: '0.05', rounding: 'up' } as const;

/**
 * The same menu written as a costing-engine request by hand (keys instead of row ids), with the
 * milk pack at `milkPrice`: the independent reference for the impact's figures.
 */
function engineRequest(milkPrice: string, sizes: { name: string; currentPrice: string; lines: LineInput[] }[]): CostPreviewRequest {
  return {
    currency: 'GBP',
    policy: POLICY,
    ingredients: [
      { key: 'milk', baseUnit: 'ml', densityGPerMl: '1.03', yieldPct: '92', pack: { count: '6', quantity: '2', unit: 'l', price: milkPrice }, allergens: ['milk'] },
      { key: 'beans', baseUnit: 'g', yieldPct: '96', pack: { quantity: '1', unit: 'kg', price: '21.40' }, measures: { shot: { quantity: '9', unit: 'g' } } },
      { key: 'sugar', baseUnit: 'g', pack: { count: '10', quantity: '1', unit: 'kg', price: '11.90' } },
      { key: 'cup', baseUnit: 'each', pack: { count: '50', quantity: '20', unit: 'each', price: '61.50' } },
    ],
    preparations: [
      { key: 'sweet-cream', yield: { quantity: '0.6', unit: 'l' }, lines: [{ item: 'milk', quantity: '500', unit: 'ml' }, { item: 'sugar', quantity: '100', unit: 'g' }] },
      { key: 'foam', yield: { quantity: '0.5', unit: 'l' }, lines: [{ item: 'sweet-cream', quantity: '400', unit: 'ml' }, { item: 'sugar', quantity: '20', unit: 'g' }] },
    ],
    sizes,
  };
}

const REFERENCE_SIZES = [
  { name: 'Latte Small', currentPrice: '3.10', lines: [{ item: 'beans', quantity: '1', unit: 'shot' }, { item: 'milk', quantity: '200', unit: 'ml' }, { item: 'cup', quantity: '1', unit: 'each' }] },
  { name: 'Latte Large', currentPrice: '3.60', lines: [{ item: 'beans', quantity: '2', unit: 'shot' }, { item: 'milk', quantity: '380', unit: 'ml' }, { item: 'cup', quantity: '1', unit: 'each' }] },
  { name: 'Foam brew Small', currentPrice: '3.80', lines: [{ item: 'beans', quantity: '18', unit: 'g' }, { item: 'foam', quantity: '60', unit: 'ml' }, { item: 'cup', quantity: '1', unit: 'each' }] },
];

describe('the impact of a milk price rise', () => {
  let m: Awaited<ReturnType<typeof makeRepricingMenu>>;
  let owner: Session;
  let body: Record<string, any>; // eslint-disable-line @typescript-eslint/no-explicit-any

  beforeAll(async () => {
    const o = await ownerOfNewBusiness();
    owner = o.owner;
    m = await makeRepricingMenu(ctx.db, o.biz.businessId);
    const res = await owner.post('/api/reprice/preview', { changes: [{ ingredientId: m.milk.id, newPrice: '10.69' }] });
    expect(res.status, JSON.stringify(res.body)).toBe(200);
    body = res.body;
  });

  test('finds every drink size that uses milk, directly or two preparations deep, and no other', () => {
    const found = body.rows.map((r: { drinkId: string; size: string }) => `${r.drinkId}|${r.size}`).sort();
    expect(found).toEqual([`${m.latte.id}|Small ${m.s}`, `${m.latte.id}|Large ${m.s}`, `${m.foamBrew.id}|Small ${m.s}`].sort());
    const foam = body.rows.find((r: { drinkId: string }) => r.drinkId === m.foamBrew.id);
    expect(foam.via).toEqual(['preparation']);
    expect(foam.through).toEqual([`Vanilla foam ${m.s}`]);
    expect(foam.ingredients).toEqual([`Milk ${m.s}`]);
    expect(body.rows.find((r: { drinkId: string }) => r.drinkId === m.latte.id).via).toEqual(['direct']);
  });

  test('finds the modifiers that use milk (an add-on and a swap) and not the extra shot', () => {
    expect(body.modifiers.map((x: { modifierId: string }) => x.modifierId).sort()).toEqual([m.splash, m.oatSwap].sort());
    // Splash: 30 ml of milk. Unit cost before = 9.90 ÷ 12000 ml ÷ 0.92; after = 10.69 ÷ 12000 ÷ 0.92.
    // 30 × 9.90 ÷ 11040 = 0.0269021… → 0.0269; 30 × 10.69 ÷ 11040 = 0.0290489… → 0.0290.
    const splash = body.modifiers.find((x: { modifierId: string }) => x.modifierId === m.splash);
    expect([splash.oldCostDelta, splash.newCostDelta]).toEqual(['0.0269', '0.0290']);
    // Oat swap: + 200 ml oat (14.40 ÷ 6000 = 0.0024/ml → 0.48) − 200 ml milk (1980 ÷ 11040 = 0.17935 → 0.2138 after).
    const swap = body.modifiers.find((x: { modifierId: string }) => x.modifierId === m.oatSwap);
    expect(swap.oldCostDelta).toBe('0.3007'); // 0.48 − 0.1793478… = 0.3006521…
    expect(swap.newCostDelta).toBe('0.2863'); // 0.48 − 0.1936594… = 0.2863405…
  });

  test("every figure equals the costing engine's, costed independently from a hand-written request", () => {
    const before = costPreview(engineRequest('9.90', REFERENCE_SIZES));
    const after = costPreview(engineRequest('10.69', REFERENCE_SIZES));
    const rowFor = (name: string) => {
      const [drink, size] = name.split(' ').length === 2 ? name.split(' ') : ['Foam brew', 'Small'];
      const id = drink === 'Latte' ? m.latte.id : m.foamBrew.id;
      return body.rows.find((r: { drinkId: string; size: string }) => r.drinkId === id && r.size === `${size} ${m.s}`);
    };
    REFERENCE_SIZES.forEach((ref, i) => {
      const row = rowFor(ref.name);
      expect(row.oldCost).toBe(before.sizes[i].cost);
      expect(row.newCost).toBe(after.sizes[i].cost);
      expect(row.currentPrice).toBe(ref.currentPrice);
      expect(row.oldMarginPct).toBe(before.sizes[i].atCurrent?.marginPct);
      expect(row.newMarginPct).toBe(after.sizes[i].atCurrent?.marginPct);
      expect(row.suggestedPrice).toBe(after.sizes[i].suggestedPrice);
      expect(row.belowTarget).toBe(Number(after.sizes[i].atCurrent?.marginPct) < 72);
    });
  });

  test('rows are sorted by margin lost, largest first', () => {
    const lost = body.rows.map((r: { marginLostPct: string }) => Number(r.marginLostPct));
    expect(lost).toEqual([...lost].sort((a, b) => b - a));
    expect(lost[0]).toBeGreaterThan(0);
  });

  test('nothing is saved: the menu costing is unchanged', async () => {
    const menu = await owner.get('/api/menu/costing');
    const latte = menu.body.drinks.find((d: { id: string }) => d.id === m.latte.id);
    const before = costPreview(engineRequest('9.90', REFERENCE_SIZES));
    expect(latte.sizes.map((s: { cost: string }) => s.cost)).toEqual([before.sizes[0].cost, before.sizes[1].cost]);
  });
});

test('worked example: a rise in the milk pack, by hand, step by step', async () => {
  const { biz, owner } = await ownerOfNewBusiness();
  const d = await makeDocumentedDrink(ctx.db, biz.businessId);
  // The documented drink (issue 3): 2 shots (18 g) of beans, 260 ml milk, 2 pumps (15 ml) of
  // house syrup, one cup; priced 3.45 with 20 % VAT included; target margin 72 %, step 0.05 up.
  // The milk pack (6 × 2 l, yield 92 %) goes from 9.90 to 10.69 (about +8 %).
  //
  // Step 1, milk usable unit cost = price ÷ (count × quantity in ml) ÷ (yield ÷ 100)
  //   before: 9.90 ÷ 12000 ÷ 0.92 = 0.000896739130434782… per ml
  //   after: 10.69 ÷ 12000 ÷ 0.92 = 0.000968297101449275… per ml
  // Step 2, milk line = 260 ml × unit cost
  //   before: 0.233152173913043478…   after: 0.251757246376811594…
  // Step 3, the other lines do not change:
  //   beans 18 g × 21.40 ÷ 1000 g ÷ 0.96 = 0.40125
  //   syrup: 1 kg sugar at 11.90 ÷ 10 = 1.19 per batch of 1250 ml → 0.000952 per ml × 15 ml = 0.01428
  //   cup: 61.50 ÷ 1000 = 0.0615
  // Step 4, cost per cup = the sum of the unrounded lines
  //   before: 0.40125 + 0.233152173913… + 0.01428 + 0.0615 = 0.710182173913… → "0.7102" (as documented)
  //   after:  0.40125 + 0.251757246376… + 0.01428 + 0.0615 = 0.728787246376… → "0.7288"
  // Step 5, change = 0.018605072463… → "0.0186"; as % of before: 0.018605… ÷ 0.710182… × 100 = 2.6197… → "2.62"
  // Step 6, margin at 3.45: net = 3.45 ÷ 1.2 = 2.875
  //   before (2.875 − 0.710182…) ÷ 2.875 × 100 = 75.2980… → "75.30"
  //   after  (2.875 − 0.728787…) ÷ 2.875 × 100 = 74.6508… → "74.65"; still above 72: not below target
  //   lost: 75.298011… − 74.650878… = 0.647132… → "0.65" points
  // Step 7, suggested price = 0.728787… × 1.2 ÷ (1 − 0.72) = 3.123373…, up to the next 0.05 → "3.15"
  const res = await owner.post('/api/reprice/preview', { changes: [{ ingredientId: d.milk.id, newPrice: '10.69' }] });
  expect(res.status, JSON.stringify(res.body)).toBe(200);
  expect(res.body.rows).toHaveLength(1);
  expect(res.body.rows[0]).toMatchObject({
    drinkId: d.drink.id,
    oldCost: '0.7102',
    newCost: '0.7288',
    costChange: '0.0186',
    costChangePct: '2.62',
    currentPrice: '3.45',
    oldMarginPct: '75.30',
    newMarginPct: '74.65',
    marginLostPct: '0.65',
    belowTarget: false,
    suggestedPrice: '3.15',
  });
  expect(res.body.changes).toEqual([expect.objectContaining({ ingredientId: d.milk.id, oldPrice: '9.90', newPrice: '10.69', changePct: '7.98', oldUnitCost: '0.0009', newUnitCost: '0.0010', source: 'typed' })]);
});

describe('effective dates of pack prices', () => {
  test("a future-dated pack price does not change today's cost; previewing at its date does", async () => {
    const { biz, owner } = await ownerOfNewBusiness();
    const d = await makeDocumentedDrink(ctx.db, biz.businessId);
    const future = new Date(Date.now() + 7 * 86400_000).toISOString().slice(0, 10);
    const packId = d.milk.packId as string;
    const add = await owner.post(`/api/packs/${packId}/prices`, { price: '10.69', effectiveFrom: future });
    expect(add.status, JSON.stringify(add.body)).toBe(201);

    const today = await owner.get(`/api/drinks/${d.drink.id}/costing`);
    expect(today.body.sizes[0].cost).toBe('0.7102');

    const planned = await owner.get('/api/reprice/planned');
    expect(planned.body.planned).toEqual([expect.objectContaining({ ingredientId: d.milk.id, packId, currentPrice: '9.90', price: '10.69', effectiveFrom: future, isCostingPack: true })]);

    const atDate = await owner.post('/api/reprice/preview', { changes: [], asOf: future });
    expect(atDate.status, JSON.stringify(atDate.body)).toBe(200);
    expect(atDate.body.changes).toEqual([expect.objectContaining({ ingredientId: d.milk.id, oldPrice: '9.90', newPrice: '10.69', source: 'planned' })]);
    expect(atDate.body.rows[0]).toMatchObject({ oldCost: '0.7102', newCost: '0.7288' });

    // Today with nothing typed: nothing changes.
    const none = await owner.post('/api/reprice/preview', { changes: [{ ingredientId: d.milk.id, newPrice: '9.90' }] });
    expect(none.body.rows[0]).toMatchObject({ oldCost: '0.7102', newCost: '0.7102', costChange: '0.0000' });
  });
});

describe('money impact per week and month', () => {
  test('from till sales of the last 4 weeks when known, else the expected cups a week shared among sizes', async () => {
    const { biz, owner } = await ownerOfNewBusiness();
    const m = await makeRepricingMenu(ctx.db, biz.businessId);
    // Latte: 80 Small and 40 Large sold over the last 4 weeks → 20 and 10 a week.
    const [smallDs, largeDs] = m.latte.drinkSizeIds;
    const day = (n: number) => new Date(Date.now() - n * 86400_000).toISOString().slice(0, 10);
    await ctx.db('sales_lines').insert([
      { business_id: biz.businessId, site_id: biz.siteIds[0], sold_on: day(3), drink_size_id: smallDs, quantity: '50', net_sales: '129.17' },
      { business_id: biz.businessId, site_id: biz.siteIds[1], sold_on: day(20), drink_size_id: smallDs, quantity: '30', net_sales: '77.50' },
      { business_id: biz.businessId, site_id: biz.siteIds[0], sold_on: day(10), drink_size_id: largeDs, quantity: '40', net_sales: '120.00' },
      // Older than 4 weeks: not counted.
      { business_id: biz.businessId, site_id: biz.siteIds[0], sold_on: day(40), drink_size_id: largeDs, quantity: '999', net_sales: '1.00' },
    ]);
    // Foam brew has no sales: the owner expects 14 a week (one size → 14).
    await ctx.db('drinks').where({ id: m.foamBrew.id }).update({ expected_weekly_cups: 14 });
    const res = await owner.post('/api/reprice/preview', { changes: [{ ingredientId: m.milk.id, newPrice: '10.69' }] });
    expect(res.status).toBe(200);
    const row = (id: string) => res.body.rows.find((r: { drinkSizeId: string }) => r.drinkSizeId === id);
    expect(row(smallDs)).toMatchObject({ weeklyCups: '20', cupsSource: 'sales' });
    expect(row(largeDs)).toMatchObject({ weeklyCups: '10', cupsSource: 'sales' });
    expect(row(m.foamBrew.drinkSizeIds[0])).toMatchObject({ weeklyCups: '14', cupsSource: 'expected' });
    // Latte Small: 200 ml × (10.69 − 9.90) ÷ 11040 = 0.0143115942… a cup; × 20 = 0.286231… → 0.29 a week.
    expect(row(smallDs).weeklyCostIncrease).toBe('0.29');
    // × 52 ÷ 12 = 1.24033… → 1.24 a month.
    expect(row(smallDs).monthlyCostIncrease).toBe('1.24');
    // Total: Small 0.286231884 + Large (380 × 0.79 ÷ 11040 × 10 = 0.271920290) +
    // Foam (60 ml foam: 400 ml sweet cream per 500 ml, 500 ml milk per 600 ml → 60 × 0.8 × 500/600 = 40 ml milk;
    //   40 × 0.79 ÷ 11040 = 0.002862319 × 14 = 0.040072464) = 0.598224638 → 0.60
    expect(res.body.totals).toMatchObject({ rows: 3, rowsWithCups: 3, weeklyCostIncrease: '0.60', monthlyCostIncrease: '2.59' });
    // Keeping every price, the profit falls by exactly the cost rise.
    expect(res.body.totals.weeklyProfitChange).toBe('-0.60');
  });
});

describe('refusals', () => {
  test('an unknown ingredient, a bad price, nothing to preview, and the roles', async () => {
    const { biz, owner } = await ownerOfNewBusiness();
    const other = await makeBusiness(ctx.db);
    const theirs = await makeRepricingMenu(ctx.db, other.businessId);
    const r1 = await owner.post('/api/reprice/preview', { changes: [{ ingredientId: theirs.milk.id, newPrice: '10' }] });
    expect(r1.status).toBe(400);
    expect(r1.body.error.fields).toEqual({ 'changes[0].ingredientId': 'That ingredient was not found.' });
    const r2 = await owner.post('/api/reprice/preview', { changes: [{ ingredientId: theirs.milk.id, newPrice: '1e3' }] });
    expect(r2.status).toBe(400);
    expect(Object.keys(r2.body.error.fields)).toEqual(['changes[0].newPrice']);
    const r3 = await owner.post('/api/reprice/preview', { changes: [] });
    expect(r3.status).toBe(400);
    expect(Object.keys(r3.body.error.fields)).toEqual(['changes']);
    const barista = await signIn(ctx.app, biz.users.barista.email);
    expect((await barista.post('/api/reprice/preview', { changes: [] })).status).toBe(403);
    const bookkeeper = await signIn(ctx.app, biz.users.bookkeeper.email);
    const mine = await makeRepricingMenu(ctx.db, biz.businessId);
    expect((await bookkeeper.post('/api/reprice/preview', { changes: [{ ingredientId: mine.milk.id, newPrice: '10' }] })).status).toBe(200);
  });
});
