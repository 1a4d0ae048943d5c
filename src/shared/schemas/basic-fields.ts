import { z } from 'zod';

/**
 * The field schemas every form and route builds on, so that what is accepted is exactly what
 * PostgreSQL stores: text without control characters, e-mail addresses, ids, dates a calendar
 * has. Decimals sized to their columns are in `decimal-fields.ts` (they need decimal.js, which
 * the sign-in page does not).
 */

/**
 * Characters no name, note or e-mail address may hold: C0 and C1 controls (NUL among them;
 * PostgreSQL refuses NUL in text), and the bidirectional overrides and isolates that make a
 * name read differently from how it is stored (Unicode TR #9, "Explicit Directional Formatting").
 */
// eslint-disable-next-line no-control-regex
const CONTROL = /[\u0000-\u0008\u000B\u000C\u000E-\u001F\u007F-\u009F\u202A-\u202E\u2066-\u2069]/;
// eslint-disable-next-line no-control-regex
const CONTROL_SINGLE_LINE = /[\u0000-\u001F\u007F-\u009F\u202A-\u202E\u2066-\u2069]/;

export const CONTROL_MESSAGE = 'Remove the control characters (such as a null byte or a text-direction mark).';

/** Does a string hold a character no field accepts (multi-line text may keep tabs and line breaks)? */
export function hasControlCharacters(value: string, multiline = true): boolean {
  return (multiline ? CONTROL : CONTROL_SINGLE_LINE).test(value);
}

interface TextOptions {
  /** What the field is, for the messages: "Name the supplier." */
  what?: string;
  min?: number;
  max?: number;
  multiline?: boolean;
}

/** Trimmed text in Unicode NFC, within its length, without control characters. */
export function text({ what, min = 0, max = 200, multiline = false }: TextOptions = {}) {
  const required = what ? `Name the ${what}.` : 'Fill this in.';
  return z
    .string({ error: what ? required : 'Enter text.' })
    .refine((s) => !hasControlCharacters(s, multiline), CONTROL_MESSAGE)
    .transform((s) => s.normalize('NFC').trim())
    .pipe(
      z
        .string()
        .min(min, min > 0 ? required : undefined)
        .max(max, `Keep this to ${max} characters or fewer.`),
    );
}

/** A name the business gives something: 1–120 characters. */
export const nameOf = (what: string, max = 120) => text({ what, min: 1, max });

/** Optional free text (a note, a contact): empty becomes null. */
export const optionalText = (max = 2000, multiline = true) =>
  text({ max, multiline })
    .transform((s) => (s === '' ? null : s))
    .nullish();

/** An e-mail address: at most 254 characters (RFC 5321), lower-cased. */
export const email = z
  .string({ error: 'Enter an e-mail address.' })
  .refine((s) => !hasControlCharacters(s, false), 'Enter an e-mail address.')
  .transform((s) => s.trim().toLowerCase())
  .pipe(z.email('Enter an e-mail address.').max(254, 'That e-mail address is too long.'));

/** An e-mail address or nothing: a blank field ('') means none. */
export const optionalEmail = z.union([z.literal('').transform(() => null), email]).nullish();

/** A record id in a body or query: a UUID; whether it is this business's is the service's check. */
export const id = (what = 'record') => z.uuid({ error: `Choose a ${what}.` });

/** The years a date in Tamp & Tally may fall in: a café's records, not history or science fiction. */
export const FIRST_YEAR = 1900;
export const LAST_YEAR = 2999;

/** Is `s` a real calendar day written YYYY-MM-DD between FIRST_YEAR and LAST_YEAR? */
export function isCalendarDate(s: string): boolean {
  const m = /^(\d{4})-(\d{2})-(\d{2})$/.exec(s);
  if (!m) return false;
  const [y, mo, d] = [Number(m[1]), Number(m[2]), Number(m[3])];
  if (y < FIRST_YEAR || y > LAST_YEAR || mo < 1 || mo > 12 || d < 1) return false;
  const days = [31, y % 4 === 0 && (y % 100 !== 0 || y % 400 === 0) ? 29 : 28, 31, 30, 31, 30, 31, 31, 30, 31, 30, 31][mo - 1];
  return d <= days;
}

/** A calendar date, YYYY-MM-DD: 2026-02-30 and 0000-01-01 are refused. */
export const isoDate = z
  .string({ error: 'Enter a date as YYYY-MM-DD.' })
  .regex(/^\d{4}-\d{2}-\d{2}$/, 'Enter a date as YYYY-MM-DD.')
  .refine(isCalendarDate, 'Enter a real date as YYYY-MM-DD.');

/** A calendar month, YYYY-MM, within the same years as a date. */
export const isoMonth = z
  .string({ error: 'Give the month as YYYY-MM.' })
  .regex(/^\d{4}-(0[1-9]|1[0-2])$/, 'Give the month as YYYY-MM.')
  .refine((s) => isCalendarDate(`${s}-01`), 'Give a real month as YYYY-MM.');

/** A whole number within bounds (counts of days, weeks, positions). */
export const wholeNumber = (min: number, max: number, what = 'a whole number') =>
  z.number({ error: `Enter ${what}.` }).int(`Enter ${what}.`).min(min, `Must be ${min} or more.`).max(max, `Must be ${max} or less.`);

/** `?asOf=YYYY-MM-DD`: the day prices are read for (the business's today when left out). */
export const asOfQuery = z.object({ asOf: isoDate.optional() });
