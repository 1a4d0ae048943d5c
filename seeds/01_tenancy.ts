import type { Knex } from 'knex';
import { hashPassword } from '../server/auth/passwords';

// The demo scenario is invented: the café, its sites, people and suppliers
// exist nowhere else.
export const DEMO_PASSWORD = 'tamp-and-tally-demo';
export const DEMO = {
  businessId: '0d1e6a52-5f0c-4c3a-9a51-1c7a2f000001',
  siteIds: { market: '0d1e6a52-5f0c-4c3a-9a51-1c7a2f000011', canal: '0d1e6a52-5f0c-4c3a-9a51-1c7a2f000012' },
  otherBusinessId: '0d1e6a52-5f0c-4c3a-9a51-1c7a2f000002',
  otherSiteId: '0d1e6a52-5f0c-4c3a-9a51-1c7a2f000021',
};

export const DEMO_USERS = [
  { email: 'owner@demo.test', name: 'Ada Marsh', role: 'owner', business: DEMO.businessId },
  { email: 'manager@demo.test', name: 'Tomas Reyes', role: 'manager', business: DEMO.businessId },
  { email: 'barista@demo.test', name: 'Priya Holt', role: 'barista', business: DEMO.businessId },
  { email: 'bookkeeper@demo.test', name: 'Glen Okafor', role: 'bookkeeper', business: DEMO.businessId },
  { email: 'owner2@demo.test', name: 'Wren Calloway', role: 'owner', business: DEMO.otherBusinessId },
] as const;

export async function seed(knex: Knex) {
  await knex.raw('truncate table businesses, session, rate_limits restart identity cascade');
  await knex('businesses').insert([
    { id: DEMO.businessId, name: 'Lantern Row Coffee', country: 'GB', currency: 'GBP', tax_mode: 'inclusive' },
    { id: DEMO.otherBusinessId, name: 'Bright Hollow Café', country: 'US', currency: 'USD', tax_mode: 'exclusive' },
  ]);
  await knex('sites').insert([
    { id: DEMO.siteIds.market, business_id: DEMO.businessId, name: 'Market Street' },
    { id: DEMO.siteIds.canal, business_id: DEMO.businessId, name: 'Canal Yard' },
    { id: DEMO.otherSiteId, business_id: DEMO.otherBusinessId, name: 'Hollow Lane' },
  ]);
  const hash = await hashPassword(DEMO_PASSWORD);
  await knex('users').insert(DEMO_USERS.map((u) => ({ business_id: u.business, email: u.email, name: u.name, role: u.role, password_hash: hash })));
}
