// Small adapters: config parsing, the fake SMTP server with the nodemailer mailer.
import { describe, expect, it } from 'vitest';
import { loadConfig } from '../../server/config';
import { FakeSmtp } from '../../server/lib/fake-smtp';
import { createSmtpMailer } from '../../server/lib/mailer';
import { redactPrices } from '../../server/lib/redact';

describe('config', () => {
  it('fails fast with a message naming every bad variable', () => {
    expect(() => loadConfig({ PORT: 'abc' })).toThrow(/DATABASE_URL[\s\S]*PORT|PORT[\s\S]*DATABASE_URL/);
  });

  it('requires a session secret in production', () => {
    expect(() => loadConfig({ NODE_ENV: 'production', DATABASE_URL: 'postgres://u:p@db.example.com/q' })).toThrow(/SESSION_SECRET/);
  });

  it('defaults PORT to 3000 and seeds demo data outside production only', () => {
    const dev = loadConfig({ DATABASE_URL: 'postgres://u:p@127.0.0.1/q' });
    expect(dev.port).toBe(3000);
    expect(dev.seedDemo).toBe(true);
    const prod = loadConfig({ NODE_ENV: 'production', DATABASE_URL: 'postgres://u:p@db/q', SESSION_SECRET: 'x'.repeat(32) });
    expect(prod.seedDemo).toBe(false);
  });
});

describe('fake SMTP + mailer', () => {
  it('captures a message sent through nodemailer, parsed, with its links', async () => {
    const smtp = new FakeSmtp();
    const port = await smtp.start();
    const mailer = createSmtpMailer({ host: '127.0.0.1', port }, 'Quiltline <no-reply@quiltline.example.com>');
    try {
      await mailer.send({ to: 'someone@example.com', subject: 'Hello ✓', text: 'Open https://app.example.com/set-password?token=abc&x=1 please' });
      const m = await smtp.waitFor((x) => x.subject === 'Hello ✓', 2000);
      expect(m.envelopeTo).toEqual(['someone@example.com']);
      expect(m.from).toContain('no-reply@quiltline.example.com');
      expect(m.links).toEqual(['https://app.example.com/set-password?token=abc&x=1']);
      smtp.clear();
      expect(smtp.messages()).toEqual([]);
      await expect(smtp.waitFor(() => true, 50)).rejects.toThrow(/no matching e-mail/);
    } finally {
      mailer.close();
      await smtp.stop();
    }
  });
});

describe('redactPrices', () => {
  it('removes price-like keys at any depth and keeps the rest', () => {
    const out = redactPrices({ id: 'j', quote: { totalMinor: 1200, lines: [{ name: 'roll', unitPriceMinor: 300, qty: 4 }] }, notes: 'n' });
    expect(out).toEqual({ id: 'j', quote: { lines: [{ name: 'roll', qty: 4 }] }, notes: 'n' });
  });
});
