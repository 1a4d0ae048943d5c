import type { AddressInfo, Socket } from 'node:net';
import express from 'express';
import Stripe from 'stripe';
import { apiRouter, Controls, type Fault } from './api';
import { Engine } from './context';
import { devRouter } from './dev-routes';
import { IdempotencyStore } from './idempotency';
import { Accounts } from './state';
import { WebhookSender } from './webhooks';

export interface PaymentsFakeOptions {
  host?: string;
  port?: number;
  webhookUrl?: string;
  webhookSecret?: string;
  webhookRetryDelaysMs?: number[];
  /** How long one delivery may take before it counts as failed; default 5000 ms. */
  webhookTimeoutMs?: number;
}

export interface PaymentsFake {
  url: string;
  host: string;
  port: number;
  setWebhook(url: string | null, secret?: string): void;
  /** Delivers everything pending now and waits for those attempts. */
  flushWebhooks(): Promise<void>;
  /** Holds every request on a route (e.g. 'POST /v1/payment_intents') this long before it runs; 0 clears. */
  setDelay(routeKey: string, ms: number): void;
  /** The next request on the route fails: 'http500' before running, 'dropAfterSave' after saving. */
  failNext(routeKey: string, fault: Fault): void;
  reset(): void;
  close(): Promise<void>;
}

export const DEFAULT_WEBHOOK_SECRET = 'whsec_local_payments_fake';

/**
 * Starts the local payments fake: the subset of the payments API the app uses,
 * in memory per API key, answering the official SDK over plain http.
 */
export async function startPaymentsFake(opts: PaymentsFakeOptions = {}): Promise<PaymentsFake> {
  const host = opts.host ?? '127.0.0.1';
  let baseUrl = '';
  const accounts = new Accounts();
  const webhooks = new WebhookSender({
    url: opts.webhookUrl ?? null,
    secret: opts.webhookSecret ?? DEFAULT_WEBHOOK_SECRET,
    retryDelaysMs: opts.webhookRetryDelaysMs ?? [200, 1000, 3000],
    timeoutMs: opts.webhookTimeoutMs ?? 5000,
  });
  const engine = new Engine(accounts, webhooks, Stripe.API_VERSION, () => baseUrl);
  const idempotency = new IdempotencyStore();
  const controls = new Controls();
  const reset = () => {
    accounts.clear();
    idempotency.clear();
    controls.clear();
    webhooks.reset();
  };

  const app = express();
  app.disable('x-powered-by');
  // The SDK sends GET parameters bracket-encoded too (created[gte]=…, expand[0]=…).
  app.set('query parser', 'extended');
  app.use(apiRouter(engine, idempotency, controls));
  app.use(devRouter(engine, { flush: () => webhooks.flush(), reset }));

  const server = app.listen(opts.port ?? 0, host);
  await new Promise<void>((resolve, reject) => {
    server.once('listening', resolve);
    server.once('error', reject);
  });
  const sockets = new Set<Socket>();
  server.on('connection', (s) => {
    sockets.add(s);
    s.once('close', () => sockets.delete(s));
  });
  const port = (server.address() as AddressInfo).port;
  baseUrl = `http://${host.includes(':') ? `[${host}]` : host}:${port}`;

  return {
    url: baseUrl,
    host,
    port,
    setWebhook: (url, secret) => webhooks.configure(url, secret),
    flushWebhooks: () => webhooks.flush(),
    setDelay: (routeKey, ms) => {
      if (ms > 0) controls.delays.set(routeKey, ms);
      else controls.delays.delete(routeKey);
    },
    failNext: (routeKey, fault) => controls.failNext(routeKey, fault),
    reset,
    close: async () => {
      await webhooks.close();
      await new Promise<void>((resolve, reject) => {
        server.close((err) => (err ? reject(err) : resolve()));
        for (const s of sockets) s.destroy();
      });
    },
  };
}
