/**
 * Keeps private link tokens out of the logs. A customer's quote link, pay link, payment page token
 * and e-mailed reset/invite token each grant access on their own, and error logs are read by more
 * people (and kept longer) than the database. Anything token-shaped — a path segment or query value
 * of 20+ URL-safe characters that is not a UUID (record ids stay readable) — becomes `[redacted]`.
 */
const UUID = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;
const TOKENISH = /^[A-Za-z0-9_\-.~%]{20,}$/;
// Inside free text (error messages, SQL): long URL-safe runs, optionally two joined by a dot.
const TOKEN_IN_TEXT = /[A-Za-z0-9_-]{20,}(?:\.[A-Za-z0-9_-]{20,})?/g;

const redactPart = (part: string) => (TOKENISH.test(part) && !UUID.test(part) ? '[redacted]' : part);

/** A request URL with token-like path segments and query values replaced. */
export function redactUrl(url: string): string {
  const [path, query] = url.split('?', 2);
  const safePath = path.split('/').map(redactPart).join('/');
  if (query === undefined) return safePath;
  const safeQuery = query
    .split('&')
    .map((kv) => {
      const i = kv.indexOf('=');
      return i < 0 ? redactPart(kv) : `${kv.slice(0, i)}=${redactPart(kv.slice(i + 1))}`;
    })
    .join('&');
  return `${safePath}?${safeQuery}`;
}

/** Free text (a message, a stack) with token-like runs replaced; UUIDs are left alone. */
export function redactText(text: string): string {
  return text.replace(TOKEN_IN_TEXT, (m) => (UUID.test(m) ? m : /[0-9]/.test(m) && /[A-Za-z]/.test(m) ? '[redacted]' : m));
}

/**
 * What to log about an error: its stack (or message), redacted. Not the error object itself:
 * database errors carry the SQL and its parameters (`sql`, `parameters`), which hold the token
 * that was looked up.
 */
export function describeError(err: unknown): string {
  if (err instanceof Error) return redactText(err.stack ?? `${err.name}: ${err.message}`);
  return redactText(String(err));
}
