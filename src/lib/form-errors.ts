import type { z } from 'zod';
import { isApiError } from './api-client';

export type FieldErrors = Record<string, string>;

/** The first message per field path ("propertyAddress.town") of a zod error. */
export function zodFieldErrors(error: z.ZodError): FieldErrors {
  const out: FieldErrors = {};
  for (const issue of error.issues) {
    const key = issue.path.map(String).join('.');
    if (!(key in out)) out[key] = issue.message;
  }
  return out;
}

/**
 * Field errors from a failed mutation: the server's details by path, with an optional prefix
 * stripped (some servers report "body.email"). Empty when the error names no field.
 */
export function serverFieldErrors(error: unknown): FieldErrors {
  if (!isApiError(error)) return {};
  const out: FieldErrors = {};
  for (const d of error.details) {
    const key = d.path.replace(/^body\./, '');
    if (!(key in out)) out[key] = d.message;
  }
  return out;
}

/** The server writes messages in lower case to sit beside a field; a strip on its own reads as a sentence. */
export function asSentence(message: string): string {
  const s = message.trim();
  if (!s) return s;
  return s[0].toUpperCase() + s.slice(1) + (/[.!?]$/.test(s) ? '' : '.');
}

/** A message for the top of a form when the error is not about one field. */
export function formErrorMessage(error: unknown): string | null {
  if (!error) return null;
  if (isApiError(error)) return error.details.length ? 'Some fields need attention.' : asSentence(error.message);
  return error instanceof Error ? asSentence(error.message) : 'Something went wrong.';
}
