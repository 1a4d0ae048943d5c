import { afterAll, beforeAll, describe, expect, test } from 'vitest';
import request from 'supertest';
import { startTestApp, type TestContext } from '../helpers/context';
import { makeBusiness, signIn, suffix, TEST_PASSWORD, type BusinessFixture } from '../helpers/factories';

let ctx: TestContext;
let biz: BusinessFixture;
beforeAll(async () => {
  ctx = await startTestApp({ LOGIN_MAX_FAILURES: '3' });
  biz = await makeBusiness(ctx.db);
});
afterAll(() => ctx.close());

const linkToken = (text: string, path: string) => {
  const m = text.match(new RegExp(`${path}\\?token=([A-Za-z0-9_-]+)`));
  if (!m) throw new Error(`no ${path} link in: ${text}`);
  return m[1];
};

describe('sign-in', () => {
  test('login returns the user, a CSRF token and a session that /me recognises', async () => {
    const agent = request.agent(ctx.app);
    const res = await agent.post('/api/auth/login').send({ email: biz.users.manager.email, password: TEST_PASSWORD });
    expect(res.status).toBe(200);
    expect(res.body.user).toEqual({ id: biz.users.manager.id, email: biz.users.manager.email, name: expect.any(String), role: 'manager', businessId: biz.businessId });
    expect(res.body.csrfToken).toMatch(/^[A-Za-z0-9_-]{20,}$/);
    const cookie = res.headers['set-cookie'][0];
    expect(cookie).toMatch(/tt\.sid=/);
    expect(cookie).toMatch(/HttpOnly/);
    expect(cookie).toMatch(/SameSite=Lax/);
    const me = await agent.get('/api/auth/me');
    expect(me.status).toBe(200);
    expect(me.body.user.email).toBe(biz.users.manager.email);
    expect(me.body.csrfToken).toBe(res.body.csrfToken);
  });

  test('the session id changes at sign-in', async () => {
    const agent = request.agent(ctx.app);
    // A session before sign-in (a failed attempt does not create one, so make one through /me… it does not either);
    // compare two sign-ins instead: each gets its own new id.
    const a = await agent.post('/api/auth/login').send({ email: biz.users.owner.email, password: TEST_PASSWORD });
    const b = await agent.post('/api/auth/login').send({ email: biz.users.owner.email, password: TEST_PASSWORD });
    const sid = (r: request.Response) => String(r.headers['set-cookie'][0]).split(';')[0];
    expect(sid(a)).not.toBe(sid(b));
  });

  test('bad credentials give 401 and no session', async () => {
    const res = await request(ctx.app).post('/api/auth/login').send({ email: biz.users.barista.email, password: 'wrong-password-1' });
    expect(res.status).toBe(401);
    expect(res.body.error.code).toBe('bad_credentials');
    expect(res.headers['set-cookie']).toBeUndefined();
    const unknown = await request(ctx.app).post('/api/auth/login').send({ email: `nobody-${suffix()}@example.test`, password: 'whatever-123' });
    expect(unknown.status).toBe(401);
  });

  test('a missing field gives 400 naming it', async () => {
    const res = await request(ctx.app).post('/api/auth/login').send({ email: 'a@b.test' });
    expect(res.status).toBe(400);
    expect(res.body.error.fields).toHaveProperty('password');
  });

  test('logout ends the session', async () => {
    const s = await signIn(ctx.app, biz.users.bookkeeper.email);
    expect((await s.post('/api/auth/logout')).status).toBe(204);
    expect((await s.get('/api/auth/me')).status).toBe(401);
  });

  test('failed sign-ins are throttled per account with 429, and the right password is refused while throttled', async () => {
    const b = await makeBusiness(ctx.db);
    const email = b.users.barista.email;
    for (let i = 0; i < 3; i++) {
      const r = await request(ctx.app).post('/api/auth/login').send({ email, password: `wrong-${i}-password` });
      expect(r.status).toBe(401);
    }
    const blocked = await request(ctx.app).post('/api/auth/login').send({ email, password: 'wrong-again-password' });
    expect(blocked.status).toBe(429);
    expect(blocked.body.error.code).toBe('throttled');
    expect(blocked.body.error.message).toMatch(/Too many failed sign-ins/);
    const stillBlocked = await request(ctx.app).post('/api/auth/login').send({ email, password: TEST_PASSWORD });
    expect(stillBlocked.status).toBe(429);
    // Another account from the same address is not blocked by this account's failures.
    expect((await request(ctx.app).post('/api/auth/login').send({ email: b.users.owner.email, password: TEST_PASSWORD })).status).toBe(200);
  });
});

