import { suffix } from '../../helpers/factories';
import { makeDrink, makeIngredient, makeSize } from '../../helpers/costing-factories';
import { statuses, type Actor, type RouteCase, type RouteFixture } from './types';

// The books routes: counts, waste, till sales, month end and reports.
// Roles (issue 6): bookkeeper and owner everything; manager counts, imports, reports;
// barista counts and waste only; reopening a month is the owner's alone.

const reports = statuses({ owner: 200, manager: 200, barista: 403, bookkeeper: 200, other: 404 });
const reportsOwnBusiness = statuses({ owner: 200, manager: 200, barista: 403, bookkeeper: 200 });
const everyRoleSite = statuses({ owner: 200, manager: 200, barista: 200, bookkeeper: 200, other: 404 });
const counting = (ok: number) => statuses({ owner: ok, manager: ok, barista: ok, bookkeeper: ok, other: 404 });
const wasting = (ok: number) => statuses({ owner: ok, manager: 403, barista: ok, bookkeeper: ok, other: 404 });
const importing = (ok: number) => statuses({ owner: ok, manager: ok, barista: 403, bookkeeper: ok, other: 404 });

const ACTOR_INDEX: Record<Actor, number> = { anonymous: 1, barista: 2, bookkeeper: 3, manager: 4, other: 5, owner: 6 };
/** A past month of its own for each actor (closing is not repeatable). */
const monthFor = (actor: Actor, base: number) => `20${String(base).padStart(2, '0')}-${String(ACTOR_INDEX[actor]).padStart(2, '0')}`;

