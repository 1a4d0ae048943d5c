import { suffix, TEST_PASSWORD } from '../../helpers/factories';
import type { RouteCase, RouteFixture } from './types';

const publicRoute = (status: number) => ({ anonymous: status, owner: status, manager: status, barista: status, bookkeeper: status, other: status });

async function newMember(f: RouteFixture) {
  const [u] = await f.db('users').insert({ business_id: f.biz.businessId, email: `m-${suffix()}@example.test`, name: 'Temp', role: 'barista' }).returning('id');
  return u.id as string;
}
async function newInvitation(f: RouteFixture) {
  const [i] = await f.db('invitations').insert({ business_id: f.biz.businessId, email: `i-${suffix()}@example.test`, role: 'barista', token_hash: suffix() + suffix(), expires_at: f.db.raw("now() + interval '1 day'") }).returning('id');
  return i.id as string;
}

const signupBody = () => ({ name: 'N', email: `su-${suffix()}@example.test`, password: TEST_PASSWORD, businessName: 'B', siteName: 'S', country: 'GB', currency: 'GBP', taxMode: 'inclusive', timeZone: 'Europe/London', taxName: 'VAT', taxRatePct: '20' });

export const routes: RouteCase[] = [
  { method: 'get', path: '/api/health' },
  { method: 'get', path: '/api/config' },
  { method: 'post', path: '/api/auth/login', ownSession: true, expect: publicRoute(401), body: () => ({ email: `nobody-${suffix()}@example.test`, password: 'not-the-password' }) },
  { method: 'get', path: '/api/auth/me' },
  { method: 'post', path: '/api/auth/logout', ownSession: true },
  // A wrong current password: every signed-in role reaches the check, and nobody's sessions end.
  { method: 'post', path: '/api/auth/password', body: () => ({ currentPassword: 'not-my-password', newPassword: TEST_PASSWORD }), expect: { ...publicRoute(400), anonymous: 401 } },
  { method: 'post', path: '/api/auth/signup', ownSession: true, body: signupBody },
  { method: 'post', path: '/api/auth/password-reset/request', body: () => ({ email: `x-${suffix()}@example.test` }) },
  { method: 'post', path: '/api/auth/password-reset/complete', ownSession: true, expect: publicRoute(400), body: () => ({ token: 'not-a-real-token-at-all', password: TEST_PASSWORD }) },
  { method: 'get', path: '/api/invitations/:token', url: () => '/api/invitations/unknown-token', expect: publicRoute(404) },
  { method: 'post', path: '/api/invitations/:token/accept', ownSession: true, url: () => '/api/invitations/unknown-token/accept', expect: publicRoute(404), body: () => ({ name: 'N', password: TEST_PASSWORD }) },
  { method: 'get', path: '/api/team' },
  { method: 'post', path: '/api/team/invitations', body: () => ({ email: `inv-${suffix()}@example.test`, role: 'barista' }) },
  { method: 'delete', path: '/api/team/invitations/:id', url: async (f) => `/api/team/invitations/${await newInvitation(f)}` },
  { method: 'patch', path: '/api/team/members/:id', url: async (f) => `/api/team/members/${await newMember(f)}`, body: () => ({ role: 'manager' }) },
  { method: 'delete', path: '/api/team/members/:id', url: async (f) => `/api/team/members/${await newMember(f)}` },
  { method: 'get', path: '/api/sites' },
  { method: 'post', path: '/api/sites', body: () => ({ name: `Site ${suffix()}` }) },
  { method: 'patch', path: '/api/sites/:id', url: (f) => `/api/sites/${f.biz.siteIds[1]}`, body: () => ({ name: `Renamed ${suffix()}` }) },
  { method: 'get', path: '/api/business' },
  { method: 'patch', path: '/api/business', body: () => ({ name: `Biz ${suffix()}` }), fullBody: () => ({ name: `Biz ${suffix()}`, country: 'GB', currency: 'GBP', taxMode: 'inclusive', taxName: 'VAT', timeZone: 'Europe/London' }) },
];
