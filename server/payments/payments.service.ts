import type { Knex } from 'knex';
import Stripe from 'stripe';
import type { AppDeps } from '../platform/deps';
import type { SessionUser } from '../auth/roles';
import { AppError, badGateway, conflict, invalidInput, notFound, paymentFailed } from '../platform/errors';
import { toMinorUnits } from '../../src/shared/ordering';
import { writeMoney } from '../../src/shared/money';
import { addEvent, findOrder, type OrderRow } from '../orders/orders.repo';
import {
  findPayment, insertPayment, latestPayment, paymentByIntent, paymentByKey, recordWebhookEvent, savedCard, updatePayment,
  type PaymentRow, type PaymentStatus,
} from './payments.repo';
import { outcomeUnknown, paymentsClient } from './stripe-client';

/** The payment method ids published for test mode that the pay dialog offers. */
export const TEST_CARDS = [
  { id: 'pm_card_visa', label: 'Test card that pays' },
  { id: 'pm_card_visa_chargeDeclined', label: 'Test card that is declined' },
  { id: 'pm_card_visa_chargeDeclinedInsufficientFunds', label: 'Test card without enough funds' },
  { id: 'pm_card_authenticationRequired', label: 'Test card that needs the cardholder to confirm' },
] as const;
const TEST_IDS: ReadonlySet<string> = new Set(TEST_CARDS.map((c) => c.id));

/** A pending attempt older than this is treated as unknown (the server may have stopped mid-call). */
export const PENDING_STALE_MS = 60_000;

const DECLINE_WORDS: Record<string, string> = {
  generic_decline: 'The card was declined by the bank that issued it. Try another card, or ask the bank why.',
  insufficient_funds: 'The card was declined because there is not enough money on it. Try another card.',
  card_declined: 'The card was declined. Try another card.',
  expired_card: 'The card has expired. Save a current card and try again.',
  authentication_required: 'The card needs the cardholder to confirm the payment with their bank.',
};

export const UNKNOWN_MESSAGE = 'Payment being confirmed: we have not yet heard back whether the card was charged. Nothing more will be charged; check again in a minute.';
const ACTION_MESSAGE = 'The card needs the cardholder to confirm this payment with their bank before it can be charged.';

export function declineWords(code: string | null | undefined, fallback?: string): string {
  return (code && DECLINE_WORDS[code]) || fallback || DECLINE_WORDS.card_declined;
}

/** The idempotency key of one attempt to pay one order: a retry of the attempt replays, never charges again. */
export function attemptKey(orderId: string, attempt: number): string {
  return `purchase-order-${orderId}-attempt-${attempt}`;
}

/** The PaymentIntent parameters of an attempt, rebuilt identically from its row whenever it is re-sent. */
function intentParams(p: PaymentRow, order: Pick<OrderRow, 'id' | 'number' | 'business_id'>): Stripe.PaymentIntentCreateParams {
  return {
    amount: Number(p.amount_minor),
    currency: p.currency.toLowerCase(),
    payment_method: p.payment_method_id ?? undefined,
    ...(p.customer_id ? { customer: p.customer_id } : {}),
    confirm: true,
    // Confirmed here on the server: no redirect-based methods, so no return_url.
    automatic_payment_methods: { enabled: true, allow_redirects: 'never' },
    description: `Purchase order ${order.number}`,
    metadata: { order_id: order.id, order_number: order.number, business_id: order.business_id, attempt: String(p.attempt), payment_key: p.idempotency_key },
    expand: ['latest_charge'],
  };
}

function nextActionUrl(pi: Stripe.PaymentIntent): string | null {
  const na = pi.next_action;
  if (!na) return null;
  if (na.redirect_to_url?.url) return na.redirect_to_url.url;
  const sdk = na.use_stripe_sdk as { stripe_js?: string } | undefined;
  return typeof sdk?.stripe_js === 'string' ? sdk.stripe_js : null;
}

function cardWords(pi: Stripe.PaymentIntent): string {
  const pm = pi.payment_method;
  const charge = pi.latest_charge;
  const card = (typeof charge === 'object' && charge?.payment_method_details?.card) || (typeof pm === 'object' && pm?.card) || null;
  return card ? ` with the ${card.brand} card ending ${card.last4}` : '';
}

interface Applied {
  status: PaymentStatus;
  /** The order was cancelled before this payment succeeded: the money must go back. */
  refundNeeded: boolean;
}

/**
 * Brings one attempt (and its order) in line with what the provider says about its
 * PaymentIntent. Safe to call any number of times, from the pay call, a check or a webhook:
 * a state already recorded changes nothing, and a success is never undone here.
 */
