/**
 * Where the payments keys come from. Production: STRIPE_SECRET_KEY and STRIPE_WEBHOOK_SECRET from
 * the environment (PAYMENTS_API_URL unset, so the SDK talks to the service itself). Development and
 * demo with no keys: the local stand-in (server/lib/payments/fake-service.ts) at PAYMENTS_API_URL,
 * default http://127.0.0.1:12111, with a local test key that moves no money and a webhook signing
 * secret made at random once per install (a fixed, published secret would let anyone who can reach
 * a demo or staging server tell it that a payment succeeded).
 */
import { randomBytes } from 'node:crypto';
import fs from 'node:fs';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import type { PaymentsConfig } from '../lib/payments/gateway';

const REPO_ROOT = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '../..');

export const LOCAL_PAYMENTS_PORT = 12111;
export const LOCAL_SECRET_KEY = 'sk_test_quiltline_local';
const SECRET_FILE = 'local-payments-webhook-secret';

/** The install's data folder (UPLOAD_DIR, default <repo>/uploads), shared by the app and the stand-in's process. */
export function localDataDir(env: NodeJS.ProcessEnv = process.env): string {
  return path.resolve(env.UPLOAD_DIR || path.join(REPO_ROOT, 'uploads'));
}

/**
 * This install's webhook signing secret for the local stand-in: read from the data folder, or made
 * there at random the first time (exclusive create, so the app and the stand-in starting together
 * agree on one; readable by the owner only).
 */
export function localWebhookSecret(dataDir: string): string {
  const file = path.join(dataDir, SECRET_FILE);
  const read = () => fs.readFileSync(file, 'utf8').trim();
  if (fs.existsSync(file)) return read();
  fs.mkdirSync(dataDir, { recursive: true });
  try {
    fs.writeFileSync(file, `whsec_${randomBytes(32).toString('base64url')}\n`, { flag: 'wx', mode: 0o600 });
  } catch (e) {
    if ((e as NodeJS.ErrnoException).code !== 'EEXIST') throw e;
  }
  return read();
}

export type ResolvedPaymentsConfig = (PaymentsConfig & { provider: 'service' | 'local' }) | null;

/** Reads the payments settings; null = payments switched off (production without keys). */
export function paymentsConfigFromEnv(env: NodeJS.ProcessEnv, isProduction: boolean, dataDir = localDataDir(env)): ResolvedPaymentsConfig {
  const secretKey = env.STRIPE_SECRET_KEY?.trim();
  const webhookSecret = env.STRIPE_WEBHOOK_SECRET?.trim();
  const apiUrl = env.PAYMENTS_API_URL?.trim() || undefined;
  if (secretKey || webhookSecret) {
    if (!secretKey || !webhookSecret) throw new Error('Invalid configuration:\n  STRIPE_SECRET_KEY and STRIPE_WEBHOOK_SECRET must be set together');
    return { secretKey, webhookSecret, apiUrl, provider: apiUrl ? 'local' : 'service' };
  }
  if (isProduction) return null;
  return {
    secretKey: LOCAL_SECRET_KEY,
    webhookSecret: localWebhookSecret(dataDir),
    apiUrl: apiUrl ?? `http://127.0.0.1:${LOCAL_PAYMENTS_PORT}`,
    provider: 'local',
  };
}
