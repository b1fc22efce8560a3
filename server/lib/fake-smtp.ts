import type { AddressInfo } from 'node:net';
import { SMTPServer } from 'smtp-server';
import { ORGANISATION_HEADER } from './mailer';

/** A message as the fake SMTP server received it. */
export interface CapturedMail {
  id: number;
  receivedAt: string;
  envelopeFrom: string;
  envelopeTo: string[];
  from: string;
  to: string;
  /** The Reply-To address, '' when none. */
  replyTo: string;
  /** The sending company (the `X-Quiltline-Organisation` header), null when the message names none. */
  organisationId: string | null;
  subject: string;
  text: string;
  html: string;
  /** Every http(s) link found in the text or HTML body. */
  links: string[];
  raw: string;
}

/** What the outbox page and the tests read. */
export interface Outbox {
  messages(): CapturedMail[];
  clear(): void;
  waitFor(predicate: (m: CapturedMail) => boolean, timeoutMs?: number): Promise<CapturedMail>;
}

const LINK_RE = /https?:\/\/[^\s"'<>)]+/g;

/**
 * An SMTP server on 127.0.0.1 inside this process that keeps every message in memory — the local
 * stand-in for a real relay (`npm start` without SMTP_URL, and the tests).
 */
export class FakeSmtp implements Outbox {
  private server: SMTPServer | null = null;
  private store: CapturedMail[] = [];
  private nextId = 1;
  private waiters = new Set<() => void>();
  port = 0;

  constructor(private readonly limit = 500) {}

  // A closed SMTPServer refuses to listen again, so every start() builds a fresh one (tests stop
  // and restart the fake to play a mail server that goes down and comes back).
  private createServer(): SMTPServer {
    return new SMTPServer({
      authOptional: true,
      disabledCommands: ['STARTTLS'],
      logger: false,
      onData: (stream, session, callback) => {
        const chunks: Buffer[] = [];
        stream.on('data', (c: Buffer) => chunks.push(c));
        stream.on('error', callback);
        stream.on('end', () => {
          const raw = Buffer.concat(chunks);
          // mailparser (~5 MB of heap) is loaded by the first message, not by every server that never runs this fake.
          import('mailparser')
            .then(({ simpleParser }) => simpleParser(raw))
            .then((parsed) => {
              const text = parsed.text ?? '';
              const html = typeof parsed.html === 'string' ? parsed.html : '';
              const addr = (a: typeof parsed.from | typeof parsed.to) => (Array.isArray(a) ? a.map((x) => x.text).join(', ') : (a?.text ?? ''));
              this.store.push({
                id: this.nextId++,
                receivedAt: new Date().toISOString(),
                envelopeFrom: session.envelope.mailFrom ? session.envelope.mailFrom.address : '',
                envelopeTo: session.envelope.rcptTo.map((r) => r.address),
                from: addr(parsed.from),
                to: addr(parsed.to),
                replyTo: addr(parsed.replyTo),
                organisationId: (parsed.headers.get(ORGANISATION_HEADER.toLowerCase()) as string | undefined) ?? null,
                subject: parsed.subject ?? '',
                text,
                html,
                links: [...new Set([...(text.match(LINK_RE) ?? []), ...(html.match(LINK_RE) ?? [])].map((l) => l.replace(/&amp;/g, '&')))],
                raw: raw.toString('utf8'),
              });
              if (this.store.length > this.limit) this.store.splice(0, this.store.length - this.limit);
              for (const w of this.waiters) w();
              callback();
            })
            .catch(callback);
        });
      },
    });
  }

  /** Listens on 127.0.0.1; port 0 picks a free one. Resolves to the port. */
  async start(port = 0): Promise<number> {
    const server = this.createServer();
    this.server = server;
    await new Promise<void>((resolve, reject) => {
      server.once('error', reject);
      server.listen(port, '127.0.0.1', () => resolve());
    });
    this.port = (server.server.address() as AddressInfo).port;
    return this.port;
  }

  async stop(): Promise<void> {
    const server = this.server;
    this.server = null;
    if (server) await new Promise<void>((resolve) => server.close(() => resolve()));
  }

  /** Newest last. */
  messages(): CapturedMail[] {
    return [...this.store];
  }

  clear(): void {
    this.store = [];
  }

  /** Resolves with the first message (already received or arriving) that matches. */
  waitFor(predicate: (m: CapturedMail) => boolean, timeoutMs = 5000): Promise<CapturedMail> {
    return new Promise((resolve, reject) => {
      const check = () => {
        const hit = this.store.find(predicate);
        if (hit) {
          cleanup();
          resolve(hit);
        }
      };
      const timer = setTimeout(() => {
        cleanup();
        reject(new Error(`no matching e-mail within ${timeoutMs} ms (${this.store.length} in the outbox)`));
      }, timeoutMs);
      const cleanup = () => {
        clearTimeout(timer);
        this.waiters.delete(check);
      };
      this.waiters.add(check);
      check();
    });
  }
}
