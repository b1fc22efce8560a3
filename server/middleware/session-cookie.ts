import { createHmac, timingSafeEqual } from 'node:crypto';

/**
 * The session id in a Cookie header, as express-session reads it (the `cookie` package's parse,
 * then `s:` + cookie-signature's HMAC-SHA256 checked against the secret), for a handler that reads
 * the session in the same statement as its answer. Undefined when express-session would find no id,
 * and also whenever the header is unusual (the cookie given twice): the caller then leaves the
 * request to express-session, so this never has to agree with it on the edge cases.
 */
export function sessionIdFromCookie(header: string | undefined, name: string, secret: string): string | undefined {
  if (!header) return undefined;
  let raw: string | undefined;
  for (const pair of header.split(';')) {
    const eq = pair.indexOf('=');
    if (eq < 0 || pair.slice(0, eq).trim() !== name) continue;
    if (raw !== undefined) return undefined;
    raw = pair.slice(eq + 1).trim();
  }
  if (!raw) return undefined;
  if (raw.length > 1 && raw.startsWith('"') && raw.endsWith('"')) raw = raw.slice(1, -1);
  if (raw.includes('%')) {
    try {
      raw = decodeURIComponent(raw);
    } catch {
      return undefined;
    }
  }
  if (!raw.startsWith('s:')) return undefined;
  const signed = raw.slice(2);
  const value = signed.slice(0, signed.lastIndexOf('.'));
  const expected = Buffer.from(`${value}.${createHmac('sha256', secret).update(value).digest('base64').replace(/=+$/, '')}`);
  const given = Buffer.from(signed);
  return expected.length === given.length && timingSafeEqual(expected, given) ? value : undefined;
}
