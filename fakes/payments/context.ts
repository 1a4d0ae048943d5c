import type Stripe from 'stripe';
import { buildEvent } from './objects';
import type { Params } from './params';
import type { Account, Accounts } from './state';
import type { WebhookSender } from './webhooks';

/** What every endpoint handler gets: its account, parsed parameters and a way to emit events. */
export interface Ctx {
  account: Account;
  params: Params;
  path: Record<string, string>;
  requestId: string;
  idempotencyKey: string | null;
  engine: Engine;
  emit(type: Stripe.Event.Type, object: unknown): void;
}

export type Handler = (ctx: Ctx) => unknown;

/** Shared by the API routes and the test-only routes. */
export class Engine {
  constructor(
    readonly accounts: Accounts,
    readonly webhooks: WebhookSender,
    readonly apiVersion: string,
    private readonly base: () => string,
  ) {}

  baseUrl(): string {
    return this.base();
  }

  /** Records an event for the account; the caller queues it for delivery once it has answered. */
  record(
    account: Account,
    type: Stripe.Event.Type,
    object: unknown,
    request: { id: string | null; idempotency_key: string | null },
  ): Stripe.Event {
    const event = buildEvent(type, object, request, this.apiVersion, this.webhooks.url ? 1 : 0);
    account.events.set(event.id, event);
    return event;
  }
}
