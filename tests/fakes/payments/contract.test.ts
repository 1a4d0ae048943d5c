// Contract tests of the payments fake through the official SDK (stripe@23.1.0,
// the app's version). Expected shapes, codes and classes are the SDK's own
// (src/Error.ts maps statuses to classes) and the API's published test
// payment methods and error codes.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import Stripe from 'stripe';
import { startPaymentsFake, type PaymentsFake } from '../../../fakes/payments/server';
import { rejection, sdk, testKey } from './helpers';

let fake: PaymentsFake;
beforeAll(async () => {
  fake = await startPaymentsFake({ port: 0 });
});
afterAll(async () => {
  await fake.close();
});

const card = { allowed_payment_method_types: ['card'] };

describe('encoding and shapes', () => {
  it('round-trips bracketed metadata and expands latest_charge on create and retrieve', async () => {
    const stripe = sdk(fake);
    const metadata = { order_id: 'po-7781', 'site[name]': 'Harbour Kiosk', note: 'a&b=c ü' };
    const pi = await stripe.paymentIntents.create({
      amount: 4210, currency: 'GBP', payment_method: 'pm_card_visa', confirm: true, ...card,
      description: 'PO 7781 beans', metadata, expand: ['latest_charge'],
    });
    expect(pi.id).toMatch(/^pi_[A-Za-z0-9]{24}$/);
    expect(pi.object).toBe('payment_intent');
    expect(pi.currency).toBe('gbp');
    expect(pi.metadata).toEqual(metadata);
    expect(pi.description).toBe('PO 7781 beans');
    expect(pi.livemode).toBe(false);
    expect(pi.client_secret).toMatch(new RegExp(`^${pi.id}_secret_`));
    expect(Math.abs(pi.created - Date.now() / 1000)).toBeLessThan(5);
    const charge = pi.latest_charge as Stripe.Charge;
    expect(charge.object).toBe('charge');
    expect(charge.id).toMatch(/^ch_/);
    expect(charge.amount).toBe(4210);
    expect(charge.payment_intent).toBe(pi.id);

    const again = await stripe.paymentIntents.retrieve(pi.id, { expand: ['latest_charge', 'payment_method'] });
    expect((again.latest_charge as Stripe.Charge).id).toBe(charge.id);
    expect((again.payment_method as Stripe.PaymentMethod).card?.last4).toBe('4242');
    const plain = await stripe.paymentIntents.retrieve(pi.id);
    expect(plain.latest_charge).toBe(charge.id);
  });

  it('answers every call with a Request-Id and the Stripe-Version it was sent', async () => {
    const stripe = sdk(fake);
    const customer = await stripe.customers.create({ email: 'orders@larkspur.example', name: 'Larkspur Café' });
    expect(customer.lastResponse.requestId).toMatch(/^req_[A-Za-z0-9]{14}$/);
    expect(customer.lastResponse.apiVersion).toBe(Stripe.API_VERSION);
    const err = await rejection(stripe.paymentIntents.retrieve('pi_missing'));
    expect(err.requestId).toMatch(/^req_/);
    expect(err.requestId).not.toBe(customer.lastResponse.requestId);
  });

  it('refuses unknown parameters and non-integer amounts before doing anything', async () => {
    const stripe = sdk(fake);
    const unknown = await rejection(stripe.paymentIntents.create({ amount: 500, currency: 'usd', colour: 'red' } as Stripe.PaymentIntentCreateParams));
    expect(unknown).toBeInstanceOf(Stripe.errors.StripeInvalidRequestError);
    expect(unknown.code).toBe('parameter_unknown');
    expect(unknown.param).toBe('colour');
    const notInt = await rejection(stripe.paymentIntents.create({ amount: 12.5, currency: 'usd' }));
    expect(notInt.code).toBe('parameter_invalid_integer');
    expect(notInt.param).toBe('amount');
    const missing = await rejection(stripe.paymentIntents.create({ currency: 'usd' } as Stripe.PaymentIntentCreateParams));
    expect(missing.code).toBe('parameter_missing');
    // Minimum charge for usd is 50 cents (the API's published minimums, from memory).
    const small = await rejection(stripe.paymentIntents.create({ amount: 49, currency: 'usd' }));
    expect(small.code).toBe('amount_too_small');
    expect((await stripe.paymentIntents.list()).data).toHaveLength(0);
  });

  it('requires a return_url or a no-redirect setting when confirming with automatic payment methods', async () => {
    const stripe = sdk(fake);
    const err = await rejection(stripe.paymentIntents.create({ amount: 900, currency: 'eur', payment_method: 'pm_card_visa', confirm: true }));
    expect(err).toBeInstanceOf(Stripe.errors.StripeInvalidRequestError);
    expect(err.statusCode).toBe(400);
    expect(err.param).toBe('return_url');
    const ok = await stripe.paymentIntents.create({
      amount: 900, currency: 'eur', payment_method: 'pm_card_visa', confirm: true,
      automatic_payment_methods: { enabled: true, allow_redirects: 'never' },
    });
    expect(ok.status).toBe('succeeded');
    // The name of older API versions is accepted too (the SDK's types no longer have it).
    const legacy = await stripe.paymentIntents.create({
      amount: 900, currency: 'eur', payment_method: 'pm_card_visa', confirm: true, payment_method_types: ['card'],
    } as Stripe.PaymentIntentCreateParams);
    expect(legacy.status).toBe('succeeded');
    expect(legacy.payment_method_types).toEqual(['card']);
    const allowed = await stripe.paymentIntents.create({
      amount: 900, currency: 'eur', payment_method: 'pm_card_visa', confirm: true, allowed_payment_method_types: ['card'],
    });
    expect(allowed.allowed_payment_method_types).toEqual(['card']);
    expect(allowed.automatic_payment_methods).toBeNull();
    const withUrl = await stripe.paymentIntents.create({
      amount: 900, currency: 'eur', payment_method: 'pm_card_visa', confirm: true, return_url: 'http://127.0.0.1:5173/paid',
    });
    expect(withUrl.status).toBe('succeeded');
  });
});

