// Where the payment keys come from, and when the local stand-in is used.
import { describe, expect, it } from 'vitest';
import { LOCAL_SECRET_KEY, LOCAL_WEBHOOK_SECRET, paymentsConfigFromEnv } from '../../server/lib/payments/payments-config';

describe('payments configuration', () => {
  it('uses the real service with both keys and no API URL', () => {
    expect(paymentsConfigFromEnv({ STRIPE_SECRET_KEY: 'sk_live_x', STRIPE_WEBHOOK_SECRET: 'whsec_x' }, true)).toEqual({
      secretKey: 'sk_live_x',
      webhookSecret: 'whsec_x',
      apiUrl: undefined,
      provider: 'service',
    });
  });

  it('refuses one key without the other, naming both', () => {
    expect(() => paymentsConfigFromEnv({ STRIPE_SECRET_KEY: 'sk_live_x' }, true)).toThrow(/STRIPE_SECRET_KEY and STRIPE_WEBHOOK_SECRET must be set together/);
    expect(() => paymentsConfigFromEnv({ STRIPE_WEBHOOK_SECRET: 'whsec_x' }, false)).toThrow(/set together/);
  });

  it('needs no keys for the demo: the local stand-in on 127.0.0.1:12111 with local test keys', () => {
    expect(paymentsConfigFromEnv({}, false)).toEqual({
      secretKey: LOCAL_SECRET_KEY,
      webhookSecret: LOCAL_WEBHOOK_SECRET,
      apiUrl: 'http://127.0.0.1:12111',
      provider: 'local',
    });
    expect(paymentsConfigFromEnv({ PAYMENTS_API_URL: 'http://127.0.0.1:12199' }, false)?.apiUrl).toBe('http://127.0.0.1:12199');
  });

  it('switches card payments off in production without keys (never a stand-in there)', () => {
    expect(paymentsConfigFromEnv({}, true)).toBeNull();
  });
});
