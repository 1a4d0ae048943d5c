// Webhook signatures are checked against the SDK's own helpers (stripe@23.1.0
// src/Webhooks.ts: generateTestHeaderString and constructEvent, default
// tolerance 300 s), never against a copy of the fake's code.
import { afterAll, afterEach, beforeAll, describe, expect, it, vi } from 'vitest';
import Stripe from 'stripe';
import { startPaymentsFake, type PaymentsFake } from '../../../fakes/payments/server';
import { sdk, startReceiver } from './helpers';

const secret = 'whsec_tests_4f1b2c9d8e7a';
let fake: PaymentsFake;
const receivers: Awaited<ReturnType<typeof startReceiver>>[] = [];

async function receiver(answer?: (n: number) => number, holdMs?: (n: number) => number) {
  const r = await startReceiver(answer, holdMs);
  receivers.push(r);
  fake.setWebhook(r.url, secret);
  return r;
}

beforeAll(async () => {
  fake = await startPaymentsFake({ port: 0, webhookSecret: secret, webhookRetryDelaysMs: [20, 40, 60], webhookTimeoutMs: 300 });
});
afterEach(() => {
  fake.setWebhook(null);
});
afterAll(async () => {
  await fake.close();
  await Promise.all(receivers.map((r) => r.close()));
});

const card = { allowed_payment_method_types: ['card'] };
const tsOf = (header: string) => Number(/t=(\d+)/.exec(header)?.[1]);

describe('signatures', () => {
  it('signs exactly as generateTestHeaderString does and constructEvent accepts the raw body', async () => {
    const r = await receiver();
    const stripe = sdk(fake);
    const pi = await stripe.paymentIntents.create({ amount: 3300, currency: 'usd', payment_method: 'pm_card_visa', confirm: true, ...card });
    await fake.flushWebhooks();
    const delivered = r.ofType('payment_intent.succeeded');
    expect(delivered).toHaveLength(1);
    const { raw, signature } = delivered[0];
    const timestamp = tsOf(signature);
    expect(Math.abs(timestamp - Date.now() / 1000)).toBeLessThan(5);
    expect(signature).toBe(stripe.webhooks.generateTestHeaderString({ payload: raw, secret, timestamp }));

    const event = stripe.webhooks.constructEvent(raw, signature, secret);
    expect(event.type).toBe('payment_intent.succeeded');
    expect(event.id).toMatch(/^evt_/);
    expect(event.object).toBe('event');
    expect(event.livemode).toBe(false);
    expect(event.pending_webhooks).toBe(1);
    expect(event.api_version).toBe(Stripe.API_VERSION);
    expect(event.request).toEqual({ id: pi.lastResponse.requestId, idempotency_key: expect.stringMatching(/^stripe-node-retry-/) });
    const obj = event.data.object as Stripe.PaymentIntent;
    expect(obj.id).toBe(pi.id);
    expect(obj.status).toBe('succeeded');
    // Pretty-printed on purpose: re-serialising the parsed body changes the bytes.
    expect(raw).toBe(JSON.stringify(JSON.parse(raw), null, 2));
  });

  it('sends the events of a payment, a decline and a refund', async () => {
    const r = await receiver();
    const stripe = sdk(fake);
    const pi = await stripe.paymentIntents.create({ amount: 1800, currency: 'usd', payment_method: 'pm_card_visa', confirm: true, ...card });
    await stripe.refunds.create({ payment_intent: pi.id, amount: 800 });
    await stripe.paymentIntents.create({ amount: 1800, currency: 'usd', payment_method: 'pm_card_chargeDeclined', confirm: true, ...card }).catch(() => null);
    await stripe.paymentIntents.create({ amount: 1800, currency: 'usd', payment_method: 'pm_card_authenticationRequired', confirm: true, ...card });
    await fake.flushWebhooks();
    const types = r.received.map((x) => x.event.type);
    for (const t of ['payment_intent.created', 'charge.succeeded', 'payment_intent.succeeded', 'refund.created', 'charge.refunded',
      'charge.failed', 'payment_intent.payment_failed', 'payment_intent.requires_action']) {
      expect(types).toContain(t);
    }
    const refunded = r.ofType('charge.refunded')[0].event.data.object as unknown as Stripe.Charge;
    expect(refunded.amount_refunded).toBe(800);
    const failed = r.ofType('payment_intent.payment_failed')[0].event.data.object as unknown as Stripe.PaymentIntent;
    expect(failed.last_payment_error?.decline_code).toBe('generic_decline');
    for (const x of r.received) expect(() => stripe.webhooks.constructEvent(x.raw, x.signature, secret)).not.toThrow();
  });

  it('a tampered or re-serialised body, a wrong secret or a stale timestamp is refused by constructEvent', async () => {
    const r = await receiver();
    const stripe = sdk(fake);
    await stripe.paymentIntents.create({ amount: 2100, currency: 'usd' });
    await fake.flushWebhooks();
    const { raw, signature } = r.ofType('payment_intent.created')[0];
    const verify = (body: string, header = signature, key = secret, receivedAt?: number) =>
      () => stripe.webhooks.constructEvent(body, header, key, undefined, undefined, receivedAt);
    expect(verify(raw.replace('"amount": 2100', '"amount": 1'))).toThrow(Stripe.errors.StripeSignatureVerificationError);
    expect(verify(JSON.stringify(JSON.parse(raw)))).toThrow(Stripe.errors.StripeSignatureVerificationError);
    expect(verify(raw, signature, 'whsec_someone_else')).toThrow(Stripe.errors.StripeSignatureVerificationError);
    const stale = (tsOf(signature) + 301) * 1000;
    expect(verify(raw, signature, secret, stale)).toThrow(/tolerance/);
    expect(verify(raw, signature, secret, (tsOf(signature) + 299) * 1000)).not.toThrow();
  });
});

