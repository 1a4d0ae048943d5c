import type Stripe from 'stripe';
import type { Ctx, Engine } from '../context';
import { docUrl, FakeApiError, missingParam, notFound, paramError, stateError } from '../errors';
import { buildCharge, buildPaymentIntent, type ChargeResult } from '../objects';
import {
  applyMetadata, expandList, optBool, optEnum, optHash, optInt, optString, optStringArray, rejectUnknown, reqString,
  type Params,
} from '../params';
import type { Account, StoredIntent, StoredPaymentMethod } from '../state';
import { formatMinor, MAX_AMOUNT, minimumAmount } from './amounts';
import { findCustomer } from './lookups';
import { resolvePaymentMethod } from './payment-methods';

type Emit = Ctx['emit'];

const CREATE_PARAMS = [
  'amount', 'currency', 'customer', 'payment_method', 'confirm', 'off_session', 'return_url',
  'automatic_payment_methods', 'payment_method_types', 'allowed_payment_method_types', 'description', 'metadata', 'expand',
  'receipt_email', 'setup_future_usage', 'error_on_requires_action',
] as const;
const CONFIRM_PARAMS = [
  'payment_method', 'return_url', 'off_session', 'error_on_requires_action', 'receipt_email',
  'setup_future_usage', 'allowed_payment_method_types', 'expand',
] as const;
const EXPANDABLE = ['latest_charge', 'customer', 'payment_method'] as const;
const CONFIRMABLE: readonly Stripe.PaymentIntent.Status[] = ['requires_payment_method', 'requires_confirmation', 'requires_action'];

// The API's wording when a confirmation could need a redirect and no return_url was given.
const RETURN_URL_REQUIRED =
  'This PaymentIntent is configured to accept payment methods enabled in your Dashboard. Because some of these payment methods might redirect your customer off of your page, you must provide a `return_url`. If you don\'t want to accept redirect-based payment methods, set `automatic_payment_methods[enabled]` to `true` and `automatic_payment_methods[allow_redirects]` to `never` when creating Setup Intents and Payment Intents.';

function intentOr404(ctx: Ctx): StoredIntent {
  const intent = ctx.account.intents.get(ctx.path.id);
  if (!intent) throw notFound('payment_intent', ctx.path.id, 'intent');
  return intent;
}

function checkExpand(paths: string[], prefix = ''): string[] {
  for (const path of paths) {
    const bare = prefix && path.startsWith(prefix) ? path.slice(prefix.length) : path;
    if ((prefix && !path.startsWith(prefix)) || !(EXPANDABLE as readonly string[]).includes(bare)) {
      throw paramError(`This property cannot be expanded (${path}).`, 'expand');
    }
  }
  return paths.map((p) => p.slice(prefix.length));
}

export function renderIntent(account: Account, pi: Stripe.PaymentIntent, expand: string[]): Stripe.PaymentIntent {
  const out = structuredClone(pi);
  for (const path of expand) {
    if (path === 'latest_charge' && typeof pi.latest_charge === 'string') {
      out.latest_charge = structuredClone(account.charges.get(pi.latest_charge) ?? null);
    } else if (path === 'customer' && typeof pi.customer === 'string') {
      out.customer = structuredClone(account.customers.get(pi.customer) ?? null);
    } else if (path === 'payment_method' && typeof pi.payment_method === 'string') {
      out.payment_method = structuredClone(account.paymentMethods.get(pi.payment_method)?.object ?? null);
    }
  }
  return out;
}

function parseReturnUrl(params: Params): string | undefined {
  const url = optString(params, 'return_url');
  if (url === undefined) return undefined;
  try {
    new URL(url);
  } catch {
    throw paramError('Not a valid URL', 'return_url', 'url_invalid');
  }
  return url;
}

function parseAutomatic(params: Params): Stripe.PaymentIntent.AutomaticPaymentMethods | undefined {
  const hash = optHash(params, 'automatic_payment_methods');
  if (!hash) return undefined;
  rejectUnknown(hash, ['enabled', 'allow_redirects']);
  const enabled = optBool(hash, 'enabled');
  if (enabled === undefined) throw missingParam('automatic_payment_methods[enabled]');
  const allow = optEnum(hash, 'allow_redirects', ['always', 'never'] as const);
  return { enabled, allow_redirects: allow ?? 'always' };
}

