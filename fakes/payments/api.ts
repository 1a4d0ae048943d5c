import express, { type Request, type Response, type Router } from 'express';
import type Stripe from 'stripe';
import type { Ctx, Engine, Handler } from './context';
import { authError, FakeApiError, internalError, paramError } from './errors';
import type { IdempotencyStore, Lookup } from './idempotency';
import { asParams } from './params';
import { createCustomer, retrieveCustomer, updateCustomer } from './resources/customers';
import { confirmIntentRoute, createIntent, listIntents, retrieveIntent } from './resources/payment-intents';
import { attachPaymentMethod, retrievePaymentMethod } from './resources/payment-methods';
import { createRefund, retrieveCharge, retrieveEvent, retrieveRefund } from './resources/refunds';
import { newId } from './state';

export type Fault = 'http500' | 'dropAfterSave';

/** Per-route test controls, keyed like 'POST /v1/payment_intents/:id/confirm'. */
export class Controls {
  readonly delays = new Map<string, number>();
  private readonly faults = new Map<string, Fault[]>();

  failNext(routeKey: string, fault: Fault): void {
    const queue = this.faults.get(routeKey) ?? [];
    queue.push(fault);
    this.faults.set(routeKey, queue);
  }

  takeFault(routeKey: string): Fault | undefined {
    return this.faults.get(routeKey)?.shift();
  }

  clear(): void {
    this.delays.clear();
    this.faults.clear();
  }
}

const ROUTES: ReadonlyArray<readonly ['GET' | 'POST', string, Handler]> = [
  ['POST', '/v1/customers', createCustomer],
  ['GET', '/v1/customers/:id', retrieveCustomer],
  ['POST', '/v1/customers/:id', updateCustomer],
  ['POST', '/v1/payment_methods/:id/attach', attachPaymentMethod],
  ['GET', '/v1/payment_methods/:id', retrievePaymentMethod],
  ['POST', '/v1/payment_intents', createIntent],
  ['GET', '/v1/payment_intents', listIntents],
  ['GET', '/v1/payment_intents/:id', retrieveIntent],
  ['POST', '/v1/payment_intents/:id/confirm', confirmIntentRoute],
  ['POST', '/v1/refunds', createRefund],
  ['GET', '/v1/refunds/:id', retrieveRefund],
  ['GET', '/v1/charges/:id', retrieveCharge],
  ['GET', '/v1/events/:id', retrieveEvent],
];

export const ROUTE_KEYS: readonly string[] = ROUTES.map(([method, path]) => `${method} ${path}`);

const KEY_PATTERN = /^(sk|rk)_test_[A-Za-z0-9_]+$/;

function mask(key: string): string {
  return key.length <= 12 ? `${key.slice(0, 3)}****` : `${key.slice(0, 8)}${'*'.repeat(key.length - 12)}${key.slice(-4)}`;
}

/** Bearer auth as the SDK sends it (Basic with the key as user name also works, as with the API). */
export function apiKeyOf(req: Request): string {
  const header = req.get('authorization') ?? '';
  let key = '';
  const bearer = /^Bearer\s+(.+)$/i.exec(header);
  const basic = /^Basic\s+(.+)$/i.exec(header);
  if (bearer) key = bearer[1].trim();
  else if (basic) key = Buffer.from(basic[1], 'base64').toString('utf8').split(':')[0];
  if (!key) {
    throw authError(
      "You did not provide an API key. You need to provide your API key in the Authorization header, using Bearer auth (e.g. 'Authorization: Bearer YOUR_SECRET_KEY').",
    );
  }
  if (/^(sk|rk)_live_/.test(key)) {
    throw authError(`Invalid API Key provided: ${mask(key)}. The local payments fake accepts test-mode keys only.`);
  }
  if (!KEY_PATTERN.test(key)) throw authError(`Invalid API Key provided: ${mask(key)}`);
  return key;
}

