import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { parse } from 'csv-parse/sync';
import { D } from '../../../src/shared/decimal';
import { startTestApp, type TestContext } from '../../helpers/context';
import { signIn, type Session } from '../../helpers/factories';
import { makeDrink, makeSize, makeSupplier } from '../../helpers/costing-factories';
import { makeBooksCafe, makeCount, makeDelivery, makeSales } from './scenario';

let ctx: TestContext;
beforeAll(async () => {
  ctx = await startTestApp();
});
afterAll(() => ctx.close());

type Cafe = Awaited<ReturnType<typeof makeBooksCafe>>;

/** October 2026 of the test café (figures worked out by hand in the test below). */
async function october(cafe: Cafe) {
  const { f, beans, milk, cups, latteSizeId } = cafe;
  const [a, b] = f.siteIds;
  const db = ctx.db;
  await makeCount(db, f, a, '2026-09-15', [{ packId: beans.packId!, packs: '99' }]); // older: not the opening
  await makeCount(db, f, a, '2026-09-30', [{ packId: beans.packId!, packs: '3.5' }, { packId: milk.packId!, packs: '10' }]);
  await makeCount(db, f, a, '2026-10-31', [{ packId: beans.packId!, packs: '2.25' }, { packId: milk.packId!, packs: '8' }]);
  await makeCount(db, f, a, '2026-10-31', [{ packId: beans.packId!, packs: '500' }], 'open'); // unfinished: ignored
  await makeDelivery(db, f, { siteId: a, supplierId: cafe.supplierId, receivedOn: '2026-10-12', lines: [
    { packId: beans.packId!, quantity: '5', unitPrice: '20', net: '100.00' },
    { packId: milk.packId!, quantity: '40', unitPrice: '1.2', net: '48.00' },
    { packId: cups.packId!, quantity: '3', unitPrice: '5', net: '15.00', tax: '3.00' },
  ] });
  await makeDelivery(db, f, { siteId: a, supplierId: cafe.supplierId, receivedOn: '2026-11-01', lines: [{ packId: beans.packId!, quantity: '9', unitPrice: '24', net: '216.00' }] });
  await makeSales(db, f, a, [
    { soldOn: '2026-10-05', drinkSizeId: latteSizeId, quantity: '100', netSales: '300.00' },
    { soldOn: '2026-10-15', drinkSizeId: latteSizeId, quantity: '10', netSales: '30.00' },
    { soldOn: '2026-10-16', drinkSizeId: latteSizeId, quantity: '10', netSales: '30.00' },
    { soldOn: '2026-10-20', drinkSizeId: latteSizeId, quantity: '50', netSales: '150.00' },
    { soldOn: '2026-09-30', drinkSizeId: latteSizeId, quantity: '1000', netSales: '3000.00' }, // not October
  ]);
  await makeSales(db, f, b, [{ soldOn: '2026-10-10', drinkSizeId: latteSizeId, quantity: '20', netSales: '60.00' }]);
  await db('waste_entries').insert([
    { business_id: f.businessId, site_id: a, occurred_on: '2026-10-21', ingredient_id: milk.id, quantity: '1000', unit: 'ml', reason: 'Soured' },
    { business_id: f.businessId, site_id: a, occurred_on: '2026-10-21', drink_size_id: latteSizeId, quantity: '2', reason: 'Remade' },
  ]);
}

function checkArithmetic(body: { rows: Record<string, string | null>[]; totals: Record<string, string | null> }) {
  const sum = (k: string) => body.rows.reduce((s, r) => s.plus(r[k] as string), new D(0)).toFixed(2);
  for (const r of body.rows) {
    expect(new D(r.opening as string).plus(r.purchases as string).minus(r.closing as string).toFixed(2)).toBe(r.actual);
    expect(new D(r.actual as string).minus(r.theoretical as string).toFixed(2)).toBe(r.variance);
  }
  for (const k of ['opening', 'purchases', 'closing', 'actual', 'theoretical', 'variance', 'waste']) expect(body.totals[k]).toBe(sum(k));
}

