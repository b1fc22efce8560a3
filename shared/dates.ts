/**
 * Dates, in one place for the app, the server, e-mails, PDFs and payment pages.
 *
 * Data: calendar dates are ISO `YYYY-MM-DD` strings and moments are ISO timestamps; calendar
 * arithmetic is done in UTC so a date never shifts by a day with the clock or the time zone.
 * People: one style everywhere, day, short month and year in British English, "2 Dec 2026"
 * (with the time, "2 Dec 2026, 14:05"; with the weekday, "Wed, 2 Dec 2026").
 */

const DAY_MS = 86_400_000;
const LOCALE = 'en-GB';

/** Today's calendar date in UTC, e.g. "2027-01-20" (what the server stamps on quotes and invoices). */
export function todayIso(now = new Date()): string {
  return now.toISOString().slice(0, 10);
}

/** Today's calendar date where the code runs (the viewer's own day in a browser), e.g. "2027-01-20". */
export function localTodayIso(now = new Date()): string {
  return `${now.getFullYear()}-${String(now.getMonth() + 1).padStart(2, '0')}-${String(now.getDate()).padStart(2, '0')}`;
}

/** `days` whole days after `dateIso` (negative goes back), across month and leap-year ends. */
export function addDaysIso(dateIso: string, days: number): string {
  const d = new Date(`${dateIso.slice(0, 10)}T00:00:00Z`);
  d.setUTCDate(d.getUTCDate() + days);
  return d.toISOString().slice(0, 10);
}

/** The Monday on or before a `YYYY-MM-DD` date (weeks start on Monday, ISO 8601). */
export function mondayOf(dateIso: string): string {
  const d = new Date(`${dateIso.slice(0, 10)}T00:00:00Z`);
  return new Date(d.getTime() - ((d.getUTCDay() + 6) % 7) * DAY_MS).toISOString().slice(0, 10);
}

function parse(value: string | Date): Date {
  if (value instanceof Date) return value;
  return new Date(value.length === 10 ? `${value}T00:00:00Z` : value);
}

/**
 * A calendar date for people: "2 Dec 2026". `value` is `YYYY-MM-DD` or a timestamp (read in UTC,
 * so a date never shifts by a day). Options add the weekday ("Wed, 2 Dec 2026") or leave out the
 * year ("Wed 2 Dec", for column headings). Empty input gives ''; unreadable input is returned as is.
 */
export function formatDate(value: string | Date | null | undefined, opts: { weekday?: boolean; year?: boolean } = {}): string {
  if (!value) return '';
  const d = parse(value);
  if (Number.isNaN(d.getTime())) return String(value);
  return d.toLocaleDateString(LOCALE, {
    ...(opts.weekday ? { weekday: 'short' as const } : {}),
    day: 'numeric',
    month: 'short',
    ...(opts.year === false ? {} : { year: 'numeric' as const }),
    timeZone: 'UTC',
  });
}

/**
 * A moment for people: "2 Dec 2026, 14:05", in `timeZone` (default: where the code runs, so the
 * viewer's own zone in a browser). Empty input gives ''; unreadable input is returned as is.
 */
export function formatDateTime(value: string | Date | null | undefined, timeZone?: string): string {
  if (!value) return '';
  const d = parse(value);
  if (Number.isNaN(d.getTime())) return String(value);
  return d.toLocaleString(LOCALE, { day: 'numeric', month: 'short', year: 'numeric', hour: '2-digit', minute: '2-digit', ...(timeZone ? { timeZone } : {}) });
}