async function pack(f: RouteFixture) {
  return (await makeIngredient(f.db, f.biz.businessId, { baseUnit: 'ml', category: 'dairy', pack: { quantity: '1', unit: 'l', price: '1.10' } })).packId as string;
}
async function openCount(f: RouteFixture) {
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
const CSV = 'date,item,size,quantity,net sales\n2026-11-02,Flat white,Regular,3,9.00\n';
async function pendingImport(f: RouteFixture) {
  const [i] = await f.db('sales_imports').insert({ business_id: f.biz.businessId, site_id: f.biz.siteIds[0], file_sha256: suffix().padEnd(64, '0'), filename: 'till.csv' }).returning('id');
  await f.db('sales_import_files').insert({ import_id: i.id, content: CSV });
  return i.id as string;
}
const columns = { date: 'date', item: 'item', size: 'size', quantity: 'quantity', netSales: 'net sales', dateFormat: 'YYYY-MM-DD' };

export const routes: RouteCase[] = [
  { method: 'get', path: '/api/reports/cogs', url: (f) => `/api/reports/cogs?month=2026-11&siteId=${f.biz.siteIds[0]}`, expect: reports },
  { method: 'get', path: '/api/reports/cogs.csv', url: (f) => `/api/reports/cogs.csv?month=2026-11&siteId=${f.biz.siteIds[0]}`, expect: reports },
  { method: 'get', path: '/api/reports/purchases.csv', url: (f) => `/api/reports/purchases.csv?month=2026-11&siteId=${f.biz.siteIds[0]}`, expect: reports },
  { method: 'get', path: '/api/reports/stock-valuation.csv', url: async (f) => `/api/reports/stock-valuation.csv?countId=${await openCount(f)}`, expect: reports },
  { method: 'get', path: '/api/reports/purchases-by-supplier', url: (f) => `/api/reports/purchases-by-supplier?month=2026-11&siteId=${f.biz.siteIds[0]}`, expect: reports },
  { method: 'get', path: '/api/reports/cogs-trend', url: (f) => `/api/reports/cogs-trend?month=2026-11&months=2&siteId=${f.biz.siteIds[0]}`, expect: reports },
  { method: 'get', path: '/api/periods', expect: reportsOwnBusiness },
  {
    method: 'post', path: '/api/periods/:month/close', url: (_f, a) => `/api/periods/${monthFor(a, 1)}/close`,
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
    expect: statuses({ owner: 200, manager: 403, barista: 403, bookkeeper: 403 }),
  },

  { method: 'get', path: '/api/stock-counts', url: (f) => `/api/stock-counts?siteId=${f.biz.siteIds[0]}`, expect: everyRoleSite },
  { method: 'post', path: '/api/stock-counts', body: (f) => ({ siteId: f.biz.siteIds[0], countDate: '2026-11-30' }), expect: counting(201) },
  { method: 'get', path: '/api/stock-counts/:id', url: async (f) => `/api/stock-counts/${await openCount(f)}`, expect: everyRoleSite },
  { method: 'put', path: '/api/stock-counts/:id/lines/:packId', url: async (f) => `/api/stock-counts/${await openCount(f)}/lines/${await pack(f)}`, body: () => ({ packs: '2.5' }), expect: counting(200) },
  { method: 'post', path: '/api/stock-counts/:id/finish', url: async (f) => `/api/stock-counts/${await openCount(f)}/finish`, expect: counting(200) },
  { method: 'delete', path: '/api/stock-counts/:id', url: async (f) => `/api/stock-counts/${await openCount(f)}`, expect: counting(204) },

  { method: 'get', path: '/api/waste/choices', expect: statuses({ owner: 200, manager: 403, barista: 200, bookkeeper: 200 }) },
  { method: 'get', path: '/api/waste', url: (f) => `/api/waste?month=2026-11&siteId=${f.biz.siteIds[0]}`, expect: everyRoleSite },
  {
    method: 'post', path: '/api/waste',
    url: async (f) => {
      ingredientId = (await makeIngredient(f.db, f.biz.businessId, { baseUnit: 'ml', pack: { quantity: '1', unit: 'l', price: '1' } })).id;
      return '/api/waste';
    },
    body: (f) => ({ siteId: f.biz.siteIds[0], occurredOn: '2026-11-05', item: { kind: 'ingredient', id: ingredientId }, quantity: '250', unit: 'ml', reason: 'Poured away' }),
    expect: wasting(201),
  },
  { method: 'delete', path: '/api/waste/:id', url: async (f) => `/api/waste/${await wasteEntry(f)}`, expect: wasting(204) },

  { method: 'get', path: '/api/sales-imports', url: (f) => `/api/sales-imports?siteId=${f.biz.siteIds[0]}`, expect: statuses({ owner: 200, manager: 200, barista: 403, bookkeeper: 200 }) },
  {
    method: 'post', path: '/api/sales-imports',
    send: (req, f) => req.field('siteId', f.biz.siteIds[0]).attach('file', Buffer.from(`${CSV}2026-11-03,Tea ${suffix()},Regular,1,2.00\n`), { filename: 'till.csv', contentType: 'text/csv' }),
    expect: importing(201),
  },
  { method: 'post', path: '/api/sales-imports/:id/preview', url: async (f) => `/api/sales-imports/${await pendingImport(f)}/preview`, body: () => ({ columns }), expect: importing(200) },
  {
    method: 'post', path: '/api/sales-imports/:id/accept',
    url: async (f) => {
      const sizeId = await makeSize(f.db, f.biz.businessId);
      drinkSizeId = (await makeDrink(f.db, f.biz.businessId, { sizes: [{ sizeId, lines: [] }] })).drinkSizeIds[0];
      return `/api/sales-imports/${await pendingImport(f)}/accept`;
    },
    body: () => ({ columns, items: [{ tillItem: 'Flat white', tillSize: 'Regular', drinkSizeId }] }),
    expect: importing(200),
  },
  { method: 'delete', path: '/api/sales-imports/:id', url: async (f) => `/api/sales-imports/${await pendingImport(f)}`, expect: importing(204) },
  { method: 'get', path: '/api/sales/days', url: (f) => `/api/sales/days?month=2026-11&siteId=${f.biz.siteIds[0]}`, expect: importing(200) },
  { method: 'get', path: '/api/sales/days/:soldOn', url: (f) => `/api/sales/days/2026-11-03?siteId=${f.biz.siteIds[0]}`, expect: importing(200) },
  { method: 'put', path: '/api/sales/days', body: (f) => ({ siteId: f.biz.siteIds[0], soldOn: '2026-11-03', lines: [] }), expect: importing(200) },
];