describe('monthly cost of goods', () => {
  let cafe: Cafe;
  let keeper: Session;
  beforeAll(async () => {
    cafe = await makeBooksCafe(ctx.db);
    await october(cafe);
    keeper = await signIn(ctx.app, cafe.f.users.bookkeeper.email);
  });

  it('recomputes every figure of a site independently', async () => {
    const res = await keeper.get(`/api/reports/cogs?month=2026-10&siteId=${cafe.f.siteIds[0]}`);
    expect(res.status, JSON.stringify(res.body)).toBe(200);
    // Worked out by hand from the scenario's prices:
    // latte before the 16th: coffee 18 g × 0.02 = 0.36, dairy 250 ml × 0.0012 = 0.30,
    // syrup pump 10 ml of a 2.50 batch of 1250 ml = 0.02 (other 2.00/2.50 → 0.016, syrup-sauce 0.004), cup 0.10;
    // from the 16th coffee 18 × 0.024 = 0.432. Cups: 110 before, 60 from the 16th.
    // coffee 110 × 0.36 + 60 × 0.432 = 65.52; dairy 170 × 0.30 = 51.00; other 2.72; syrup-sauce 0.68; packaging 17.00.
    // Opening (2026-09-30): beans 3.5 × 20 = 70.00, milk 10 × 1.20 = 12.00.
    // Closing (2026-10-31): beans 2.25 × 24 = 54.00, milk 8 × 1.20 = 9.60.
    // Waste: 1000 ml milk = 1.20; 2 lattes on the 21st = coffee 0.864, dairy 0.60, other 0.032, syrup 0.008, cups 0.20.
    expect(res.body).toMatchObject({ month: '2026-10', siteId: cafe.f.siteIds[0], closed: false, currency: 'GBP' });
    expect(res.body.rows).toEqual([
      { category: 'coffee', opening: '70.00', purchases: '100.00', closing: '54.00', actual: '116.00', theoretical: '65.52', variance: '50.48', variancePct: '77.05', waste: '0.86' },
      { category: 'dairy', opening: '12.00', purchases: '48.00', closing: '9.60', actual: '50.40', theoretical: '51.00', variance: '-0.60', variancePct: '-1.18', waste: '1.80' },
      { category: 'other', opening: '0.00', purchases: '0.00', closing: '0.00', actual: '0.00', theoretical: '2.72', variance: '-2.72', variancePct: '-100.00', waste: '0.03' },
      { category: 'packaging', opening: '0.00', purchases: '15.00', closing: '0.00', actual: '15.00', theoretical: '17.00', variance: '-2.00', variancePct: '-11.76', waste: '0.20' },
      { category: 'syrup-sauce', opening: '0.00', purchases: '0.00', closing: '0.00', actual: '0.00', theoretical: '0.68', variance: '-0.68', variancePct: '-100.00', waste: '0.01' },
    ]);
    // 181.40 ÷ 510.00 = 35.568…%
    expect(res.body.totals).toEqual({
      opening: '82.00', purchases: '163.00', closing: '63.60', actual: '181.40', theoretical: '136.92', variance: '44.48', variancePct: '32.49', waste: '2.90', netSales: '510.00', cogsPctOfSales: '35.57',
    });
    checkArithmetic(res.body);
    expect(res.body.cups).toBe('170');
    expect(res.body.notes).toEqual([]);
  });

  it('adds the sites up when no site is given, and says which counts are missing', async () => {
    const res = await keeper.get('/api/reports/cogs?month=2026-10');
    expect(res.status).toBe(200);
    expect(res.body.siteId).toBeNull();
    // Site B sold 20 lattes on the 10th: + coffee 7.20, dairy 6.00, other 0.32, syrup 0.08, cups 2.00.
    expect(res.body.totals.theoretical).toBe('152.52');
    expect(res.body.totals.netSales).toBe('570.00');
    checkArithmetic(res.body);
    expect(res.body.notes.join(' ')).toMatch(/No finished count on or before 2026-09-30 for South/);
    expect(res.body.notes.join(' ')).toMatch(/No finished count dated 2026-10-31 for South/);
  });

  it('exports the same figures as CSV, totals row equal to the report', async () => {
    const site = cafe.f.siteIds[0];
    const json = await keeper.get(`/api/reports/cogs?month=2026-10&siteId=${site}`);
    const res = await keeper.get(`/api/reports/cogs.csv?month=2026-10&siteId=${site}`).buffer(true).parse((r, cb) => {
      let data = '';
      r.on('data', (c: Buffer) => (data += c.toString('utf8')));
      r.on('end', () => cb(null, data));
    });
    expect(res.status).toBe(200);
    expect(res.headers['content-type']).toMatch(/^text\/csv/);
    expect(res.headers['content-disposition']).toMatch(/attachment; filename="cost-of-goods_2026-10_north-[0-9a-f]{8}\.csv"/);
    const records = parse(res.body as string, { bom: true, columns: true }) as Record<string, string>[];
    const total = records.at(-1)!;
    expect(total.category).toBe('All categories');
    expect(total.actual_cost).toBe(json.body.totals.actual);
    expect(total.theoretical_cost).toBe(json.body.totals.theoretical);
    expect(total.net_sales).toBe(json.body.totals.netSales);
    expect(total.cost_pct_of_net_sales).toBe(json.body.totals.cogsPctOfSales);
    // A negative variance stays a number in the file (not neutralised as a formula).
    expect(records.find((r) => r.category === 'dairy')!.variance).toBe('-0.60');
  });

  it('neutralises cells that a spreadsheet would run as formulas (OWASP CSV injection)', async () => {
    const evil = await makeSupplier(ctx.db, cafe.biz, `=HYPERLINK("http://x.test","y") ${Date.now()}`);
    await makeDelivery(ctx.db, cafe.f, { siteId: cafe.f.siteIds[1], supplierId: evil, receivedOn: '2026-10-03', invoice: '@SUM(1+1)', paymentReference: '-2+3', lines: [{ packId: cafe.milk.packId!, quantity: '1', unitPrice: '1.2', net: '1.20', tax: '0' }] });
    const res = await keeper.get(`/api/reports/purchases.csv?month=2026-10&siteId=${cafe.f.siteIds[1]}`).buffer(true).parse((r, cb) => {
      let data = '';
      r.on('data', (c: Buffer) => (data += c.toString('utf8')));
      r.on('end', () => cb(null, data));
    });
    expect(res.status).toBe(200);
    const rows = parse(res.body as string, { bom: true, columns: true }) as Record<string, string>[];
    expect(rows).toHaveLength(1);
    expect(rows[0].supplier.startsWith(`'=HYPERLINK`)).toBe(true);
    expect(rows[0].supplier_invoice_number).toBe("'@SUM(1+1)");
    expect(rows[0].payment_reference).toBe("'-2+3");
    expect(rows[0]).toMatchObject({ date_received: '2026-10-03', net: '1.20', tax: '0.00', gross: '1.20' });
  });

  it('values a count for export at the price in force on its date', async () => {
    const count = (await ctx.db('stock_counts').where({ site_id: cafe.f.siteIds[0], count_date: '2026-10-31', status: 'finished' }).first('id')).id;
    const res = await keeper.get(`/api/reports/stock-valuation.csv?countId=${count}`).buffer(true).parse((r, cb) => {
      let data = '';
      r.on('data', (c: Buffer) => (data += c.toString('utf8')));
      r.on('end', () => cb(null, data));
    });
    const rows = parse(res.body as string, { bom: true, columns: true }) as Record<string, string>[];
    expect(rows.map((r) => [r.category, r.packs_counted, r.pack_price, r.value])).toEqual([
      ['coffee', '2.25', '24.00', '54.00'],
      ['dairy', '8', '1.20', '9.60'],
      ['', '', '', '63.60'],
    ]);
  });
});

