import { suffix } from '../../helpers/factories';
import { statuses, type Actor, type RouteCase, type RouteFixture } from './types';

// Purchase orders, payments and stock. No row reaches the payments service: pay runs on a
// draft (409 before any call), the card is refused by its id before any call.

const read = (ok = 200, other = 404) => statuses({ owner: ok, manager: ok, barista: 403, bookkeeper: ok, other });
const write = (ok = 200, other = 404) => statuses({ owner: ok, manager: ok, barista: 403, bookkeeper: 403, other });
const ownerOnly = (ok = 200, other = ok) => statuses({ owner: ok, manager: 403, barista: 403, bookkeeper: 403, other });

interface Base { supplierId: string; packId: string; siteId: string }
const bases = new WeakMap<RouteFixture, Promise<Base>>();
function base(f: RouteFixture): Promise<Base> {
  let p = bases.get(f);
  if (!p) {
    p = (async () => {
      const b = f.biz.businessId;
      const [s] = await f.db('suppliers').insert({ business_id: b, name: `RT supplier ${suffix()}`, order_email: `rt-${suffix()}@supplier.test`, payment_terms: 'account', delivery_days: [1, 3, 5] }).returning('id');
      const [i] = await f.db('ingredients').insert({ business_id: b, name: `RT milk ${suffix()}`, category: 'dairy', base_unit: 'ml' }).returning('id');
      const [pk] = await f.db('packs').insert({ business_id: b, ingredient_id: i.id, supplier_id: s.id, description: '1 l', quantity: '1', unit: 'l' }).returning('id');
      await f.db('pack_prices').insert({ business_id: b, pack_id: pk.id, price: '1.20', effective_from: '2020-01-01' });
      return { supplierId: s.id, packId: pk.id, siteId: f.biz.siteIds[0] };
    })();
    bases.set(f, p);
  }
  return p;
}
const known = new WeakMap<RouteFixture, Base>();
const baseNow = (f: RouteFixture) => known.get(f) as Base;
async function ready(f: RouteFixture) {
  known.set(f, await base(f));
}

/** An order row straight in the database, in the given state, with one line (and a receipt when received). */
async function order(f: RouteFixture, status: string) {
  const b = await base(f);
  known.set(f, b);
  const [o] = await f.db('purchase_orders').insert({
    business_id: f.biz.businessId, site_id: b.siteId, supplier_id: b.supplierId, number: `RT-${suffix()}`, status, currency: 'GBP', payment_terms: 'account',
    subtotal: '2.40', total: '2.40',
  }).returning('id');
  const [l] = await f.db('purchase_order_lines').insert({ business_id: f.biz.businessId, order_id: o.id, pack_id: b.packId, description: 'RT milk', quantity: '2', unit_price: '1.20', line_total: '2.40' }).returning('id');
  if (status === 'received') {
    const [r] = await f.db('receipts').insert({ business_id: f.biz.businessId, site_id: b.siteId, order_id: o.id, received_on: '2026-12-01' }).returning('id');
    await f.db('receipt_lines').insert({ business_id: f.biz.businessId, receipt_id: r.id, order_line_id: l.id, pack_id: b.packId, quantity: '2', unit_price: '1.25', net: '2.50' });
  }
  return { id: o.id as string, lineId: l.id as string };
}
const lineOf = new Map<string, string>();
const key = (f: RouteFixture, a: Actor) => `${f.biz.businessId}:${a}`;
const orderUrl = (status: string, tail = '') => async (f: RouteFixture, a: Actor) => {
  const o = await order(f, status);
  lineOf.set(key(f, a), o.lineId);
  return `/api/purchase-orders/${o.id}${tail}`;
};

