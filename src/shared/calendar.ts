/**
 * Calendar days in a business's own time zone: "today", a sale's day, a count's date and a
 * month's bounds. Pure: the current instant is always passed in (the server's clock and the
 * browser's are the only places that read it).
 */

const formatters = new Map<string, Intl.DateTimeFormat>();

function partsIn(timeZone: string, instant: Date) {
  let f = formatters.get(timeZone);
  if (!f) {
    f = new Intl.DateTimeFormat('en-CA', { timeZone, year: 'numeric', month: '2-digit', day: '2-digit', hour: '2-digit', minute: '2-digit', hourCycle: 'h23' });
    formatters.set(timeZone, f);
  }
  const parts = Object.fromEntries(f.formatToParts(instant).map((p) => [p.type, p.value]));
  return { date: `${parts.year}-${parts.month}-${parts.day}`, time: `${parts.hour}:${parts.minute}` };
}

/** Is this an IANA time zone the runtime knows ("Europe/London", "America/New_York")? */
export function isTimeZone(timeZone: string): boolean {
  try {
    new Intl.DateTimeFormat('en', { timeZone });
    return /^[A-Za-z_]+(\/[A-Za-z0-9_+-]+)*$/.test(timeZone) || timeZone === 'UTC';
  } catch {
    return false;
  }
}

/** The calendar day (YYYY-MM-DD) an instant falls on in a time zone. */
export function dateIn(timeZone: string, instant: Date): string {
  return partsIn(timeZone, instant).date;
}

/** The wall-clock time (HH:MM, 24-hour) of an instant in a time zone. */
export function timeIn(timeZone: string, instant: Date): string {
  return partsIn(timeZone, instant).time;
}

/** The month (YYYY-MM) of a date. */
export function monthOf(date: string): string {
  return date.slice(0, 7);
}

/** A date moved by whole days (calendar arithmetic, no time zone involved). */
export function addDays(date: string, days: number): string {
  const d = new Date(`${date}T00:00:00Z`);
  d.setUTCDate(d.getUTCDate() + days);
  return d.toISOString().slice(0, 10);
}

/** The ISO weekday of a date: 1 = Monday … 7 = Sunday. */
export function isoWeekday(date: string): number {
  const day = new Date(`${date}T00:00:00Z`).getUTCDay();
  return day === 0 ? 7 : day;
}

/** The first and last day of a month (YYYY-MM). */
export function monthBounds(month: string): { first: string; last: string } {
  const [y, m] = month.split('-').map(Number);
  const last = new Date(Date.UTC(y, m, 0)).getUTCDate();
  return { first: `${month}-01`, last: `${month}-${String(last).padStart(2, '0')}` };
}

/** The month before or after (`step` months on). */
export function addMonths(month: string, step: number): string {
  const [y, m] = month.split('-').map(Number);
  const d = new Date(Date.UTC(y, m - 1 + step, 1));
  return d.toISOString().slice(0, 7);
}
