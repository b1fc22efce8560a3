import fs from 'node:fs';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { z } from 'zod';
import type { StorageConfig } from '../lib/storage';
import { paymentsConfigFromEnv, type ResolvedPaymentsConfig } from './payments';
import { refineStorageEnv, storageConfigFromEnv, storageEnvShape } from './storage';

/** The repository: the nearest folder above this module with a package.json (server/config/ when run from source, dist-server/ when compiled). */
export const REPO_ROOT = findRepoRoot(path.dirname(fileURLToPath(import.meta.url)));

function findRepoRoot(from: string): string {
  for (let dir = from; ; dir = path.dirname(dir)) {
    if (fs.existsSync(path.join(dir, 'package.json'))) return dir;
    if (path.dirname(dir) === dir) throw new Error(`no package.json above ${from}`);
  }
}

const bool = (fallback: boolean) =>
  z
    .enum(['1', '0', 'true', 'false', 'yes', 'no', ''])
    .optional()
    .transform((v) => (v === undefined || v === '' ? fallback : ['1', 'true', 'yes'].includes(v)));

const DEV_SECRET = 'quiltline-development-secret-not-for-production';

const envSchema = z
  .object({
    NODE_ENV: z.enum(['development', 'test', 'production']).default('development'),
    PORT: z.coerce.number().int().min(0).max(65535).default(3000),
    HOST: z.string().default('127.0.0.1'),
    DATABASE_URL: z.url({ error: 'DATABASE_URL must be a postgres:// URL (npm start sets it for the local cluster)' }),
    SESSION_SECRET: z.string().min(16, { error: 'SESSION_SECRET must be at least 16 characters' }).optional(),
    SMTP_URL: z.url().optional(),
    MAIL_FROM: z.string().default('Quiltline <no-reply@quiltline.example.com>'),
    /** Public base URL used in e-mailed links; defaults to http://127.0.0.1:PORT. */
    APP_URL: z.url().optional(),
    /** Set when running behind a reverse proxy that terminates HTTPS (e.g. "1" or "loopback"). */
    TRUST_PROXY: z.string().optional(),
    UPLOAD_DIR: z.string().default(path.join(REPO_ROOT, 'uploads')),
    // Where uploads are kept: the UPLOAD_DIR folder or an S3-compatible bucket (./storage.ts).
    ...storageEnvShape,
    DIST_DIR: z.string().default(path.join(REPO_ROOT, 'dist')),
    MIGRATE_ON_START: bool(true),
    SEED_DEMO: z.string().optional(),
    LOGIN_RATE_LIMIT: z.coerce.number().int().positive().default(20),
    LOG_SQL: bool(false),
    /** pino level: fatal, error, warn, info (default), debug, trace or silent (the tests' default). */
    LOG_LEVEL: z.enum(['fatal', 'error', 'warn', 'info', 'debug', 'trace', 'silent']).optional(),
    BCRYPT_ROUNDS: z.coerce.number().int().min(4).max(15).optional(),
    /** Worker threads for plan checks and takeoffs (default: CPUs − 1, 1 to 4). */
    TAKEOFF_WORKERS: z.coerce.number().int().min(1).max(16).optional(),
    /** Time limit of one plan check or takeoff, ms; past it the plan is refused as too complex. */
    TAKEOFF_TIME_LIMIT_MS: z.coerce.number().int().min(100).max(600_000).default(10_000),
    /** Port of the in-process fake SMTP server when SMTP_URL is unset; 0 picks a free one. */
    FAKE_SMTP_PORT: z.coerce.number().int().min(0).max(65535).default(0),
    // Card payments (./payments.ts): both keys together, or neither (the local stand-in outside production).
    STRIPE_SECRET_KEY: z.string().optional(),
    STRIPE_WEBHOOK_SECRET: z.string().optional(),
    PAYMENTS_API_URL: z.string().optional(),
    /** Retries of an e-mail the mail server refuses or cannot be reached for, before it is marked failed. */
    MAIL_RETRY_LIMIT: z.coerce.number().int().min(0).max(50).default(12),
    /** First wait before a retry, seconds; each later wait about doubles (12 retries from 30 s: about 17 h in all). */
    MAIL_RETRY_DELAY_SECONDS: z.coerce.number().int().min(1).max(3600).optional(),
    /** How long one send may take before the message is taken as lost (its instance died mid-send) and another worker retries it, seconds. */
    MAIL_SEND_TIMEOUT_SECONDS: z.coerce.number().int().min(2).max(3600).default(300),
    /** How often an idle mail worker looks for queued messages, seconds (at least 0.5). */
    MAIL_POLL_SECONDS: z.coerce.number().min(0.5).max(60).optional(),
    /** After SIGTERM, how long readiness answers 503 while new requests are still served, so a load balancer stops sending them. */
    SHUTDOWN_GRACE_SECONDS: z.coerce.number().min(0).max(300).default(0),
    /** Then at most this long for requests in flight to finish before their connections are closed. */
    SHUTDOWN_TIMEOUT_SECONDS: z.coerce.number().min(0).max(600).default(20),
  })
  .superRefine((env, ctx) => {
    refineStorageEnv(env, ctx);
    if (env.NODE_ENV === 'production' && !env.SESSION_SECRET) {
      ctx.addIssue({ code: 'custom', path: ['SESSION_SECRET'], message: 'SESSION_SECRET is required when NODE_ENV=production' });
    }
  });

