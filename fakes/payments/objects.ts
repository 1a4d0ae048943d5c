import type Stripe from 'stripe';
import type { TestCard } from './cards';
import { newId, nowSeconds } from './state';

/**
 * Builders for the API objects. Each literal is checked with `satisfies`
 * against the SDK's own types, so an SDK upgrade that adds or changes a field
 * breaks the typecheck here instead of drifting silently.
 */

export function buildCustomer(fields: {
  email: string | null;
  name: string | null;
  description: string | null;
  phone: string | null;
  metadata: Record<string, string>;
  defaultPaymentMethod: string | null;
}): Stripe.Customer {
  return {
    id: newId('cus', 14),
    object: 'customer',
    address: null,
    balance: 0,
    created: nowSeconds(),
    currency: null,
    customer_account: null,
    default_source: null,
    delinquent: false,
    description: fields.description,
    discount: null,
    email: fields.email,
    invoice_prefix: null,
    invoice_settings: {
      custom_fields: null,
      default_payment_method: fields.defaultPaymentMethod,
      footer: null,
      rendering_options: null,
    },
    livemode: false,
    metadata: fields.metadata,
    name: fields.name,
    next_invoice_sequence: 1,
    phone: fields.phone,
    preferred_locales: [],
    shipping: null,
    tax_exempt: 'none',
    test_clock: null,
  } satisfies Stripe.Customer;
}

function expiry(): { exp_month: number; exp_year: number } {
  const now = new Date();
  return { exp_month: now.getUTCMonth() + 1, exp_year: now.getUTCFullYear() + 3 };
}

export function buildPaymentMethod(card: TestCard, customer: string | null): Stripe.PaymentMethod {
  const { exp_month, exp_year } = expiry();
  return {
    id: newId('pm'),
    object: 'payment_method',
    allow_redisplay: 'unspecified',
    billing_details: { address: null, email: null, name: null, phone: null, tax_id: null },
    card: {
      brand: card.brand,
      checks: { address_line1_check: null, address_postal_code_check: null, cvc_check: 'unchecked' },
      country: card.country,
      display_brand: card.brand,
      exp_month,
      exp_year,
      fingerprint: `fp${card.brand}${card.last4}`,
      funding: card.funding,
      generated_from: null,
      last4: card.last4,
      networks: { available: [card.brand], preferred: null },
      regulated_status: 'unregulated',
      three_d_secure_usage: { supported: true },
      wallet: null,
    },
    created: nowSeconds(),
    customer,
    customer_account: null,
    livemode: false,
    metadata: {},
    type: 'card',
  } satisfies Stripe.PaymentMethod;
}

export function buildPaymentIntent(fields: {
  amount: number;
  currency: string;
  customer: string | null;
  paymentMethod: string | null;
  description: string | null;
  metadata: Record<string, string>;
  receiptEmail: string | null;
  setupFutureUsage: Stripe.PaymentIntent.SetupFutureUsage | null;
  paymentMethodTypes: string[];
  automatic: Stripe.PaymentIntent.AutomaticPaymentMethods | null;
}): Stripe.PaymentIntent {
  const id = newId('pi');
  return {
    id,
    object: 'payment_intent',
    allowed_payment_method_types: null,
    amount: fields.amount,
    amount_capturable: 0,
    amount_details: { tip: {} },
    amount_received: 0,
    application: null,
    application_fee_amount: null,
    automatic_payment_methods: fields.automatic,
    canceled_at: null,
    cancellation_reason: null,
    capture_method: 'automatic',
    client_secret: `${id}_secret_${newId('x').slice(2)}`,
    confirmation_method: 'automatic',
    created: nowSeconds(),
    currency: fields.currency,
    customer: fields.customer,
    customer_account: null,
    description: fields.description,
    excluded_payment_method_types: null,
    last_payment_error: null,
    latest_charge: null,
    livemode: false,
    managed_payments: null,
    metadata: fields.metadata,
    next_action: null,
    on_behalf_of: null,
    payment_method: fields.paymentMethod,
    payment_method_configuration_details: null,
    payment_method_options: {
      card: { installments: null, mandate_options: null, network: null, request_three_d_secure: 'automatic' },
    },
    payment_method_types: fields.paymentMethodTypes,
    payment_record: null,
    processing: null,
    receipt_email: fields.receiptEmail,
    review: null,
    setup_future_usage: fields.setupFutureUsage,
    shipping: null,
    source: null,
    statement_descriptor: null,
    statement_descriptor_suffix: null,
    status: fields.paymentMethod ? 'requires_confirmation' : 'requires_payment_method',
    transfer_data: null,
    transfer_group: null,
  } satisfies Stripe.PaymentIntent;
}