describe('authentication', () => {
  it('refuses a missing or malformed key with StripeAuthenticationError', async () => {
    const bad = new Stripe('sk_test_has spaces', { host: fake.host, port: fake.port, protocol: 'http' });
    const err = await rejection(bad.customers.create({}));
    expect(err).toBeInstanceOf(Stripe.errors.StripeAuthenticationError);
    expect(err.statusCode).toBe(401);
    expect(err.rawType).toBe('invalid_request_error');
    const live = new Stripe('sk_live_abcdef123456', { host: fake.host, port: fake.port, protocol: 'http' });
    expect(await rejection(live.customers.create({}))).toBeInstanceOf(Stripe.errors.StripeAuthenticationError);
    const res = await fetch(`${fake.url}/v1/customers`, { method: 'POST' });
    expect(res.status).toBe(401);
    expect(res.headers.get('request-id')).toMatch(/^req_/);
  });

  it('keeps each API key’s objects apart', async () => {
    const a = sdk(fake);
    const b = sdk(fake);
    const pi = await a.paymentIntents.create({ amount: 700, currency: 'usd' });
    const err = await rejection(b.paymentIntents.retrieve(pi.id));
    expect(err.statusCode).toBe(404);
    expect(err.code).toBe('resource_missing');
    expect(err.message).toBe(`No such payment_intent: '${pi.id}'`);
  });
});

