import nodemailer, { type Transporter } from 'nodemailer';

export interface MailMessage {
  to: string;
  subject: string;
  text: string;
  html?: string;
  attachments?: Array<{ filename: string; content: Buffer; contentType?: string }>;
}

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
    async send(message) {
      await transport.sendMail({ from, ...message });
    },
    close() {
      transport.close();
    },
  };
}
