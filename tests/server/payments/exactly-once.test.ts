// An order is charged at most once: concurrent presses, replayed webhooks, forged
// signatures and a payments service that goes away mid-call. Signatures are made with the
// SDK's own generateTestHeaderString (stripe@23.1.0 src/Webhooks.ts), tolerance 300 s.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import Stripe from 'stripe';
import { startTestApp } from '../../helpers/context';
import { freePort } from '../../../scripts/lib/postgres.mjs';
import { intentsFor, makeOrderWorld, placedOrder, startOrdersApp, WEBHOOK_SECRET, type OrdersContext } from '../orders/helpers';

let ctx: OrdersContext;
beforeAll(async () => {
  ctx = await startOrdersApp();
});
afterAll(() => ctx.close());

const signed = (payload: string, secret = WEBHOOK_SECRET, timestamp?: number) =>
  Stripe.webhooks.generateTestHeaderString({ payload, secret, ...(timestamp ? { timestamp } : {}) });

async function postHook(payload: string, signature: string) {
  return fetch(`${ctx.appUrl}/api/webhooks/payments`, { method: 'POST', headers: { 'content-type': 'application/json', 'stripe-signature': signature }, body: payload });
}

/** Every answer to the app is lost (the original and the SDK's two retries): the outcome is unknown to it. */
function loseAnswers() {
  for (let i = 0; i < 3; i += 1) ctx.fake.failNext('POST /v1/payment_intents', 'dropAfterSave');
}

describe('concurrent presses', () => {
  it('10 pay requests at once make one PaymentIntent and one charge', async () => {
    const w = await makeOrderWorld(ctx);
    const id = await placedOrder(w);
    // Slow the fake a little so the requests really overlap.
    ctx.fake.setDelay('POST /v1/payment_intents', 150);
    try {
      const answers = await Promise.all(Array.from({ length: 10 }, () => w.owner.post(`/api/purchase-orders/${id}/pay`, { paymentMethodId: 'pm_card_visa' })));
      const statuses = answers.map((a) => a.status).sort();
      expect(statuses).toEqual([200, 409, 409, 409, 409, 409, 409, 409, 409, 409]);
      expect(new Set(answers.filter((a) => a.status === 409).map((a) => a.body.error.code))).toEqual(new Set(['payment_in_progress']));
    } finally {
      ctx.fake.setDelay('POST /v1/payment_intents', 0);
    }
    const intents = await intentsFor(ctx.stripe, id);
    expect(intents.map((i) => i.status)).toEqual(['succeeded']);
    const charge = await ctx.stripe.charges.retrieve(String(intents[0].latest_charge));
    expect(charge.paid).toBe(true);
    expect(await ctx.db('payments').where({ order_id: id }).count<{ n: string }[]>({ n: '*' })).toEqual([{ n: '1' }]);
    const o = (await w.owner.get(`/api/purchase-orders/${id}`)).body;
    expect(o.status).toBe('paid');
    expect(o.timeline.filter((e: { kind: string }) => e.kind === 'paid')).toHaveLength(1);
  });
});

describe('webhooks', () => {
  it('an event delivered 3 times changes the order once', async () => {
    ctx.fake.setWebhook(null);
    const w = await makeOrderWorld(ctx);
    const id = await placedOrder(w);
    loseAnswers();
    const r = await w.owner.post(`/api/purchase-orders/${id}/pay`, { paymentMethodId: 'pm_card_visa' });
    expect([r.status, r.body.error.code]).toEqual([502, 'payments_unreachable']);
    const [pi] = await intentsFor(ctx.stripe, id);
    expect(pi.status).toBe('succeeded');
    const event = { id: `evt_test_${id.slice(0, 8)}`, object: 'event', api_version: Stripe.API_VERSION, created: Math.floor(Date.now() / 1000), data: { object: pi }, livemode: false, pending_webhooks: 1, request: { id: null, idempotency_key: null }, type: 'payment_intent.succeeded' };
    const payload = JSON.stringify(event, null, 2);
    const outcomes = [];
    for (let i = 0; i < 3; i += 1) {
      const res = await postHook(payload, signed(payload));
      expect(res.status).toBe(200);
      outcomes.push(((await res.json()) as { outcome: string }).outcome);
    }
    expect(outcomes).toEqual(['applied', 'duplicate', 'duplicate']);
    const o = (await w.owner.get(`/api/purchase-orders/${id}`)).body;
    expect([o.status, o.paymentReference]).toEqual(['paid', pi.id]);
    expect(o.timeline.filter((e: { kind: string }) => e.kind === 'paid')).toHaveLength(1);
    expect(await ctx.db('webhook_events').where({ id: event.id }).count<{ n: string }[]>({ n: '*' })).toEqual([{ n: '1' }]);
    ctx.fake.setWebhook(`${ctx.appUrl}/api/webhooks/payments`, WEBHOOK_SECRET);
  });

  it('a forged, tampered, stale or missing signature is refused with 400 and changes nothing', async () => {
    ctx.fake.setWebhook(null);
    const w = await makeOrderWorld(ctx);
    const id = await placedOrder(w);
    loseAnswers();
    await w.owner.post(`/api/purchase-orders/${id}/pay`, { paymentMethodId: 'pm_card_visa' });
    const [pi] = await intentsFor(ctx.stripe, id);
    const evtId = `evt_forged_${id.slice(0, 8)}`;
    const payload = JSON.stringify({ id: evtId, object: 'event', type: 'payment_intent.succeeded', data: { object: pi }, created: 1, livemode: false }, null, 2);
    const forged = await postHook(payload, signed(payload, 'whsec_someone_else'));
    const tampered = await postHook(payload.replace('"livemode": false', '"livemode": true'), signed(payload));
    // 301 s old: past the SDK's default tolerance of 300 s.
    const stale = await postHook(payload, signed(payload, WEBHOOK_SECRET, Math.floor(Date.now() / 1000) - 301));
    const unsigned = await fetch(`${ctx.appUrl}/api/webhooks/payments`, { method: 'POST', headers: { 'content-type': 'application/json' }, body: payload });
    for (const res of [forged, tampered, stale, unsigned]) {
      expect(res.status).toBe(400);
      expect(((await res.json()) as { error: { code: string } }).error.code).toBe('bad_signature');
    }
    const o = (await w.owner.get(`/api/purchase-orders/${id}`)).body;
    expect(o.status).toBe('placed');
    expect(o.payment.status).toBe('unknown');
    expect(await ctx.db('webhook_events').where({ id: evtId })).toEqual([]);
    ctx.fake.setWebhook(`${ctx.appUrl}/api/webhooks/payments`, WEBHOOK_SECRET);
  });
});