export const routes: RouteCase[] = [
  { method: 'get', path: '/api/purchase-orders', expect: read(200, 200) },
  {
    method: 'post', path: '/api/purchase-orders', url: async (f) => { await ready(f); return '/api/purchase-orders'; },
    body: (f) => ({ siteId: baseNow(f).siteId, supplierId: baseNow(f).supplierId, lines: [{ packId: baseNow(f).packId, quantity: '2' }] }),
    expect: write(201, 400),
  },
  { method: 'get', path: '/api/purchase-orders/:id', url: orderUrl('draft'), expect: read() },
  { method: 'patch', path: '/api/purchase-orders/:id', url: orderUrl('draft'), body: () => ({ notes: 'Leave at the back door' }), expect: write() },
  { method: 'post', path: '/api/purchase-orders/:id/place', url: orderUrl('draft', '/place'), expect: write() },
  { method: 'post', path: '/api/purchase-orders/:id/cancel', url: orderUrl('placed', '/cancel'), expect: write() },
  {
    method: 'post', path: '/api/purchase-orders/:id/receive', url: orderUrl('placed', '/receive'),
    body: (f, a) => ({ lines: [{ lineId: lineOf.get(key(f, a)), quantityReceived: '2', unitPrice: '1.20' }] }), expect: write(),
  },
  { method: 'post', path: '/api/purchase-orders/:id/close', url: orderUrl('received', '/close'), expect: write() },
  { method: 'post', path: '/api/purchase-orders/:id/pack-prices', url: orderUrl('received', '/pack-prices'), body: (f) => ({ packId: baseNow(f).packId }), expect: write(201) },
  {
    method: 'post', path: '/api/purchase-orders/:id/invoice', url: orderUrl('placed', '/invoice'),
    // Not a PDF, JPEG or PNG: refused by content before anything is stored.
    send: (req) => req.attach('file', Buffer.from('plain text, not an invoice'), { filename: 'invoice.pdf', contentType: 'application/pdf' }),
    expect: statuses({ owner: 400, manager: 400, barista: 403, bookkeeper: 403, other: 400 }),
  },
  { method: 'get', path: '/api/purchase-orders/:id/invoice', url: orderUrl('placed', '/invoice'), expect: read(404) },
  { method: 'post', path: '/api/purchase-orders/:id/pay', url: orderUrl('draft', '/pay'), body: () => ({ paymentMethodId: 'pm_card_visa' }), expect: ownerOnly(409, 404) },
  { method: 'post', path: '/api/purchase-orders/:id/payment/check', url: orderUrl('placed', '/payment/check'), expect: ownerOnly(200, 404) },
  { method: 'get', path: '/api/payments/card', expect: ownerOnly() },
  { method: 'put', path: '/api/payments/card', body: () => ({ paymentMethodId: 'pm_not_a_test_card' }), expect: ownerOnly(400) },
  { method: 'delete', path: '/api/payments/card', expect: ownerOnly() },
  { method: 'post', path: '/api/webhooks/payments', expect: { anonymous: 400, owner: 400, manager: 400, barista: 400, bookkeeper: 400, other: 400 }, send: (req) => req.set('content-type', 'application/json').send('{"id":"evt_unsigned"}') },
  { method: 'get', path: '/api/suppliers/:supplierId/ordering', url: async (f) => `/api/suppliers/${(await base(f)).supplierId}/ordering`, expect: read() },
  {
    method: 'put', path: '/api/suppliers/:supplierId/ordering', url: async (f) => `/api/suppliers/${(await base(f)).supplierId}/ordering`,
    body: () => ({ minimumOrder: '40', deliveryDays: [1, 3, 5], orderCutoff: '15:00', leadDays: 1, deliveryCharge: '0', paymentTerms: 'account' }), expect: write(),
  },
  { method: 'get', path: '/api/suppliers/:supplierId/catalogue', url: async (f) => `/api/suppliers/${(await base(f)).supplierId}/catalogue`, expect: read() },
  { method: 'get', path: '/api/sites/:siteId/stock', url: (f) => `/api/sites/${f.biz.siteIds[0]}/stock`, expect: statuses({ owner: 200, manager: 200, barista: 200, bookkeeper: 200, other: 404 }) },
  {
    method: 'put', path: '/api/sites/:siteId/stock/:packId', url: async (f) => `/api/sites/${f.biz.siteIds[0]}/stock/${(await base(f)).packId}`,
    body: () => ({ par: '6', reorderPoint: '2' }), expect: write(),
  },
  { method: 'get', path: '/api/sites/:siteId/suggested-order', url: async (f) => `/api/sites/${f.biz.siteIds[0]}/suggested-order?supplierId=${(await base(f)).supplierId}`, expect: read() },
];