describe('throttling per address', () => {
  test('failures across many accounts from one address are throttled', async () => {
    const t = await startTestApp({ LOGIN_MAX_FAILURES_PER_ADDRESS: '4' });
    try {
      // A documentation address (RFC 5737) seen through the loopback proxy.
      const ip = `203.0.113.${Math.floor(Math.random() * 250) + 1}`;
      const attempt = (n: number) => request(t.app).post('/api/auth/login').set('X-Forwarded-For', ip).send({ email: `spray-${n}-${suffix()}@example.test`, password: 'guess-password' });
      for (let i = 0; i < 4; i++) expect((await attempt(i)).status).toBe(401);
      expect((await attempt(9)).status).toBe(429);
    } finally {
      await t.close();
    }
  });
});

describe('CSRF', () => {
  test('a state-changing request without the token is refused with 403 and changes nothing', async () => {
    const s = await signIn(ctx.app, biz.users.owner.email);
    const before = await ctx.db('sites').where({ business_id: biz.businessId }).count<{ n: string }[]>('* as n');
    const res = await s.agent.post('/api/sites').send({ name: 'Sneaky' });
    expect(res.status).toBe(403);
    expect(res.body.error.code).toBe('csrf');
    const wrong = await s.agent.post('/api/sites').set('X-CSRF-Token', 'x'.repeat(32)).send({ name: 'Sneaky' });
    expect(wrong.status).toBe(403);
    const after = await ctx.db('sites').where({ business_id: biz.businessId }).count<{ n: string }[]>('* as n');
    expect(after[0].n).toBe(before[0].n);
    const ok = await s.post('/api/sites', { name: `Harbour ${suffix()}` });
    expect(ok.status).toBe(201);
  });
});

describe('sign-up', () => {
  test('a new owner creates a business with its first site and is signed in', async () => {
    const email = `new-${suffix()}@example.test`;
    const agent = request.agent(ctx.app);
    const res = await agent.post('/api/auth/signup').send({ name: 'Nell Aster', email, password: 'a-long-password', businessName: 'Quay Beans', siteName: 'Quayside', country: 'IE', currency: 'eur', taxMode: 'inclusive' });
    expect(res.status).toBe(201);
    expect(res.body.user.role).toBe('owner');
    expect(res.body.business).toMatchObject({ name: 'Quay Beans', country: 'IE', currency: 'EUR', taxMode: 'inclusive' });
    const sites = await agent.get('/api/sites');
    expect(sites.body.sites.map((x: { name: string }) => x.name)).toEqual(['Quayside']);
    const again = await request(ctx.app).post('/api/auth/signup').send({ name: 'X', email, password: 'a-long-password', businessName: 'B', siteName: 'S', country: 'GB', currency: 'GBP', taxMode: 'inclusive' });
    expect(again.status).toBe(409);
  });

  test('bad sign-up input names every bad field', async () => {
    const res = await request(ctx.app).post('/api/auth/signup').send({ name: '', email: 'not-an-email', password: 'short', businessName: 'B', siteName: 'S', currency: 'XXQ', taxMode: 'maybe' });
    expect(res.status).toBe(400);
    expect(Object.keys(res.body.error.fields).sort()).toEqual(['currency', 'email', 'name', 'password', 'taxMode']);
  });
});

describe('invitations through the mailbox', () => {
  test('the owner invites a barista, who sets a name and password and is signed in with that role', async () => {
    const owner = await signIn(ctx.app, biz.users.owner.email);
    const email = `invitee-${suffix()}@example.test`;
    const inv = await owner.post('/api/team/invitations', { email, role: 'barista' });
    expect(inv.status).toBe(201);
    expect(inv.body.invitation).toMatchObject({ email, role: 'barista' });
    const msg = await ctx.mail.waitForMessage((m) => m.to.includes(email));
    expect(msg.subject).toMatch(/invited you/);
    const token = linkToken(msg.text, '/accept-invite');
    const info = await request(ctx.app).get(`/api/invitations/${token}`);
    expect(info.body).toMatchObject({ email, role: 'barista' });
    const agent = request.agent(ctx.app);
    const acc = await agent.post(`/api/invitations/${token}/accept`).send({ name: 'Ola Finch', password: 'barista-password' });
    expect(acc.status).toBe(201);
    expect(acc.body.user).toMatchObject({ email, role: 'barista', businessId: biz.businessId });
    // Single use.
    expect((await request(ctx.app).post(`/api/invitations/${token}/accept`).send({ name: 'Again', password: 'barista-password' })).status).toBe(404);
    const team = await owner.get('/api/team');
    expect(team.body.members.some((m: { email: string }) => m.email === email)).toBe(true);
  });
});

