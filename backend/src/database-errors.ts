/**
 * Whether an error means the database could not be reached (stopped, restarting, connection cut), as opposed to
 * a query the database refused. The pool opens new connections by itself once it is back, so such a failure is
 * temporary: requests answer 503 and background work records it in our words.
 */

/** Node's socket errors and mysql2's codes for a connection that could not be made or was lost. */
const UNREACHABLE_CODES = new Set([
  'ECONNREFUSED',
  'ECONNRESET',
  'EPIPE',
  'ETIMEDOUT',
  'EHOSTUNREACH',
  'ENETUNREACH',
  'EAI_AGAIN',
  'PROTOCOL_CONNECTION_LOST',
  'PROTOCOL_ENQUEUE_AFTER_FATAL_ERROR',
  'PROTOCOL_ENQUEUE_AFTER_QUIT',
  'PROTOCOL_SEQUENCE_TIMEOUT',
  'ER_SERVER_SHUTDOWN',
  'ER_CONNECTION_KILLED',
  'ER_CON_COUNT_ERROR',
]);
/** MariaDB's numbers for the same: server shutdown (1053), connection killed (1927), too many connections (1040). */
const UNREACHABLE_ERRNOS = new Set([1053, 1927, 1040]);
/** mysql2 says this (without a code) when a pooled connection was closed under it. */
const CLOSED_CONNECTION = /closed state|Connection lost|Pool is closed/i;

export function isDatabaseUnreachable(err: unknown): boolean {
  const seen = new Set<unknown>();
  for (let e: unknown = err; e && typeof e === 'object' && !seen.has(e);) {
    seen.add(e);
    const { code, errno, message, driverError, cause } = e as { code?: unknown; errno?: unknown; message?: unknown; driverError?: unknown; cause?: unknown };
    if (typeof code === 'string' && UNREACHABLE_CODES.has(code)) return true;
    if (typeof errno === 'number' && UNREACHABLE_ERRNOS.has(errno)) return true;
    if (typeof message === 'string' && CLOSED_CONNECTION.test(message)) return true;
    e = driverError ?? cause;
  }
  return false;
}