export async function applyIntentIn(trx: Knex.Transaction, paymentId: string, pi: Stripe.PaymentIntent, actorId: string | null): Promise<Applied> {
  const first = await findPayment(trx, paymentId);
  if (!first) throw notFound('That payment');
  // Lock order before payment, everywhere, so two appliers never deadlock.
  const order = (await findOrder(trx, first.business_id, first.order_id, true)) as OrderRow;
  const p = (await findPayment(trx, paymentId, true)) as PaymentRow;
  const money = writeMoney(order.total, order.currency);
  const final = p.status === 'succeeded' || p.status === 'refunded';

  if (pi.status === 'succeeded') {
    if (final) return { status: p.status, refundNeeded: false };
    await updatePayment(trx, p.id, { status: 'succeeded', intent_id: pi.id, failure_code: null, message: null, next_action_url: null });
    if (order.status === 'placed') {
      await trx('purchase_orders').where({ id: order.id })
        .update({ status: 'paid', paid_at: trx.fn.now(), payment_reference: pi.id, version: order.version + 1, updated_at: trx.fn.now() });
      await addEvent(trx, order.business_id, order.id, actorId, 'paid', `Paid ${money} ${order.currency}${cardWords(pi)}; reference ${pi.id}.`, { intentId: pi.id, attempt: p.attempt });
      return { status: 'succeeded', refundNeeded: false };
    }
    await addEvent(trx, order.business_id, order.id, actorId, 'paid_late', `A payment of ${money} ${order.currency} went through after the order was ${order.status}; reference ${pi.id}.`, { intentId: pi.id });
    return { status: 'succeeded', refundNeeded: order.status === 'cancelled' };
  }
  if (final) return { status: p.status, refundNeeded: false };
  // Events arrive in any order: a failed attempt is never re-confirmed, so only a success
  // (handled above) can move it; an earlier snapshot (e.g. payment_intent.created) must not.
  if (p.status === 'failed') return { status: 'failed', refundNeeded: false };
  const unconfirmed = pi.status === 'requires_payment_method' && !pi.last_payment_error;

  if (pi.status === 'requires_action') {
    if (p.status !== 'requires_action') {
      await updatePayment(trx, p.id, { status: 'requires_action', intent_id: pi.id, message: ACTION_MESSAGE, next_action_url: nextActionUrl(pi) });
      await addEvent(trx, order.business_id, order.id, actorId, 'payment_action', ACTION_MESSAGE, { intentId: pi.id });
    }
    return { status: 'requires_action', refundNeeded: false };
  }
  if ((pi.status === 'requires_payment_method' && !unconfirmed) || pi.status === 'canceled') {
    const err = pi.last_payment_error;
    const code = err?.decline_code ?? err?.code ?? (pi.status === 'canceled' ? 'canceled' : 'card_declined');
    const words = pi.status === 'canceled' ? 'The payment was cancelled before it completed.' : declineWords(code, err?.message);
    await updatePayment(trx, p.id, { status: 'failed', intent_id: pi.id, failure_code: code, message: words, next_action_url: null });
    await addEvent(trx, order.business_id, order.id, actorId, 'payment_failed', `Payment not taken: ${words}`, { intentId: pi.id, code });
    return { status: 'failed', refundNeeded: false };
  }
  // processing, requires_confirmation, requires_capture, not yet confirmed: not settled. Only a
  // pending attempt becomes unknown; one awaiting the cardholder stays as it is.
  if (p.status === 'requires_action') return { status: 'requires_action', refundNeeded: false };
  if (p.status !== 'unknown') await updatePayment(trx, p.id, { status: 'unknown', intent_id: pi.id, message: UNKNOWN_MESSAGE });
  return { status: 'unknown', refundNeeded: false };
}

async function applyIntent(deps: AppDeps, paymentId: string, pi: Stripe.PaymentIntent, actorId: string | null): Promise<PaymentStatus> {
  const applied = await deps.db.transaction((trx) => applyIntentIn(trx, paymentId, pi, actorId));
  if (applied.refundNeeded) {
    const p = (await findPayment(deps.db, paymentId)) as PaymentRow;
    await refundPayment(deps, p, null);
  }
  return applied.status;
}

async function markUnknown(db: Knex, p: PaymentRow) {
  await db.transaction(async (trx) => {
    await findOrder(trx, p.business_id, p.order_id, true);
    const cur = (await findPayment(trx, p.id, true)) as PaymentRow;
    if (cur.status === 'pending') await updatePayment(trx, p.id, { status: 'unknown', message: UNKNOWN_MESSAGE });
  });
}

