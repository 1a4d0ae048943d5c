// Idempotency and faults through the official SDK (stripe@23.1.0). The SDK
// puts an Idempotency-Key on every POST and retries connection errors, 409 and
// 5xx with the same key (its src/RequestSender.ts); the fake must leave exactly
// one intent whatever happens in between.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import Stripe from 'stripe';
import { startPaymentsFake, type PaymentsFake } from '../../../fakes/payments/server';
import { attempts, rejection, sdk, startReceiver, testKey } from './helpers';

let fake: PaymentsFake;
let receiver: Awaited<ReturnType<typeof startReceiver>>;
beforeAll(async () => {
  receiver = await startReceiver();
  fake = await startPaymentsFake({ port: 0, webhookUrl: receiver.url, webhookSecret: 'whsec_idem_tests', webhookRetryDelaysMs: [20, 40, 80] });
});
afterAll(async () => {
  await fake.close();
  await receiver.close();
});

const create = 'POST /v1/payment_intents';
const params = (orderId: string): Stripe.PaymentIntentCreateParams => ({
  amount: 2750, currency: 'usd', payment_method: 'pm_card_visa', confirm: true, allowed_payment_method_types: ['card'],
  metadata: { order_id: orderId },
});

function eventsFor(intentId: string, type: string) {
  return receiver.ofType(type).filter((r) => r.event.data.object.id === intentId);
}

describe('replays', () => {
  it('replays the saved response with Idempotent-Replayed and Original-Request, without a second charge or webhook', async () => {
    const stripe = sdk(fake);
    const key = `po-${testKey()}`;
    const first = await stripe.paymentIntents.create(params('po-1'), { idempotencyKey: key });
    const second = await stripe.paymentIntents.create(params('po-1'), { idempotencyKey: key });
    expect(second.id).toBe(first.id);
    expect(second.latest_charge).toBe(first.latest_charge);
    const headers = second.lastResponse.headers;
    expect(headers['idempotent-replayed']).toBe('true');
    expect(headers['original-request']).toBe(first.lastResponse.requestId);
    expect(second.lastResponse.requestId).not.toBe(first.lastResponse.requestId);
    expect(first.lastResponse.headers['idempotent-replayed']).toBeUndefined();
    expect((await stripe.paymentIntents.list()).data).toHaveLength(1);

    await fake.flushWebhooks();
    expect(eventsFor(first.id, 'payment_intent.succeeded')).toHaveLength(1);
    expect(eventsFor(first.id, 'payment_intent.created')).toHaveLength(1);
    expect(eventsFor(first.id, 'payment_intent.succeeded')[0].event.request).toEqual({
      id: first.lastResponse.requestId, idempotency_key: key,
    });
  });

  it('replays a 402 decline as the same StripeCardError', async () => {
    const stripe = sdk(fake);
    const key = `decline-${testKey()}`;
    const body = { ...params('po-2'), payment_method: 'pm_card_chargeDeclined' };
    const first = (await rejection(stripe.paymentIntents.create(body, { idempotencyKey: key }))) as Stripe.errors.StripeCardError;
    const second = (await rejection(stripe.paymentIntents.create(body, { idempotencyKey: key }))) as Stripe.errors.StripeCardError;
    expect(second).toBeInstanceOf(Stripe.errors.StripeCardError);
    expect(second.decline_code).toBe('generic_decline');
    expect((second.payment_intent as Stripe.PaymentIntent).id).toBe((first.payment_intent as Stripe.PaymentIntent).id);
    expect(second.headers?.['idempotent-replayed']).toBe('true');
    expect((await stripe.paymentIntents.list()).data).toHaveLength(1);
  });

  it('does not save parameter-validation errors, so the key can be used again', async () => {
    const stripe = sdk(fake);
    const key = `fixup-${testKey()}`;
    const bad = await rejection(stripe.paymentIntents.create({ ...params('po-3'), amount: 10 }, { idempotencyKey: key }));
    expect(bad.code).toBe('amount_too_small');
    const good = await stripe.paymentIntents.create(params('po-3'), { idempotencyKey: key });
    expect(good.status).toBe('succeeded');
    expect(good.lastResponse.headers['idempotent-replayed']).toBeUndefined();
  });

  it('answers StripeIdempotencyError for other parameters or another endpoint with the same key', async () => {
    const stripe = sdk(fake);
    const key = `mismatch-${testKey()}`;
    await stripe.paymentIntents.create(params('po-4'), { idempotencyKey: key });
    const otherParams = await rejection(stripe.paymentIntents.create(params('po-5'), { idempotencyKey: key }));
    expect(otherParams).toBeInstanceOf(Stripe.errors.StripeIdempotencyError);
    expect(otherParams.statusCode).toBe(400);
    expect(otherParams.rawType).toBe('idempotency_error');
    const otherEndpoint = await rejection(stripe.customers.create({ email: 'x@larkspur.example' }, { idempotencyKey: key }));
    expect(otherEndpoint).toBeInstanceOf(Stripe.errors.StripeIdempotencyError);
    expect((await stripe.paymentIntents.list()).data).toHaveLength(1);
  });

  it('keeps keys per API key', async () => {
    const key = `shared-${testKey()}`;
    const a = await sdk(fake).paymentIntents.create(params('po-6'), { idempotencyKey: key });
    const b = await sdk(fake).paymentIntents.create(params('po-7'), { idempotencyKey: key });
    expect(b.id).not.toBe(a.id);
  });
});

