import type Stripe from 'stripe';
import type { Ctx } from '../context';
import { notFound, noSuchParam, paramError, stateError } from '../errors';
import { buildRefund } from '../objects';
import { applyMetadata, expandList, optEnum, optInt, optString, rejectUnknown } from '../params';
import { formatMinor } from './amounts';

function chargeToRefund(ctx: Ctx, intentId: string | undefined, chargeId: string | undefined): Stripe.Charge {
  if (intentId) {
    const intent = ctx.account.intents.get(intentId);
    if (!intent) throw noSuchParam('payment_intent', intentId, 'payment_intent');
    const latest = intent.object.latest_charge;
    const charge = typeof latest === 'string' ? ctx.account.charges.get(latest) : undefined;
    if (intent.object.status !== 'succeeded' || !charge || charge.status !== 'succeeded') {
      throw stateError(
        400,
        `This PaymentIntent (${intentId}) does not have a successful charge to refund.`,
        'payment_intent_unexpected_state',
        'payment_intent',
      );
    }
    return charge;
  }
  const charge = ctx.account.charges.get(chargeId as string);
  if (!charge) throw noSuchParam('charge', chargeId as string, 'charge');
  if (charge.status !== 'succeeded') {
    throw stateError(400, `Charge ${charge.id} has not succeeded, so it cannot be refunded.`, 'charge_not_refundable', 'charge');
  }
  return charge;
}

export function createRefund(ctx: Ctx): unknown {
  const p = ctx.params;
  rejectUnknown(p, ['payment_intent', 'charge', 'amount', 'reason', 'metadata', 'expand']);
  const intentId = optString(p, 'payment_intent') || undefined;
  const chargeId = optString(p, 'charge') || undefined;
  if (!intentId && !chargeId) {
    throw paramError('One of the following params should be provided for this request: payment_intent or charge.', undefined, 'parameter_missing');
  }
  if (intentId && chargeId) {
    throw paramError('You may only specify one of these parameters: charge, payment_intent.', 'charge');
  }
  const amount = optInt(p, 'amount');
  if (amount !== undefined && amount <= 0) {
    throw paramError('Invalid positive integer', 'amount', 'parameter_invalid_integer');
  }
  const reason = optEnum(p, 'reason', ['duplicate', 'fraudulent', 'requested_by_customer'] as const) ?? null;
  const metadata = applyMetadata({}, p);
  if (expandList(p).length > 0) throw paramError(`This property cannot be expanded (${expandList(p)[0]}).`, 'expand');

  const charge = chargeToRefund(ctx, intentId, chargeId);
  const remaining = charge.amount - charge.amount_refunded;
  if (remaining <= 0) {
    throw stateError(400, `Charge ${charge.id} has already been refunded.`, 'charge_already_refunded');
  }
  const refundAmount = amount ?? remaining;
  if (refundAmount > remaining) {
    throw stateError(
      400,
      `Refund amount (${formatMinor(refundAmount, charge.currency)} ${charge.currency}) is greater than unrefunded amount on charge (${formatMinor(remaining, charge.currency)} ${charge.currency})`,
      'amount_too_large',
      'amount',
    );
  }
  const refund = buildRefund(charge, refundAmount, reason, metadata);
  ctx.account.refunds.set(refund.id, refund);
  charge.amount_refunded += refundAmount;
  charge.refunded = charge.amount_refunded === charge.amount;
  ctx.emit('refund.created', refund);
  ctx.emit('charge.refunded', charge);
  return structuredClone(refund);
}

/** GET of one stored object by the id in the URL: 404 resource_missing when absent. */
function retrieveFrom<T>(pick: (ctx: Ctx) => Map<string, T>, kind: string): (ctx: Ctx) => unknown {
  return (ctx) => {
    rejectUnknown(ctx.params, ['expand']);
    const found = pick(ctx).get(ctx.path.id);
    if (!found) throw notFound(kind, ctx.path.id, 'id');
    return structuredClone(found);
  };
}

export const retrieveRefund = retrieveFrom((ctx) => ctx.account.refunds, 'refund');
export const retrieveCharge = retrieveFrom((ctx) => ctx.account.charges, 'charge');
export const retrieveEvent = retrieveFrom((ctx) => ctx.account.events, 'event');