describe('delivery', () => {
  it('retries a failing receiver with the same event id and body, each attempt signed', async () => {
    const r = await receiver((n) => (n <= 2 ? 500 : 200));
    const stripe = sdk(fake);
    await stripe.customers.create({ email: 'retry@larkspur.example' });
    await vi.waitFor(() => expect(r.received).toHaveLength(3), { timeout: 3000, interval: 10 });
    const ids = new Set(r.received.map((x) => x.event.id));
    expect(ids.size).toBe(1);
    expect(new Set(r.received.map((x) => x.raw)).size).toBe(1);
    for (const x of r.received) expect(() => stripe.webhooks.constructEvent(x.raw, x.signature, secret)).not.toThrow();
    await new Promise((res) => setTimeout(res, 150));
    expect(r.received).toHaveLength(3);
  });

  it('gives up after three retries', async () => {
    const r = await receiver(() => 503);
    const stripe = sdk(fake);
    await stripe.customers.create({});
    await vi.waitFor(() => expect(r.received).toHaveLength(4), { timeout: 3000, interval: 10 });
    await new Promise((res) => setTimeout(res, 200));
    await fake.flushWebhooks();
    expect(r.received).toHaveLength(4);
    const log = (await (await fetch(`${fake.url}/__fake/webhooks`)).json()) as { event: string; state: string; attempts: unknown[] }[];
    const entry = log.find((d) => d.event === r.received[0].event.id);
    expect(entry?.state).toBe('failed');
    expect(entry?.attempts).toHaveLength(4);
  });

  it('retries a receiver that times out', async () => {
    // The first answer comes after the fake's 300 ms timeout; the second at once.
    const r = await receiver(() => 200, (n) => (n === 1 ? 600 : 0));
    await sdk(fake).customers.create({});
    await vi.waitFor(() => expect(r.received).toHaveLength(2), { timeout: 3000, interval: 10 });
    expect(r.received[1].event.id).toBe(r.received[0].event.id);
    await fake.flushWebhooks(); // waits for the attempt in flight to record its answer
    const log = (await (await fetch(`${fake.url}/__fake/webhooks`)).json()) as { event: string; state: string; attempts: { error: string | null }[] }[];
    const entry = log.find((d) => d.event === r.received[0].event.id);
    expect(entry?.state).toBe('delivered');
    expect(entry?.attempts[0].error).toMatch(/TimeoutError/);
  });

  it('flushWebhooks sends pending deliveries at once, retries included, and waits for them', async () => {
    const own = await startPaymentsFake({ port: 0, webhookSecret: secret, webhookRetryDelaysMs: [60_000] });
    const r = await startReceiver((n) => (n === 1 ? 500 : 200));
    receivers.push(r);
    try {
      own.setWebhook(r.url);
      await sdk(own).customers.create({ name: 'Flush Test' });
      // The first flush waits for the first attempt (refused); the second sends the retry now, not in a minute.
      await own.flushWebhooks();
      expect(r.received).toHaveLength(1);
      await own.flushWebhooks();
      expect(r.received).toHaveLength(2);
      expect(r.received[1].event.id).toBe(r.received[0].event.id);
    } finally {
      await own.close();
    }
  });

  it('sends nothing when no URL is set', async () => {
    const r = await receiver();
    fake.setWebhook(null);
    await sdk(fake).customers.create({});
    await fake.flushWebhooks();
    expect(r.received).toHaveLength(0);
  });
});
