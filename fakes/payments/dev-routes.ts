import express, { type Request, type Response, type Router } from 'express';
import type { Engine } from './context';
import { FakeApiError } from './errors';
import { completeAuthentication } from './resources/payment-intents';
import { formatMinor } from './resources/amounts';

/**
 * Routes outside /v1 for tests and developers: completing an authentication,
 * flushing webhooks, resetting, and a page listing recent payment intents.
 */
export interface DevHooks {
  flush(): Promise<void>;
  reset(): void;
}

const esc = (s: string) =>
  s.replace(/[&<>"']/g, (c) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' })[c] as string);

function page(title: string, body: string): string {
  return `<!doctype html><html lang="en"><head><meta charset="utf-8"><title>${esc(title)}</title>
<style>body{font-family:system-ui,sans-serif;margin:2rem;color:#2A2320;background:#F7F3EC}
table{border-collapse:collapse;background:#FFFDF9}th,td{border:1px solid #E4DBCF;padding:.3rem .6rem;text-align:left}
td.num{text-align:right;font-variant-numeric:tabular-nums}button{font-size:1rem;margin-right:1rem;padding:.4rem 1rem}</style>
</head><body>${body}</body></html>`;
}

function parseResult(value: unknown): 'succeed' | 'fail' {
  if (value === 'succeed' || value === 'fail') return value;
  throw new FakeApiError(400, { type: 'invalid_request_error', message: "result must be 'succeed' or 'fail'", param: 'result' }, false);
}

function sendError(res: Response, err: unknown): void {
  if (err instanceof FakeApiError) {
    res.status(err.status).json(err.body());
    return;
  }
  throw err;
}

export function devRouter(engine: Engine, hooks: DevHooks): Router {
  const router = express.Router();
  const forms = [express.json(), express.urlencoded({ extended: false })];

  function authenticate(req: Request, result: 'succeed' | 'fail') {
    const found = engine.accounts.findIntent(String(req.params.id));
    if (!found) {
      throw new FakeApiError(404, { type: 'invalid_request_error', code: 'resource_missing', message: `No such payment_intent: '${req.params.id}'` }, false);
    }
    return { found, intent: completeAuthentication(engine, found.account, found.intent, result) };
  }

  router.post('/__fake/payment_intents/:id/authenticate', ...forms, (req, res) => {
    try {
      res.json(authenticate(req, parseResult(req.body?.result)).intent);
    } catch (err) {
      sendError(res, err);
    }
  });

  // The page a redirect_to_url next action points at: the customer's bank, played by a developer.
  router.get('/__fake/authenticate/:id', (req, res) => {
    const found = engine.accounts.findIntent(String(req.params.id));
    if (!found) {
      res.status(404).type('html').send(page('Not found', '<p>No such payment intent.</p>'));
      return;
    }
    const pi = found.intent.object;
    res.type('html').send(page('Authenticate payment', `<h1>Authenticate a test payment</h1>
<p>${esc(pi.id)}: ${esc(formatMinor(pi.amount, pi.currency))} ${esc(pi.currency.toUpperCase())}, status ${esc(pi.status)}</p>
<form method="post"><button name="result" value="succeed">Complete authentication</button>
<button name="result" value="fail">Fail authentication</button></form>`));
  });

  router.post('/__fake/authenticate/:id', ...forms, (req, res) => {
    try {
      const result = parseResult(req.body?.result);
      const { found, intent } = authenticate(req, result);
      const returnUrl = found.intent.returnUrl;
      if (!returnUrl) {
        res.type('html').send(page('Done', `<p>${esc(intent.id)} is now ${esc(intent.status)}.</p>`));
        return;
      }
      const target = new URL(returnUrl);
      target.searchParams.set('payment_intent', intent.id);
      target.searchParams.set('payment_intent_client_secret', intent.client_secret ?? '');
      target.searchParams.set('redirect_status', intent.status === 'succeeded' ? 'succeeded' : 'failed');
      res.redirect(303, target.toString());
    } catch (err) {
      sendError(res, err);
    }
  });

  router.post('/__fake/webhooks/flush', async (_req, res) => {
    await hooks.flush();
    res.status(204).end();
  });

  router.get('/__fake/webhooks', (_req, res) => {
    res.json(engine.webhooks.deliveries().map((d) => ({
      event: d.event.id, type: d.event.type, url: d.url, state: d.state, attempts: d.attempts,
    })));
  });

  router.post('/__fake/reset', (_req, res) => {
    hooks.reset();
    res.status(204).end();
  });

  router.get('/', (_req, res) => {
    const intents = engine.accounts.all()
      .flatMap((account) => [...account.intents.values()].map((i) => ({ account, i })))
      .sort((a, b) => b.i.object.created - a.i.object.created || b.i.seq - a.i.seq)
      .slice(0, 100);
    const rows = intents.map(({ account, i }) => {
      const pi = i.object;
      const meta = Object.entries(pi.metadata).map(([k, v]) => `${esc(k)}=${esc(v)}`).join('<br>');
      return `<tr><td>${new Date(pi.created * 1000).toISOString()}</td><td>${esc(pi.id)}</td><td>${esc(account.apiKey.slice(0, 12))}…</td>
<td>${esc(pi.status)}</td><td class="num">${esc(formatMinor(pi.amount, pi.currency))}</td><td>${esc(pi.currency.toUpperCase())}</td>
<td>${esc(typeof pi.customer === 'string' ? pi.customer : '')}</td><td>${meta}</td></tr>`;
    }).join('\n');
    const deliveries = engine.webhooks.deliveries().slice(-30).reverse().map((d) =>
      `<tr><td>${esc(d.event.id)}</td><td>${esc(d.event.type)}</td><td>${esc(d.state)}</td><td class="num">${d.attempts.length}</td>
<td>${esc(d.attempts.map((a) => a.status ?? a.error ?? '').join(', '))}</td></tr>`).join('\n');
    res.type('html').send(page('Local payments fake', `<h1>Local payments fake</h1>
<p>Webhooks go to: ${esc(engine.webhooks.url ?? '(not set)')}</p>
<h2>Recent payment intents</h2>
${rows ? `<table><thead><tr><th>Created (UTC)</th><th>Id</th><th>Key</th><th>Status</th><th>Amount</th><th>Currency</th><th>Customer</th><th>Metadata</th></tr></thead><tbody>${rows}</tbody></table>`
    : '<p>No payment intents yet. Pay a purchase order in the app to see one here.</p>'}
<h2>Recent webhook deliveries</h2>
${deliveries ? `<table><thead><tr><th>Event</th><th>Type</th><th>State</th><th>Attempts</th><th>Answers</th></tr></thead><tbody>${deliveries}</tbody></table>`
    : '<p>No deliveries yet.</p>'}`));
  });

  return router;
}
