import type { FieldPath, FieldValues, UseFormSetError } from 'react-hook-form';
import { isApiError } from '../api-client';
import { asSentence } from '../form-errors';

/**
 * Shows a failed request on the form: each field the server named (the 422's details, by path such
 * as "propertyAddress.postcode") on that field, and a sentence at the top (`root.server`) when the
 * error names no field. `prefix` places the paths of a nested body ("customer" → "customer.name").
 * Returns whether any field was named.
 */
export function showServerErrors<T extends FieldValues>(error: unknown, setError: UseFormSetError<T>, prefix = ''): boolean {
  const details = isApiError(error) ? error.details : [];
  for (const d of details) {
    // Some routes report the body's fields as "body.email".
    const path = d.path.replace(/^body\./, '');
    setError((prefix ? `${prefix}.${path}` : path) as FieldPath<T>, { type: 'server', message: d.message });
  }
  if (details.length === 0) setError('root.server', { type: 'server', message: formErrorMessage(error) ?? undefined });
  return details.length > 0;
}

/** A message for the top of a form when the error is not about one field. */
export function formErrorMessage(error: unknown): string | null {
  if (!error) return null;
  if (isApiError(error)) return error.details.length ? 'Some fields need attention.' : asSentence(error.message);
  return error instanceof Error ? asSentence(error.message) : 'Something went wrong.';
}
