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