/**
 * Card-only payment method types. The SDK's pinned API version names the
 * parameter `allowed_payment_method_types`; older versions `payment_method_types`.
 * Both are accepted; giving both is refused.
 */
function parseTypes(params: Params): { name: 'allowed_payment_method_types' | 'payment_method_types'; types: string[] } | undefined {
  if (params.allowed_payment_method_types !== undefined && params.payment_method_types !== undefined) {
    throw paramError('You may only specify one of these parameters: allowed_payment_method_types, payment_method_types.', 'payment_method_types');
  }
  const name = params.allowed_payment_method_types !== undefined ? 'allowed_payment_method_types' : 'payment_method_types';
  const types = optStringArray(params, name);
  if (!types) return undefined;
  for (const t of types) {
    if (t !== 'card') {
      throw paramError(`The payment method type "${t}" is not supported by the local payments fake (only "card").`, name);
    }
  }
  return { name, types };
}

/** `off_session` is a boolean, or in the SDK's API version also 'one_off' | 'recurring'. */
function parseOffSession(params: Params): boolean {
  const v = params.off_session;
  if (v === 'one_off' || v === 'recurring') return true;
  return optBool(params, 'off_session') ?? false;
}

function checkPaymentMethodOwner(pm: StoredPaymentMethod, customer: string | null): void {
  const owner = pm.object.customer;
  if (typeof owner === 'string' && owner !== customer) {
    throw stateError(
      400,
      `The provided PaymentMethod belongs to a Customer (${owner}). Pass customer=${owner} with it to use it.`,
      'payment_method_unexpected_state',
      'payment_method',
    );
  }
}

interface ConfirmOptions {
  offSession: boolean;
  errorOnRequiresAction: boolean;
  returnUrl: string | null;
}

export function createIntent(ctx: Ctx): unknown {
  const p = ctx.params;
  rejectUnknown(p, CREATE_PARAMS);
  const amount = optInt(p, 'amount');
  if (amount === undefined) throw missingParam('amount');
  const currency = reqString(p, 'currency').toLowerCase();
  if (!/^[a-z]{3}$/.test(currency)) throw paramError(`Invalid currency: ${currency}.`, 'currency', 'parameter_invalid_string');
  const minimum = minimumAmount(currency);
  if (amount < minimum) {
    throw paramError(`Amount must be at least ${formatMinor(minimum, currency)} ${currency}`, 'amount', 'amount_too_small');
  }
  if (amount > MAX_AMOUNT) {
    throw paramError(`Amount must be no more than ${formatMinor(MAX_AMOUNT, currency)} ${currency}`, 'amount', 'amount_too_large');
  }
  const confirm = optBool(p, 'confirm') ?? false;
  const offSession = parseOffSession(p);
  const errorOnRequiresAction = optBool(p, 'error_on_requires_action') ?? false;
  if (!confirm && (p.off_session !== undefined || p.error_on_requires_action !== undefined)) {
    const name = p.off_session !== undefined ? 'off_session' : 'error_on_requires_action';
    throw paramError(`The parameter ${name} can only be used with confirm=true.`, name);
  }
  const returnUrl = parseReturnUrl(p);
  if (returnUrl !== undefined && !confirm) {
    throw paramError('The parameter return_url can only be used with confirm=true.', 'return_url');
  }
  const automatic = parseAutomatic(p);
  const types = parseTypes(p);
  if (automatic && types) {
    throw paramError(`You may only specify one of these parameters: automatic_payment_methods, ${types.name}.`, 'automatic_payment_methods');
  }
  const automaticSetting = types ? null : (automatic ?? { enabled: true, allow_redirects: 'always' as const });
  if (confirm && returnUrl === undefined && automaticSetting?.allow_redirects !== 'never' && !types) {
    throw paramError(RETURN_URL_REQUIRED, 'return_url');
  }
  const setupFutureUsage = optEnum(p, 'setup_future_usage', ['on_session', 'off_session'] as const) ?? null;
  const description = optString(p, 'description') || null;
  const receiptEmail = optString(p, 'receipt_email') || null;
  const metadata = applyMetadata({}, p);
  const expand = checkExpand(expandList(p));
  const customerId = optString(p, 'customer') || null;
  const pmParam = optString(p, 'payment_method') || null;
  if (confirm && !pmParam) throw missingParam('payment_method');

  // Validation is over; from here the endpoint works and its outcome is saved.
  if (customerId) findCustomer(ctx.account, customerId, 'customer');
  const pm = pmParam ? resolvePaymentMethod(ctx, pmParam, 'payment_method') : null;
  if (pm) checkPaymentMethodOwner(pm, customerId);

  const pi = buildPaymentIntent({
    amount, currency, customer: customerId, paymentMethod: pm?.object.id ?? null, description, metadata,
    receiptEmail, setupFutureUsage, paymentMethodTypes: types?.types ?? ['card'], automatic: automaticSetting,
  });
  if (types?.name === 'allowed_payment_method_types') {
    pi.allowed_payment_method_types = types.types as Stripe.PaymentIntent.AllowedPaymentMethodType[];
  }
  const stored: StoredIntent = { object: pi, seq: ctx.account.nextSeq(), returnUrl: null, pendingCard: null };
  ctx.account.intents.set(pi.id, stored);
  ctx.emit('payment_intent.created', pi);
  if (confirm && pm) {
    runConfirmation(ctx, stored, pm, { offSession, errorOnRequiresAction, returnUrl: returnUrl ?? null });
  }
  return renderIntent(ctx.account, pi, expand);
}

