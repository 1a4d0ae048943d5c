import session from 'express-session';
import connectPgSimple from 'connect-pg-simple';
import type pg from 'pg';

/** How often a session's expiry is moved on in the database while it is in use. */
export const TOUCH_EVERY_MS = 60_000;
const TRACKED_SESSIONS = 10_000;

/**
 * Sessions in PostgreSQL (connect-pg-simple), with the expiry moved on at most once a minute per
 * session and process rather than on every request: express-session holds each response until
 * the store's touch has finished, and an UPDATE per request is a write on every read. The
 * cookie still rolls on every response; the stored expiry lags it by under a minute of a
 * 12-hour session. The map only remembers when this process last wrote; losing it (a restart,
 * another process) costs one extra write, never a session.
 */
export function createSessionStore(pool: pg.Pool) {
  const PgStore = connectPgSimple(session);
  const touchedAt = new Map<string, number>();
  class ThrottledStore extends PgStore {
    override touch(sid: string, sess: session.SessionData, fn?: (err?: unknown) => void) {
      const now = Date.now();
      const last = touchedAt.get(sid);
      if (last !== undefined && now - last < TOUCH_EVERY_MS) {
        fn?.();
        return;
      }
      if (touchedAt.size >= TRACKED_SESSIONS) touchedAt.clear();
      touchedAt.set(sid, now);
      super.touch(sid, sess, fn);
    }

    override destroy(sid: string, fn?: (err?: unknown) => void) {
      touchedAt.delete(sid);
      super.destroy(sid, fn);
    }
  }
  return new ThrottledStore({ pool, tableName: 'session', createTableIfMissing: false, pruneSessionInterval: 60 * 15 });
}
