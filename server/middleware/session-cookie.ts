import { parse } from 'cookie';
import { unsign } from 'cookie-signature';

/**
 * The session id in a Cookie header, read as express-session reads it: the `cookie` package's
 * parse, then an `s:`-prefixed value whose cookie-signature HMAC matches the secret. Undefined when
 * express-session would find no id; the caller then leaves the request to express-session.
 */
export function sessionIdFromCookie(header: string | undefined, name: string, secret: string): string | undefined {
  if (!header) return undefined;
  const raw = parse(header)[name];
  if (!raw?.startsWith('s:')) return undefined;
  return unsign(raw.slice(2), secret) || undefined;
}