export function confirmIntentRoute(ctx: Ctx): unknown {
  const p = ctx.params;
  rejectUnknown(p, CONFIRM_PARAMS);
  const offSession = parseOffSession(p);
  const errorOnRequiresAction = optBool(p, 'error_on_requires_action') ?? false;
  const returnUrl = parseReturnUrl(p);
  const setupFutureUsage = optEnum(p, 'setup_future_usage', ['on_session', 'off_session'] as const);
  const receiptEmail = optString(p, 'receipt_email');
  const types = parseTypes(p);
  const expand = checkExpand(expandList(p));
  const pmParam = optString(p, 'payment_method') || null;

  const stored = intentOr404(ctx);
  const pi = stored.object;
  if (!CONFIRMABLE.includes(pi.status)) {
    throw stateError(
      400,
      `You cannot confirm this PaymentIntent because it has a status of ${pi.status}. Only a PaymentIntent with one of the following statuses may be confirmed: ${CONFIRMABLE.join(', ')}.`,
      'payment_intent_unexpected_state',
    );
  }
  const pmId = pmParam ?? (typeof pi.payment_method === 'string' ? pi.payment_method : null);
  if (!pmId) {
    throw paramError(
      "You cannot confirm this PaymentIntent because it's missing a payment method. Update the PaymentIntent with a payment method or pass payment_method when confirming.",
      'payment_method',
      'parameter_missing',
    );
  }
  const redirectsAllowed = !types && pi.automatic_payment_methods?.enabled && pi.automatic_payment_methods.allow_redirects !== 'never';
  if (redirectsAllowed && !returnUrl && !stored.returnUrl) throw paramError(RETURN_URL_REQUIRED, 'return_url');

  const pm = resolvePaymentMethod(ctx, pmId, 'payment_method');
  const customer = typeof pi.customer === 'string' ? pi.customer : null;
  checkPaymentMethodOwner(pm, customer);
  if (setupFutureUsage !== undefined) pi.setup_future_usage = setupFutureUsage;
  if (receiptEmail !== undefined) pi.receipt_email = receiptEmail || null;
  if (types) {
    pi.automatic_payment_methods = null;
    pi.payment_method_types = types.types;
    if (types.name === 'allowed_payment_method_types') {
      pi.allowed_payment_method_types = types.types as Stripe.PaymentIntent.AllowedPaymentMethodType[];
    }
  }
  runConfirmation(ctx, stored, pm, { offSession, errorOnRequiresAction, returnUrl: returnUrl ?? stored.returnUrl });
  return renderIntent(ctx.account, pi, expand);
}

export function retrieveIntent(ctx: Ctx): unknown {
  rejectUnknown(ctx.params, ['expand', 'client_secret']);
  const expand = checkExpand(expandList(ctx.params));
  return renderIntent(ctx.account, intentOr404(ctx).object, expand);
}