export interface Config {
  nodeEnv: 'development' | 'test' | 'production';
  isProduction: boolean;
  port: number;
  host: string;
  databaseUrl: string;
  sessionSecret: string;
  smtpUrl?: string;
  mailFrom: string;
  appUrl: string;
  trustProxy: string | number | boolean;
  /** The local data folder: uploads with the local driver, and the local payments secret. */
  uploadDir: string;
  /** Where uploads are kept (server/lib/storage). */
  storage: StorageConfig;
  distDir: string;
  migrateOnStart: boolean;
  seedDemo: boolean;
  loginRateLimit: number;
  logSql: boolean;
  logLevel: string;
  /** bcrypt cost; 10 by default, 4 in tests (speed only: the algorithm is the same). */
  bcryptRounds: number;
  takeoffWorkers?: number;
  takeoffTimeLimitMs: number;
  mailRetryLimit: number;
  mailRetryDelaySeconds: number;
  mailPollSeconds: number;
  mailSendTimeoutSeconds: number;
  shutdownGraceMs: number;
  shutdownTimeoutMs: number;
  /** Prune expired sessions on a timer (off in tests so nothing keeps the process alive). */
  pruneSessions: boolean;
  fakeSmtpPort: number;
  /** Card payments; null = switched off (production without keys). */
  payments: ResolvedPaymentsConfig;
}

/** Parses the environment; throws one readable error naming every bad variable. */
export function loadConfig(env: NodeJS.ProcessEnv = process.env): Config {
  const parsed = envSchema.safeParse(env);
  if (!parsed.success) {
    const lines = parsed.error.issues.map((i) => `  ${i.path.join('.') || '(env)'}: ${i.message}`);
    throw new Error(`Invalid configuration:\n${lines.join('\n')}`);
  }
  const e = parsed.data;
  const trust = e.TRUST_PROXY;
  return {
    nodeEnv: e.NODE_ENV,
    isProduction: e.NODE_ENV === 'production',
    port: e.PORT,
    host: e.HOST,
    databaseUrl: e.DATABASE_URL,
    sessionSecret: e.SESSION_SECRET ?? DEV_SECRET,
    smtpUrl: e.SMTP_URL,
    mailFrom: e.MAIL_FROM,
    appUrl: (e.APP_URL ?? `http://127.0.0.1:${e.PORT}`).replace(/\/$/, ''),
    trustProxy: trust === undefined || trust === '' ? false : /^\d+$/.test(trust) ? Number(trust) : trust === 'true' ? true : trust,
    uploadDir: path.resolve(e.UPLOAD_DIR),
    storage: storageConfigFromEnv(e, path.resolve(e.UPLOAD_DIR)),
    distDir: path.resolve(e.DIST_DIR),
    migrateOnStart: e.MIGRATE_ON_START,
    seedDemo: e.SEED_DEMO === undefined ? e.NODE_ENV !== 'production' : ['1', 'true', 'yes'].includes(e.SEED_DEMO),
    loginRateLimit: e.LOGIN_RATE_LIMIT,
    logSql: e.LOG_SQL,
    logLevel: e.LOG_LEVEL ?? (e.NODE_ENV === 'test' ? 'silent' : 'info'),
    bcryptRounds: e.BCRYPT_ROUNDS ?? (e.NODE_ENV === 'test' ? 4 : 10),
    pruneSessions: e.NODE_ENV !== 'test',
    takeoffWorkers: e.TAKEOFF_WORKERS,
    takeoffTimeLimitMs: e.TAKEOFF_TIME_LIMIT_MS,
    fakeSmtpPort: e.FAKE_SMTP_PORT,
    payments: paymentsConfigFromEnv(
      { STRIPE_SECRET_KEY: e.STRIPE_SECRET_KEY, STRIPE_WEBHOOK_SECRET: e.STRIPE_WEBHOOK_SECRET, PAYMENTS_API_URL: e.PAYMENTS_API_URL },
      e.NODE_ENV === 'production',
      path.resolve(e.UPLOAD_DIR),
    ),
    mailRetryLimit: e.MAIL_RETRY_LIMIT,
    mailSendTimeoutSeconds: e.MAIL_SEND_TIMEOUT_SECONDS,
    // Tests wait for mail: short retries and fast polling there.
    mailRetryDelaySeconds: e.MAIL_RETRY_DELAY_SECONDS ?? (e.NODE_ENV === 'test' ? 1 : 30),
    mailPollSeconds: e.MAIL_POLL_SECONDS ?? (e.NODE_ENV === 'test' ? 0.5 : 2),
    shutdownGraceMs: e.SHUTDOWN_GRACE_SECONDS * 1000,
    shutdownTimeoutMs: e.SHUTDOWN_TIMEOUT_SECONDS * 1000,
  };
}
