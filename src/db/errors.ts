// Recognising what MariaDB (through mysql2 and Drizzle) said, whatever wraps the error: Drizzle
// puts the driver's error in `cause`. Used by transactions (deadlock retry) and by the server's
// fault mapping (a stopped database answers 503, a trigger's refusal 409).

interface DriverError {
  code?: string;
  errno?: number;
  sqlState?: string;
  sqlMessage?: string;
}

/** The innermost error of a `cause` chain (at most 5 deep). */
export function rootCause(err: unknown): unknown {
  let e: unknown = err;
  for (let i = 0; i < 5; i++) {
    const next = e && typeof e === 'object' ? (e as { cause?: unknown }).cause : undefined;
    if (!next) break;
    e = next;
  }
  return e;
}

function driverError(err: unknown): DriverError | null {
  for (let e = err, i = 0; e && typeof e === 'object' && i < 6; e = (e as { cause?: unknown }).cause, i++) {
    const d = e as DriverError;
    if (typeof d.errno === 'number' || typeof d.code === 'string') return d;
  }
  return null;
}

/** MariaDB chose this transaction as a deadlock victim (safe to run it again). */
export function isDeadlock(err: unknown): boolean {
  return driverError(err)?.errno === 1213;
}

/** A unique index refused the row. */
export function isDuplicateKey(err: unknown): boolean {
  return driverError(err)?.errno === 1062;
}

/** A trigger refused the statement (SIGNAL SQLSTATE '45000'); the message says which rule. */
export function triggerRefusal(err: unknown): string | null {
  const d = driverError(err);
  return d && (d.errno === 1644 || d.sqlState === '45000') ? (d.sqlMessage ?? 'refused by the database') : null;
}

/** Socket errors that mean the other side is not answering (any service). */
export const NETWORK_ERROR_CODES = new Set([
  'ECONNREFUSED',
  'ECONNRESET',
  'ETIMEDOUT',
  'EPIPE',
  'EHOSTUNREACH',
  'ENOTFOUND',
  'EAI_AGAIN',
]);

const UNREACHABLE_CODES = new Set([
  ...NETWORK_ERROR_CODES,
  'PROTOCOL_CONNECTION_LOST',
  'PROTOCOL_SEQUENCE_TIMEOUT',
  'ER_SERVER_SHUTDOWN',
  'ER_CON_COUNT_ERROR',
]);
// 1040 too many connections, 1053 shutdown in progress, 1205 lock wait timeout, 2002/2003/2006/2013 gone
const UNREACHABLE_ERRNOS = new Set([1040, 1053, 1205, 2002, 2003, 2006, 2013, 1927]);

/** The database is stopped, unreachable, restarting or too busy: the same request may work shortly. */
export function isDatabaseUnavailable(err: unknown): boolean {
  const d = driverError(err);
  if (d && ((d.code && UNREACHABLE_CODES.has(d.code)) || (d.errno !== undefined && UNREACHABLE_ERRNOS.has(d.errno))))
    return true;
  const message = rootCause(err) instanceof Error ? (rootCause(err) as Error).message : '';
  return /Pool is closed|Connection lost|Can't add new command when connection is in closed state/i.test(message);
}
