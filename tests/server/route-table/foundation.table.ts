import { suffix, TEST_PASSWORD } from '../../helpers/factories';
import { statuses, type RouteCase, type RouteFixture } from './types';

const ownerOnly = statuses({ owner: 200, manager: 403, barista: 403, bookkeeper: 403 });
const everyRole = statuses({ owner: 200, manager: 200, barista: 200, bookkeeper: 200 });
const publicRoute = (status: number) => ({ anonymous: status, owner: status, manager: status, barista: status, bookkeeper: status, other: status });

async function newMember(f: RouteFixture) {
  const [u] = await f.db('users').insert({ business_id: f.biz.businessId, email: `m-${suffix()}@example.test`, name: 'Temp', role: 'barista' }).returning('id');
  return u.id as string;
}
async function newInvitation(f: RouteFixture) {
  const [i] = await f.db('invitations').insert({ business_id: f.biz.businessId, email: `i-${suffix()}@example.test`, role: 'barista', token_hash: suffix() + suffix(), expires_at: f.db.raw("now() + interval '1 day'") }).returning('id');
  return i.id as string;
}

export const routes: RouteCase[] = [
  { method: 'get', path: '/api/health', expect: publicRoute(200) },
  { method: 'get', path: '/api/config', expect: publicRoute(200) },
  { method: 'post', path: '/api/auth/login', ownSession: true, expect: publicRoute(401), body: () => ({ email: `nobody-${suffix()}@example.test`, password: 'not-the-password' }) },
  { method: 'get', path: '/api/auth/me', expect: statuses({ owner: 200, manager: 200, barista: 200, bookkeeper: 200 }) },
  { method: 'post', path: '/api/auth/logout', ownSession: true, expect: { ...publicRoute(204) } },
  { method: 'post', path: '/api/auth/signup', ownSession: true, expect: publicRoute(201), body: () => ({ name: 'N', email: `su-${suffix()}@example.test`, password: TEST_PASSWORD, businessName: 'B', siteName: 'S', country: 'GB', currency: 'GBP', taxMode: 'inclusive' }) },
  { method: 'post', path: '/api/auth/password-reset/request', expect: publicRoute(202), body: () => ({ email: `x-${suffix()}@example.test` }) },
  { method: 'post', path: '/api/auth/password-reset/complete', ownSession: true, expect: publicRoute(400), body: () => ({ token: 'not-a-real-token-at-all', password: TEST_PASSWORD }) },
  { method: 'get', path: '/api/invitations/:token', url: () => '/api/invitations/unknown-token', expect: publicRoute(404) },
  { method: 'post', path: '/api/invitations/:token/accept', ownSession: true, url: () => '/api/invitations/unknown-token/accept', expect: publicRoute(404), body: () => ({ name: 'N', password: TEST_PASSWORD }) },
  { method: 'get', path: '/api/team', expect: ownerOnly },
  { method: 'post', path: '/api/team/invitations', expect: statuses({ owner: 201, manager: 403, barista: 403, bookkeeper: 403 }), body: () => ({ email: `inv-${suffix()}@example.test`, role: 'barista' }) },
  { method: 'delete', path: '/api/team/invitations/:id', url: async (f) => `/api/team/invitations/${await newInvitation(f)}`, expect: statuses({ owner: 204, manager: 403, barista: 403, bookkeeper: 403, other: 404 }) },
  { method: 'patch', path: '/api/team/members/:id', url: async (f) => `/api/team/members/${await newMember(f)}`, body: () => ({ role: 'manager' }), expect: statuses({ owner: 200, manager: 403, barista: 403, bookkeeper: 403, other: 404 }) },
  { method: 'delete', path: '/api/team/members/:id', url: async (f) => `/api/team/members/${await newMember(f)}`, expect: statuses({ owner: 204, manager: 403, barista: 403, bookkeeper: 403, other: 404 }) },
  { method: 'get', path: '/api/sites', expect: everyRole },
  { method: 'post', path: '/api/sites', body: () => ({ name: `Site ${suffix()}` }), expect: statuses({ owner: 201, manager: 403, barista: 403, bookkeeper: 403 }) },
  { method: 'patch', path: '/api/sites/:id', url: (f) => `/api/sites/${f.biz.siteIds[1]}`, body: () => ({ name: `Renamed ${suffix()}` }), expect: statuses({ owner: 200, manager: 403, barista: 403, bookkeeper: 403, other: 404 }) },
  { method: 'get', path: '/api/business', expect: everyRole },
  { method: 'patch', path: '/api/business', body: () => ({ name: `Biz ${suffix()}` }), expect: ownerOnly },
];