describe('password reset through the mailbox', () => {
  test('a single-use link sets a new password', async () => {
    const b = await makeBusiness(ctx.db);
    const email = b.users.manager.email;
    expect((await request(ctx.app).post('/api/auth/password-reset/request').send({ email })).status).toBe(202);
    const msg = await ctx.mail.waitForMessage((m) => m.to.includes(email));
    const token = linkToken(msg.text, '/reset-password');
    expect((await request(ctx.app).post('/api/auth/password-reset/complete').send({ token, password: 'brand-new-password' })).status).toBe(204);
    expect((await request(ctx.app).post('/api/auth/login').send({ email, password: 'brand-new-password' })).status).toBe(200);
    expect((await request(ctx.app).post('/api/auth/login').send({ email, password: TEST_PASSWORD })).status).toBe(401);
    const reuse = await request(ctx.app).post('/api/auth/password-reset/complete').send({ token, password: 'another-password' });
    expect(reuse.status).toBe(400);
    expect(reuse.body.error.code).toBe('invalid_token');
  });

  test('an unknown e-mail gets the same answer and no message', async () => {
    const email = `ghost-${suffix()}@example.test`;
    expect((await request(ctx.app).post('/api/auth/password-reset/request').send({ email })).status).toBe(202);
    // The lookup runs after the answer: wait for it to finish, then look.
    await ctx.app.locals.idle();
    expect(ctx.mail.messages().some((m) => m.to.includes(email))).toBe(false);
  });

  test('an expired link is refused', async () => {
    const b = await makeBusiness(ctx.db);
    await request(ctx.app).post('/api/auth/password-reset/request').send({ email: b.users.owner.email });
    const msg = await ctx.mail.waitForMessage((m) => m.to.includes(b.users.owner.email));
    const token = linkToken(msg.text, '/reset-password');
    await ctx.db('password_resets').where({ user_id: b.users.owner.id }).update({ expires_at: ctx.db.raw("now() - interval '1 minute'") });
    expect((await request(ctx.app).post('/api/auth/password-reset/complete').send({ token, password: 'brand-new-password' })).status).toBe(400);
  });
});

describe('team', () => {
  test('the last owner cannot be demoted or removed; another member can be', async () => {
    const b = await makeBusiness(ctx.db);
    const owner = await signIn(ctx.app, b.users.owner.email);
    const demote = await owner.patch(`/api/team/members/${b.users.owner.id}`, { role: 'manager' });
    expect(demote.status).toBe(409);
    expect(demote.body.error.code).toBe('last_owner');
    expect((await owner.delete(`/api/team/members/${b.users.owner.id}`)).status).toBe(409);
    expect((await owner.patch(`/api/team/members/${b.users.barista.id}`, { role: 'manager' })).body.member.role).toBe('manager');
    expect((await owner.delete(`/api/team/members/${b.users.bookkeeper.id}`)).status).toBe(204);
    const left = await ctx.db('users').where({ business_id: b.businessId }).orderBy('role').pluck('role');
    expect(left).toEqual(['manager', 'manager', 'owner']);
  });

  test('another business sees 404 for this business’s members, and nothing changes', async () => {
    const other = await makeBusiness(ctx.db);
    const s = await signIn(ctx.app, other.users.owner.email);
    expect((await s.patch(`/api/team/members/${biz.users.manager.id}`, { role: 'owner' })).status).toBe(404);
    expect((await s.delete(`/api/team/members/${biz.users.manager.id}`)).status).toBe(404);
    const row = await ctx.db('users').where({ id: biz.users.manager.id }).first();
    expect(row.role).toBe('manager');
  });
});

describe('health and errors', () => {
  test('health reports the database up', async () => {
    expect((await request(ctx.app).get('/api/health')).body).toEqual({ ok: true, db: 'up' });
  });
  test('unknown API routes are a JSON 404; oversized bodies 413; broken JSON 400', async () => {
    const r = await request(ctx.app).get('/api/nope');
    expect(r.status).toBe(404);
    expect(r.body.error.code).toBe('not_found');
    const big = await request(ctx.app).post('/api/auth/login').set('content-type', 'application/json').send(JSON.stringify({ email: 'x'.repeat(2_000_000), password: 'y' }));
    expect(big.status).toBe(413);
    const broken = await request(ctx.app).post('/api/auth/login').set('content-type', 'application/json').send('{"email":');
    expect(broken.status).toBe(400);
    expect(broken.body.error.code).toBe('invalid_json');
  });
});