function send(res: Response, status: number, body: unknown, drop: boolean): void {
  if (drop) {
    // The result is saved; the client never hears it and must retry with the same key.
    res.socket?.destroy();
    return;
  }
  res.status(status).type('application/json').send(JSON.stringify(body, null, 2));
}

const sleep = (ms: number) => new Promise((r) => setTimeout(r, ms));

export function apiRouter(engine: Engine, idempotency: IdempotencyStore, controls: Controls): Router {
  const router = express.Router();
  router.use('/v1', express.urlencoded({ extended: true, limit: '1mb', parameterLimit: 5000 }));

  for (const [method, pattern, handler] of ROUTES) {
    const routeKey = `${method} ${pattern}`;
    const run = async (req: Request, res: Response) => {
      const requestId = newId('req', 14);
      res.set('Request-Id', requestId);
      res.set('Stripe-Version', req.get('stripe-version') ?? engine.apiVersion);
      const fault = controls.takeFault(routeKey);
      const drop = fault === 'dropAfterSave';
      let lookup: Lookup | null = null;
      try {
        const apiKey = apiKeyOf(req);
        // A failure in front of the endpoint: nothing ran, nothing is saved.
        if (fault === 'http500') throw internalError('A simulated server error before the request was processed.');
        const params = asParams(method === 'GET' ? req.query : req.body);
        const idemKey = method === 'POST' ? (req.get('idempotency-key') ?? null) : null;
        if (idemKey !== null) {
          res.set('Idempotency-Key', idemKey);
          lookup = idempotency.begin(apiKey, idemKey, `${method} ${req.path}`, params);
          if (lookup.kind === 'replay') {
            res.set('Idempotent-Replayed', 'true');
            res.set('Original-Request', lookup.saved.requestId);
            send(res, lookup.saved.status, lookup.saved.body, drop);
            return;
          }
        }
        const delay = controls.delays.get(routeKey);
        if (delay) await sleep(delay);

        const account = engine.accounts.get(apiKey);
        const events: Stripe.Event[] = [];
        const ctx: Ctx = {
          account, params, path: req.params as Record<string, string>, requestId, idempotencyKey: idemKey, engine,
          emit: (type, object) => {
            events.push(engine.record(account, type, object, { id: requestId, idempotency_key: idemKey }));
          },
        };
        let status = 200;
        let body: unknown;
        try {
          body = handler(ctx);
        } catch (err) {
          if (!(err instanceof FakeApiError) || !err.stored) throw err;
          status = err.status;
          body = err.body();
        }
        if (lookup?.kind === 'new') lookup.complete({ status, body, requestId });
        send(res, status, body, drop);
        for (const event of events) engine.webhooks.enqueue(event);
      } catch (err) {
        if (lookup?.kind === 'new') lookup.abandon();
        const apiErr = err instanceof FakeApiError ? err : internalError();
        if (!(err instanceof FakeApiError)) console.error('payments fake: unexpected error', err);
        if (apiErr.status === 409) res.set('Stripe-Should-Retry', 'true');
        send(res, apiErr.status, apiErr.body(), drop);
      }
    };
    if (method === 'GET') router.get(pattern, run);
    else router.post(pattern, run);
  }

  router.all('/v1/{*rest}', (req, res) => {
    res.set('Request-Id', newId('req', 14));
    const err = new FakeApiError(404, {
      type: 'invalid_request_error',
      message: `Unrecognized request URL (${req.method}: ${req.path}). The local payments fake implements: ${ROUTE_KEYS.join(', ')}.`,
    }, false);
    send(res, 404, err.body(), false);
  });

  // Malformed bodies and other parser failures answer in the API's error shape.
  router.use('/v1', (err: unknown, _req: Request, res: Response, _next: express.NextFunction) => {
    void _next;
    const apiErr = err instanceof FakeApiError ? err : paramError(`Invalid request body: ${err instanceof Error ? err.message : String(err)}`);
    res.set('Request-Id', newId('req', 14));
    send(res, apiErr.status, apiErr.body(), false);
  });
  return router;
}
