import { expect, test } from 'vitest';
import request from 'supertest';
import { createApp } from '../../server/app';
import { systemClock } from '../../server/platform/clock';
import { loadConfig, ConfigError } from '../../server/platform/config';
import { createDb } from '../../server/platform/db';
import { createLogger } from '../../server/platform/logger';
import { createMailer } from '../../server/platform/mailer';
import { freePort } from '../../scripts/lib/postgres.mjs';
import { startTestApp } from '../helpers/context';

test('health answers 503 with db "down" when the database is unreachable', async () => {
  // A loopback port nobody listens on.
  const url = `postgres://app@127.0.0.1:${await freePort()}/nothing`;
  const config = loadConfig({ NODE_ENV: 'test', DATABASE_URL: url, LOG_LEVEL: 'silent' });
  const db = createDb(url);
  const app = createApp({ db, config, mailer: createMailer({ host: '127.0.0.1', port: 1, from: 'x@y.test' }), logger: createLogger('silent'), clock: systemClock });
  try {
    const res = await request(app).get('/api/health');
    expect(res.status).toBe(503);
    expect(res.body).toEqual({ ok: false, db: 'down' });
  } finally {
    await app.locals.shutdown();
    await db.destroy();
  }
});

test('responses carry a request id and a content security policy that allows only our own origin', async () => {
  const ctx = await startTestApp();
  try {
    const res = await request(ctx.app).get('/api/health');
    expect(res.headers['x-request-id']).toMatch(/^[0-9a-f-]{36}$/);
    const csp = String(res.headers['content-security-policy']);
    expect(csp).toContain("default-src 'self'");
    expect(csp).toContain("connect-src 'self'");
    expect(csp).toContain("frame-ancestors 'none'");
    // Plain http on loopback: no upgrade of requests to https.
    expect(csp).not.toContain('upgrade-insecure-requests');
    expect(res.headers['x-powered-by']).toBeUndefined();
  } finally {
    await ctx.close();
  }
});

test('a bad configuration value stops the boot with a message naming the variable', () => {
  expect(() => loadConfig({ PORT: 'eighty' })).toThrow(ConfigError);
  expect(() => loadConfig({ PORT: 'eighty' })).toThrow(/PORT/);
  expect(() => loadConfig({ STRIPE_SECRET_KEY: 'pk_live_x' })).toThrow(/STRIPE_SECRET_KEY/);
  expect(() => loadConfig({ NODE_ENV: 'production' })).toThrow(/SESSION_SECRET/);
  const c = loadConfig({});
  expect(c.PORT).toBe(3000);
  expect(c.DATABASE_URL).toBe('postgres://app@127.0.0.1:54329/tamp');
  expect(c.paymentsTestMode).toBe(true);
  expect(c.cookieSecure).toBe(false);
  expect(loadConfig({ APP_URL: 'https://cafe.example' }).cookieSecure).toBe(true);
});
