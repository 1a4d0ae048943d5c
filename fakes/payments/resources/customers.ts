import type Stripe from 'stripe';
import type { Ctx } from '../context';
import { notFound, noSuchParam, paramError } from '../errors';
import { buildCustomer } from '../objects';
import { applyMetadata, expandList, optHash, optString, rejectUnknown } from '../params';
import { attachTo, resolvePaymentMethod } from './payment-methods';

const EDITABLE = ['email', 'name', 'description', 'phone', 'metadata', 'invoice_settings', 'expand'] as const;

function customerOr404(ctx: Ctx): Stripe.Customer {
  const customer = ctx.account.customers.get(ctx.path.id);
  if (!customer) throw notFound('customer', ctx.path.id);
  return customer;
}

function defaultPaymentMethodParam(ctx: Ctx, customerId: string | null): string | null | undefined {
  const settings = optHash(ctx.params, 'invoice_settings');
  if (!settings) return undefined;
  rejectUnknown(settings, ['default_payment_method']);
  const pm = optString(settings, 'default_payment_method');
  if (pm === undefined) return undefined;
  if (pm === '') return null;
  const stored = ctx.account.paymentMethods.get(pm);
  if (!stored) throw noSuchParam('PaymentMethod', pm, 'invoice_settings[default_payment_method]');
  if (stored.object.customer !== customerId) {
    throw paramError(
      `The customer does not have a payment method with the ID ${pm}. The payment method must be attached to the customer.`,
      'invoice_settings[default_payment_method]',
      'resource_missing',
    );
  }
  return pm;
}

function text(ctx: Ctx, name: string): string | null | undefined {
  const v = optString(ctx.params, name);
  if (v === undefined) return undefined;
  return v === '' ? null : v;
}

export function createCustomer(ctx: Ctx): unknown {
  rejectUnknown(ctx.params, [...EDITABLE, 'payment_method']);
  const metadata = applyMetadata({}, ctx.params);
  const pmId = optString(ctx.params, 'payment_method');
  const settings = optHash(ctx.params, 'invoice_settings');
  if (settings) rejectUnknown(settings, ['default_payment_method']);
  const wantedDefault = settings ? optString(settings, 'default_payment_method') : undefined;
  if (wantedDefault && wantedDefault !== pmId) {
    throw paramError(
      `The customer does not have a payment method with the ID ${wantedDefault}. The payment method must be attached to the customer.`,
      'invoice_settings[default_payment_method]',
      'resource_missing',
    );
  }
  const customer = buildCustomer({
    email: text(ctx, 'email') ?? null,
    name: text(ctx, 'name') ?? null,
    description: text(ctx, 'description') ?? null,
    phone: text(ctx, 'phone') ?? null,
    metadata,
    defaultPaymentMethod: null,
  });
  // Resolve the payment method before storing anything, so a bad id leaves no customer behind.
  const pm = pmId === undefined ? undefined : resolvePaymentMethod(ctx, pmId, 'payment_method');
  ctx.account.customers.set(customer.id, customer);
  if (pm) {
    attachTo(ctx, pm, customer.id);
    if (wantedDefault) customer.invoice_settings.default_payment_method = pm.object.id;
  }
  ctx.emit('customer.created', customer);
  return renderCustomer(ctx, customer);
}

export function retrieveCustomer(ctx: Ctx): unknown {
  rejectUnknown(ctx.params, ['expand']);
  return renderCustomer(ctx, customerOr404(ctx));
}

export function updateCustomer(ctx: Ctx): unknown {
  rejectUnknown(ctx.params, EDITABLE);
  const customer = customerOr404(ctx);
  const metadata = applyMetadata(customer.metadata, ctx.params);
  const defaultPm = defaultPaymentMethodParam(ctx, customer.id);
  for (const name of ['email', 'name', 'description', 'phone'] as const) {
    const v = text(ctx, name);
    if (v !== undefined) customer[name] = v;
  }
  customer.metadata = metadata;
  if (defaultPm !== undefined) customer.invoice_settings.default_payment_method = defaultPm;
  ctx.emit('customer.updated', customer);
  return renderCustomer(ctx, customer);
}

function renderCustomer(ctx: Ctx, customer: Stripe.Customer): unknown {
  const out = structuredClone(customer) as unknown as Record<string, unknown>;
  for (const path of expandList(ctx.params)) {
    if (path === 'invoice_settings.default_payment_method') {
      const id = customer.invoice_settings.default_payment_method;
      const settings = out.invoice_settings as Record<string, unknown>;
      if (typeof id === 'string') settings.default_payment_method = structuredClone(ctx.account.paymentMethods.get(id)?.object ?? null);
    } else {
      throw paramError(`This property cannot be expanded (${path}).`, 'expand');
    }
  }
  return out;
}