/** Charges the card according to its test behaviour; a decline throws the saved 402. */
function runConfirmation(ctx: Ctx, stored: StoredIntent, pm: StoredPaymentMethod, opts: ConfirmOptions): void {
  const pi = stored.object;
  pi.payment_method = pm.object.id;
  pi.last_payment_error = null;
  pi.next_action = null;
  stored.returnUrl = opts.returnUrl;
  const outcome = pm.card.outcome;
  if (outcome.kind === 'succeed') {
    succeed(ctx.account, stored, pm, ctx.emit);
  } else if (outcome.kind === 'decline') {
    decline(ctx.account, stored, pm, ctx.emit, { kind: 'failed', code: 'card_declined', declineCode: outcome.declineCode, message: outcome.message });
  } else if (opts.offSession || opts.errorOnRequiresAction) {
    decline(ctx.account, stored, pm, ctx.emit, {
      kind: 'failed',
      code: 'authentication_required',
      declineCode: 'authentication_required',
      message: 'Your card was declined. This transaction requires authentication.',
    });
  } else {
    requireAction(ctx.engine, stored, pm, ctx.emit);
  }
}

function succeed(account: Account, stored: StoredIntent, pm: StoredPaymentMethod, emit: Emit): void {
  const pi = stored.object;
  const charge = buildCharge(pi, pm.object, { kind: 'paid' });
  account.charges.set(charge.id, charge);
  pi.status = 'succeeded';
  pi.amount_received = pi.amount;
  pi.latest_charge = charge.id;
  pi.next_action = null;
  stored.pendingCard = null;
  // A successful payment with setup_future_usage saves the card to the customer.
  if (pi.setup_future_usage && typeof pi.customer === 'string' && !pm.object.customer) {
    pm.object.customer = pi.customer;
    emit('payment_method.attached', pm.object);
  }
  emit('charge.succeeded', charge);
  emit('payment_intent.succeeded', pi);
}

function decline(
  account: Account,
  stored: StoredIntent,
  pm: StoredPaymentMethod,
  emit: Emit,
  result: Extract<ChargeResult, { kind: 'failed' }>,
): never {
  const pi = stored.object;
  const charge = buildCharge(pi, pm.object, result);
  account.charges.set(charge.id, charge);
  const error = {
    type: 'card_error' as const,
    code: result.code,
    decline_code: result.declineCode,
    message: result.message,
    charge: charge.id,
    doc_url: docUrl(result.code),
  };
  pi.status = 'requires_payment_method';
  pi.latest_charge = charge.id;
  pi.payment_method = null;
  pi.next_action = null;
  pi.last_payment_error = { ...error, code: result.code as Stripe.PaymentIntent.LastPaymentError.Code, payment_method: structuredClone(pm.object) };
  stored.pendingCard = null;
  emit('charge.failed', charge);
  emit('payment_intent.payment_failed', pi);
  throw new FakeApiError(402, { ...error, payment_intent: structuredClone(pi), payment_method: structuredClone(pm.object) }, true);
}

function requireAction(engine: Engine, stored: StoredIntent, pm: StoredPaymentMethod, emit: Emit): void {
  const pi = stored.object;
  const url = `${engine.baseUrl()}/__fake/authenticate/${pi.id}`;
  pi.status = 'requires_action';
  pi.next_action = stored.returnUrl
    ? { type: 'redirect_to_url', redirect_to_url: { url, return_url: stored.returnUrl } }
    : { type: 'use_stripe_sdk', use_stripe_sdk: { type: 'three_d_secure_redirect', stripe_js: url } };
  stored.pendingCard = pm;
  emit('payment_intent.requires_action', pi);
}

/**
 * Test-only: the customer completes or fails the authentication an intent is
 * waiting for. Success charges the card; failure leaves the intent needing a
 * new payment method, as the API does.
 */
