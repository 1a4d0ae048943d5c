import { randomUUID } from 'node:crypto';
import { afterAll, beforeAll, describe, expect, inject, test } from 'vitest';
import type { Knex } from 'knex';
import { z } from 'zod';
import { startTestApp, type TestContext } from '../helpers/context';
import { makeBusiness, signIn, type Session } from '../helpers/factories';
import { CONTRACT, routeKey } from '../../src/shared/contract/registry';
import { isSchema, type Endpoint } from '../../src/shared/contract/endpoint';
import type { RouteCase, RouteFixture } from './route-table/types';

/**
 * The hostile-input walk. For every write endpoint of the contract: take a valid body with
 * every field its schema knows (the route table's fixture, checked against the schema), then,
 * field by field, put a hostile value in its place and send it as the owner. Each must be
 * answered 400 `invalid_input` naming that field (never a 5xx, never a success), and afterwards
 * the database must read back exactly as before. The walk runs on a database of its own, so
 * "nothing changed" is checked over every table.
 */

const tables = import.meta.glob<{ routes: RouteCase[] }>('./route-table/*.table.ts', { eager: true });
const CASES = new Map(Object.values(tables).flatMap((m) => m.routes).map((c) => [`${c.method.toUpperCase()} ${c.path}`, c]));
const WRITES = CONTRACT.map((c) => c.endpoint).filter((e) => e.method !== 'GET' && isSchema(e.body));

type Path = (string | number)[];

/** `lines[0].quantity`, as the API names fields. */
function fieldName(path: Path): string {
  return path.reduce<string>((out, p) => (typeof p === 'number' ? `${out}[${p}]` : out ? `${out}.${p}` : p), '');
}

/** Every place in a body a value can be spoiled: each leaf, each object and array; of an array, its first item. */
function places(value: unknown, path: Path = []): { path: Path; value: unknown }[] {
  const here = path.length > 0 ? [{ path, value }] : [];
  if (Array.isArray(value)) return value.length > 0 ? [...here, ...places(value[0], [...path, 0])] : here;
  if (value !== null && typeof value === 'object') return [...here, ...Object.entries(value).flatMap(([k, v]) => places(v, [...path, k]))];
  return here;
}

const DECIMAL = /^-?\d+(\.\d+)?$/;
const DATE = /^\d{4}-\d{2}-\d{2}$/;
const UUID = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;

function nested(depth: number): unknown {
  let v: unknown = 'x';
  for (let i = 0; i < depth; i += 1) v = [v];
  return v;
}

/** Hostile values for a place, chosen by what the valid value there is. */
function hostileFor(valid: unknown): { label: string; value: unknown }[] {
  const always = [
    { label: 'a NUL character', value: 'a\u0000b' },
    { label: 'a right-to-left override', value: '\u202Eevil' },
    { label: 'a prototype key', value: JSON.parse('{"__proto__": {"polluted": true}}') },
    { label: 'deep nesting', value: nested(40) },
  ];
  if (typeof valid === 'string') {
    const out = [...always, { label: 'a very long string', value: 'x'.repeat(100_000) }, { label: 'a number', value: 12345 }, { label: 'a boolean', value: true }, { label: 'an array', value: [] }, { label: 'an object', value: {} }];
    if (DECIMAL.test(valid)) {
      out.push(
        { label: 'a number beyond its column', value: '99999999999999999999' },
        { label: 'more decimal places than its column', value: '0.00000000001' },
        { label: 'NaN', value: 'NaN' },
        { label: 'Infinity', value: 'Infinity' },
        { label: '1e400', value: '1e400' },
      );
    }
    if (DATE.test(valid)) out.push({ label: 'year 0', value: '0000-01-01' }, { label: 'an impossible day', value: '2026-02-30' });
    if (UUID.test(valid)) out.push({ label: 'an id that is not this business’s', value: randomUUID() });
    return out;
  }
  if (typeof valid === 'number') return [...always, { label: 'text', value: '12abc' }, { label: 'a boolean', value: true }, { label: 'an array', value: [] }, { label: '1e400 as text', value: '1e400' }];
  if (typeof valid === 'boolean') return [...always, { label: 'text', value: 'yes' }, { label: 'a number', value: 1 }];
  if (Array.isArray(valid)) return [{ label: 'an object', value: {} }, { label: 'text', value: 'x' }, { label: 'deep nesting', value: nested(40) }];
  if (valid !== null && typeof valid === 'object') return [{ label: 'an array', value: [] }, { label: 'text', value: 'x' }, { label: 'a prototype key', value: JSON.parse('{"__proto__": {"polluted": true}}') }];
  return always;
}

