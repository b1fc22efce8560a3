// Error logs must not carry private link tokens (a quote link or pay token grants access alone).
import express from 'express';
import request from 'supertest';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { describeError, redactText, redactUrl } from '../../server/lib/log-redact';
import { errorHandler } from '../../server/middleware/error-handler';
import { createLogger } from '../../server/lib/logger';
import { requestLog } from '../../server/middleware/request-log';
import { signQuoteLink } from '../../server/modules/quotes/quote-link';

const QUOTE_ID = '3f2b8a52-1c4d-4e6f-9a0b-7c8d9e0f1a2b';
const token = signQuoteLink({ quoteId: QUOTE_ID, nonce: 'Zq3xN8pL0vR2sT4uW6yA1b', exp: 1_900_000_000 }, 'a-secret-for-this-test-only');
const payToken = 'nR7kQ2mX9vB4cD8fG1hJ5lP3sT6wY0zA';

afterEach(() => vi.restoreAllMocks());

describe('redaction', () => {
  it('replaces token-like path segments and query values, keeping ids and words', () => {
    expect(redactUrl(`/api/public/quotes/${encodeURIComponent(token)}/accept`)).toBe('/api/public/quotes/[redacted]/accept');
    expect(redactUrl(`/pay/invoice/${payToken}/pdf`)).toBe('/pay/invoice/[redacted]/pdf');
    expect(redactUrl(`/reset-password?token=${payToken}&x=1`)).toBe('/reset-password?token=[redacted]&x=1');
    expect(redactUrl(`/api/quotes/${QUOTE_ID}/send`)).toBe(`/api/quotes/${QUOTE_ID}/send`);
    expect(redactText(`WHERE "pay_token" = '${payToken}' AND id = '${QUOTE_ID}'`)).toBe(`WHERE "pay_token" = '[redacted]' AND id = '${QUOTE_ID}'`);
    expect(redactText(`link ${token} refused`)).not.toContain(token.split('.')[1]);
  });

  it('logs a 500 on a customer link without the token, in the URL, the message or the SQL', async () => {
    const logged: string[] = [];
    const app = express();
    app.use(requestLog(createLogger({ destination: { write: (line: string) => void logged.push(line) } })));
    app.get('/api/public/quotes/:token', () => {
      throw Object.assign(new Error(`lookup failed for ${payToken}`), {
        sql: `SELECT * FROM invoices WHERE pay_token = '${payToken}'`,
        parameters: [payToken],
      });
    });
    app.use(errorHandler);
    const res = await request(app).get(`/api/public/quotes/${encodeURIComponent(token)}`);
    expect(res.status).toBe(500);
    const all = logged.join('\n');
    expect(all).toContain('/api/public/quotes/[redacted]');
    expect(all).not.toContain(payToken);
    expect(all).not.toContain(encodeURIComponent(token));
    expect(all).not.toContain(token.split('.')[1]);
    expect(describeError(new Error(`x ${payToken}`))).not.toContain(payToken);
  });
});