describe('month-end close', () => {
  it('freezes the report, refuses changes in the month with 409, and records the reopening', async () => {
    const cafe = await makeBooksCafe(ctx.db);
    await october(cafe);
    const [keeper, owner, manager] = await Promise.all([
      signIn(ctx.app, cafe.f.users.bookkeeper.email), signIn(ctx.app, cafe.f.users.owner.email), signIn(ctx.app, cafe.f.users.manager.email),
    ]);
    const site = cafe.f.siteIds[0];
    const before = await keeper.get(`/api/reports/cogs?month=2026-10&siteId=${site}`);

    expect((await manager.post('/api/periods/2026-10/close')).status).toBe(403);
    const closed = await keeper.post('/api/periods/2026-10/close', { reason: 'Month end' });
    expect(closed.status, JSON.stringify(closed.body)).toBe(200);
    expect(closed.body.period).toMatchObject({ month: '2026-10', status: 'closed' });
    expect((await keeper.post('/api/periods/2026-10/close')).status).toBe(409);
    expect((await keeper.post('/api/periods/2999-01/close')).body.error.code).toBe('month_not_over');

    // A back-dated price and a menu change would move a live report: the closed one stays.
    await ctx.db('pack_prices').insert({ business_id: cafe.biz, pack_id: cafe.milk.packId, price: '2.40', effective_from: '2026-10-01' });
    const after = await keeper.get(`/api/reports/cogs?month=2026-10&siteId=${site}`);
    expect(after.body.closed).toBe(true);
    expect(after.body.rows).toEqual(before.body.rows);
    expect(after.body.totals).toEqual(before.body.totals);

    const refusals = [
      await keeper.post('/api/waste', { siteId: site, occurredOn: '2026-10-20', item: { kind: 'ingredient', id: cafe.milk.id }, quantity: '100', unit: 'ml', reason: 'Spilt' }),
      await keeper.post('/api/stock-counts', { siteId: site, countDate: '2026-10-31' }),
      await keeper.put('/api/sales/days', { siteId: site, soldOn: '2026-10-02', lines: [] }),
    ];
    const openCount = (await ctx.db('stock_counts').where({ site_id: site, count_date: '2026-10-31', status: 'open' }).first('id')).id;
    refusals.push(await keeper.put(`/api/stock-counts/${openCount}/lines/${cafe.beans.packId}`, { packs: '1' }));
    refusals.push(await keeper.delete(`/api/stock-counts/${openCount}`));
    for (const r of refusals) {
      expect(r.status, JSON.stringify(r.body)).toBe(409);
      expect(r.body.error.code).toBe('month_closed');
      expect(r.body.error.message).toMatch(/October 2026 is closed/);
    }
    // November is open.
    expect((await keeper.post('/api/waste', { siteId: site, occurredOn: '2026-11-02', item: { kind: 'ingredient', id: cafe.milk.id }, quantity: '100', unit: 'ml', reason: 'Spilt' })).status).toBe(201);

    expect((await keeper.post('/api/periods/2026-10/reopen')).status).toBe(403);
    const reopened = await owner.post('/api/periods/2026-10/reopen', { reason: 'Late invoice' });
    expect(reopened.status).toBe(200);
    expect(reopened.body.period.status).toBe('open');
    expect(reopened.body.period.events.map((e: { action: string; by: string; reason: string }) => [e.action, e.by, e.reason])).toEqual([
      ['close', expect.stringMatching(/^bookkeeper /), 'Month end'],
      ['reopen', expect.stringMatching(/^owner /), 'Late invoice'],
    ]);
    // Open again: the live report uses the back-dated milk price (opening 10 × 1.20 stays September's; closing 8 × 2.40).
    const live = await keeper.get(`/api/reports/cogs?month=2026-10&siteId=${site}`);
    expect(live.body.closed).toBe(false);
    expect(live.body.rows.find((r: { category: string }) => r.category === 'dairy').closing).toBe('19.20');
  });
});

