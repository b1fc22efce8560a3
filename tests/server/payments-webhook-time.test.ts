// Webhook timestamps: a signed event must be dated within five minutes of our clock either way.
// The SDK refused only old ones; future-dated events were accepted, so a captured signature could
// be replayed for as long as its (future) date allowed.
import { describe, expect, it } from 'vitest';
import { createPaymentsGateway, WEBHOOK_TOLERANCE_SECONDS } from '../../server/lib/payments/gateway';
import { signWebhookPayload } from '../../server/lib/payments/fake-service';

const SECRET = 'whsec_test_timestamps_0123456789';
const gateway = createPaymentsGateway({ secretKey: 'sk_test_timestamps', webhookSecret: SECRET });
const payload = JSON.stringify({ id: 'evt_time_1', object: 'event', type: 'checkout.session.completed', data: { object: { id: 'cs_1' } } });
const now = () => Math.floor(Date.now() / 1000);
const verify = (t: number) => gateway.verifyWebhook(Buffer.from(payload), signWebhookPayload(payload, SECRET, t));

describe('webhook timestamp tolerance', () => {
  it('accepts an event dated now or a little off (clock skew)', () => {
    expect(verify(now()).id).toBe('evt_time_1');
    expect(verify(now() + 30).id).toBe('evt_time_1');
    expect(verify(now() - 30).id).toBe('evt_time_1');
  });

  it('refuses one dated more than the tolerance ahead, as it refuses one as far behind', () => {
    expect(WEBHOOK_TOLERANCE_SECONDS).toBe(300);
    expect(() => verify(now() + 3600)).toThrow(/tolerance/i);
    expect(() => verify(now() + 24 * 3600)).toThrow(/tolerance/i);
    expect(() => verify(now() - 3600)).toThrow(/tolerance/i);
  });
});
