import { afterAll, describe, expect, inject, it } from 'vitest';
import pg from 'pg';
import { createSessionStore } from '../../../server/auth/session-store';

const pool = new pg.Pool({ connectionString: inject('databaseUrl'), max: 2 });
afterAll(() => pool.end());

const call = (fn: (cb: (err?: unknown) => void) => void) => new Promise<void>((resolve, reject) => fn((err) => (err ? reject(err) : resolve())));
const sessionWith = (expires: string) => ({ cookie: { originalMaxAge: 1000, expires: new Date(expires), httpOnly: true, path: '/' } }) as never;
const storedExpiry = async (sid: string) => (await pool.query('select expire from session where sid = $1', [sid])).rows[0]?.expire.toISOString();

describe('the session store', () => {
  it('moves a session\'s stored expiry on at its first touch, then at most once a minute, and forgets it when destroyed', async () => {
    const store = createSessionStore(pool);
    const sid = `test-${Date.now()}-${Math.random()}`;
    await call((cb) => store.set(sid, sessionWith('2030-01-01T00:00:00Z'), cb));
    expect(await storedExpiry(sid)).toBe('2030-01-01T00:00:00.000Z');

    await call((cb) => store.touch(sid, sessionWith('2030-01-01T01:00:00Z'), cb));
    expect(await storedExpiry(sid)).toBe('2030-01-01T01:00:00.000Z');
    // Within the minute: the response is not held for another write.
    await call((cb) => store.touch(sid, sessionWith('2030-01-01T02:00:00Z'), cb));
    expect(await storedExpiry(sid)).toBe('2030-01-01T01:00:00.000Z');

    await call((cb) => store.destroy(sid, cb));
    expect(await storedExpiry(sid)).toBeUndefined();
    // A new session under the same id is touched again straight away.
    await call((cb) => store.set(sid, sessionWith('2030-02-01T00:00:00Z'), cb));
    await call((cb) => store.touch(sid, sessionWith('2030-02-01T01:00:00Z'), cb));
    expect(await storedExpiry(sid)).toBe('2030-02-01T01:00:00.000Z');
    await call((cb) => store.destroy(sid, cb));
    store.close();
  });
});
