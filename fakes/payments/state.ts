import { randomBytes } from 'node:crypto';
import type Stripe from 'stripe';
import type { TestCard } from './cards';

const ALPHABET = 'ABCDEFGHIJKLMNOPQRSTUVWXYZabcdefghijklmnopqrstuvwxyz0123456789';

/** Ids look like the API's: a type prefix and 24 letters or digits. */
export function newId(prefix: string, length = 24): string {
  const bytes = randomBytes(length);
  let out = '';
  for (const b of bytes) out += ALPHABET[b % ALPHABET.length];
  return `${prefix}_${out}`;
}

export function nowSeconds(): number {
  return Math.floor(Date.now() / 1000);
}

export interface StoredPaymentMethod {
  object: Stripe.PaymentMethod;
  card: TestCard;
}

export interface StoredIntent {
  object: Stripe.PaymentIntent;
  /** Insertion order breaks ties between intents created in the same second. */
  seq: number;
  returnUrl: string | null;
  /** The test card that awaits authentication through the test route. */
  pendingCard: StoredPaymentMethod | null;
}

/** Everything one API key owns; keys never see each other's objects. */
export class Account {
  readonly customers = new Map<string, Stripe.Customer>();
  readonly paymentMethods = new Map<string, StoredPaymentMethod>();
  readonly intents = new Map<string, StoredIntent>();
  readonly charges = new Map<string, Stripe.Charge>();
  readonly refunds = new Map<string, Stripe.Refund>();
  readonly events = new Map<string, Stripe.Event>();
  private seq = 0;

  constructor(readonly apiKey: string) {}

  nextSeq(): number {
    this.seq += 1;
    return this.seq;
  }
}

export class Accounts {
  private readonly byKey = new Map<string, Account>();

  get(apiKey: string): Account {
    let account = this.byKey.get(apiKey);
    if (!account) {
      account = new Account(apiKey);
      this.byKey.set(apiKey, account);
    }
    return account;
  }

  all(): Account[] {
    return [...this.byKey.values()];
  }

  /** Test routes address an intent by id alone; ids are unique across keys. */
  findIntent(id: string): { account: Account; intent: StoredIntent } | undefined {
    for (const account of this.byKey.values()) {
      const intent = account.intents.get(id);
      if (intent) return { account, intent };
    }
    return undefined;
  }

  clear(): void {
    this.byKey.clear();
  }
}
