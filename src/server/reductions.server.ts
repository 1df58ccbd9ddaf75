// Queueing a reduction and adding a note: under the test's lock, so a release cannot slip between the check and
// the insert, and with its audit row in the same transaction.
import { listLogs } from '../db/queries/logs';
import { queueReduction } from '../db/queries/reductions';
import { insertNote, updateTest } from '../db/queries/tests';
import type { NoteKind } from '../lib/domain';
import { auditBy } from './audit.server';
import { AppError } from './errors';
import type { RequestUser } from './http';
import { withLockedTest } from './locks.server';
import { validatePlan } from './plans.server';

/** POST /api/tests/{id}/reductions: a reduction of every log with the current plan → its id. */
export function queueTestReduction(user: RequestUser, testId: number): Promise<number> {
  return withLockedTest(testId, { forWrite: true }, async (tx, test) => {
    validatePlan(test.plan);
    const logs = await listLogs(tx, test.id);
    if (!logs.length) throw new AppError('no-logs', 'Upload a log before starting a reduction.');
    const id = await queueReduction(tx, {
      testId: test.id,
      plan: test.plan,
      logIds: logs.map((l) => l.id),
      queuedBy: user.id,
    });
    await updateTest(tx, test.id, {});
    await auditBy(tx, user, 'reduction-queued', test.id, { reductionId: id, logIds: logs.map((l) => l.id) });
    return id;
  });
}

/** POST /api/tests/{id}/notes: a note on a test that is not released, with its audit row. */
export function addTestNote(
  user: RequestUser,
  testId: number,
  note: { kind: NoteKind; body: string },
): Promise<number> {
  return withLockedTest(testId, { forWrite: true }, async (tx) => {
    const id = await insertNote(tx, { testId, userId: user.id, ...note });
    await auditBy(tx, user, 'note-added', testId, { noteId: id, kind: note.kind });
    return id;
  });
}