describe('a key still in flight', () => {
  it('answers 409 idempotency_key_in_use while the first request runs', async () => {
    const stripe = sdk(fake, testKey(), { maxNetworkRetries: 0 });
    fake.setDelay(create, 400);
    try {
      const key = `slow-${testKey()}`;
      const first = stripe.paymentIntents.create(params('po-8'), { idempotencyKey: key });
      await new Promise((r) => setTimeout(r, 100));
      const err = await rejection(stripe.paymentIntents.create(params('po-8'), { idempotencyKey: key }));
      expect(err).toBeInstanceOf(Stripe.errors.StripeAPIError);
      expect(err.statusCode).toBe(409);
      expect(err.code).toBe('idempotency_key_in_use');
      expect((await first).status).toBe('succeeded');
    } finally {
      fake.setDelay(create, 0);
    }
  });

  it('the SDK retries the 409 and ends with the replayed result', async () => {
    const stripe = sdk(fake);
    const sent = attempts(stripe);
    fake.setDelay(create, 800);
    try {
      const key = `retry409-${testKey()}`;
      const first = stripe.paymentIntents.create(params('po-9'), { idempotencyKey: key });
      await new Promise((r) => setTimeout(r, 100));
      const second = await stripe.paymentIntents.create(params('po-9'), { idempotencyKey: key });
      const original = await first;
      expect(second.id).toBe(original.id);
      expect(second.lastResponse.headers['idempotent-replayed']).toBe('true');
      // The first call, then at least two attempts of the second: a 409, then the replay.
      expect(sent.filter((k) => k === key).length).toBeGreaterThanOrEqual(3);
      expect((await stripe.paymentIntents.list()).data).toHaveLength(1);
    } finally {
      fake.setDelay(create, 0);
    }
  });
});

describe('faults', () => {
  it('a 500 before the endpoint ran: the SDK retries with the same key and one intent exists', async () => {
    const stripe = sdk(fake);
    const keys = attempts(stripe);
    fake.failNext(create, 'http500');
    const pi = await stripe.paymentIntents.create(params('po-10'));
    expect(pi.status).toBe('succeeded');
    // Nothing was saved by the failed attempt, so the retry ran afresh.
    expect(pi.lastResponse.headers['idempotent-replayed']).toBeUndefined();
    expect(keys).toHaveLength(2);
    expect(keys[0]).toMatch(/^stripe-node-retry-/);
    expect(keys[1]).toBe(keys[0]);
    const all = await stripe.paymentIntents.list();
    expect(all.data.map((p) => p.id)).toEqual([pi.id]);
  });

  it('a dropped connection after the save: the retry replays it and one intent, one charge, one webhook exist', async () => {
    const stripe = sdk(fake);
    const sent = attempts(stripe);
    const key = `drop-${testKey()}`;
    fake.failNext(create, 'dropAfterSave');
    const pi = await stripe.paymentIntents.create(params('po-11'), { idempotencyKey: key });
    expect(pi.status).toBe('succeeded');
    expect(pi.lastResponse.headers['idempotent-replayed']).toBe('true');
    expect(sent).toEqual([key, key]);
    const all = await stripe.paymentIntents.list();
    expect(all.data.map((p) => p.id)).toEqual([pi.id]);
    await fake.flushWebhooks();
    expect(eventsFor(pi.id, 'payment_intent.succeeded')).toHaveLength(1);
  });

  it('a dropped connection with retries off still gets the one retry the SDK makes for closed connections', async () => {
    const stripe = sdk(fake, testKey(), { maxNetworkRetries: 0 });
    fake.failNext(create, 'dropAfterSave');
    const pi = await stripe.paymentIntents.create(params('po-12'));
    expect(pi.lastResponse.headers['idempotent-replayed']).toBe('true');
    expect((await stripe.paymentIntents.list()).data).toHaveLength(1);
  });

  it('a 500 with retries off surfaces as StripeAPIError and leaves no intent', async () => {
    const stripe = sdk(fake, testKey(), { maxNetworkRetries: 0 });
    fake.failNext(create, 'http500');
    const err = await rejection(stripe.paymentIntents.create(params('po-13')));
    expect(err).toBeInstanceOf(Stripe.errors.StripeAPIError);
    expect(err.statusCode).toBe(500);
    expect((await stripe.paymentIntents.list()).data).toHaveLength(0);
  });
});
