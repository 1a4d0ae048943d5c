import { suffix } from '../../helpers/factories';
import { makeDrink, makeIngredient, makeSize } from '../../helpers/costing-factories';
import { statuses, type Actor, type RouteCase, type RouteFixture } from './types';

// The books routes: counts, waste, till sales, month end and reports. Statuses come from each
// entry's capability, except where a fixture leads elsewhere: another business's owner naming
// this business's site (or count) in a query or body gets 400 naming the field, and month-end
// paths name a month, not a record of the business.

const ACTOR_INDEX: Record<Actor, number> = { anonymous: 1, barista: 2, bookkeeper: 3, manager: 4, other: 5, owner: 6 };
/** A past month of its own for each actor (closing is not repeatable). */
const monthFor = (actor: Actor, base: number) => `20${String(base).padStart(2, '0')}-${String(ACTOR_INDEX[actor]).padStart(2, '0')}`;

/** The statuses an entry's capability gives, but 400 for another business's owner (this business's id in a query or body). */
const foreignIdIn = (ok: number, roles: { manager?: number; barista?: number; bookkeeper?: number } = {}) =>
  statuses({ owner: ok, manager: roles.manager ?? ok, barista: roles.barista ?? ok, bookkeeper: roles.bookkeeper ?? ok, other: 400 });
const reports = foreignIdIn(200, { barista: 403 });
const importing = (ok: number) => foreignIdIn(ok, { barista: 403 });

async function pack(f: RouteFixture) {
  return (await makeIngredient(f.db, f.biz.businessId, { baseUnit: 'ml', category: 'dairy', pack: { quantity: '1', unit: 'l', price: '1.10' } })).packId as string;
}
async function openCount(f: RouteFixture) {
  await pack(f);
  const [c] = await f.db('stock_counts').insert({ business_id: f.biz.businessId, site_id: f.biz.siteIds[0], count_date: '2026-11-20' }).returning('id');
  return c.id as string;
}
let ingredientId = '';
let drinkSizeId = '';
async function wasteEntry(f: RouteFixture) {
  const ing = await makeIngredient(f.db, f.biz.businessId, { baseUnit: 'ml', pack: { quantity: '1', unit: 'l', price: '1' } });
  const [w] = await f.db('waste_entries').insert({ business_id: f.biz.businessId, site_id: f.biz.siteIds[0], occurred_on: '2026-11-04', ingredient_id: ing.id, quantity: '10', unit: 'ml', reason: 'Spilt' }).returning('id');
  return w.id as string;
}
async function aDrinkSize(f: RouteFixture) {
  const sizeId = await makeSize(f.db, f.biz.businessId);
  drinkSizeId = (await makeDrink(f.db, f.biz.businessId, { sizes: [{ sizeId, lines: [] }] })).drinkSizeIds[0];
  return drinkSizeId;
}
let imports = 0;
/** A pending till file whose rows are its own (a repeat of an accepted file's rows is refused). */
async function pendingImport(f: RouteFixture) {
  imports += 1;
  const csv = `date,item,size,quantity,net sales,tax\n2026-11-02,Flat white,Regular,${imports},9.00,1.80\n`;
  const [i] = await f.db('sales_imports').insert({ business_id: f.biz.businessId, site_id: f.biz.siteIds[0], file_sha256: suffix().padEnd(64, '0'), filename: 'till.csv' }).returning('id');
  await f.db('sales_import_files').insert({ import_id: i.id, content: csv });
  return i.id as string;
}
const columns = { date: 'date', item: 'item', size: 'size', quantity: 'quantity', netSales: 'net sales', tax: 'tax', dateFormat: 'YYYY-MM-DD' };