/** Card errors: the declined intent is stored at the provider and its id comes with the error. */
async function recordDecline(deps: AppDeps, p: PaymentRow, err: Stripe.errors.StripeCardError, actorId: string | null): Promise<never> {
  const code = err.decline_code ?? err.code ?? 'card_declined';
  const words = declineWords(code, err.message);
  const intentId = err.payment_intent?.id ?? null;
  await deps.db.transaction(async (trx) => {
    const order = (await findOrder(trx, p.business_id, p.order_id, true)) as OrderRow;
    const cur = (await findPayment(trx, p.id, true)) as PaymentRow;
    if (cur.status === 'succeeded' || cur.status === 'refunded' || cur.status === 'failed') return;
    await updatePayment(trx, p.id, { status: 'failed', intent_id: intentId ?? cur.intent_id, failure_code: code, message: words });
    await addEvent(trx, order.business_id, order.id, actorId, 'payment_failed', `Payment not taken: ${words}`, { intentId, code });
  });
  throw paymentFailed(err.code === 'authentication_required' ? 'authentication_required' : 'card_declined', words);
}

const unreachable = () =>
  badGateway('payments_unreachable', 'The payments service could not be reached, so this payment could not be confirmed. The order is not marked paid and will not be charged twice: it shows "payment being confirmed" until we hear back. Try again in a minute.');

/** Sends (or re-sends, with the same key and parameters) one attempt's PaymentIntent and records the answer. */
async function sendAttempt(deps: AppDeps, p: PaymentRow, order: OrderRow, actorId: string | null): Promise<PaymentStatus> {
  const stripe = paymentsClient(deps.config);
  let pi: Stripe.PaymentIntent;
  try {
    pi = await stripe.paymentIntents.create(intentParams(p, order), { idempotencyKey: p.idempotency_key });
  } catch (err) {
    if (err instanceof Stripe.errors.StripeCardError) return recordDecline(deps, p, err, actorId);
    if (err instanceof Stripe.errors.StripeError && err.statusCode === 409) {
      throw conflict('payment_in_progress', 'A payment for this order is already under way. Wait a moment, then reload the order.');
    }
    if (outcomeUnknown(err)) {
      await markUnknown(deps.db, p);
      throw unreachable();
    }
    deps.logger.warn({ err, paymentId: p.id }, 'payments service refused a payment');
    await deps.db.transaction(async (trx) => {
      await findOrder(trx, p.business_id, p.order_id, true);
      await updatePayment(trx, p.id, { status: 'failed', failure_code: 'provider_refused', message: 'The payments service refused the request.' });
    });
    throw badGateway('payments_error', `The payments service refused the payment: ${err instanceof Error ? err.message : 'unknown error'}`);
  }
  return applyIntent(deps, p.id, pi, actorId);
}

/**
 * Finds out what happened to an attempt whose outcome is not known: by its stored intent id,
 * else by the idempotency key in the intents' metadata, else by re-sending the attempt with
 * the same key (the provider replays its first answer, so this never charges twice).
 */
export async function settleAttempt(deps: AppDeps, p: PaymentRow, actorId: string | null): Promise<PaymentStatus> {
  const stripe = paymentsClient(deps.config);
  const order = (await findOrder(deps.db, p.business_id, p.order_id)) as OrderRow;
  try {
    let pi: Stripe.PaymentIntent | undefined;
    if (p.intent_id) pi = await stripe.paymentIntents.retrieve(p.intent_id, { expand: ['latest_charge'] });
    else {
      const since = Math.floor(new Date(p.created_at).getTime() / 1000) - 300;
      const list = await stripe.paymentIntents.list({ created: { gte: since }, limit: 100, ...(p.customer_id ? { customer: p.customer_id } : {}) });
      pi = list.data.find((x) => x.metadata?.payment_key === p.idempotency_key);
      if (pi) pi = await stripe.paymentIntents.retrieve(pi.id, { expand: ['latest_charge'] });
    }
    if (pi) return await applyIntent(deps, p.id, pi, actorId);
  } catch (err) {
    if (outcomeUnknown(err)) throw unreachable();
    throw err;
  }
  return sendAttempt(deps, p, order, actorId);
}

async function resolveMethod(deps: AppDeps, businessId: string, paymentMethodId: string) {
  const saved = await savedCard(deps.db, businessId);
  if (saved?.payment_method_id && saved.payment_method_id === paymentMethodId) return { paymentMethodId, customerId: saved.customer_id };
  if (deps.config.paymentsTestMode && TEST_IDS.has(paymentMethodId)) return { paymentMethodId, customerId: null };
  throw invalidInput({ paymentMethodId: deps.config.paymentsTestMode ? 'Choose the saved card or one of the test cards.' : 'Choose the saved card.' });
}

