import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { startTestApp, type TestContext } from '../../helpers/context';
import { makeBusiness, signIn } from '../../helpers/factories';
import { makeBooksCafe } from './scenario';

let ctx: TestContext;
beforeAll(async () => {
  ctx = await startTestApp();
});
afterAll(() => ctx.close());

const manualRows = (site: string, day: string) =>
  ctx.db('sales_lines').where({ site_id: site, sold_on: day }).whereNull('import_id').orderBy('id').select('drink_size_id', 'quantity', 'net_sales', 'tax');

describe('a day of sales typed in by hand', () => {
  it('loads what was saved for the day, in the order saved, and saving replaces it and says how many it replaced', async () => {
    const cafe = await makeBooksCafe(ctx.db);
    const site = cafe.f.siteIds[0];
    const latte = await ctx.db('drink_sizes as ds').join('drinks as d', 'd.id', 'ds.drink_id').join('cup_sizes as cs', 'cs.id', 'ds.size_id')
      .where('ds.id', cafe.latteSizeId).first('d.name as drink', 'cs.name as size', 'ds.drink_id');
    // A second size of the same drink, so a day can hold two lines.
    const [large] = await ctx.db('cup_sizes').insert({ business_id: cafe.biz, name: `Large ${cafe.biz.slice(0, 6)}`, volume_ml: 455 }).returning('id');
    const [largeSize] = await ctx.db('drink_sizes').insert({ business_id: cafe.biz, drink_id: latte.drink_id, size_id: large.id, price: '3.90' }).returning('id');
    const manager = await signIn(ctx.app, cafe.f.users.manager.email);
    const url = (day: string, siteId = site) => `/api/sales/days/${day}?siteId=${siteId}`;

    const empty = await manager.get(url('2026-10-12'));
    expect(empty.status, JSON.stringify(empty.body)).toBe(200);
    expect(empty.body).toEqual({ siteId: site, soldOn: '2026-10-12', closed: false, currency: 'GBP', lines: [], importedLines: 0 });

    const first = await manager.put('/api/sales/days', { siteId: site, soldOn: '2026-10-12', lines: [
      { drinkSizeId: largeSize.id, quantity: '12', netSales: '39', tax: '7.80' },
      { drinkSizeId: cafe.latteSizeId, quantity: '30', netSales: '85.00' },
    ] });
    expect(first.status, JSON.stringify(first.body)).toBe(200);
    expect(first.body.replaced).toBe(0);
    const saved = [
      { drinkSizeId: largeSize.id, label: `${latte.drink} (Large ${cafe.biz.slice(0, 6)})`, quantity: '12', netSales: '39.00', tax: '7.80' },
      { drinkSizeId: cafe.latteSizeId, label: `${latte.drink} (${latte.size})`, quantity: '30', netSales: '85.00', tax: null },
    ];
    expect(first.body.lines).toEqual(saved);

    // A till file's lines for the same day are counted, not listed, and saving by hand leaves them.
    const [imp] = await ctx.db('sales_imports').insert({ business_id: cafe.biz, site_id: site, file_sha256: 'b'.repeat(64), filename: 'till.csv', row_count: 1, status: 'accepted', first_day: '2026-10-12', last_day: '2026-10-12' }).returning('id');
    await ctx.db('sales_lines').insert({ business_id: cafe.biz, site_id: site, import_id: imp.id, sold_on: '2026-10-12', drink_size_id: cafe.latteSizeId, quantity: '5', net_sales: '14.00' });

    const loaded = await manager.get(url('2026-10-12'));
    expect(loaded.body).toEqual({ siteId: site, soldOn: '2026-10-12', closed: false, currency: 'GBP', lines: saved, importedLines: 1 });
    // Other days and the other site are their own.
    expect((await manager.get(url('2026-10-13'))).body.lines).toEqual([]);
    expect((await manager.get(url('2026-10-12', cafe.f.siteIds[1]))).body.lines).toEqual([]);

    const again = await manager.put('/api/sales/days', { siteId: site, soldOn: '2026-10-12', lines: [{ drinkSizeId: cafe.latteSizeId, quantity: '31.5', netSales: '88.20' }] });
    expect(again.body).toMatchObject({ replaced: 2, importedLines: 1, lines: [{ drinkSizeId: cafe.latteSizeId, quantity: '31.5', netSales: '88.20', tax: null }] });
    expect(await manualRows(site, '2026-10-12')).toEqual([{ drink_size_id: cafe.latteSizeId, quantity: '31.5000', net_sales: '88.2000', tax: null }]);
    expect(await ctx.db('sales_lines').where({ import_id: imp.id }).count<{ n: string }[]>('* as n')).toEqual([{ n: '1' }]);

    // An empty save clears the day's hand-entered lines.
    expect((await manager.put('/api/sales/days', { siteId: site, soldOn: '2026-10-12', lines: [] })).body).toMatchObject({ replaced: 1, lines: [], importedLines: 1 });
  });

  it('says a closed month is closed, and refuses to save in it (409) leaving its lines as they were', async () => {
    const cafe = await makeBooksCafe(ctx.db);
    const site = cafe.f.siteIds[0];
    const owner = await signIn(ctx.app, cafe.f.users.owner.email);
    await owner.put('/api/sales/days', { siteId: site, soldOn: '2026-09-05', lines: [{ drinkSizeId: cafe.latteSizeId, quantity: '20', netSales: '56.00' }] });
    await ctx.db('periods').insert({ business_id: cafe.biz, month: '2026-09-01', status: 'closed', closed_at: ctx.db.fn.now() });

    const day = await owner.get(`/api/sales/days/2026-09-05?siteId=${site}`);
    expect(day.body).toMatchObject({ closed: true, lines: [{ drinkSizeId: cafe.latteSizeId, quantity: '20', netSales: '56.00' }] });
    expect((await owner.get(`/api/sales/days/2026-10-01?siteId=${site}`)).body.closed).toBe(false);
    const refused = await owner.put('/api/sales/days', { siteId: site, soldOn: '2026-09-05', lines: [] });
    expect(refused.status).toBe(409);
    expect(refused.body.error.code).toBe('month_closed');
    expect(await manualRows(site, '2026-09-05')).toEqual([{ drink_size_id: cafe.latteSizeId, quantity: '20.0000', net_sales: '56.0000', tax: null }]);
  });

  it('names a bad site (400, another business\'s too), has no page for a day that is not one (404), and is kept to the roles that import sales', async () => {
    const cafe = await makeBooksCafe(ctx.db);
    const site = cafe.f.siteIds[0];
    const other = await makeBusiness(ctx.db);
    const owner = await signIn(ctx.app, cafe.f.users.owner.email);
    // A day in the path that no calendar has is a page that does not exist.
    for (const path of [`/api/sales/days/2026-02-30?siteId=${site}`, `/api/sales/days/0000-01-01?siteId=${site}`, `/api/sales/days/yesterday?siteId=${site}`]) {
      expect((await owner.get(path)).status, path).toBe(404);
    }
    for (const path of ['/api/sales/days/2026-10-01', '/api/sales/days/2026-10-01?siteId=north', `/api/sales/days/2026-10-01?siteId=${other.siteIds[0]}`]) {
      const res = await owner.get(path);
      expect(res.status, path).toBe(400);
      expect(res.body.error.code, path).toBe('invalid_input');
      expect(Object.keys(res.body.error.fields), path).toEqual(['siteId']);
    }
    expect((await (await signIn(ctx.app, other.users.owner.email)).get(`/api/sales/days/2026-10-01?siteId=${site}`)).status).toBe(400);
    expect((await (await signIn(ctx.app, cafe.f.users.bookkeeper.email)).get(`/api/sales/days/2026-10-01?siteId=${site}`)).status).toBe(200);
    expect((await (await signIn(ctx.app, cafe.f.users.barista.email)).get(`/api/sales/days/2026-10-01?siteId=${site}`)).status).toBe(403);
  });
});
