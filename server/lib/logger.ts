import pino, { type DestinationStream, type Logger } from 'pino';

export type { Logger };

/**
 * The server's structured (JSON) log. Request lines carry the request id, user id and organisation
 * id and never headers or bodies (cookies, passwords, tokens, customers' details); the redact paths
 * are a second guard for anything logged by hand.
 */
export function createLogger(opts: { level?: string; destination?: DestinationStream } = {}): Logger {
  return pino(
    {
      level: opts.level ?? 'info',
      redact: { paths: ['password', '*.password', 'token', '*.token', 'headers.cookie', 'headers.authorization'], censor: '[redacted]' },
    },
    opts.destination,
  );
}
