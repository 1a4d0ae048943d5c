import net from 'node:net';
import { afterAll, beforeAll, describe, expect, test } from 'vitest';
import request from 'supertest';
import { startTestApp, type TestContext } from '../helpers/context';
import { makeBusiness, signIn, suffix, TEST_PASSWORD } from '../helpers/factories';

let ctx: TestContext;
beforeAll(async () => {
  ctx = await startTestApp({ LOGIN_MAX_FAILURES: '3', LOGIN_WINDOW_MINUTES: '15' });
});
afterAll(() => ctx.close());

/** A documentation address (RFC 5737) seen through the loopback proxy. */
const address = () => `198.51.100.${Math.floor(Math.random() * 250) + 1}`;
const loginFrom = (ip: string, email: string, password: string) => request(ctx.app).post('/api/auth/login').set('X-Forwarded-For', ip).send({ email, password });

const linkToken = (text: string) => {
  const m = text.match(/\/reset-password\?token=([A-Za-z0-9_-]+)/);
  if (!m) throw new Error(`no reset link in: ${text}`);
  return m[1];
};

describe('sign-in throttling cannot lock a user out from elsewhere', () => {
  test('failures from one address lock that account there only; the owner signs in from another address', async () => {
    const b = await makeBusiness(ctx.db);
    const email = b.users.owner.email;
    const attacker = address();
    for (let i = 0; i < 3; i += 1) expect((await loginFrom(attacker, email, `guess-${i}-password`)).status).toBe(401);
    expect((await loginFrom(attacker, email, TEST_PASSWORD)).status).toBe(429);
    let owner = address();
    while (owner === attacker) owner = address();
    expect((await loginFrom(owner, email, TEST_PASSWORD)).status).toBe(200);
  });

  test('a lock earned again lasts twice as long (back-off)', async () => {
    const b = await makeBusiness(ctx.db);
    const email = b.users.manager.email;
    const ip = address();
    const key = `acct:${email.toLowerCase()}|${ip}`;
    const lockMinutes = async () => {
      const r = await ctx.db.raw('select extract(epoch from (locked_until - now())) / 60 as m from login_throttles where key = ?', [key]);
      return Number(r.rows[0].m);
    };
    for (let i = 0; i < 3; i += 1) await loginFrom(ip, email, `guess-${i}-password`);
    const first = await lockMinutes();
    expect(first).toBeGreaterThan(14);
    expect(first).toBeLessThanOrEqual(15);
    // The lock runs out; three more failures lock it again, now for 30 minutes.
    await ctx.db('login_throttles').where({ key }).update({ locked_until: ctx.db.raw("now() - interval '1 second'") });
    for (let i = 0; i < 3; i += 1) expect((await loginFrom(ip, email, `again-${i}-password`)).status).toBe(401);
    const second = await lockMinutes();
    expect(second).toBeGreaterThan(29);
    expect(second).toBeLessThanOrEqual(30);
  });
});

describe('password reset and sessions', () => {
  test('completing a reset ends every session of that user', async () => {
    const b = await makeBusiness(ctx.db);
    const email = b.users.bookkeeper.email;
    const phone = await signIn(ctx.app, email);
    const laptop = await signIn(ctx.app, email);
    const someoneElse = await signIn(ctx.app, b.users.owner.email);
    expect((await request(ctx.app).post('/api/auth/password-reset/request').set('X-Forwarded-For', address()).send({ email })).status).toBe(202);
    const token = linkToken((await ctx.mail.waitForMessage((m) => m.to.includes(email), 20_000)).text);
    expect((await request(ctx.app).post('/api/auth/password-reset/complete').send({ token, password: 'a-fresh-password' })).status).toBe(204);
    expect((await phone.get('/api/auth/me')).status).toBe(401);
    expect((await laptop.get('/api/auth/me')).status).toBe(401);
    expect((await someoneElse.get('/api/auth/me')).status).toBe(200);
  });

  test('changing a password ends the other sessions and keeps this one', async () => {
    const b = await makeBusiness(ctx.db);
    const email = b.users.owner.email;
    const here = await signIn(ctx.app, email);
    const there = await signIn(ctx.app, email);
    const wrong = await here.post('/api/auth/password', { currentPassword: 'not-the-password', newPassword: 'another-long-password' });
    expect(wrong.status).toBe(400);
    expect(Object.keys(wrong.body.error.fields)).toEqual(['currentPassword']);
    expect((await there.get('/api/auth/me')).status).toBe(200);
    expect((await here.post('/api/auth/password', { currentPassword: TEST_PASSWORD, newPassword: 'another-long-password' })).status).toBe(204);
    expect((await here.get('/api/auth/me')).status).toBe(200);
    expect((await there.get('/api/auth/me')).status).toBe(401);
    expect((await request(ctx.app).post('/api/auth/login').send({ email, password: 'another-long-password' })).status).toBe(200);
  });

  test('reset requests are throttled per address (429 after ten in a quarter of an hour)', async () => {
    const ip = address();
    for (let i = 0; i < 10; i += 1) {
      expect((await request(ctx.app).post('/api/auth/password-reset/request').set('X-Forwarded-For', ip).send({ email: `nobody-${suffix()}@example.test` })).status).toBe(202);
    }
    const res = await request(ctx.app).post('/api/auth/password-reset/request').set('X-Forwarded-For', ip).send({ email: `nobody-${suffix()}@example.test` });
    expect(res.status).toBe(429);
    expect(res.body.error.code).toBe('throttled');
  });

  test('an account gets at most three reset e-mails an hour, however often it is asked, and the answer is the same', async () => {
    const b = await makeBusiness(ctx.db);
    const email = b.users.barista.email;
    for (let i = 0; i < 6; i += 1) {
      expect((await request(ctx.app).post('/api/auth/password-reset/request').set('X-Forwarded-For', address()).send({ email })).status).toBe(202);
      await ctx.app.locals.idle();
    }
    await ctx.mail.waitForMessage((m) => m.to.includes(email), 20_000);
    expect(ctx.mail.messages().filter((m) => m.to.includes(email))).toHaveLength(3);
  });
});