export const routes: RouteCase[] = [
  { method: 'get', path: '/api/reports/cogs', url: (f) => `/api/reports/cogs?month=2026-11&siteId=${f.biz.siteIds[0]}`, expect: reports },
  { method: 'get', path: '/api/reports/cogs.csv', url: (f) => `/api/reports/cogs.csv?month=2026-11&siteId=${f.biz.siteIds[0]}`, expect: reports },
  { method: 'get', path: '/api/reports/purchases.csv', url: (f) => `/api/reports/purchases.csv?month=2026-11&siteId=${f.biz.siteIds[0]}`, expect: reports },
  { method: 'get', path: '/api/reports/stock-valuation.csv', url: async (f) => `/api/reports/stock-valuation.csv?countId=${await openCount(f)}`, expect: reports },
  { method: 'get', path: '/api/reports/purchases-by-supplier', url: (f) => `/api/reports/purchases-by-supplier?month=2026-11&siteId=${f.biz.siteIds[0]}`, expect: reports },
  { method: 'get', path: '/api/reports/cogs-trend', url: (f) => `/api/reports/cogs-trend?month=2026-11&months=2&siteId=${f.biz.siteIds[0]}`, expect: reports },
  { method: 'get', path: '/api/periods' },
  {
    method: 'post', path: '/api/periods/:month/close', url: (_f, a) => `/api/periods/${monthFor(a, 1)}/close`,
    body: () => ({ reason: 'Month end' }),
    expect: statuses({ owner: 200, manager: 403, barista: 403, bookkeeper: 200 }),
  },
  {
    method: 'post', path: '/api/periods/:month/reopen',
    url: async (f, a) => {
      const month = monthFor(a, 2);
      const businessId = a === 'other' ? f.otherBiz.businessId : f.biz.businessId;
      await f.db('periods').insert({ business_id: businessId, month: `${month}-01`, status: 'closed', closed_at: f.db.fn.now() });
      return `/api/periods/${month}/reopen`;
    },
    body: () => ({ reason: 'A late delivery note' }),
    expect: statuses({ owner: 200, manager: 403, barista: 403, bookkeeper: 403 }),
  },

  { method: 'get', path: '/api/stock-counts', url: (f) => `/api/stock-counts?siteId=${f.biz.siteIds[0]}`, expect: foreignIdIn(200) },
  { method: 'post', path: '/api/stock-counts', body: (f) => ({ siteId: f.biz.siteIds[0], countDate: '2026-11-30' }), expect: foreignIdIn(201) },
  { method: 'get', path: '/api/stock-counts/:id', url: async (f) => `/api/stock-counts/${await openCount(f)}` },
  {
    method: 'put', path: '/api/stock-counts/:id/lines/:packId', url: async (f) => `/api/stock-counts/${await openCount(f)}/lines/${await pack(f)}`,
    body: () => ({ packs: '2.5' }),
    // 2 whole packs and 500 ml of a 1 l pack open.
    fullBody: () => ({ packs: '2', quantity: '500', unit: 'ml' }),
  },
  { method: 'post', path: '/api/stock-counts/:id/finish', url: async (f) => `/api/stock-counts/${await openCount(f)}/finish` },
  { method: 'delete', path: '/api/stock-counts/:id', url: async (f) => `/api/stock-counts/${await openCount(f)}` },

  { method: 'get', path: '/api/waste/choices' },
  {
    method: 'get', path: '/api/waste',
    url: async (f) => {
      await wasteEntry(f);
      return `/api/waste?month=2026-11&siteId=${f.biz.siteIds[0]}`;
    },
    expect: foreignIdIn(200),
  },
  {
    method: 'post', path: '/api/waste',
    url: async (f) => {
      ingredientId = (await makeIngredient(f.db, f.biz.businessId, { baseUnit: 'ml', pack: { quantity: '1', unit: 'l', price: '1' } })).id;
      return '/api/waste';
    },
    body: (f) => ({ siteId: f.biz.siteIds[0], occurredOn: '2026-11-05', item: { kind: 'ingredient', id: ingredientId }, quantity: '250', unit: 'ml', reason: 'Poured away' }),
    expect: foreignIdIn(201, { manager: 403 }),
  },
  { method: 'delete', path: '/api/waste/:id', url: async (f) => `/api/waste/${await wasteEntry(f)}` },

  { method: 'get', path: '/api/sales-imports', url: (f) => `/api/sales-imports?siteId=${f.biz.siteIds[0]}`, expect: importing(200) },
  {
    method: 'post', path: '/api/sales-imports',
    send: (req, f) => req.field('siteId', f.biz.siteIds[0]).attach('file', Buffer.from(`date,item,size,quantity,net sales\n2026-11-03,Tea ${suffix()},Regular,1,2.00\n`), { filename: 'till.csv', contentType: 'text/csv' }),
    expect: importing(201),
  },
  { method: 'post', path: '/api/sales-imports/:id/preview', url: async (f) => `/api/sales-imports/${await pendingImport(f)}/preview`, body: () => ({ columns }) },
  {
    method: 'post', path: '/api/sales-imports/:id/accept',
    url: async (f) => {
      await aDrinkSize(f);
      return `/api/sales-imports/${await pendingImport(f)}/accept`;
    },
    body: () => ({ columns, items: [{ tillItem: 'Flat white', tillSize: 'Regular', drinkSizeId }] }),
  },
  { method: 'delete', path: '/api/sales-imports/:id', url: async (f) => `/api/sales-imports/${await pendingImport(f)}` },
  { method: 'get', path: '/api/sales/days', url: (f) => `/api/sales/days?month=2026-11&siteId=${f.biz.siteIds[0]}`, expect: importing(200) },
  { method: 'get', path: '/api/sales/days/:soldOn', url: (f) => `/api/sales/days/2026-11-03?siteId=${f.biz.siteIds[0]}`, expect: importing(200) },
  {
    method: 'put', path: '/api/sales/days',
    url: async (f) => {
      await aDrinkSize(f);
      return '/api/sales/days';
    },
    body: (f) => ({ siteId: f.biz.siteIds[0], soldOn: '2026-11-03', lines: [] }),
    fullBody: (f) => ({ siteId: f.biz.siteIds[0], soldOn: '2026-11-03', lines: [{ drinkSizeId, quantity: '12', netSales: '36.00', tax: '7.20' }] }),
    expect: importing(200),
  },
];
