import type { Knex } from 'knex';
import { throttled } from '../platform/errors';

export interface ThrottleSettings {
  /** Failed sign-ins for one account from one address before it locks. */
  maxFailures: number;
  /** Failed sign-ins from one address, whatever the accounts, before it locks. */
  maxFailuresPerAddress: number;
  windowMinutes: number;
}

/** The longest lock the back-off reaches. */
const MAX_LOCK_MINUTES = 24 * 60;

const accountKey = (email: string, address: string) => `acct:${email.trim().toLowerCase()}|${address}`;
const addressKey = (address: string) => `addr:${address}`;
export const resetAddressKey = (address: string) => `reset:${address}`;

/** Minutes until the lock on any of these keys lifts, or 0 when none is locked. */
async function lockedFor(db: Knex, keys: string[]): Promise<number> {
  const row = await db('login_throttles')
    .whereIn('key', keys)
    .where('locked_until', '>', db.fn.now())
    .max({ until: 'locked_until' })
    .first();
  if (!row?.until) return 0;
  const ms = new Date(row.until as string).getTime() - Date.now();
  return Math.max(1, Math.ceil(ms / 60_000));
}

/**
 * Counts one event against a key. When the count within the window reaches `limit`, the key is
 * locked for the window, doubled for each earlier lock when `backOff` is on (capped at a day).
 */
export async function countAgainst(db: Knex, key: string, limit: number, windowMinutes: number, backOff: boolean): Promise<void> {
  await db.transaction(async (trx) => {
    const r = await trx.raw(
      `insert into login_throttles (key, failures, window_ends) values (?, 1, now() + make_interval(mins => ?))
       on conflict (key) do update set
         failures = case when login_throttles.window_ends <= now() then 1 else login_throttles.failures + 1 end,
         window_ends = case when login_throttles.window_ends <= now() then excluded.window_ends else login_throttles.window_ends end
       returning failures, lockouts`,
      [key, windowMinutes],
    );
    const { failures, lockouts } = r.rows[0] as { failures: number; lockouts: number };
    if (failures < limit) return;
    const minutes = backOff ? Math.min(windowMinutes * 2 ** lockouts, MAX_LOCK_MINUTES) : windowMinutes;
    await trx('login_throttles').where({ key }).update({
      locked_until: trx.raw('now() + make_interval(mins => ?)', [minutes]),
      lockouts: lockouts + 1,
      failures: 0,
      window_ends: trx.raw('now() + make_interval(mins => ?)', [windowMinutes]),
    });
  });
}

/** 429 when this account is locked from this address, or this address is locked. */
export async function assertLoginAllowed(db: Knex, email: string, address: string): Promise<void> {
  const minutes = await lockedFor(db, [accountKey(email, address), addressKey(address)]);
  if (minutes > 0) throw throttled(`Too many failed sign-ins. Wait ${minutes} minute${minutes === 1 ? '' : 's'} and try again, or reset your password.`);
}

export async function recordLoginFailure(db: Knex, s: ThrottleSettings, email: string, address: string): Promise<void> {
  await countAgainst(db, accountKey(email, address), s.maxFailures, s.windowMinutes, true);
  await countAgainst(db, addressKey(address), s.maxFailuresPerAddress, s.windowMinutes, false);
}

/** A right password from an address clears that account's count there (the address's own count stays). */
export async function recordLoginSuccess(db: Knex, email: string, address: string): Promise<void> {
  await db('login_throttles').where({ key: accountKey(email, address) }).delete();
}

/** Reset requests per address: `limit` in `windowMinutes`, then 429 until the window ends. */
export async function assertResetAllowed(db: Knex, address: string, limit: number, windowMinutes: number): Promise<void> {
  const minutes = await lockedFor(db, [resetAddressKey(address)]);
  if (minutes > 0) throw throttled(`Too many reset requests from here. Wait ${minutes} minute${minutes === 1 ? '' : 's'} and try again.`);
  await countAgainst(db, resetAddressKey(address), limit, windowMinutes, false);
}
