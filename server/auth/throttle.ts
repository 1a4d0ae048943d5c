import type { Knex } from 'knex';
import { ipKeyGenerator, rateLimit, type Options, type Store, type IncrementResponse } from 'express-rate-limit';
import type { Request } from 'express';
import { throttled } from '../platform/errors';

/** express-rate-limit counters in PostgreSQL (shared by every server process). */
class PgStore implements Store {
  private windowMs = 60_000;
  constructor(private db: Knex, public prefix: string) {}
  init(options: Options) {
    this.windowMs = options.windowMs;
  }
  async increment(key: string): Promise<IncrementResponse> {
    const k = this.prefix + key;
    const r = await this.db.raw(
      `insert into rate_limits (key, hits, reset_at) values (?, 1, now() + (? || ' milliseconds')::interval)
       on conflict (key) do update set
         hits = case when rate_limits.reset_at <= now() then 1 else rate_limits.hits + 1 end,
         reset_at = case when rate_limits.reset_at <= now() then excluded.reset_at else rate_limits.reset_at end
       returning hits, reset_at`,
      [k, String(this.windowMs)],
    );
    return { totalHits: r.rows[0].hits, resetTime: new Date(r.rows[0].reset_at) };
  }
  async decrement(key: string) {
    await this.db('rate_limits').where({ key: this.prefix + key }).where('hits', '>', 0).decrement('hits', 1);
  }
  async resetKey(key: string) {
    await this.db('rate_limits').where({ key: this.prefix + key }).delete();
  }
}

/**
 * Failed sign-ins are counted per account and per address; successful ones
 * are not counted. When either limit is reached the answer is 429.
 */
export function loginThrottles(db: Knex, opts: { maxFailures: number; maxFailuresPerAddress: number; windowMinutes: number }) {
  const windowMs = opts.windowMinutes * 60_000;
  const message = `Too many failed sign-ins. Wait ${opts.windowMinutes} minutes and try again, or reset your password.`;
  const common = {
    windowMs,
    skipSuccessfulRequests: true,
    standardHeaders: 'draft-8' as const,
    legacyHeaders: false,
    handler: () => {
      throw throttled(message);
    },
  };
  const perAccount = rateLimit({
    ...common,
    limit: opts.maxFailures,
    store: new PgStore(db, 'login:acct:'),
    keyGenerator: (req: Request) => String((req.body as { email?: unknown })?.email ?? '').trim().toLowerCase(),
  });
  const perAddress = rateLimit({
    ...common,
    // An address may hold several accounts (an office, a café's Wi-Fi): a higher limit.
    limit: opts.maxFailuresPerAddress,
    store: new PgStore(db, 'login:ip:'),
    keyGenerator: (req: Request) => ipKeyGenerator(req.ip ?? 'unknown'),
  });
  return [perAddress, perAccount];
}
