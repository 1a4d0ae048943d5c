import Stripe from 'stripe';
import type { Config } from '../platform/config';

const clients = new WeakMap<Config, Stripe>();

/**
 * The payments SDK configured from the environment: the secret key and the API's
 * host, port and protocol (the bundled fake in development and tests). One client per
 * configuration; the SDK retries connection errors and 5xx with the same idempotency key.
 */
export function paymentsClient(config: Config): Stripe {
  let client = clients.get(config);
  if (!client) {
    client = new Stripe(config.STRIPE_SECRET_KEY, {
      host: config.STRIPE_API_HOST,
      port: config.STRIPE_API_PORT,
      protocol: config.STRIPE_API_PROTOCOL,
      maxNetworkRetries: 2,
      timeout: 20_000,
      appInfo: { name: 'Tamp & Tally' },
    });
    clients.set(config, client);
  }
  return client;
}

/** Is this an SDK error that leaves the outcome of a POST unknown (no answer, or a server failure)? */
export function outcomeUnknown(err: unknown): boolean {
  return err instanceof Stripe.errors.StripeConnectionError || err instanceof Stripe.errors.StripeAPIError
    || (err instanceof Stripe.errors.StripeError && (err.statusCode ?? 0) >= 500);
}