export type ChargeResult =
  | { kind: 'paid' }
  | { kind: 'failed'; code: string; declineCode: string; message: string };

export function buildCharge(
  intent: Stripe.PaymentIntent,
  pm: Stripe.PaymentMethod,
  result: ChargeResult,
): Stripe.Charge {
  const paid = result.kind === 'paid';
  const card = pm.card;
  return {
    id: newId('ch'),
    object: 'charge',
    amount: intent.amount,
    amount_captured: paid ? intent.amount : 0,
    amount_refunded: 0,
    application: null,
    application_fee: null,
    application_fee_amount: null,
    balance_transaction: paid ? newId('txn') : null,
    billing_details: pm.billing_details,
    calculated_statement_descriptor: 'TAMP TALLY FAKE',
    captured: paid,
    created: nowSeconds(),
    currency: intent.currency,
    customer: typeof intent.customer === 'string' ? intent.customer : (intent.customer?.id ?? null),
    description: intent.description,
    disputed: false,
    failure_balance_transaction: null,
    failure_code: paid ? null : result.code,
    failure_message: paid ? null : result.message,
    fraud_details: {},
    livemode: false,
    metadata: { ...intent.metadata },
    on_behalf_of: null,
    outcome: paid
      ? {
          advice_code: null, network_advice_code: null, network_decline_code: null,
          network_status: 'approved_by_network', reason: null, risk_level: 'normal', risk_score: 20,
          seller_message: 'Payment complete.', type: 'authorized',
        }
      : {
          advice_code: null, network_advice_code: null, network_decline_code: null,
          network_status: 'declined_by_network', reason: result.declineCode, risk_level: 'normal', risk_score: 20,
          seller_message: 'The bank did not return any further details with this decline.', type: 'issuer_declined',
        },
    paid,
    payment_intent: intent.id,
    payment_method: pm.id,
    payment_method_details: card
      ? {
          type: 'card',
          card: {
            amount_authorized: paid ? intent.amount : null,
            authorization_code: paid ? '123456' : null,
            brand: card.brand,
            checks: card.checks,
            country: card.country,
            electronic_commerce_indicator: null,
            exp_month: card.exp_month,
            exp_year: card.exp_year,
            extended_authorization: { status: 'disabled' },
            fingerprint: card.fingerprint,
            funding: card.funding,
            incremental_authorization: { status: 'unavailable' },
            installments: null,
            last4: card.last4,
            mandate: null,
            multicapture: { status: 'unavailable' },
            network: card.brand,
            network_token: { used: false },
            network_transaction_id: paid ? newId('nt', 15) : null,
            overcapture: { maximum_amount_capturable: intent.amount, status: 'unavailable' },
            regulated_status: 'unregulated',
            three_d_secure: null,
            transaction_link_id: null,
            wallet: null,
          },
        }
      : null,
    receipt_email: intent.receipt_email,
    receipt_number: null,
    receipt_url: null,
    refunded: false,
    review: null,
    shipping: null,
    source: null,
    source_transfer: null,
    statement_descriptor: null,
    statement_descriptor_suffix: null,
    status: paid ? 'succeeded' : 'failed',
    transfer_data: null,
    transfer_group: null,
  } satisfies Stripe.Charge;
}

export function buildRefund(
  charge: Stripe.Charge,
  amount: number,
  reason: Stripe.Refund.Reason | null,
  metadata: Record<string, string>,
): Stripe.Refund {
  return {
    id: newId('re'),
    object: 'refund',
    amount,
    balance_transaction: newId('txn'),
    charge: charge.id,
    created: nowSeconds(),
    currency: charge.currency,
    customer: charge.customer,
    customer_account: null,
    destination_details: { card: { reference_status: 'pending', reference_type: 'acquirer_reference_number', type: 'refund' }, type: 'card' },
    metadata,
    payment_intent: charge.payment_intent,
    payment_method: charge.payment_method,
    reason,
    receipt_number: null,
    source_transfer_reversal: null,
    status: 'succeeded',
    transfer_reversal: null,
  } satisfies Stripe.Refund;
}

export function buildEvent(
  type: Stripe.Event.Type,
  object: unknown,
  request: { id: string | null; idempotency_key: string | null },
  apiVersion: string,
  pendingWebhooks: number,
): Stripe.Event {
  return {
    id: newId('evt'),
    object: 'event',
    api_version: apiVersion,
    created: nowSeconds(),
    data: { object: structuredClone(object) as Stripe.Event.Data.Object },
    livemode: false,
    pending_webhooks: pendingWebhooks,
    request,
    type,
  } satisfies Stripe.EventBase as Stripe.Event;
}
