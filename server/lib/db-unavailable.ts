/**
 * Errors that mean "the database cannot be reached right now" (restart, failover, connections
 * refused or cut), as opposed to a bug or bad data: the app answers 503 with a retry hint for these
 * and recovers by itself once PostgreSQL is back (both pools make fresh connections on demand).
 *
 * SQLSTATE classes from the PostgreSQL manual, Appendix A "PostgreSQL Error Codes":
 * 08 connection exception, 57P01 admin_shutdown, 57P02 crash_shutdown, 57P03 cannot_connect_now,
 * 53300 too_many_connections; 55000 only with "not currently accepting connections" (a database
 * closed to new connections during maintenance).
 */
const SQLSTATES = new Set(['57P01', '57P02', '57P03', '53300']);
const NODE_CODES = new Set(['ECONNREFUSED', 'ECONNRESET', 'ETIMEDOUT', 'EPIPE', 'EHOSTUNREACH', 'ENOTFOUND']);
const SEQUELIZE_NAMES = new Set([
  'SequelizeConnectionError',
  'SequelizeConnectionRefusedError',
  'SequelizeConnectionTimedOutError',
  'SequelizeHostNotReachableError',
  'SequelizeHostNotFoundError',
  'SequelizeConnectionAcquireTimeoutError',
]);
const MESSAGES =
  /Connection terminated|terminating connection|not currently accepting connections|the database system is (starting up|shutting down)|timeout exceeded when trying to connect|Client has encountered a connection error|connection is closed/i;

/** Seconds a client is told to wait before trying again. */
export const DB_RETRY_AFTER_SECONDS = 5;

export function isDatabaseUnavailable(err: unknown, depth = 0): boolean {
  if (!err || typeof err !== 'object' || depth > 4) return false;
  const e = err as { name?: string; code?: string; message?: string; parent?: unknown; original?: unknown; cause?: unknown };
  if (e.name && SEQUELIZE_NAMES.has(e.name)) return true;
  if (typeof e.code === 'string') {
    if (SQLSTATES.has(e.code) || e.code.startsWith('08') || NODE_CODES.has(e.code)) return true;
    if (e.code === '55000' && /not currently accepting connections/i.test(e.message ?? '')) return true;
  }
  if (typeof e.message === 'string' && MESSAGES.test(e.message)) return true;
  return [e.parent, e.original, e.cause].some((inner) => inner !== err && isDatabaseUnavailable(inner, depth + 1));
}