describe('test payment methods', () => {
  it('pm_card_visa succeeds with a paid charge', async () => {
    const stripe = sdk(fake);
    const pi = await stripe.paymentIntents.create({
      amount: 1999, currency: 'usd', payment_method: 'pm_card_visa', confirm: true, ...card, expand: ['latest_charge'],
    });
    expect(pi.status).toBe('succeeded');
    expect(pi.amount_received).toBe(1999);
    expect(pi.payment_method).toMatch(/^pm_/);
    expect(pi.payment_method).not.toBe('pm_card_visa');
    const charge = pi.latest_charge as Stripe.Charge;
    expect(charge.paid).toBe(true);
    expect(charge.status).toBe('succeeded');
    expect(charge.payment_method_details?.card?.brand).toBe('visa');
  });

  it.each([
    ['pm_card_visa_chargeDeclined', 'generic_decline'],
    ['pm_card_chargeDeclined', 'generic_decline'],
    ['pm_card_visa_chargeDeclinedInsufficientFunds', 'insufficient_funds'],
    ['pm_card_chargeDeclinedInsufficientFunds', 'insufficient_funds'],
  ])('%s is declined with StripeCardError %s and the intent is kept', async (pm, declineCode) => {
    const stripe = sdk(fake);
    const err = (await rejection(stripe.paymentIntents.create({
      amount: 2500, currency: 'usd', payment_method: pm, confirm: true, ...card, metadata: { order_id: 'po-1' },
    }))) as Stripe.errors.StripeCardError;
    expect(err).toBeInstanceOf(Stripe.errors.StripeCardError);
    expect(err.statusCode).toBe(402);
    expect(err.code).toBe('card_declined');
    expect(err.decline_code).toBe(declineCode);
    expect(err.charge).toMatch(/^ch_/);
    const pi = err.payment_intent as Stripe.PaymentIntent;
    expect(pi.status).toBe('requires_payment_method');
    expect(pi.last_payment_error?.decline_code).toBe(declineCode);
    const stored = await stripe.paymentIntents.retrieve(pi.id, { expand: ['latest_charge'] });
    expect(stored.status).toBe('requires_payment_method');
    expect(stored.amount_received).toBe(0);
    expect(stored.last_payment_error?.code).toBe('card_declined');
    expect((stored.latest_charge as Stripe.Charge).paid).toBe(false);
    expect((stored.latest_charge as Stripe.Charge).status).toBe('failed');
  });

  it('a declined intent can be confirmed again with a working card', async () => {
    const stripe = sdk(fake);
    const err = (await rejection(stripe.paymentIntents.create({
      amount: 3100, currency: 'usd', payment_method: 'pm_card_chargeDeclined', confirm: true, ...card,
    }))) as Stripe.errors.StripeCardError;
    const id = (err.payment_intent as Stripe.PaymentIntent).id;
    const paid = await stripe.paymentIntents.confirm(id, { payment_method: 'pm_card_visa' });
    expect(paid.status).toBe('succeeded');
    expect(paid.last_payment_error).toBeNull();
    const twice = await rejection(stripe.paymentIntents.confirm(id));
    expect(twice).toBeInstanceOf(Stripe.errors.StripeInvalidRequestError);
    expect(twice.code).toBe('payment_intent_unexpected_state');
  });

  it('pm_card_authenticationRequired asks for action, completed through the test route', async () => {
    const stripe = sdk(fake);
    const pi = await stripe.paymentIntents.create({
      amount: 5400, currency: 'eur', payment_method: 'pm_card_authenticationRequired', confirm: true,
      return_url: 'http://127.0.0.1:5173/orders/paid',
    });
    expect(pi.status).toBe('requires_action');
    expect(pi.next_action?.type).toBe('redirect_to_url');
    expect(pi.next_action?.redirect_to_url?.return_url).toBe('http://127.0.0.1:5173/orders/paid');
    expect(pi.next_action?.redirect_to_url?.url).toBe(`${fake.url}/__fake/authenticate/${pi.id}`);

    const res = await fetch(`${fake.url}/__fake/payment_intents/${pi.id}/authenticate`, {
      method: 'POST', headers: { 'content-type': 'application/json' }, body: JSON.stringify({ result: 'succeed' }),
    });
    expect(res.status).toBe(200);
    expect(((await res.json()) as Stripe.PaymentIntent).status).toBe('succeeded');
    const done = await stripe.paymentIntents.retrieve(pi.id, { expand: ['latest_charge'] });
    expect(done.status).toBe('succeeded');
    expect(done.amount_received).toBe(5400);
    expect((done.latest_charge as Stripe.Charge).paid).toBe(true);
  });

  it('a failed authentication leaves the intent needing a payment method', async () => {
    const stripe = sdk(fake);
    const pi = await stripe.paymentIntents.create({
      amount: 5400, currency: 'eur', payment_method: 'pm_card_authenticationRequired', confirm: true, ...card,
    });
    expect(pi.status).toBe('requires_action');
    expect(pi.next_action?.type).toBe('use_stripe_sdk');
    const res = await fetch(`${fake.url}/__fake/payment_intents/${pi.id}/authenticate`, {
      method: 'POST', headers: { 'content-type': 'application/json' }, body: JSON.stringify({ result: 'fail' }),
    });
    expect(res.status).toBe(200);
    const failed = await stripe.paymentIntents.retrieve(pi.id);
    expect(failed.status).toBe('requires_payment_method');
    expect(failed.last_payment_error?.code).toBe('payment_intent_authentication_failure');
    expect(failed.latest_charge).toBeNull();
  });

  it('off_session with an authentication-required card fails with 402 authentication_required', async () => {
    const stripe = sdk(fake);
    const customer = await stripe.customers.create({ email: 'owner@larkspur.example' });
    const pm = await stripe.paymentMethods.attach('pm_card_authenticationRequired', { customer: customer.id });
    const err = (await rejection(stripe.paymentIntents.create({
      amount: 8800, currency: 'usd', customer: customer.id, payment_method: pm.id, confirm: true, off_session: true, ...card,
    }))) as Stripe.errors.StripeCardError;
    expect(err).toBeInstanceOf(Stripe.errors.StripeCardError);
    expect(err.code).toBe('authentication_required');
    expect((err.payment_intent as Stripe.PaymentIntent).status).toBe('requires_payment_method');
  });
});

