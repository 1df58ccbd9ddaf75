// Faults of the services Hoopline depends on, told apart from bugs: a stopped or unreachable
// MariaDB, object storage that refuses or times out. They answer 503 (nothing was changed; try
// again) and the worker retries them with back-off; a trigger's refusal answers 409.
import { isDatabaseUnavailable, NETWORK_ERROR_CODES, rootCause, triggerRefusal } from '../db/errors';
import { AppError } from './errors';

const SDK_TRANSIENT_NAMES = new Set([
  'TimeoutError',
  'RequestTimeout',
  'RequestTimeoutException',
  'NetworkingError',
  'ServiceUnavailable',
  'SlowDown',
  'InternalError',
  'ThrottlingException',
]);

/** Object storage did not answer, timed out or answered 5xx (the AWS SDK's error shapes). */
export function isStorageUnavailable(err: unknown): boolean {
  for (let e = err, i = 0; e && typeof e === 'object' && i < 6; e = (e as { cause?: unknown }).cause, i++) {
    const x = e as { code?: string; name?: string; message?: string; $metadata?: { httpStatusCode?: number } };
    const status = x.$metadata?.httpStatusCode;
    if (typeof status === 'number' && status >= 500) return true;
    if (x.code && NETWORK_ERROR_CODES.has(x.code)) return true;
    if (x.name && SDK_TRANSIENT_NAMES.has(x.name)) return true;
    if (typeof x.message === 'string' && /socket hang up|ECONNREFUSED|ECONNRESET|connect ETIMEDOUT/.test(x.message))
      return true;
    // the SDK's multipart upload reports a failed part as an aggregate
    if (
      Array.isArray((e as { errors?: unknown[] }).errors) &&
      (e as { errors: unknown[] }).errors.some(isStorageUnavailable)
    )
      return true;
  }
  return false;
}

/** A fault that may pass by itself: worth a retry later, never a user's mistake. */
export function isTransientFault(err: unknown): boolean {
  return isDatabaseUnavailable(err) || isStorageUnavailable(err);
}

/** The AppError a service fault answers with, or null when it is not one. */
export function faultToAppError(err: unknown): AppError | null {
  const refused = triggerRefusal(err);
  if (refused) return new AppError('database-refused', undefined, { rule: refused });
  if (isDatabaseUnavailable(err))
    return new AppError('unavailable', 'The database is not answering; nothing was changed. Try again shortly.');
  if (isStorageUnavailable(err))
    return new AppError('unavailable', 'Object storage is not answering; nothing was changed. Try again shortly.');
  return null;
}

/** One line about a fault for the server log (never sent to a client). */
export function describeFault(err: unknown): string {
  const e = rootCause(err) as { code?: string; message?: string } | undefined;
  return [e?.code, e?.message].filter(Boolean).join(': ') || String(err);
}
