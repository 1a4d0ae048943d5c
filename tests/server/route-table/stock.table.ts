import { suffix } from '../../helpers/factories';
import { statuses, type Actor, type RouteCase, type RouteFixture } from './types';

// Storage areas of a site and the area of a stocked pack: read by every role, changed by
// the owner and manager. `other` (an owner elsewhere) gets 404 for this business's site.

const read = statuses({ owner: 200, manager: 200, barista: 200, bookkeeper: 200, other: 404 });
const write = (ok = 200) => statuses({ owner: ok, manager: ok, barista: 403, bookkeeper: 403, other: 404 });

const site = (f: RouteFixture) => f.biz.siteIds[0];
const areasUrl = (f: RouteFixture) => `/api/sites/${site(f)}/storage-areas`;

/** A fresh area at the first site (each call its own, so a delete has one per actor). */
async function area(f: RouteFixture): Promise<string> {
  const [a] = await f.db('storage_areas').insert({ business_id: f.biz.businessId, site_id: site(f), name: `RT area ${suffix()}`, position: 100 }).returning('id');
  return a.id;
}

const stocked = new WeakMap<RouteFixture, Promise<string>>();
/** One pack stocked at the first site. */
function stockedPack(f: RouteFixture): Promise<string> {
  let p = stocked.get(f);
  if (!p) {
    p = (async () => {
      const b = f.biz.businessId;
      const [i] = await f.db('ingredients').insert({ business_id: b, name: `RT oat drink ${suffix()}`, category: 'plant-milk', base_unit: 'ml' }).returning('id');
      const [pk] = await f.db('packs').insert({ business_id: b, ingredient_id: i.id, description: '1 l carton', quantity: '1', unit: 'l' }).returning('id');
      await f.db('stock_items').insert({ business_id: b, site_id: site(f), pack_id: pk.id });
      return pk.id as string;
    })();
    stocked.set(f, p);
  }
  return p;
}

/** The reorder body is the site's areas as they are when the call is made (read just before it, in `url`). */
const currentOrder = new Map<Actor, string[]>();

export const routes: RouteCase[] = [
  { method: 'get', path: '/api/sites/:siteId/storage-areas', url: areasUrl, expect: read },
  { method: 'post', path: '/api/sites/:siteId/storage-areas', url: areasUrl, body: () => ({ name: `RT new ${suffix()}` }), expect: write(201) },
  {
    method: 'put', path: '/api/sites/:siteId/storage-areas/order',
    url: async (f, actor) => {
      await area(f);
      currentOrder.set(actor, (await f.db('storage_areas').where({ site_id: site(f) }).orderBy('position').select('id')).map((r) => r.id as string).reverse());
      return `${areasUrl(f)}/order`;
    },
    body: (_f, actor) => ({ areaIds: currentOrder.get(actor) }),
    expect: write(),
  },
  { method: 'patch', path: '/api/sites/:siteId/storage-areas/:areaId', url: async (f) => `${areasUrl(f)}/${await area(f)}`, body: () => ({ name: `RT renamed ${suffix()}` }), expect: write() },
  { method: 'delete', path: '/api/sites/:siteId/storage-areas/:areaId', url: async (f) => `${areasUrl(f)}/${await area(f)}`, expect: write(204) },
  {
    method: 'put', path: '/api/sites/:siteId/stock/:packId/storage-area',
    url: async (f) => `/api/sites/${site(f)}/stock/${await stockedPack(f)}/storage-area`,
    body: () => ({ storageAreaId: null }),
    expect: write(),
  },
];