type Reserved = { kind: 'new'; payment: PaymentRow; order: OrderRow } | { kind: 'open'; payment: PaymentRow };

/**
 * Pays a placed order by card, at most once. The order row is locked while an attempt is
 * reserved, so concurrent presses find the open attempt and stop; an attempt whose outcome is
 * unknown is settled (never charged afresh) before any new attempt is made.
 */
export async function payOrder(deps: AppDeps, user: SessionUser, orderId: string, paymentMethodId: string, depth = 0): Promise<void> {
  const method = await resolveMethod(deps, user.businessId, paymentMethodId);
  const reserved: Reserved = await deps.db.transaction(async (trx) => {
    const order = await findOrder(trx, user.businessId, orderId, true);
    if (!order) throw notFound('That purchase order');
    if (order.payment_terms === 'account') throw conflict('paid_on_account', 'This supplier is paid on account against their invoice: there is nothing to pay by card.');
    if (['paid', 'part_received', 'received', 'closed'].includes(order.status)) throw conflict('already_paid', 'This order has already been paid.');
    if (order.status !== 'placed') throw conflict('not_placed', order.status === 'draft' ? 'Place the order before paying it.' : 'A cancelled order cannot be paid.');
    const last = await latestPayment(trx, orderId);
    if (last && (last.status === 'pending' || last.status === 'unknown' || last.status === 'requires_action')) return { kind: 'open', payment: last };
    if (last?.status === 'succeeded') throw conflict('already_paid', 'This order has already been paid.');
    const amount = toMinorUnits(order.total, order.currency);
    if (amount <= 0) throw conflict('nothing_to_pay', 'The order total is zero: there is nothing to pay.');
    const attempt = (last?.attempt ?? 0) + 1;
    const payment = await insertPayment(trx, {
      business_id: user.businessId, order_id: orderId, attempt, idempotency_key: attemptKey(orderId, attempt), status: 'pending',
      amount_minor: String(amount), currency: order.currency, payment_method_id: method.paymentMethodId, customer_id: method.customerId,
    });
    await addEvent(trx, user.businessId, orderId, user.id, 'payment_started', `Payment of ${writeMoney(order.total, order.currency)} ${order.currency} by card started (attempt ${attempt}).`, { attempt });
    return { kind: 'new', payment, order };
  });

  if (reserved.kind === 'new') {
    const status = await sendAttempt(deps, reserved.payment, reserved.order, user.id);
    if (status === 'failed') {
      const p = (await findPayment(deps.db, reserved.payment.id)) as PaymentRow;
      throw paymentFailed('card_declined', p.message ?? declineWords(p.failure_code));
    }
    return;
  }
  const open = reserved.payment;
  if (open.status === 'pending' && Date.now() - new Date(open.created_at).getTime() < PENDING_STALE_MS) {
    throw conflict('payment_in_progress', 'A payment for this order is already under way. Wait a moment, then reload the order.');
  }
  const status = await settleAttempt(deps, open, user.id);
  if (status === 'succeeded') return;
  if (status === 'requires_action') throw conflict('payment_needs_action', ACTION_MESSAGE);
  if (status === 'unknown') throw unreachable();
  // The open attempt failed: this press makes the next attempt.
  if (depth > 0) throw new AppError(500, 'internal', 'The payment could not be settled.');
  await payOrder(deps, user, orderId, paymentMethodId, depth + 1);
}

/** "Check again": settles the order's open attempt, if any, from the provider's record. */
export async function checkPayment(deps: AppDeps, user: SessionUser, orderId: string): Promise<void> {
  const order = await findOrder(deps.db, user.businessId, orderId);
  if (!order) throw notFound('That purchase order');
  const last = await latestPayment(deps.db, orderId);
  if (!last || !['pending', 'unknown', 'requires_action'].includes(last.status)) return;
  if (last.status === 'pending' && Date.now() - new Date(last.created_at).getTime() < PENDING_STALE_MS) return;
  await settleAttempt(deps, last, user.id);
}

