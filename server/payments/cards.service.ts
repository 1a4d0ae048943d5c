import Stripe from 'stripe';
import type { AppDeps } from '../platform/deps';
import type { SessionUser } from '../auth/roles';
import { badGateway, badRequest, invalidInput } from '../platform/errors';
import { forgetCard, savedCard, upsertSavedCard } from './payments.repo';
import { TEST_CARDS } from './payments.service';
import { outcomeUnknown, paymentsClient } from './stripe-client';

/**
 * The business's saved card: a customer at the payment provider with one attached
 * payment method. Card numbers never reach this server. In live use the provider's own
 * card form (its hosted fields, fed by a SetupIntent) turns the card into a `pm_…` id in the
 * browser and only that id is posted here; in test mode the published test ids stand in.
 */
export async function presentCard(deps: AppDeps, businessId: string) {
  const row = await savedCard(deps.db, businessId);
  return {
    card: row?.payment_method_id
      ? { paymentMethodId: row.payment_method_id, brand: row.card_brand, last4: row.card_last4, expMonth: row.card_exp_month, expYear: row.card_exp_year }
      : null,
    testMode: deps.config.paymentsTestMode,
    testCards: deps.config.paymentsTestMode ? TEST_CARDS : [],
  };
}

export async function saveCard(deps: AppDeps, user: SessionUser, paymentMethodId: string) {
  if (deps.config.paymentsTestMode && !TEST_CARDS.some((c) => c.id === paymentMethodId)) {
    throw invalidInput({ paymentMethodId: 'In test mode, choose one of the test cards.' });
  }
  const stripe = paymentsClient(deps.config);
  const existing = await savedCard(deps.db, user.businessId);
  try {
    let customerId = existing?.customer_id;
    if (!customerId) {
      const business = await deps.db('businesses').where({ id: user.businessId }).first('name');
      const customer = await stripe.customers.create(
        { name: business.name, email: user.email, metadata: { business_id: user.businessId } },
        { idempotencyKey: `business-${user.businessId}-customer` },
      );
      customerId = customer.id;
      await upsertSavedCard(deps.db, { business_id: user.businessId, customer_id: customerId, payment_method_id: null, card_brand: null, card_last4: null, card_exp_month: null, card_exp_year: null });
    }
    const pm = await stripe.paymentMethods.attach(paymentMethodId, { customer: customerId });
    await stripe.customers.update(customerId, { invoice_settings: { default_payment_method: pm.id } });
    await upsertSavedCard(deps.db, {
      business_id: user.businessId, customer_id: customerId, payment_method_id: pm.id,
      card_brand: pm.card?.brand ?? null, card_last4: pm.card?.last4 ?? null, card_exp_month: pm.card?.exp_month ?? null, card_exp_year: pm.card?.exp_year ?? null,
    });
  } catch (err) {
    if (outcomeUnknown(err)) throw badGateway('payments_unreachable', 'The payments service could not be reached, so the card was not saved. Try again in a minute.');
    if (err instanceof Stripe.errors.StripeError) throw badRequest('card_refused', `The payments service did not accept the card: ${err.message}`);
    throw err;
  }
  return presentCard(deps, user.businessId);
}

export async function removeCard(deps: AppDeps, businessId: string) {
  await forgetCard(deps.db, businessId);
  return presentCard(deps, businessId);
}
