import { randomUUID } from 'node:crypto';
import type { Express } from 'express';
import type { Knex } from 'knex';
import request from 'supertest';
import { hashPassword } from '../../server/auth/passwords';
import type { Role } from '../../server/auth/roles';

export const TEST_PASSWORD = 'correct-horse-battery';
let hashed: Promise<string> | undefined;
const passwordHash = () => (hashed ??= hashPassword(TEST_PASSWORD));

export const suffix = () => randomUUID().slice(0, 8);

export interface BusinessFixture {
  businessId: string;
  siteIds: string[];
  users: Record<Role, { id: string; email: string }>;
}

/** A fresh business with two sites and one user per role, all unique to this call. */
export async function makeBusiness(db: Knex, opts: { currency?: string; taxMode?: 'inclusive' | 'exclusive' } = {}): Promise<BusinessFixture> {
  const s = suffix();
  const [b] = await db('businesses')
    .insert({ name: `Test Café ${s}`, country: 'GB', currency: opts.currency ?? 'GBP', tax_mode: opts.taxMode ?? 'inclusive' })
    .returning('id');
  const sites = await db('sites').insert([{ business_id: b.id, name: `North ${s}` }, { business_id: b.id, name: `South ${s}` }]).returning('id');
  const hash = await passwordHash();
  const users = {} as BusinessFixture['users'];
  for (const role of ['owner', 'manager', 'barista', 'bookkeeper'] as const) {
    const email = `${role}-${s}@example.test`;
    const [u] = await db('users').insert({ business_id: b.id, email, name: `${role} ${s}`, role, password_hash: hash }).returning('id');
    users[role] = { id: u.id, email };
  }
  return { businessId: b.id, siteIds: sites.map((x) => x.id), users };
}

export interface Session {
  agent: ReturnType<typeof request.agent>;
  csrf: string;
  get(path: string): request.Test;
  post(path: string, body?: object): request.Test;
  patch(path: string, body?: object): request.Test;
  put(path: string, body?: object): request.Test;
  delete(path: string): request.Test;
}

/** Signs in through the real login route; requests carry the session cookie and CSRF token. */
export async function signIn(app: Express, email: string, password = TEST_PASSWORD): Promise<Session> {
  const agent = request.agent(app);
  const res = await agent.post('/api/auth/login').send({ email, password });
  if (res.status !== 200) throw new Error(`sign-in of ${email} failed: ${res.status} ${JSON.stringify(res.body)}`);
  const csrf = res.body.csrfToken as string;
  return {
    agent,
    csrf,
    get: (p) => agent.get(p),
    post: (p, body) => agent.post(p).set('X-CSRF-Token', csrf).send(body ?? {}),
    patch: (p, body) => agent.patch(p).set('X-CSRF-Token', csrf).send(body ?? {}),
    put: (p, body) => agent.put(p).set('X-CSRF-Token', csrf).send(body ?? {}),
    delete: (p) => agent.delete(p).set('X-CSRF-Token', csrf),
  };
}
