import { randomBytes } from 'node:crypto';
import type { AddressInfo } from 'node:net';
import express from 'express';
import Stripe from 'stripe';
import type { PaymentsFake } from '../../../fakes/payments/server';

/** A fresh test key per test: the fake keeps state per key, so tests never share objects. */
export function testKey(): string {
  return `sk_test_${randomBytes(12).toString('hex')}`;
}

export function sdk(fake: PaymentsFake, key = testKey(), config: Stripe.StripeConfig = {}): Stripe {
  return new Stripe(key, { host: fake.host, port: fake.port, protocol: 'http', ...config });
}

/** Catches the error a promise rejects with, failing when it resolves. */
export async function rejection(promise: Promise<unknown>): Promise<Stripe.errors.StripeError> {
  try {
    await promise;
  } catch (err) {
    return err as Stripe.errors.StripeError;
  }
  throw new Error('expected the call to fail');
}

/**
 * Records the idempotency key of every attempt the SDK sends. (Its 'response'
 * event fires only for the answer it finally keeps, not for retried ones.)
 */
export function attempts(stripe: Stripe): (string | undefined)[] {
  const seen: (string | undefined)[] = [];
  stripe.on('request', (e: Stripe.RequestEvent) => seen.push(e.idempotency_key));
  return seen;
}

export interface Received {
  raw: string;
  signature: string;
  event: { id: string; type: string; data: { object: Record<string, unknown> }; request: { id: string | null; idempotency_key: string | null } };
}

/**
 * A webhook receiver built the way the app's is: express.raw on the route,
 * the raw bytes kept for signature checks. `answer` picks the status per call,
 * `holdMs` how long that call waits before answering.
 */
export async function startReceiver(answer: (n: number) => number = () => 200, holdMs: (n: number) => number = () => 0) {
  const received: Received[] = [];
  let calls = 0;
  const app = express();
  app.post('/hooks', express.raw({ type: 'application/json' }), (req, res) => {
    calls += 1;
    const raw = (req.body as Buffer).toString('utf8');
    received.push({ raw, signature: String(req.get('stripe-signature')), event: JSON.parse(raw) });
    const n = calls;
    setTimeout(() => {
      if (!res.writableEnded && !res.destroyed) res.status(answer(n)).json({ received: true });
    }, holdMs(n));
  });
  const server = app.listen(0, '127.0.0.1');
  await new Promise<void>((resolve) => server.once('listening', () => resolve()));
  const port = (server.address() as AddressInfo).port;
  return {
    url: `http://127.0.0.1:${port}/hooks`,
    received,
    ofType: (type: string) => received.filter((r) => r.event.type === type),
    close: () => new Promise<void>((resolve) => {
      server.close(() => resolve());
      server.closeAllConnections();
    }),
  };
}