function spoil(body: unknown, path: Path, value: unknown): unknown {
  const copy = structuredClone(body) as Record<string | number, unknown>;
  let at: Record<string | number, unknown> = copy;
  for (const p of path.slice(0, -1)) at = at[p] as Record<string | number, unknown>;
  at[path[path.length - 1]] = value;
  return copy;
}

/** The keys of an object schema, through optional, nullable and pipes. */
function objectKeys(schema: z.ZodType): string[] | null {
  let s: unknown = schema;
  for (let i = 0; i < 10; i += 1) {
    if (s instanceof z.ZodObject) return Object.keys(s.shape);
    if (s instanceof z.ZodOptional || s instanceof z.ZodNullable) s = s.unwrap();
    else if (s instanceof z.ZodPipe) s = s.in;
    else return null;
  }
  return null;
}

const SKIP_TABLES = new Set(['session', 'sessions', 'rate_limits', 'data_versions', 'knex_migrations', 'knex_migrations_lock']);

/** Every row of every table, as one fingerprint per table. */
async function snapshot(db: Knex): Promise<Record<string, string>> {
  const names = (await db('information_schema.tables').where({ table_schema: 'public', table_type: 'BASE TABLE' }).pluck('table_name')) as string[];
  const out: Record<string, string> = {};
  for (const t of names.filter((n) => !SKIP_TABLES.has(n)).sort()) {
    const r = await db.raw(`select count(*)::int as n, md5(coalesce(string_agg(x::text, '|' order by x::text), '')) as h from ?? x`, [t]);
    out[t] = `${r.rows[0].n}:${r.rows[0].h}`;
  }
  return out;
}

let ctx: TestContext;
let fixture: RouteFixture;
let owner: Session;

beforeAll(async () => {
  ctx = await startTestApp({}, inject('hostileDatabaseUrl'));
  const [biz, otherBiz] = await Promise.all([makeBusiness(ctx.db), makeBusiness(ctx.db)]);
  fixture = { db: ctx.db, biz, otherBiz };
  owner = await signIn(ctx.app, biz.users.owner.email);
});
afterAll(() => ctx.close());

test('the walk covers every write endpoint of the contract', () => {
  expect(WRITES.length).toBeGreaterThan(0);
  expect(WRITES.map(routeKey).filter((k) => !CASES.has(k))).toEqual([]);
});

describe.each(WRITES.map((e) => [routeKey(e), e] as const))('%s', (key, e: Endpoint) => {
  test('refuses every hostile field with 400 naming it, and changes nothing', { timeout: 300_000 }, async () => {
    const c = CASES.get(key)!;
    const url = c.url ? await c.url(fixture, 'owner') : c.path;
    const body = (c.fullBody ?? c.body)?.(fixture, 'owner');
    const schema = e.body as z.ZodType;
    const parsed = schema.safeParse(body);
    expect(parsed.success, `the fixture's body must be valid: ${JSON.stringify(parsed.error?.issues)}`).toBe(true);
    const keys = objectKeys(schema);
    if (keys) expect(keys.filter((k) => !(k in (body as object))), 'the fixture leaves out fields of the schema').toEqual([]);

    const before = await snapshot(ctx.db);
    const wrong: string[] = [];
    for (const place of places(body)) {
      for (const h of hostileFor(place.value)) {
        const sent = spoil(body, place.path, h.value);
        const res = await owner.agent[c.method](url).set('X-CSRF-Token', owner.csrf).send(sent as object);
        const name = fieldName(place.path);
        const fields = Object.keys(res.body?.error?.fields ?? {});
        const named = fields.some((f) => f === name || f.startsWith(`${name}.`) || f.startsWith(`${name}[`));
        if (res.status !== 400 || res.body?.error?.code !== 'invalid_input' || !named) {
          wrong.push(`${name} = ${h.label}: ${res.status} ${JSON.stringify(res.body).slice(0, 200)}`);
        }
      }
    }
    expect(wrong).toEqual([]);
    expect(await snapshot(ctx.db)).toEqual(before);
  });
});
