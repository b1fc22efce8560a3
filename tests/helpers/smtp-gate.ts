// An SMTP server for tests of the mail queue across processes: it can be stopped and started again
// on the same port (the mail server going down and coming back), and it can hold the next message
// unanswered after its data arrived (a send in flight), telling which client (EHLO name) sent it.
import type { AddressInfo } from 'node:net';
import { simpleParser } from 'mailparser';
import { SMTPServer } from 'smtp-server';

export interface GateMail {
  /** The EHLO name of the client that sent it (the app instance, from SMTP_URL's `name`). */
  client: string;
  to: string;
  subject: string;
}

export class SmtpGate {
  port = 0;
  /** Messages accepted (answered 250), in order. */
  readonly accepted: GateMail[] = [];
  private server: SMTPServer | null = null;
  private holding = false;
  private onHeld: ((client: string) => void) | null = null;
  private waiters = new Set<() => void>();

  async start(port = this.port): Promise<number> {
    const server = new SMTPServer({
      authOptional: true,
      disabledCommands: ['STARTTLS'],
      logger: false,
      onData: (stream, session, callback) => {
        const chunks: Buffer[] = [];
        stream.on('data', (c: Buffer) => chunks.push(c));
        stream.on('end', () => {
          const client = session.hostNameAppearsAs;
          if (this.holding) {
            // Never answered: the sender waits for its 250 until it is killed.
            this.onHeld?.(client);
            return;
          }
          simpleParser(Buffer.concat(chunks)).then(
            (m) => {
              const to = Array.isArray(m.to) ? m.to.map((a) => a.text).join(', ') : (m.to?.text ?? '');
              this.accepted.push({ client, to, subject: m.subject ?? '' });
              for (const w of this.waiters) w();
              callback();
            },
            (err: Error) => callback(err),
          );
        });
      },
    });
    await new Promise<void>((resolve, reject) => {
      server.once('error', reject);
      server.listen(port, '127.0.0.1', () => resolve());
    });
    this.server = server;
    this.port = (server.server.address() as AddressInfo).port;
    return this.port;
  }

  /** Closes the port: senders get "connection refused" until start() again. */
  async stop(): Promise<void> {
    const s = this.server;
    this.server = null;
    if (s) await new Promise<void>((resolve) => s.close(() => resolve()));
  }

  /** Holds the next messages unanswered; resolves with the client whose message is held first. */
  holdNext(): Promise<string> {
    this.holding = true;
    return new Promise((resolve) => {
      this.onHeld = (client) => {
        this.onHeld = null;
        resolve(client);
      };
    });
  }

  /** Answers messages again (held ones stay unanswered: their senders are gone). */
  release() {
    this.holding = false;
    this.onHeld = null;
  }

  /** Resolves with the first accepted message matching, waiting up to `timeoutMs`. */
  waitFor(match: (m: GateMail) => boolean, timeoutMs: number): Promise<GateMail> {
    return new Promise((resolve, reject) => {
      const check = () => {
        const m = this.accepted.find(match);
        if (!m) return false;
        clear();
        resolve(m);
        return true;
      };
      const timer = setTimeout(() => {
        clear();
        reject(new Error(`no matching message within ${timeoutMs} ms; accepted: ${JSON.stringify(this.accepted)}`));
      }, timeoutMs);
      const clear = () => {
        clearTimeout(timer);
        this.waiters.delete(onMail);
      };
      const onMail = () => void check();
      if (!check()) this.waiters.add(onMail);
    });
  }
}
