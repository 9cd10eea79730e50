import { ConnectionError } from 'sequelize';

/** How long a client should wait before trying again while MariaDB cannot be reached. */
export const DB_RETRY_AFTER_SECONDS = 30;

// The connector's codes for "there is no usable connection" (as opposed to a bad query).
const CONNECTION_CODES = new Set([
  'ECONNREFUSED',
  'ECONNRESET',
  'ETIMEDOUT',
  'EHOSTUNREACH',
  'ENOTFOUND',
  'EPIPE',
  'ER_SOCKET_UNEXPECTED_CLOSE',
  'ER_CONNECTION_ALREADY_CLOSED',
  'ER_GET_CONNECTION_TIMEOUT',
  'ER_CONNECTION_TIMEOUT',
  'ER_CON_COUNT_ERROR',
  'ER_SERVER_SHUTDOWN',
]);

/**
 * Whether an error means the database is out of reach (stopped, restarting, unreachable), so the
 * right answer is 503 "try again shortly" rather than 500 "our bug". Sequelize wraps connect
 * failures in ConnectionError; a query on a connection that died with the server surfaces as a
 * DatabaseError whose original carries the connector's code (and `fatal`).
 */
export function isDatabaseUnavailable(error: unknown): boolean {
  if (error instanceof ConnectionError) return true;
  for (let e: unknown = error, depth = 0; e && typeof e === 'object' && depth < 4; depth++) {
    const { code, fatal, name } = e as { code?: unknown; fatal?: unknown; name?: unknown };
    if (typeof name === 'string' && /^Sequelize(Connection|HostNotReachable|HostNotFound|AccessDenied|InvalidConnection)/.test(name)) return true;
    if (typeof code === 'string' && CONNECTION_CODES.has(code)) return true;
    if (fatal === true && typeof code === 'string' && code.startsWith('ER_')) return true;
    e = (e as { original?: unknown; parent?: unknown; cause?: unknown }).original ?? (e as { parent?: unknown }).parent ?? (e as { cause?: unknown }).cause;
  }
  return false;
}
