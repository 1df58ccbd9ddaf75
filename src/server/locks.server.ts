// One transaction per change of state, holding the test row's lock (DESIGN 6): the status is
// re-read under the lock, so a release racing an upload, a disposition, a plan save or a
// finishing reduction leaves one consistent outcome.
import { inTransaction, type Tx } from '../db/client.server';
import { lockTest } from '../db/queries/tests';
import type { Test } from '../db/schema';
import { AppError, errors } from './errors';

/**
 * Run `fn` in one transaction that first locks the test's row: 404 when there is no such test,
 * and with `forWrite` 409 when it is released. Everything `fn` writes, audit rows included,
 * commits together or not at all.
 */
export function withLockedTest<T>(
  testId: number,
  opts: { forWrite: boolean },
  fn: (tx: Tx, test: Test) => Promise<T>,
): Promise<T> {
  return inTransaction(async (tx) => {
    const test = await lockTest(tx, testId);
    if (!test) throw errors.notFound('test');
    if (opts.forWrite && test.status === 'released') throw new AppError('test-released');
    return fn(tx, test);
  });
}
