import pino, { type DestinationStream, type Logger } from 'pino';

export type { Logger };

/** Lines wait in memory until this much is due, or the flush interval passes. */
const BATCH_BYTES = 4096;
const FLUSH_INTERVAL_MS = 1000;
/** Past this much waiting (a log reader that stopped reading), lines are dropped, not the process. */
const MAX_WAITING_BYTES = 16 * 1024 * 1024;

/**
 * The server's structured (JSON) log. Request lines carry the request id, user id and organisation
 * id and never headers or bodies (cookies, passwords, tokens, customers' details); the redact paths
 * are a second guard for anything logged by hand.
 *
 * Without a destination it goes to standard output asynchronously, in batches: a busy server makes
 * one write for a dozen lines instead of a blocking write per line (and a slow log reader on the
 * pipe no longer stalls requests). Lines are out within a second; pino writes what is left
 * synchronously when the process exits. Every way the server ends goes through process.exit (the
 * shutdown, a stop asked for during start-up, a fatal error: see index.ts), so only a kill -9 or a
 * crash of the runtime itself loses the last second.
 */
export function createLogger(opts: { level?: string; destination?: DestinationStream } = {}): Logger {
  return pino(
    {
      level: opts.level ?? 'info',
      redact: { paths: ['password', '*.password', 'token', '*.token', 'headers.cookie', 'headers.authorization'], censor: '[redacted]' },
    },
    opts.destination ?? batchedStdout(),
  );
}

function batchedStdout(): DestinationStream {
  return pino.destination({ dest: 1, sync: false, minLength: BATCH_BYTES, maxLength: MAX_WAITING_BYTES, periodicFlush: FLUSH_INTERVAL_MS });
}
