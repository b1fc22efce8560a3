import type { Address } from '../../../shared/api/customers';

/** "12 Mill Lane, Upper Beck, Hartsford HF2 4QL" — lines that are empty are skipped. */
export function formatAddress(a: Partial<Address> | null | undefined): string {
  if (!a) return '';
  const town = [a.town, a.postcode].filter(Boolean).join(' ');
  return [a.line1, a.line2, town].filter(Boolean).join(', ');
}

// Dates for people come from shared/dates (one style for the app, e-mails and PDFs).
export { formatDate, formatDateTime } from '../../../shared/dates';