describe('the payments service going away', () => {
  it('the fake stopped answering mid-payment: "being confirmed", then settled once it returns, with no second charge', async () => {
    ctx.fake.setWebhook(null);
    const w = await makeOrderWorld(ctx);
    const id = await placedOrder(w);
    loseAnswers();
    const r = await w.owner.post(`/api/purchase-orders/${id}/pay`, { paymentMethodId: 'pm_card_visa' });
    expect(r.status).toBe(502);
    expect(r.body.error.message).toMatch(/could not be reached/);
    const confirming = (await w.owner.get(`/api/purchase-orders/${id}`)).body;
    expect(confirming.status).toBe('placed');
    expect(confirming.payment).toMatchObject({ status: 'unknown', confirming: true });
    expect(confirming.payment.message).toMatch(/^Payment being confirmed/);
    // Pressing pay again settles the open attempt from the provider's record instead of charging.
    const again = await w.owner.post(`/api/purchase-orders/${id}/pay`, { paymentMethodId: 'pm_card_visa' });
    expect(again.status).toBe(200);
    expect(again.body.status).toBe('paid');
    expect(again.body.payment.attempt).toBe(1);
    const intents = await intentsFor(ctx.stripe, id);
    expect(intents.map((i) => i.status)).toEqual(['succeeded']);
    expect(again.body.paymentReference).toBe(intents[0].id);
    ctx.fake.setWebhook(`${ctx.appUrl}/api/webhooks/payments`, WEBHOOK_SECRET);
  });

  it('"check again" settles an unknown attempt by its idempotency key', async () => {
    ctx.fake.setWebhook(null);
    const w = await makeOrderWorld(ctx);
    const id = await placedOrder(w);
    loseAnswers();
    await w.owner.post(`/api/purchase-orders/${id}/pay`, { paymentMethodId: 'pm_card_visa_chargeDeclined' });
    const checked = await w.owner.post(`/api/purchase-orders/${id}/payment/check`);
    expect(checked.body.status).toBe('placed');
    expect(checked.body.payment).toMatchObject({ status: 'failed', code: 'generic_decline', attempt: 1 });
    expect((await intentsFor(ctx.stripe, id)).map((i) => i.status)).toEqual(['requires_payment_method']);
    ctx.fake.setWebhook(`${ctx.appUrl}/api/webhooks/payments`, WEBHOOK_SECRET);
  });

  it('no payments service at all: 502 with a clear message, the order as it was', async () => {
    const port = await freePort();
    const down = await startTestApp({ STRIPE_API_PORT: String(port), STRIPE_SECRET_KEY: 'sk_test_nobody_listens' });
    try {
      const w = await makeOrderWorld(down);
      const id = await placedOrder(w);
      const before = (await w.owner.get(`/api/purchase-orders/${id}`)).body;
      const r = await w.owner.post(`/api/purchase-orders/${id}/pay`, { paymentMethodId: 'pm_card_visa' });
      expect([r.status, r.body.error.code]).toEqual([502, 'payments_unreachable']);
      expect(r.body.error.message).toMatch(/payments service could not be reached/);
      const after = (await w.owner.get(`/api/purchase-orders/${id}`)).body;
      expect([after.status, after.total, after.version, after.paymentReference]).toEqual([before.status, before.total, before.version, null]);
    } finally {
      await down.close();
    }
  });
});

describe('events out of order', () => {
  it('an earlier snapshot of a declined intent, delivered late, leaves the attempt failed', async () => {
    const w = await makeOrderWorld(ctx);
    const id = await placedOrder(w);
    const declined = await w.owner.post(`/api/purchase-orders/${id}/pay`, { paymentMethodId: 'pm_card_visa_chargeDeclinedInsufficientFunds' });
    expect(declined.status).toBe(402);
    const [intent] = await intentsFor(ctx.stripe, id);
    // What payment_intent.created carried before confirmation: no outcome yet.
    const early = { ...intent, status: 'requires_confirmation', last_payment_error: null };
    const payload = JSON.stringify({ id: `evt_late_${Date.now()}`, object: 'event', type: 'payment_intent.created', data: { object: early }, created: Math.floor(Date.now() / 1000), livemode: false, api_version: null, pending_webhooks: 1, request: { id: null, idempotency_key: null } });
    const res = await postHook(payload, signed(payload));
    expect(res.status).toBe(200);
    const o = (await w.owner.get(`/api/purchase-orders/${id}`)).body;
    expect(o.status).toBe('placed');
    expect(o.payment).toMatchObject({ status: 'failed', code: 'insufficient_funds', confirming: false });
  });
});
