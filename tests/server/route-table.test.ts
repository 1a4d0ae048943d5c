import { afterAll, beforeAll, describe, expect, test } from 'vitest';
import request from 'supertest';
import type { Express } from 'express';
import { startTestApp, type TestContext } from '../helpers/context';
import { makeBusiness, signIn, type Session } from '../helpers/factories';
import { can, ROLES } from '../../src/shared/capabilities';
import { CONTRACT, routeKey } from '../../src/shared/contract/registry';
import { isRawResponse, paramNames, successStatus, type Endpoint } from '../../src/shared/contract/endpoint';
import { ACTORS, type Actor, type RouteCase, type RouteFixture } from './route-table/types';

// Every domain adds its fixtures in a *.table.ts file beside this one.
const tables = import.meta.glob<{ routes: RouteCase[] }>('./route-table/*.table.ts', { eager: true });
const CASES: RouteCase[] = Object.values(tables).flatMap((m) => m.routes);
const ENTRIES = new Map(CONTRACT.map((c) => [routeKey(c.endpoint), c.endpoint]));
const caseKey = (c: Pick<RouteCase, 'method' | 'path'>) => `${c.method.toUpperCase()} ${c.path}`;

/** What each actor gets from an entry, from its access alone. */
export function derivedStatuses(e: Endpoint): Record<Actor, number> {
  const ok = successStatus(e);
  const open = e.access === 'public' || e.access === 'signed-in';
  const out = { anonymous: e.access === 'public' ? ok : 401, other: paramNames(e.path).length > 0 ? 404 : ok } as Record<Actor, number>;
  for (const role of ROLES) out[role] = open || can(role, e.access as Exclude<Endpoint['access'], 'public' | 'signed-in'>) ? ok : 403;
  return out;
}

function expectedFor(c: RouteCase): Record<Actor, number> {
  const e = ENTRIES.get(caseKey(c));
  if (c.expect) return c.expect;
  if (!e) throw new Error(`${caseKey(c)} is not in the contract: give its statuses`);
  return derivedStatuses(e);
}

/**
 * Money a barista must never receive (the README's promise: builds, no costs). Menu prices on
 * the price list are what customers pay, not costs, and are the one exception.
 */
const MONEY_KEY = /cost|price|value|margin|profit|total|amount|upcharge|charge|spend/i;
const BARISTA_SEES_MENU_PRICES = new Set(['GET /api/price-list']);

function moneyKeys(value: unknown, path = ''): string[] {
  if (Array.isArray(value)) return value.flatMap((v, i) => moneyKeys(v, `${path}[${i}]`));
  if (value === null || typeof value !== 'object') return [];
  return Object.entries(value).flatMap(([k, v]) => [...(MONEY_KEY.test(k) ? [`${path}.${k}`] : []), ...moneyKeys(v, `${path}.${k}`)]);
}

interface Layer { route?: { path: string; methods: Record<string, boolean> }; handle?: { stack?: Layer[] } }

/** Walks the Express router: every method + path the app answers under /api. */
function appRoutes(app: Express): string[] {
  const out: string[] = [];
  const walk = (stack: Layer[]) => {
    for (const layer of stack) {
      if (layer.route) {
        for (const m of Object.keys(layer.route.methods)) if (m !== '_all') out.push(`${m.toUpperCase()} ${layer.route.path}`);
      } else if (layer.handle?.stack) walk(layer.handle.stack);
    }
  };
  walk((app as unknown as { router: { stack: Layer[] } }).router.stack);
  return out.filter((r) => r.split(' ')[1].startsWith('/api/'));
}

let ctx: TestContext;
let fixture: RouteFixture;
const sessions = {} as Record<Exclude<Actor, 'anonymous'>, Session>;

beforeAll(async () => {
  ctx = await startTestApp();
  const [biz, otherBiz] = await Promise.all([makeBusiness(ctx.db), makeBusiness(ctx.db)]);
  fixture = { db: ctx.db, biz, otherBiz };
  sessions.owner = await signIn(ctx.app, biz.users.owner.email);
  sessions.manager = await signIn(ctx.app, biz.users.manager.email);
  sessions.barista = await signIn(ctx.app, biz.users.barista.email);
  sessions.bookkeeper = await signIn(ctx.app, biz.users.bookkeeper.email);
  sessions.other = await signIn(ctx.app, otherBiz.users.owner.email);
});
afterAll(() => ctx.close());

test('every API route of the app is in the table, and every row of the table is a route', () => {
  const actual = new Set(appRoutes(ctx.app));
  const listed = new Set(CASES.map(caseKey));
  expect([...actual].filter((r) => !listed.has(r)).sort()).toEqual([]);
  expect([...listed].filter((r) => !actual.has(r)).sort()).toEqual([]);
  expect(listed.size).toBe(CASES.length);
});

test('every contract entry is mounted, and has a row with its fixtures', () => {
  const actual = new Set(appRoutes(ctx.app));
  const listed = new Set(CASES.map(caseKey));
  expect([...ENTRIES.keys()].filter((k) => !actual.has(k))).toEqual([]);
  expect([...ENTRIES.keys()].filter((k) => !listed.has(k))).toEqual([]);
});

test("a row's own statuses agree with its entry's capability", () => {
  const disagreements: string[] = [];
  for (const c of CASES) {
    const e = ENTRIES.get(caseKey(c));
    // A public route's 401 is an answer (wrong password), not a refusal of access.
    if (!e || !c.expect || e.access === 'public') continue;
    const d = derivedStatuses(e);
    for (const a of ACTORS) {
      const refused = (s: number) => s === 401 || s === 403;
      if (refused(d[a]) !== refused(c.expect[a]) || (refused(d[a]) && d[a] !== c.expect[a])) disagreements.push(`${caseKey(c)} ${a}: row ${c.expect[a]}, capability ${d[a]}`);
    }
  }
  expect(disagreements).toEqual([]);
});

describe.each(CASES)('$method $path', (c) => {
  test.each(ACTORS.map((a) => [a, expectedFor(c)[a]] as const))('%s → %i', async (actor, expected) => {
    const url = c.url ? await c.url(fixture, actor) : c.path;
    // A logout or sign-up would end or replace the shared session: use a fresh one.
    const s = c.ownSession && actor !== 'anonymous'
      ? await signIn(ctx.app, actor === 'other' ? fixture.otherBiz.users.owner.email : fixture.biz.users[actor].email)
      : actor === 'anonymous' ? null : sessions[actor];
    const agent = s ? s.agent : request(ctx.app);
    let req = agent[c.method](url);
    if (s && c.method !== 'get') req = req.set('X-CSRF-Token', s.csrf);
    if (c.send) req = c.send(req, fixture, actor);
    else if (c.body) req = req.send(c.body(fixture, actor) as object);
    const res = await req;
    expect(res.status, JSON.stringify(res.body)).toBe(expected);
    const key = caseKey(c);
    const e = ENTRIES.get(key);
    if (actor === 'barista' && res.status < 300 && !BARISTA_SEES_MENU_PRICES.has(key) && !(e && isRawResponse(e.response))) {
      expect(moneyKeys(res.body), `${key} answers a barista money figures`).toEqual([]);
    }
  });
});
