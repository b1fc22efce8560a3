/** Calendar dates as ISO `YYYY-MM-DD` strings, always in UTC (quotes, invoices and the schedule share these). */

/** Today's date in UTC, e.g. "2027-01-20". */
export function todayIso(now = new Date()): string {
  return now.toISOString().slice(0, 10);
}

/** `days` whole days after `dateIso` (negative goes back), across month and leap-year ends. */
export function addDaysIso(dateIso: string, days: number): string {
  const d = new Date(`${dateIso}T00:00:00Z`);
  d.setUTCDate(d.getUTCDate() + days);
  return d.toISOString().slice(0, 10);
}

/** A date for people, e.g. "20 January 2027" (en-GB); `iso` may be a date or a full timestamp, read in UTC. */
export function longDate(iso: string, locale = 'en-GB'): string {
  return new Date(`${iso.slice(0, 10)}T12:00:00Z`).toLocaleDateString(locale, { day: 'numeric', month: 'long', year: 'numeric', timeZone: 'UTC' });
}
