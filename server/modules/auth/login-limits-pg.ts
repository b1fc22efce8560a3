import type pg from 'pg';
import { RateLimiterPostgres } from 'rate-limiter-flexible';
import { loginRules, type ThrottleRule } from './login-throttle';

/**
 * The sign-in back-off of login-throttle.ts kept in PostgreSQL (rate-limiter-flexible's store, table
 * login_limits), so every app instance on the database counts the same failures. Two records per
 * key: the failures within `forgetAfterMs` of the first one, and a block lasting the current delay.
 */
export class PgBackoffThrottle {
  private failures: RateLimiterPostgres;
  private blocks: RateLimiterPostgres;

  constructor(
    private readonly rule: ThrottleRule,
    pool: pg.Pool,
    prefix: string,
  ) {
    const common = { storeClient: pool, storeType: 'pool', tableName: 'login_limits', tableCreated: true, clearExpiredByTimeout: false };
    this.failures = new RateLimiterPostgres({ ...common, keyPrefix: `${prefix}-failures`, points: 1_000_000, duration: Math.ceil(rule.forgetAfterMs / 1000) });
    this.blocks = new RateLimiterPostgres({ ...common, keyPrefix: `${prefix}-block`, points: 1, duration: 1 });
  }

  /** Milliseconds to wait before `key` may try again; 0 when it may try now. */
  async waitMs(key: string): Promise<number> {
    const res = await this.blocks.get(key);
    return res && res.consumedPoints > 1 ? Math.max(0, res.msBeforeNext) : 0;
  }

  async recordFailure(key: string): Promise<void> {
    const res = await this.failures.penalty(key, 1);
    const over = res.consumedPoints - this.rule.freeFailures;
    if (over >= 0) await this.blocks.block(key, Math.ceil(Math.min(this.rule.maxDelayMs, this.rule.baseDelayMs * 2 ** over) / 1000));
  }

  async clear(key: string): Promise<void> {
    await Promise.all([this.failures.delete(key), this.blocks.delete(key)]);
  }
}

/** The sign-in route's two throttles on PostgreSQL (rules as `loginThrottles`). */
export function pgLoginThrottles(limit: number, pool: pg.Pool) {
  const rules = loginRules(limit);
  return { account: new PgBackoffThrottle(rules.account, pool, 'login-account'), address: new PgBackoffThrottle(rules.address, pool, 'login-address') };
}
