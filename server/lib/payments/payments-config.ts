/**
 * Where the payments keys come from. Production: STRIPE_SECRET_KEY and STRIPE_WEBHOOK_SECRET from
 * the environment (PAYMENTS_API_URL unset, so the SDK talks to the service itself). Development and
 * demo with no keys: the local stand-in (server/lib/payments/fake-service.ts) at PAYMENTS_API_URL,
 * default http://127.0.0.1:12111, with fixed local test keys that move no money.
 */
import type { PaymentsConfig } from './gateway';

export const LOCAL_PAYMENTS_PORT = 12111;
export const LOCAL_SECRET_KEY = 'sk_test_quiltline_local';
export const LOCAL_WEBHOOK_SECRET = 'whsec_quiltline_local_stand_in';

export type ResolvedPaymentsConfig = (PaymentsConfig & { provider: 'service' | 'local' }) | null;

/** Reads the payments settings; null = payments switched off (production without keys). */
export function paymentsConfigFromEnv(env: NodeJS.ProcessEnv, isProduction: boolean): ResolvedPaymentsConfig {
  const secretKey = env.STRIPE_SECRET_KEY?.trim();
  const webhookSecret = env.STRIPE_WEBHOOK_SECRET?.trim();
  const apiUrl = env.PAYMENTS_API_URL?.trim() || undefined;
  if (secretKey || webhookSecret) {
    if (!secretKey || !webhookSecret) throw new Error('Invalid configuration:\n  STRIPE_SECRET_KEY and STRIPE_WEBHOOK_SECRET must be set together');
    return { secretKey, webhookSecret, apiUrl, provider: apiUrl ? 'local' : 'service' };
  }
  if (isProduction) return null;
  return { secretKey: LOCAL_SECRET_KEY, webhookSecret: LOCAL_WEBHOOK_SECRET, apiUrl: apiUrl ?? `http://127.0.0.1:${LOCAL_PAYMENTS_PORT}`, provider: 'local' };
}
