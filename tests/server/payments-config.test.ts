// Where the payment keys come from, and when the local stand-in is used.
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { describe, expect, it } from 'vitest';
import { LOCAL_SECRET_KEY, localWebhookSecret, paymentsConfigFromEnv } from '../../server/config/payments';

const tmpDir = () => fs.mkdtempSync(path.join(os.tmpdir(), 'quiltline-data-'));

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

  it('needs no keys for the demo: the local stand-in on 127.0.0.1:12111 with a local test key', () => {
    const dir = tmpDir();
    expect(paymentsConfigFromEnv({}, false, dir)).toEqual({
      secretKey: LOCAL_SECRET_KEY,
      webhookSecret: localWebhookSecret(dir),
      apiUrl: 'http://127.0.0.1:12111',
      provider: 'local',
    });
    expect(paymentsConfigFromEnv({ PAYMENTS_API_URL: 'http://127.0.0.1:12199' }, false, dir)?.apiUrl).toBe('http://127.0.0.1:12199');
  });

  it('signs local webhooks with a random secret per install, kept in its data folder (never a fixed public one)', () => {
    const a = tmpDir();
    const b = tmpDir();
    const first = paymentsConfigFromEnv({}, false, a)!.webhookSecret;
    expect(first).toMatch(/^whsec_[A-Za-z0-9_-]{43}$/);
    expect(first).not.toBe('whsec_quiltline_local_stand_in');
    // The same install keeps its secret (the app and the stand-in's own process read one file)…
    expect(paymentsConfigFromEnv({}, false, a)!.webhookSecret).toBe(first);
    expect(paymentsConfigFromEnv({ UPLOAD_DIR: a }, false)!.webhookSecret).toBe(first);
    // …another install has another.
    expect(paymentsConfigFromEnv({}, false, b)!.webhookSecret).not.toBe(first);
    expect(fs.statSync(path.join(a, 'local-payments-webhook-secret')).mode & 0o077).toBe(0);
  });

  it('switches card payments off in production without keys (never a stand-in there)', () => {
    expect(paymentsConfigFromEnv({}, true)).toBeNull();
  });
});
