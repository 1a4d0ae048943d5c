import { createHmac } from 'node:crypto';
import type Stripe from 'stripe';

/**
 * The signature scheme the SDK verifies (see its Webhooks module):
 * `t=<unix seconds>,v1=<hex HMAC-SHA256 of "<t>.<body>">`, keyed with the
 * whole `whsec_…` string.
 */
export function signatureHeader(body: string, secret: string, timestamp: number): string {
  const v1 = createHmac('sha256', secret).update(`${timestamp}.${body}`, 'utf8').digest('hex');
  return `t=${timestamp},v1=${v1}`;
}

export interface DeliveryAttempt {
  at: number;
  status: number | null;
  error: string | null;
}

export interface Delivery {
  event: Stripe.Event;
  url: string;
  body: string;
  attempts: DeliveryAttempt[];
  state: 'pending' | 'delivered' | 'failed';
}

interface Pending {
  delivery: Delivery;
  timer: NodeJS.Timeout | null;
  running: Promise<void> | null;
}

export interface WebhookOptions {
  url: string | null;
  secret: string;
  retryDelaysMs: number[];
  timeoutMs: number;
}

/**
 * Delivers events to one configured URL after the API has answered. A non-2xx
 * answer or a timeout is retried at the configured intervals with the same
 * event id and body, each attempt signed afresh. Neither order nor single
 * delivery is promised, as with the real service.
 */
export class WebhookSender {
  private readonly pending = new Set<Pending>();
  private readonly log: Delivery[] = [];
  private closed = false;

  constructor(private readonly opts: WebhookOptions) {}

  configure(url: string | null, secret?: string): void {
    this.opts.url = url;
    if (secret !== undefined) this.opts.secret = secret;
  }

  get url(): string | null {
    return this.opts.url;
  }

  /** Queues an event; without a URL it is kept in the event log only. */
  enqueue(event: Stripe.Event): void {
    if (!this.opts.url || this.closed) return;
    const delivery: Delivery = {
      event,
      url: this.opts.url,
      // Pretty-printed on purpose: a receiver that re-serialises parsed JSON
      // instead of verifying the raw bytes fails the signature check.
      body: JSON.stringify(event, null, 2),
      attempts: [],
      state: 'pending',
    };
    this.log.push(delivery);
    if (this.log.length > 500) this.log.shift();
    const p: Pending = { delivery, timer: null, running: null };
    this.pending.add(p);
    this.schedule(p, 0);
  }

  deliveries(): Delivery[] {
    return [...this.log];
  }

  /** Attempts every pending delivery now and waits for those attempts. */
  async flush(): Promise<void> {
    const waits: Promise<void>[] = [];
    for (const p of this.pending) {
      if (p.running) {
        waits.push(p.running);
      } else {
        if (p.timer) clearTimeout(p.timer);
        p.timer = null;
        waits.push(this.attempt(p));
      }
    }
    await Promise.all(waits);
  }

  reset(): void {
    for (const p of this.pending) if (p.timer) clearTimeout(p.timer);
    this.pending.clear();
    this.log.length = 0;
  }

  async close(): Promise<void> {
    this.closed = true;
    const running = [...this.pending].map((p) => p.running).filter((r): r is Promise<void> => r !== null);
    for (const p of this.pending) if (p.timer) clearTimeout(p.timer);
    this.pending.clear();
    await Promise.allSettled(running);
  }

  private schedule(p: Pending, ms: number): void {
    p.timer = setTimeout(() => {
      p.timer = null;
      void this.attempt(p);
    }, ms);
    p.timer.unref();
  }

  private attempt(p: Pending): Promise<void> {
    const run = this.send(p).finally(() => {
      p.running = null;
    });
    p.running = run;
    return run;
  }

  private async send(p: Pending): Promise<void> {
    const { delivery } = p;
    const timestamp = Math.floor(Date.now() / 1000);
    const attempt: DeliveryAttempt = { at: Date.now(), status: null, error: null };
    delivery.attempts.push(attempt);
    try {
      const res = await fetch(delivery.url, {
        method: 'POST',
        headers: {
          'Content-Type': 'application/json; charset=utf-8',
          'User-Agent': 'Stripe/1.0 (+https://stripe.com/docs/webhooks)',
          'Stripe-Signature': signatureHeader(delivery.body, this.opts.secret, timestamp),
        },
        body: delivery.body,
        signal: AbortSignal.timeout(this.opts.timeoutMs),
      });
      attempt.status = res.status;
      await res.arrayBuffer().catch(() => undefined);
    } catch (err) {
      attempt.error = err instanceof Error ? `${err.name}: ${err.message}` : String(err);
    }
    if (attempt.status !== null && attempt.status >= 200 && attempt.status < 300) {
      delivery.state = 'delivered';
      this.pending.delete(p);
      return;
    }
    const retryIndex = delivery.attempts.length - 1;
    if (this.closed || !this.pending.has(p) || retryIndex >= this.opts.retryDelaysMs.length) {
      delivery.state = 'failed';
      this.pending.delete(p);
      return;
    }
    this.schedule(p, this.opts.retryDelaysMs[retryIndex]);
  }
}
