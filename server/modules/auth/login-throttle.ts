/**
 * Sign-in throttling by failures, per account and per client address, with a short exponential
 * back-off instead of a long lock-out: after `freeFailures` wrong passwords each further attempt
 * waits 1 s, 2 s, 4 s … up to `maxDelayMs`; a success clears the account's count; a count is
 * forgotten `forgetAfterMs` after its last failure. A guesser gets a few attempts a minute, while
 * the owner of the account (or a colleague behind the same office address) waits seconds, not the
 * 15 minutes a fixed window imposed on everyone behind one address.
 * (Back-off on failed authentication: OWASP Authentication Cheat Sheet, "Login Throttling".)
 */
export interface ThrottleRule {
  freeFailures: number;
  baseDelayMs: number;
  maxDelayMs: number;
  forgetAfterMs: number;
}

interface Entry {
  failures: number;
  lastFailureAt: number;
  blockedUntil: number;
}

export class BackoffThrottle {
  private entries = new Map<string, Entry>();

  constructor(
    private readonly rule: ThrottleRule,
    private readonly now: () => number = Date.now,
  ) {}

  /** Milliseconds to wait before `key` may try again; 0 when it may try now. */
  waitMs(key: string): number {
    const e = this.fresh(key);
    return e ? Math.max(0, e.blockedUntil - this.now()) : 0;
  }

  recordFailure(key: string): void {
    const t = this.now();
    const e = this.fresh(key) ?? { failures: 0, lastFailureAt: t, blockedUntil: 0 };
    e.failures++;
    e.lastFailureAt = t;
    const over = e.failures - this.rule.freeFailures;
    if (over >= 0) e.blockedUntil = t + Math.min(this.rule.maxDelayMs, this.rule.baseDelayMs * 2 ** over);
    this.entries.set(key, e);
    if (this.entries.size > 50_000) this.prune();
  }

  clear(key: string): void {
    this.entries.delete(key);
  }

  private fresh(key: string): Entry | undefined {
    const e = this.entries.get(key);
    if (e && this.now() - e.lastFailureAt > this.rule.forgetAfterMs) {
      this.entries.delete(key);
      return undefined;
    }
    return e;
  }

  private prune() {
    for (const key of this.entries.keys()) this.fresh(key);
  }
}

export const FORGET_AFTER_MS = 15 * 60_000;

/** The rules of the sign-in route; `limit` is LOGIN_RATE_LIMIT (free failures per account, at most 5; × 5 per address). */
export function loginRules(limit: number): { account: ThrottleRule; address: ThrottleRule } {
  return {
    account: { freeFailures: Math.min(5, limit), baseDelayMs: 1000, maxDelayMs: 30_000, forgetAfterMs: FORGET_AFTER_MS },
    // An office shares one address: it gets five times the room before everyone there waits.
    address: { freeFailures: limit * 5, baseDelayMs: 1000, maxDelayMs: 60_000, forgetAfterMs: FORGET_AFTER_MS },
  };
}

/** The two throttles of the sign-in route in memory, with a clock of their own (the server keeps them in PostgreSQL: login-limits-pg.ts). */
export function loginThrottles(limit: number, now: () => number = Date.now) {
  const rules = loginRules(limit);
  return { account: new BackoffThrottle(rules.account, now), address: new BackoffThrottle(rules.address, now) };
}
