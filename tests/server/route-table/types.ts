import type { Knex } from 'knex';
import type { Test } from 'supertest';
import type { BusinessFixture } from '../../helpers/factories';

export const ACTORS = ['anonymous', 'barista', 'bookkeeper', 'manager', 'other', 'owner'] as const;
export type Actor = (typeof ACTORS)[number];

export interface RouteFixture {
  db: Knex;
  /** The business whose ids appear in URLs. */
  biz: BusinessFixture;
  /** Another business: its owner is the `other` actor. */
  otherBiz: BusinessFixture;
}

/**
 * One API route and the status each actor gets. `other` is an owner of
 * another business: for this business's ids it must get 404.
 * `url` and `body` are called once per actor (in ACTORS order), so a
 * destructive route can make a fresh row for each call.
 */
export interface RouteCase {
  method: 'get' | 'post' | 'patch' | 'put' | 'delete';
  path: string;
  /**
   * The status each actor gets. Left out for a contract entry, it is worked out from the entry:
   * anonymous 401, a role without the capability 403, the others the success status, and
   * another business 404 where the path names a record. Given, its 401s and 403s must agree
   * with the entry's capability.
   */
  expect?: Record<Actor, number>;
  url?: (f: RouteFixture, actor: Actor) => string | Promise<string>;
  body?: (f: RouteFixture, actor: Actor) => unknown;
  /** The call may end or replace the session (logout, sign-up): use a fresh one for it. */
  ownSession?: boolean;
  /**
   * For the hostile-input walk: a valid body with every field the schema knows (optional ones
   * too), sent by the owner. Defaults to `body`.
   */
  fullBody?: (f: RouteFixture, actor: Actor) => unknown;
  /** For routes that take a raw body or multipart: send it yourself. */
  send?: (req: Test, f: RouteFixture, actor: Actor) => Test;
}

/** Shorthand: status for the four roles of this business, anonymous and other. */
export function statuses(s: { anonymous?: number; owner: number; manager: number; barista: number; bookkeeper: number; other?: number }): Record<Actor, number> {
  return { anonymous: s.anonymous ?? 401, other: s.other ?? s.owner, ...s } as Record<Actor, number>;
}