describe('customers and payment methods', () => {
  it('attaches a test card, sets it as the default and charges it off session', async () => {
    const stripe = sdk(fake);
    const customer = await stripe.customers.create({ email: 'books@larkspur.example', name: 'Larkspur Café', metadata: { business_id: 'b-12' } });
    expect(customer.id).toMatch(/^cus_/);
    expect(customer.invoice_settings.default_payment_method).toBeNull();
    const pm = await stripe.paymentMethods.attach('pm_card_visa', { customer: customer.id });
    expect(pm.id).toMatch(/^pm_/);
    expect(pm.customer).toBe(customer.id);
    expect(pm.card).toMatchObject({ brand: 'visa', last4: '4242' });
    expect(pm.card?.exp_year).toBeGreaterThan(new Date().getUTCFullYear());
    const updated = await stripe.customers.update(customer.id, { invoice_settings: { default_payment_method: pm.id } });
    expect(updated.invoice_settings.default_payment_method).toBe(pm.id);
    const fetched = await stripe.customers.retrieve(customer.id) as Stripe.Customer;
    expect(fetched.email).toBe('books@larkspur.example');
    expect(fetched.metadata).toEqual({ business_id: 'b-12' });
    expect((await stripe.paymentMethods.retrieve(pm.id)).customer).toBe(customer.id);

    const pi = await stripe.paymentIntents.create({
      amount: 15075, currency: 'usd', customer: customer.id, payment_method: pm.id, confirm: true, off_session: true, ...card,
    });
    expect(pi.status).toBe('succeeded');
    expect(pi.customer).toBe(customer.id);
    const other = await stripe.customers.create({});
    const wrongOwner = await rejection(stripe.paymentIntents.create({
      amount: 1000, currency: 'usd', customer: other.id, payment_method: pm.id, confirm: true, ...card,
    }));
    expect(wrongOwner.statusCode).toBe(400);
  });

  it('answers 400 resource_missing for an unknown customer parameter and 404 for an unknown id in the URL', async () => {
    const stripe = sdk(fake);
    const param = await rejection(stripe.paymentIntents.create({ amount: 1000, currency: 'usd', customer: 'cus_nope' }));
    expect(param).toBeInstanceOf(Stripe.errors.StripeInvalidRequestError);
    expect(param.statusCode).toBe(400);
    expect(param.code).toBe('resource_missing');
    expect(param.param).toBe('customer');
    const url = await rejection(stripe.customers.retrieve('cus_nope'));
    expect(url.statusCode).toBe(404);
    expect(url.message).toBe("No such customer: 'cus_nope'");
    const pm = await rejection(stripe.paymentMethods.retrieve('pm_nope'));
    expect(pm.statusCode).toBe(404);
  });
});

describe('refunds', () => {
  async function paid(stripe: Stripe, amount: number) {
    return stripe.paymentIntents.create({ amount, currency: 'usd', payment_method: 'pm_card_visa', confirm: true, ...card });
  }

  it('refunds what is left by default', async () => {
    const stripe = sdk(fake);
    const pi = await paid(stripe, 6000);
    const refund = await stripe.refunds.create({ payment_intent: pi.id, reason: 'requested_by_customer', metadata: { why: 'short delivery' } });
    expect(refund.id).toMatch(/^re_/);
    expect(refund.amount).toBe(6000);
    expect(refund.status).toBe('succeeded');
    expect(refund.charge).toBe(pi.latest_charge);
    expect(refund.payment_intent).toBe(pi.id);
    expect(refund.metadata).toEqual({ why: 'short delivery' });
    const charge = await stripe.charges.retrieve(pi.latest_charge as string);
    expect(charge.amount_refunded).toBe(6000);
    expect(charge.refunded).toBe(true);
  });

  it('refunds partially, then refuses more than is left and anything after the whole', async () => {
    const stripe = sdk(fake);
    const pi = await paid(stripe, 6000);
    const first = await stripe.refunds.create({ payment_intent: pi.id, amount: 2500 });
    expect(first.amount).toBe(2500);
    let charge = await stripe.charges.retrieve(pi.latest_charge as string);
    expect(charge.amount_refunded).toBe(2500);
    expect(charge.refunded).toBe(false);

    const tooMuch = await rejection(stripe.refunds.create({ charge: charge.id, amount: 3501 }));
    expect(tooMuch).toBeInstanceOf(Stripe.errors.StripeInvalidRequestError);
    expect(tooMuch.code).toBe('amount_too_large');
    const rest = await stripe.refunds.create({ charge: charge.id });
    expect(rest.amount).toBe(3500);
    charge = await stripe.charges.retrieve(charge.id);
    expect(charge.refunded).toBe(true);

    const again = await rejection(stripe.refunds.create({ payment_intent: pi.id }));
    expect(again).toBeInstanceOf(Stripe.errors.StripeInvalidRequestError);
    expect(again.code).toBe('charge_already_refunded');
  });

  it('refuses to refund an intent that has not succeeded', async () => {
    const stripe = sdk(fake);
    const pi = await stripe.paymentIntents.create({ amount: 1200, currency: 'usd' });
    const err = await rejection(stripe.refunds.create({ payment_intent: pi.id }));
    expect(err.code).toBe('payment_intent_unexpected_state');
  });
});