describe('the reset answer does not wait for the account lookup or the e-mail', () => {
  test('with a mail server that never answers, an existing account still gets its 202 at once', async () => {
    // A server that accepts connections and says nothing: sending would hang until it times out.
    const sockets: net.Socket[] = [];
    const silent = net.createServer((s) => void sockets.push(s));
    await new Promise<void>((resolve) => silent.listen(0, '127.0.0.1', resolve));
    const port = (silent.address() as net.AddressInfo).port;
    const t = await startTestApp({ SMTP_PORT: String(port) });
    try {
      const b = await makeBusiness(t.db);
      const res = await request(t.app).post('/api/auth/password-reset/request').send({ email: b.users.owner.email });
      expect(res.status).toBe(202);
      expect(res.body).toEqual({ ok: true });
    } finally {
      // Hang up on the mailer so the e-mail under way fails (and is logged), then close as usual.
      for (const s of sockets) s.destroy();
      silent.close();
      await t.close();
    }
  });
});

describe('the country sets the defaults of a new business', () => {
  const signup = (country: string, extra: Record<string, string> = {}) =>
    request.agent(ctx.app).post('/api/auth/signup').send({
      name: 'Rowan Vale', email: `new-${suffix()}@example.test`, password: 'a-long-password', businessName: 'Vale Beans', siteName: 'Quay',
      country, currency: country === 'US' ? 'USD' : 'GBP', taxMode: country === 'US' ? 'exclusive' : 'inclusive', ...extra,
    });

  test('a UK business starts with VAT at the standard 20 % (HMRC; tests/SOURCES.md), never 0 %', async () => {
    const agent = request.agent(ctx.app);
    const res = await agent.post('/api/auth/signup').send({ name: 'Rowan Vale', email: `uk-${suffix()}@example.test`, password: 'a-long-password', businessName: 'Vale Beans', siteName: 'Quay', country: 'GB', currency: 'GBP', taxMode: 'inclusive', timeZone: 'Europe/London' });
    expect(res.status).toBe(201);
    expect(res.body.business).toMatchObject({ country: 'GB', taxName: 'VAT', taxMode: 'inclusive', timeZone: 'Europe/London' });
    const policy = await ctx.db('pricing_policies').where({ business_id: res.body.business.id }).whereNull('category').first();
    expect(Number(policy.tax_rate_pct)).toBe(20);
    expect(policy.tax_mode).toBe('inclusive');
  });

  test("the owner's own rate and tax name are kept; a US business adds sales tax at the rate its owner sets", async () => {
    const own = await signup('GB', { taxRatePct: '5', taxName: 'VAT (reduced)' });
    expect(own.body.business.taxName).toBe('VAT (reduced)');
    expect(Number((await ctx.db('pricing_policies').where({ business_id: own.body.business.id }).first()).tax_rate_pct)).toBe(5);
    const us = await signup('US', { taxRatePct: '6.25' });
    expect(us.body.business).toMatchObject({ taxName: 'Sales tax', taxMode: 'exclusive' });
    expect(Number((await ctx.db('pricing_policies').where({ business_id: us.body.business.id }).first()).tax_rate_pct)).toBe(6.25);
  });

  test('a rate that is not a rate is refused, naming the field', async () => {
    const res = await signup('GB', { taxRatePct: '120' });
    expect(res.status).toBe(400);
    expect(Object.keys(res.body.error.fields)).toEqual(['taxRatePct']);
  });
});
