import type { Address } from '../../../shared/api/customers';

/** "12 Mill Lane, Upper Beck, Hartsford HF2 4QL" — lines that are empty are skipped. */
export function formatAddress(a: Partial<Address> | null | undefined): string {
  if (!a) return '';
  const town = [a.town, a.postcode].filter(Boolean).join(' ');
  return [a.line1, a.line2, town].filter(Boolean).join(', ');
}

/** A calendar date (YYYY-MM-DD or ISO) as "31 Jan 2027", in UTC so it never shifts by a day. */
export function formatDate(value: string | null | undefined): string {
  if (!value) return '';
  const d = new Date(value.length === 10 ? `${value}T00:00:00Z` : value);
  if (Number.isNaN(d.getTime())) return value;
  return d.toLocaleDateString('en-GB', { day: 'numeric', month: 'short', year: 'numeric', timeZone: 'UTC' });
}

/** A moment as "31 Jan 2027, 14:05" in the viewer's time zone. */
export function formatDateTime(value: string | null | undefined): string {
  if (!value) return '';
  const d = new Date(value);
  if (Number.isNaN(d.getTime())) return value;
  return d.toLocaleString('en-GB', { day: 'numeric', month: 'short', year: 'numeric', hour: '2-digit', minute: '2-digit' });
}