describe('listing payment intents', () => {
  it('lists newest first, filters by customer and pages with starting_after and ending_before', async () => {
    const stripe = sdk(fake);
    const customer = await stripe.customers.create({});
    const ids: string[] = [];
    for (let i = 0; i < 5; i += 1) {
      ids.push((await stripe.paymentIntents.create({ amount: 100 + i, currency: 'usd', customer: customer.id })).id);
    }
    await stripe.paymentIntents.create({ amount: 999, currency: 'usd' });
    const newestFirst = [...ids].reverse();

    const first = await stripe.paymentIntents.list({ customer: customer.id, limit: 2 });
    expect(first.object).toBe('list');
    expect(first.url).toBe('/v1/payment_intents');
    expect(first.data.map((p) => p.id)).toEqual(newestFirst.slice(0, 2));
    expect(first.has_more).toBe(true);
    const second = await stripe.paymentIntents.list({ customer: customer.id, limit: 2, starting_after: first.data[1].id });
    expect(second.data.map((p) => p.id)).toEqual(newestFirst.slice(2, 4));
    const last = await stripe.paymentIntents.list({ customer: customer.id, limit: 2, starting_after: second.data[1].id });
    expect(last.data.map((p) => p.id)).toEqual(newestFirst.slice(4));
    expect(last.has_more).toBe(false);
    const back = await stripe.paymentIntents.list({ customer: customer.id, limit: 2, ending_before: last.data[0].id });
    expect(back.data.map((p) => p.id)).toEqual(newestFirst.slice(2, 4));
    expect(back.has_more).toBe(true);

    const all = await stripe.paymentIntents.list({ customer: customer.id, limit: 2 }).autoPagingToArray({ limit: 20 });
    expect(all.map((p) => p.id)).toEqual(newestFirst);
    expect((await stripe.paymentIntents.list({ limit: 100 })).data).toHaveLength(6);
  });

  it('filters by created range and expands data.latest_charge', async () => {
    const stripe = sdk(fake);
    const pi = await stripe.paymentIntents.create({ amount: 450, currency: 'usd', payment_method: 'pm_card_visa', confirm: true, ...card });
    const inRange = await stripe.paymentIntents.list({ created: { gte: pi.created, lte: pi.created }, expand: ['data.latest_charge'] });
    expect(inRange.data.map((p) => p.id)).toEqual([pi.id]);
    expect((inRange.data[0].latest_charge as Stripe.Charge).paid).toBe(true);
    const later = await stripe.paymentIntents.list({ created: { gt: pi.created } });
    expect(later.data).toHaveLength(0);
    const badLimit = await rejection(stripe.paymentIntents.list({ limit: 101 }));
    expect(badLimit.statusCode).toBe(400);
  });
});

describe('developer page', () => {
  it('lists recent payment intents with status, amount, currency and metadata', async () => {
    const key = testKey();
    const stripe = sdk(fake, key);
    const pi = await stripe.paymentIntents.create({ amount: 12345, currency: 'usd', metadata: { order_id: 'po-<script>' } });
    const html = await (await fetch(`${fake.url}/`)).text();
    expect(html).toContain(pi.id);
    expect(html).toContain('requires_payment_method');
    expect(html).toContain('123.45');
    expect(html).toContain('USD');
    expect(html).toContain('order_id=po-&lt;script&gt;');
  });
});