/** Refunds a succeeded payment in full and cancels its order (idempotent per payment). */
export async function refundPayment(deps: AppDeps, p: PaymentRow, actorId: string | null): Promise<void> {
  if (!p.intent_id) throw conflict('payment_unsettled', 'The payment has no reference yet; check the payment before cancelling.');
  const stripe = paymentsClient(deps.config);
  let refundId: string;
  try {
    const refund = await stripe.refunds.create(
      { payment_intent: p.intent_id, reason: 'requested_by_customer', metadata: { order_id: p.order_id, payment_id: p.id } },
      { idempotencyKey: `purchase-order-${p.order_id}-refund-${p.id}` },
    );
    refundId = refund.id;
  } catch (err) {
    if (err instanceof Stripe.errors.StripeInvalidRequestError && err.code === 'charge_already_refunded') refundId = 'already_refunded';
    else if (outcomeUnknown(err)) {
      throw badGateway('payments_unreachable', 'The payments service could not be reached, so the refund was not made and the order is unchanged. Try again in a minute.');
    } else throw badGateway('refund_refused', `The payments service refused the refund: ${err instanceof Error ? err.message : 'unknown error'}`);
  }
  await deps.db.transaction(async (trx) => {
    const order = (await findOrder(trx, p.business_id, p.order_id, true)) as OrderRow;
    const cur = (await findPayment(trx, p.id, true)) as PaymentRow;
    if (cur.status === 'refunded') return;
    await updatePayment(trx, p.id, { status: 'refunded', refund_id: refundId === 'already_refunded' ? cur.refund_id : refundId });
    await addEvent(trx, order.business_id, order.id, actorId, 'refunded', `Refunded ${writeMoney(order.total, order.currency)} ${order.currency} to the card; reference ${refundId === 'already_refunded' ? cur.intent_id : refundId}.`, { refundId });
  });
}

/** Webhook: the provider's record of a PaymentIntent or a refund, applied once per event id. */
export async function handleWebhookEvent(deps: AppDeps, event: Stripe.Event): Promise<'applied' | 'duplicate' | 'ignored'> {
  let refundFor: string | null = null;
  const result = await deps.db.transaction(async (trx) => {
    if (!(await recordWebhookEvent(trx, event.id, event.type))) return 'duplicate' as const;
    if (event.type.startsWith('payment_intent.')) {
      const pi = event.data.object as Stripe.PaymentIntent;
      const p = (await paymentByIntent(trx, pi.id)) ?? (pi.metadata?.payment_key ? await paymentByKey(trx, pi.metadata.payment_key) : undefined);
      if (!p) return 'ignored' as const;
      const applied = await applyIntentIn(trx, p.id, pi, null);
      if (applied.refundNeeded) refundFor = p.id;
      return 'applied' as const;
    }
    if (event.type === 'charge.refunded') {
      const charge = event.data.object as Stripe.Charge;
      const intentId = typeof charge.payment_intent === 'string' ? charge.payment_intent : charge.payment_intent?.id;
      const p = intentId ? await paymentByIntent(trx, intentId) : undefined;
      if (!p || !charge.refunded) return 'ignored' as const;
      const order = (await findOrder(trx, p.business_id, p.order_id, true)) as OrderRow;
      const cur = (await findPayment(trx, p.id, true)) as PaymentRow;
      if (cur.status !== 'succeeded') return 'applied' as const;
      await updatePayment(trx, p.id, { status: 'refunded' });
      const refund = charge.refunds?.data?.[0]?.id ?? null;
      if (refund) await updatePayment(trx, p.id, { refund_id: refund });
      await addEvent(trx, order.business_id, order.id, null, 'refunded', `The payments service reports the payment was refunded${refund ? `; reference ${refund}` : ''}.`, { refundId: refund });
      if (order.status === 'paid') {
        await trx('purchase_orders').where({ id: order.id }).update({ status: 'cancelled', cancelled_at: trx.fn.now(), version: order.version + 1, updated_at: trx.fn.now() });
        await addEvent(trx, order.business_id, order.id, null, 'cancelled', 'Cancelled because its payment was refunded.');
      }
      return 'applied' as const;
    }
    return 'ignored' as const;
  });
  if (refundFor) {
    const p = (await findPayment(deps.db, refundFor)) as PaymentRow;
    await refundPayment(deps, p, null);
  }
  return result;
}

/** The order's payment as the API shows it: the latest attempt. */
export async function presentPayment(db: Knex, orderId: string) {
  const p = await latestPayment(db, orderId);
  if (!p) return null;
  const confirming = p.status === 'pending' || p.status === 'unknown';
  return {
    status: p.status,
    confirming,
    reference: p.status === 'refunded' ? (p.refund_id ?? p.intent_id) : p.intent_id,
    message: confirming ? UNKNOWN_MESSAGE : p.message,
    code: p.failure_code,
    attempt: p.attempt,
    nextActionUrl: p.status === 'requires_action' ? p.next_action_url : null,
    updatedAt: new Date(p.updated_at).toISOString(),
  };
}