export function completeAuthentication(
  engine: Engine,
  account: Account,
  stored: StoredIntent,
  result: 'succeed' | 'fail',
): Stripe.PaymentIntent {
  const pi = stored.object;
  const pm = stored.pendingCard;
  if (pi.status !== 'requires_action' || !pm) {
    throw stateError(400, `PaymentIntent ${pi.id} is not awaiting authentication (status ${pi.status}).`, 'payment_intent_unexpected_state');
  }
  const events: Stripe.Event[] = [];
  const emit: Emit = (type, object) => {
    events.push(engine.record(account, type, object, { id: null, idempotency_key: null }));
  };
  if (result === 'succeed') {
    succeed(account, stored, pm, emit);
  } else {
    const code = 'payment_intent_authentication_failure';
    pi.status = 'requires_payment_method';
    pi.payment_method = null;
    pi.next_action = null;
    pi.last_payment_error = {
      type: 'invalid_request_error',
      code,
      doc_url: docUrl(code),
      message: 'The provided PaymentMethod has failed authentication. You can provide payment_method_data or a new PaymentMethod to attempt to fulfill this PaymentIntent again.',
      payment_method: structuredClone(pm.object),
    };
    stored.pendingCard = null;
    emit('payment_intent.payment_failed', pi);
  }
  for (const event of events) engine.webhooks.enqueue(event);
  return renderIntent(account, pi, []);
}

type Range = { gt?: number; gte?: number; lt?: number; lte?: number };

function parseCreated(p: Params): Range | undefined {
  if (p.created === undefined) return undefined;
  if (typeof p.created === 'string') {
    const exact = optInt(p, 'created');
    return exact === undefined ? undefined : { gte: exact, lte: exact };
  }
  const hash = optHash(p, 'created') ?? {};
  rejectUnknown(hash, ['gt', 'gte', 'lt', 'lte']);
  const range: Range = {};
  for (const k of ['gt', 'gte', 'lt', 'lte'] as const) {
    const v = optInt(hash, k);
    if (v !== undefined) range[k] = v;
  }
  return range;
}

function inRange(t: number, r: Range): boolean {
  return (r.gt === undefined || t > r.gt) && (r.gte === undefined || t >= r.gte)
    && (r.lt === undefined || t < r.lt) && (r.lte === undefined || t <= r.lte);
}

/** Newest first: by created, then by insertion order. */
function newerFirst(a: StoredIntent, b: StoredIntent): number {
  return b.object.created - a.object.created || b.seq - a.seq;
}

export function listIntents(ctx: Ctx): unknown {
  const p = ctx.params;
  rejectUnknown(p, ['customer', 'limit', 'starting_after', 'ending_before', 'created', 'expand']);
  const limit = optInt(p, 'limit') ?? 10;
  if (limit < 1 || limit > 100) throw paramError('Invalid limit: must be between 1 and 100', 'limit', 'parameter_invalid_integer');
  const after = optString(p, 'starting_after') || undefined;
  const before = optString(p, 'ending_before') || undefined;
  if (after && before) {
    throw paramError('You may only specify one of these parameters: ending_before, starting_after.', 'ending_before');
  }
  const customer = optString(p, 'customer') || undefined;
  const created = parseCreated(p);
  const expand = checkExpand(expandList(p), 'data.');

  const cursorId = after ?? before;
  const cursor = cursorId ? ctx.account.intents.get(cursorId) : undefined;
  if (cursorId && !cursor) throw notFound('payment_intent', cursorId, after ? 'starting_after' : 'ending_before');

  const all = [...ctx.account.intents.values()]
    .filter((i) => !customer || i.object.customer === customer)
    .filter((i) => !created || inRange(i.object.created, created))
    .sort(newerFirst);
  let page: StoredIntent[];
  let hasMore: boolean;
  if (cursor && after) {
    const rest = all.filter((i) => newerFirst(cursor, i) < 0);
    page = rest.slice(0, limit);
    hasMore = rest.length > limit;
  } else if (cursor) {
    const rest = all.filter((i) => newerFirst(i, cursor) < 0);
    page = rest.slice(Math.max(0, rest.length - limit));
    hasMore = rest.length > limit;
  } else {
    page = all.slice(0, limit);
    hasMore = all.length > limit;
  }
  return {
    object: 'list',
    data: page.map((i) => renderIntent(ctx.account, i.object, expand)),
    has_more: hasMore,
    url: '/v1/payment_intents',
  } satisfies Stripe.ApiList<Stripe.PaymentIntent>;
}
