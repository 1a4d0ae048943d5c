import type { Knex } from 'knex';
import { dateIn, timeIn } from '../../src/shared/calendar';
import { notFound } from './errors';

/**
 * The one clock: nothing else on the server reads the current instant for a calendar day.
 * Tests pin it with `fixedClock`.
 */
export interface Clock {
  now(): Date;
}

export const systemClock: Clock = { now: () => new Date() };

/** A clock stopped at an instant ("2026-11-30T10:00:00Z"), for tests and the bench. */
export function fixedClock(iso: string): Clock {
  const at = new Date(iso);
  if (Number.isNaN(at.getTime())) throw new Error(`fixedClock: not an instant: ${iso}`);
  return { now: () => new Date(at.getTime()) };
}

/** Today and the time now, in a business's time zone. */
export function localNow(clock: Clock, timeZone: string): { date: string; time: string } {
  const now = clock.now();
  return { date: dateIn(timeZone, now), time: timeIn(timeZone, now) };
}

/** The business's time zone, as its owner set it. */
export async function timeZoneOf(db: Knex, businessId: string): Promise<string> {
  const row = await db('businesses').where({ id: businessId }).first('time_zone');
  if (!row) throw notFound('That business');
  return row.time_zone as string;
}

/** The business's today (YYYY-MM-DD). */
export async function businessToday(db: Knex, clock: Clock, businessId: string): Promise<string> {
  return dateIn(await timeZoneOf(db, businessId), clock.now());
}

/**
 * @deprecated Today as a UTC calendar date by the system clock, for the callers not yet moved to
 * `businessToday(db, deps.clock, businessId)` (they once imported it from the costing domain).
 * New code asks for the business's today.
 */
export function utcToday(): string {
  return dateIn('UTC', systemClock.now());
}
