import type { Ctx } from '../context';
import { notFound, noSuchParam, stateError } from '../errors';
import { testCard } from '../cards';
import { buildPaymentMethod } from '../objects';
import { rejectUnknown, reqString } from '../params';
import type { StoredPaymentMethod } from '../state';
import { findCustomer } from './lookups';

/**
 * A published test id (`pm_card_visa`, …) stands for a fresh payment method
 * cloned from that test card, as in test mode: each use yields a new `pm_` id
 * that keeps the card's behaviour.
 */
export function resolvePaymentMethod(ctx: Ctx, id: string, param: string): StoredPaymentMethod {
  const stored = ctx.account.paymentMethods.get(id);
  if (stored) return stored;
  const card = testCard(id);
  if (!card) throw noSuchParam('PaymentMethod', id, param);
  const created: StoredPaymentMethod = { object: buildPaymentMethod(card, null), card };
  ctx.account.paymentMethods.set(created.object.id, created);
  return created;
}

export function attachTo(ctx: Ctx, pm: StoredPaymentMethod, customerId: string): void {
  if (pm.object.customer === customerId) return;
  if (pm.object.customer) {
    throw stateError(400, 'The payment method you provided has already been attached to a customer.', 'resource_already_exists', 'payment_method');
  }
  pm.object.customer = customerId;
  ctx.emit('payment_method.attached', pm.object);
}

export function attachPaymentMethod(ctx: Ctx): unknown {
  rejectUnknown(ctx.params, ['customer', 'expand']);
  const customerId = reqString(ctx.params, 'customer');
  const pm = ctx.account.paymentMethods.get(ctx.path.id) ?? (testCard(ctx.path.id) ? undefined : null);
  if (pm === null) throw notFound('payment_method', ctx.path.id, 'payment_method');
  findCustomer(ctx.account, customerId, 'customer');
  const target = pm ?? resolvePaymentMethod(ctx, ctx.path.id, 'payment_method');
  attachTo(ctx, target, customerId);
  return structuredClone(target.object);
}

export function retrievePaymentMethod(ctx: Ctx): unknown {
  rejectUnknown(ctx.params, ['expand']);
  const stored = ctx.account.paymentMethods.get(ctx.path.id);
  if (stored) return structuredClone(stored.object);
  if (!testCard(ctx.path.id)) throw notFound('payment_method', ctx.path.id, 'payment_method');
  return structuredClone(resolvePaymentMethod(ctx, ctx.path.id, 'payment_method').object);
}
