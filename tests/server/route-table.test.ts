import { afterAll, beforeAll, describe, expect, test } from 'vitest';
import request from 'supertest';
import type { Express } from 'express';
import { startTestApp, type TestContext } from '../helpers/context';
import { makeBusiness, signIn, type Session } from '../helpers/factories';
import { ACTORS, type Actor, type RouteCase, type RouteFixture } from './route-table/types';

// Every domain adds its rows in a *.table.ts file beside this one.
const tables = import.meta.glob<{ routes: RouteCase[] }>('./route-table/*.table.ts', { eager: true });
const CASES: RouteCase[] = Object.values(tables).flatMap((m) => m.routes);

interface Layer { route?: { path: string; methods: Record<string, boolean> }; handle?: { stack?: Layer[] } }

/** Walks the Express router: every method + path the app answers under /api. */
function appRoutes(app: Express): string[] {
  const out: string[] = [];
  const walk = (stack: Layer[]) => {
    for (const layer of stack) {
      if (layer.route) {
        for (const m of Object.keys(layer.route.methods)) if (m !== '_all') out.push(`${m} ${layer.route.path}`);
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
  const listed = new Set(CASES.map((c) => `${c.method} ${c.path}`));
  expect([...actual].filter((r) => !listed.has(r)).sort()).toEqual([]);
  expect([...listed].filter((r) => !actual.has(r)).sort()).toEqual([]);
  expect(listed.size).toBe(CASES.length);
});

describe.each(CASES)('$method $path', (c) => {
  test.each(ACTORS.map((a) => [a, c.expect[a]] as const))('%s → %i', async (actor, expected) => {
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
  });
});
