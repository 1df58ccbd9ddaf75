import { describe, expect, it } from 'vitest';
import { faultToAppError, isStorageUnavailable, isTransientFault } from './faults.server';

const wrapped = (cause: unknown) => Object.assign(new Error('Failed query: insert …'), { cause });

describe('faults of the services', () => {
  it('recognise a stopped or lost database, through Drizzle\u2019s wrapping, as 503', () => {
    for (const cause of [
      Object.assign(new Error('connect ECONNREFUSED 127.0.0.1:3407'), { code: 'ECONNREFUSED', errno: -111 }),
      Object.assign(new Error('Connection lost: The server closed the connection.'), {
        code: 'PROTOCOL_CONNECTION_LOST',
      }),
      Object.assign(new Error('Server shutdown in progress'), { code: 'ER_SERVER_SHUTDOWN', errno: 1053 }),
    ]) {
      expect(isTransientFault(wrapped(cause))).toBe(true);
      expect(faultToAppError(wrapped(cause))?.status).toBe(503);
    }
  });

  it('recognise storage that refuses or answers 5xx, but not a missing object', () => {
    expect(isStorageUnavailable(Object.assign(new Error('x'), { $metadata: { httpStatusCode: 503 } }))).toBe(true);
    expect(isStorageUnavailable(Object.assign(new Error('socket hang up'), { code: 'ECONNRESET' }))).toBe(true);
    expect(isStorageUnavailable(Object.assign(new Error('x'), { name: 'TimeoutError' }))).toBe(true);
    expect(isStorageUnavailable(Object.assign(new Error('NoSuchKey'), { $metadata: { httpStatusCode: 404 } }))).toBe(
      false,
    );
  });

  it('answer 409 for a trigger\u2019s refusal, and leave a plain bug alone', () => {
    const refused = wrapped(
      Object.assign(new Error('x'), { errno: 1644, sqlState: '45000', sqlMessage: 'tests: a released test is locked' }),
    );
    expect(faultToAppError(refused)).toMatchObject({ status: 409, code: 'database-refused' });
    expect(isTransientFault(refused)).toBe(false);
    expect(faultToAppError(new TypeError('undefined is not a function'))).toBeNull();
  });
});
