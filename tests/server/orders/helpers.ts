import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import type { AddressInfo } from 'node:net';
import type { Server } from 'node:http';
import type { Knex } from 'knex';
import Stripe from 'stripe';
import { startPaymentsFake, type PaymentsFake } from '../../../fakes/payments/server';
import { startTestApp, type TestContext } from '../../helpers/context';
import { makeBusiness, signIn, suffix, type BusinessFixture, type Session } from '../../helpers/factories';
import { testKey } from '../../fakes/payments/helpers';

export const WEBHOOK_SECRET = 'whsec_orders_tests_1d2c3b4a';

export interface OrdersContext extends TestContext {
  fake: PaymentsFake;
  /** The SDK with the app's key, to look at what the fake holds. */
  stripe: Stripe;
  uploadDir: string;
  appUrl: string;
}

/** The real app on the test database, its SDK pointed at a fresh payments fake, listening so webhooks reach it. */
export async function startOrdersApp(env: Record<string, string> = {}): Promise<OrdersContext> {
  const fake = await startPaymentsFake({ port: 0, webhookSecret: WEBHOOK_SECRET, webhookRetryDelaysMs: [20, 40, 60], webhookTimeoutMs: 2000 });
  const key = testKey();
  const uploadDir = fs.mkdtempSync(path.join(os.tmpdir(), 'tamp-uploads-'));
  const ctx = await startTestApp({
    STRIPE_SECRET_KEY: key, STRIPE_API_HOST: fake.host, STRIPE_API_PORT: String(fake.port), STRIPE_API_PROTOCOL: 'http',
    STRIPE_WEBHOOK_SECRET: WEBHOOK_SECRET, UPLOAD_DIR: uploadDir, UPLOAD_MAX_BYTES: '100000', ...env,
  });
  const server = await new Promise<Server>((resolve) => {
    const s = ctx.app.listen(0, '127.0.0.1', () => resolve(s));
  });
  const appUrl = `http://127.0.0.1:${(server.address() as AddressInfo).port}`;
  fake.setWebhook(`${appUrl}/api/webhooks/payments`, WEBHOOK_SECRET);
  const stripe = new Stripe(key, { host: fake.host, port: fake.port, protocol: 'http' });
  return {
    ...ctx, fake, stripe, uploadDir, appUrl,
    async close() {
      await fake.close();
      await new Promise((r) => server.close(r));
      server.closeAllConnections();
      await ctx.close();
      fs.rmSync(uploadDir, { recursive: true, force: true });
    },
  };
}

export interface OrderWorld {
  biz: BusinessFixture;
  owner: Session;
  manager: Session;
  bookkeeper: Session;
  siteId: string;
  supplierId: string;
  milk: string;
  oat: string;
}

/**
 * A business with a dairy supplier (card terms, minimum 50.00, delivery 5.00, Tue/Thu,
 * cut-off 14:00, one day's lead) and two of its packs: milk 12 × 1 l at 9.60 without purchase
 * tax, oat drink 6 × 1 l at 18.00 with 20 % tax. Invented for the tests.
 */
export async function makeOrderWorld(ctx: TestContext, opts: { terms?: 'card' | 'account'; orderEmail?: string | null } = {}): Promise<OrderWorld> {
  const db = ctx.db;
  const biz = await makeBusiness(db);
  const s = suffix();
  const [sup] = await db('suppliers').insert({
    business_id: biz.businessId, name: `Dairy ${s}`, contact_name: 'Rowan', order_email: opts.orderEmail === undefined ? `orders-${s}@dairy.test` : opts.orderEmail,
    account_number: `AC-${s}`, minimum_order: '50', delivery_days: [2, 4], order_cutoff: '14:00', lead_days: 1, delivery_charge: '5', payment_terms: opts.terms ?? 'card',
  }).returning('id');
  const milk = await makePack(db, biz.businessId, sup.id, { name: `Whole milk ${s}`, description: '12 × 1 l', count: '12', quantity: '1', unit: 'l', price: '9.60', taxPct: '0' });
  const oat = await makePack(db, biz.businessId, sup.id, { name: `Oat drink ${s}`, description: '6 × 1 l', count: '6', quantity: '1', unit: 'l', price: '18.00', taxPct: '20' });
  const [owner, manager, bookkeeper] = await Promise.all([signIn(ctx.app, biz.users.owner.email), signIn(ctx.app, biz.users.manager.email), signIn(ctx.app, biz.users.bookkeeper.email)]);
  return { biz, owner, manager, bookkeeper, siteId: biz.siteIds[0], supplierId: sup.id, milk, oat };
}

export async function makePack(db: Knex, businessId: string, supplierId: string, p: { name: string; description: string; count: string; quantity: string; unit: string; price: string; taxPct: string; baseUnit?: string }) {
  const [ing] = await db('ingredients').insert({ business_id: businessId, name: p.name, category: 'dairy', base_unit: p.baseUnit ?? 'ml' }).returning('id');
  const [pack] = await db('packs').insert({
    business_id: businessId, ingredient_id: ing.id, supplier_id: supplierId, description: p.description, count: p.count, quantity: p.quantity, unit: p.unit, purchase_tax_pct: p.taxPct,
  }).returning('id');
  await db('pack_prices').insert({ business_id: businessId, pack_id: pack.id, price: p.price, effective_from: '2020-01-01' });
  return pack.id as string;
}

/** A placed order: 3 packs of milk (28.80) and 2 of oat drink (36.00 + 7.20 tax), delivery 5.00: total 77.00. */
export async function placedOrder(w: OrderWorld, by: Session = w.owner): Promise<string> {
  const created = await by.post('/api/purchase-orders', { siteId: w.siteId, supplierId: w.supplierId, lines: [{ packId: w.milk, quantity: '3' }, { packId: w.oat, quantity: '2' }] });
  if (created.status !== 201) throw new Error(`create failed: ${created.status} ${JSON.stringify(created.body)}`);
  const placed = await by.post(`/api/purchase-orders/${created.body.id}/place`);
  if (placed.status !== 200) throw new Error(`place failed: ${placed.status} ${JSON.stringify(placed.body)}`);
  return created.body.id as string;
}

/** Every PaymentIntent the fake holds for one order (by the metadata the app sets). */
export async function intentsFor(stripe: Stripe, orderId: string) {
  const list = await stripe.paymentIntents.list({ limit: 100 });
  return list.data.filter((pi) => pi.metadata.order_id === orderId);
}

export async function waitFor<T>(fn: () => Promise<T>, ok: (v: T) => boolean, timeoutMs = 5000): Promise<T> {
  const end = Date.now() + timeoutMs;
  for (;;) {
    const v = await fn();
    if (ok(v) || Date.now() > end) return v;
    await new Promise((r) => setTimeout(r, 25));
  }
}
