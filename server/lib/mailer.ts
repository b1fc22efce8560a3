import nodemailer, { type Transporter } from 'nodemailer';

export interface MailMessage {
  to: string;
  /** Where the reader's reply goes: the company's own address on customer e-mail (the sender is a no-reply address). */
  replyTo?: string;
  /**
   * The company that sends it. Sent as the `X-Quiltline-Organisation` header, so the development
   * Outbox shows each company only its own mail, whoever it was addressed to.
   */
  organisationId?: string;
  subject: string;
  text: string;
  html?: string;
  attachments?: Array<{ filename: string; content: Buffer; contentType?: string }>;
  /** What the message is about, for the job's history (the queued mailer records it; SMTP ignores it). */
  about?: MailAbout;
}

/** The job a message belongs to (its `email_sent` event), who caused it and why. */
export interface MailAbout {
  jobId: string | null;
  userId: string | null;
  purpose: string;
  quoteId?: string | null;
}

/** Header naming the sending company on every message (read back by the local fake's Outbox). */
export const ORGANISATION_HEADER = 'X-Quiltline-Organisation';

/** The app's one way to send e-mail; services receive it through deps. */
export interface Mailer {
  send(message: MailMessage): Promise<void>;
  close(): void;
}

export type SmtpTarget = { url: string } | { host: string; port: number };

/** A nodemailer adapter. `{ host, port }` is the local fake (plain SMTP, no TLS, no auth). */
export function createSmtpMailer(target: SmtpTarget, from: string): Mailer {
  const transport: Transporter =
    'url' in target
      ? nodemailer.createTransport(target.url)
      : nodemailer.createTransport({ host: target.host, port: target.port, secure: false, ignoreTLS: true });
  return {
    async send({ organisationId, about: _about, ...message }) {
      await transport.sendMail({ from, ...message, headers: organisationId ? { [ORGANISATION_HEADER]: organisationId } : undefined });
    },
    close() {
      transport.close();
    },
  };
}
