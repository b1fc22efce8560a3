import { createHash, createHmac, randomBytes, timingSafeEqual } from 'node:crypto';

/**
 * Private quote links: `<payload>.<signature>`, both base64url. The payload names the quote, a
 * per-send nonce and an expiry (seconds since the epoch); the signature is HMAC-SHA256 with a key
 * derived from the server secret and this one purpose, so a session cookie's secret-derived values
 * can never be replayed here or vice versa. Single use is enforced by the quote's state (an accepted,
 * declined or replaced quote refuses the action), not by the token alone.
 */
const PURPOSE = 'quiltline:quote-link:v1';

export interface QuoteLinkClaims {
  quoteId: string;
  nonce: string;
  /** Expiry, seconds since the epoch. */
  exp: number;
}

export type LinkCheck = { ok: true; claims: QuoteLinkClaims } | { ok: false; problem: 'invalid' | 'expired'; claims?: QuoteLinkClaims };

function key(secret: string): Buffer {
  return createHash('sha256').update(`${PURPOSE}|${secret}`).digest();
}

function sign(payload: string, secret: string): string {
  return createHmac('sha256', key(secret)).update(`${PURPOSE}|${payload}`).digest('base64url');
}

export function newLinkNonce(): string {
  return randomBytes(16).toString('base64url');
}

export function signQuoteLink(claims: QuoteLinkClaims, secret: string): string {
  const payload = Buffer.from(`${claims.quoteId}.${claims.nonce}.${claims.exp}`, 'utf8').toString('base64url');
  return `${payload}.${sign(payload, secret)}`;
}

/** Checks the signature first (a tampered token is `invalid` whatever it claims), then the expiry. */
export function verifyQuoteLink(token: string, secret: string, nowMs = Date.now()): LinkCheck {
  if (typeof token !== 'string' || token.length > 500) return { ok: false, problem: 'invalid' };
  const parts = token.split('.');
  if (parts.length !== 2 || !parts[0] || !parts[1]) return { ok: false, problem: 'invalid' };
  const expected = Buffer.from(sign(parts[0], secret));
  const given = Buffer.from(parts[1]);
  if (expected.length !== given.length || !timingSafeEqual(expected, given)) return { ok: false, problem: 'invalid' };
  const fields = Buffer.from(parts[0], 'base64url').toString('utf8').split('.');
  if (fields.length !== 3) return { ok: false, problem: 'invalid' };
  const [quoteId, nonce, expText] = fields;
  const exp = Number(expText);
  if (!/^[0-9a-f-]{36}$/i.test(quoteId) || !nonce || !Number.isInteger(exp)) return { ok: false, problem: 'invalid' };
  const claims = { quoteId, nonce, exp };
  if (exp * 1000 <= nowMs) return { ok: false, problem: 'expired', claims };
  return { ok: true, claims };
}

/** The end of a valid-until day (UTC), as link expiry seconds. */
export function endOfDayEpochSec(dateIso: string): number {
  return Math.floor(Date.parse(`${dateIso}T23:59:59Z`) / 1000);
}