describe('theoretical cost over several price ranges', () => {
  it('costs each cup at the prices of its day, counts cups with no recipe cost as uncosted, and follows a change made after a report', async () => {
    const cafe = await makeBooksCafe(ctx.db);
    const { f, milk, latteSizeId } = cafe;
    const [site] = f.siteIds;
    // Milk 1.50 a litre from the 8th, beans 24.00 a kilo from the 16th: three ranges in October.
    await ctx.db('pack_prices').insert({ business_id: f.businessId, pack_id: milk.packId, price: '1.50', effective_from: '2026-10-08' });
    // A drink size with no build: its cups cannot be costed.
    const bare = await makeDrink(ctx.db, f.businessId, { name: 'Hot water', sizes: [{ sizeId: await makeSize(ctx.db, f.businessId), price: '0.50', lines: [] }] });
    await makeSales(ctx.db, f, site, [
      { soldOn: '2026-10-03', drinkSizeId: latteSizeId, quantity: '10', netSales: '30.00' },
      { soldOn: '2026-10-09', drinkSizeId: latteSizeId, quantity: '10', netSales: '30.00' },
      { soldOn: '2026-10-20', drinkSizeId: latteSizeId, quantity: '10', netSales: '30.00' },
      { soldOn: '2026-10-04', drinkSizeId: bare.drinkSizeIds[0], quantity: '5', netSales: '2.10' },
    ]);
    const keeper = await signIn(ctx.app, f.users.bookkeeper.email);
    const theoretical = async () => {
      const res = await keeper.get(`/api/reports/cogs?month=2026-10&siteId=${site}`);
      expect(res.status, JSON.stringify(res.body)).toBe(200);
      return res.body as { rows: { category: string; theoretical: string }[]; totals: Record<string, string>; cups: string; uncostedCups: string; notes: string[] };
    };
    // Theoretical cost = Σ cups sold × the recipe's cost at the prices of the day of sale
    // (common practice, no source); the figures worked out by hand, 10 lattes a range (coffee 18 g, milk 250 ml, a 10 ml pump of the
    // 2.50 / 1250 ml syrup, one 0.10 cup): coffee 3.60 + 3.60 + 4.32 (18 × 0.024 from the 16th);
    // dairy 3.00 (250 × 0.0012) + 3.75 + 3.75 (250 × 0.0015 from the 8th); other 3 × 0.16;
    // syrup-sauce 3 × 0.04; packaging 3 × 1.00.
    const first = await theoretical();
    expect(Object.fromEntries(first.rows.map((r) => [r.category, r.theoretical]))).toEqual({ coffee: '11.52', dairy: '10.50', other: '0.48', packaging: '3.00', 'syrup-sauce': '0.12' });
    expect(first.totals.theoretical).toBe('25.62');
    expect(first.totals.netSales).toBe('92.10');
    expect(first.cups).toBe('35');
    expect(first.uncostedCups).toBe('5');
    expect(first.notes.join(' ')).toMatch(/5 cups sold could not be costed/);

    // The owner corrects the milk price of the 8th: the next report is costed again.
    await ctx.db('pack_prices').where({ pack_id: milk.packId, effective_from: '2026-10-08' }).update({ price: '1.60' });
    const second = await theoretical();
    // dairy 3.00 + 2 × 10 × 250 × 0.0016 = 3.00 + 8.00
    expect(second.rows.find((r) => r.category === 'dairy')?.theoretical).toBe('11.00');
    expect(second.totals.theoretical).toBe('26.12');

    // Waste and a count recorded after a report are in the next one (its other figures are
    // kept only while the books stand): 1 l of milk at 1.60 a litre on the 21st; 4 packs of
    // milk (1 l at 1.60) counted at the month's end.
    await ctx.db('waste_entries').insert({ business_id: f.businessId, site_id: site, occurred_on: '2026-10-21', ingredient_id: milk.id, quantity: '1000', unit: 'ml', reason: 'Soured' });
    await makeCount(ctx.db, f, site, '2026-10-31', [{ packId: milk.packId!, packs: '4' }]);
    const third = await theoretical();
    const dairy = third.rows.find((r) => r.category === 'dairy') as unknown as Record<string, string>;
    expect(dairy.waste).toBe('1.60');
    expect(dairy.closing).toBe('6.40');
    expect(third.totals.theoretical).toBe('26.12');
  });
});
