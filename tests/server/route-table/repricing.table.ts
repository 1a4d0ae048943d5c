import { suffix } from '../../helpers/factories';
import { makeRepricingMenu } from '../repricing/menu-fixture';
import { statuses, type RouteCase, type RouteFixture } from './types';

const read = (other = 200) => statuses({ owner: 200, manager: 200, barista: 403, bookkeeper: 200, other });
const write = (ok: number, other = ok) => statuses({ owner: ok, manager: ok, barista: 403, bookkeeper: 403, other });
const everyRole = statuses({ owner: 200, manager: 200, barista: 200, bookkeeper: 200 });

type Menu = Awaited<ReturnType<typeof makeRepricingMenu>>;
const menus = new WeakMap<RouteFixture, Promise<Menu>>();
/** The menu once made, for `body` (which is not async): `url` awaits it first. */
const made = new WeakMap<RouteFixture, Menu>();
const menu = (f: RouteFixture) => {
  let p = menus.get(f);
  if (!p) {
    p = makeRepricingMenu(f.db, f.biz.businessId).then((m) => (made.set(f, m), m));
    menus.set(f, p);
  }
  return p;
};
const the = (f: RouteFixture) => made.get(f) as Menu;
const scenarioIds = new WeakMap<RouteFixture, Promise<string>>();
async function newScenario(f: RouteFixture) {
  const m = await menu(f);
  const [row] = await f.db('reprice_scenarios').insert({ business_id: f.biz.businessId, name: `Scenario ${suffix()}`, changes: JSON.stringify([{ ingredientId: m.milk.id, newPrice: '10.69' }]) }).returning('id');
  return row.id as string;
}
/** A fresh planned menu price (a month from now) for each call: cancelling one uses it up. */
async function newPlannedPrice(f: RouteFixture) {
  const m = await menu(f);
  const effectiveFrom = new Date(Date.now() + 30 * 86_400_000).toISOString().slice(0, 10);
  const [row] = await f.db('menu_price_history').insert({ business_id: f.biz.businessId, drink_size_id: m.teaDrink.drinkSizeIds[0], old_price: '2.20', new_price: '2.45', effective_from: effectiveFrom, status: 'planned' }).returning('id');
  return row.id as string;
}
const scenario = (f: RouteFixture) => {
  let p = scenarioIds.get(f);
  if (!p) scenarioIds.set(f, (p = newScenario(f)));
  return p;
};

// `other` (the owner of another business) gets 404 for this business's ids in URLs, and 400
// naming the field for them in bodies ("That ingredient was not found.").
export const routes: RouteCase[] = [
  {
    method: 'post', path: '/api/reprice/preview', expect: read(400),
    url: async (f) => { await menu(f); return '/api/reprice/preview'; },
    body: (f) => ({ changes: [{ ingredientId: the(f).milk.id, newPrice: '10.69' }] }),
  },
  {
    method: 'post', path: '/api/reprice/apply', expect: write(200, 400),
    url: async (f) => { await menu(f); return '/api/reprice/apply'; },
    body: (f) => ({ effectiveFrom: '2026-12-08', prices: [{ drinkId: the(f).teaDrink.id, size: `Small ${the(f).s}`, price: '2.35' }] }),
  },
  { method: 'get', path: '/api/reprice/planned', expect: read() },
  { method: 'get', path: '/api/reprice/scheduled', expect: read() },
  { method: 'post', path: '/api/reprice/scheduled/:id/cancel', url: async (f) => `/api/reprice/scheduled/${await newPlannedPrice(f)}/cancel`, expect: write(200, 404) },
  { method: 'get', path: '/api/reprice/scenarios', expect: read() },
  { method: 'get', path: '/api/reprice/compare', url: async (f) => `/api/reprice/compare?ids=${await scenario(f)}`, expect: read(404) },
  { method: 'get', path: '/api/reprice/scenarios/:id', url: async (f) => `/api/reprice/scenarios/${await scenario(f)}`, expect: read(404) },
  { method: 'post', path: '/api/reprice/scenarios', expect: write(201), body: () => ({ name: `New ${suffix()}`, changes: [], asOf: '2030-01-01' }) },
  {
    method: 'put', path: '/api/reprice/scenarios/:id', url: async (f) => `/api/reprice/scenarios/${await scenario(f)}`, expect: write(200, 404),
    body: () => ({ name: `Renamed ${suffix()}`, changes: [], asOf: '2030-01-01' }),
  },
  { method: 'delete', path: '/api/reprice/scenarios/:id', url: async (f) => `/api/reprice/scenarios/${await newScenario(f)}`, expect: write(204, 404) },
  { method: 'get', path: '/api/drinks/:id/price-history', url: async (f) => `/api/drinks/${(await menu(f)).latte.id}/price-history`, expect: read(404) },
  { method: 'get', path: '/api/price-list', expect: everyRole },
  { method: 'get', path: '/api/price-list.csv', expect: everyRole },
];
