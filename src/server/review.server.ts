// Dispositions, the engineering review and the QA release. Each signature names the exact
// reduction it covers; release locks the test; the reviewer cannot also release.
import { getDb } from '../db/client.server';
import { insertDisposition, insertSignature } from '../db/queries/review';
import { updateTest } from '../db/queries/tests';
import { listUsers } from '../db/queries/users';
import type { DispositionOutcome } from '../db/schema';
import { auditBy } from './audit.server';
import { can } from '../lib/roles';
import { getConfig } from '../config.server';
import { AppError, errors } from './errors';
import type { RequestUser } from './http';
import { queueMail } from './outbox.server';
import { loadTestRecord, type TestRecord } from './record.server';

function requireDoneReduction(r: TestRecord) {
  if (!r.reduction || !r.result)
    throw new AppError(
      'no-result',
      'There is no finished reduction to review yet. Upload a log and run a reduction first.',
    );
  return { reduction: r.reduction, result: r.result };
}

function unlocked(r: TestRecord) {
  if (r.test.status === 'released') throw new AppError('test-released');
}

/** Record a disposition for a gauge of the current reduction; a review signed earlier is withdrawn. */
export async function dispositionGauge(
  user: RequestUser,
  testId: number,
  d: { gaugeId: string; outcome: DispositionOutcome; reason: string },
) {
  const record = await loadTestRecord(testId);
  unlocked(record);
  const { reduction } = requireDoneReduction(record);
  const rosetteIds = new Set(record.result!.rosettes.map((x) => x.id));
  if (!record.gauges.some((g) => g.id === d.gaugeId) && !rosetteIds.has(d.gaugeId))
    throw new AppError('unknown-gauge', `The current reduction has no gauge '${d.gaugeId}'.`, {
      gaugeIds: record.gauges.map((g) => g.id),
    });
  const db = getDb();
  const id = await insertDisposition(db, {
    testId,
    reductionId: reduction.id,
    gaugeId: d.gaugeId,
    outcome: d.outcome,
    reason: d.reason,
    userId: user.id,
  });
  const after = await loadTestRecord(testId);
  const status = record.test.status === 'reviewed' ? 'reduced' : record.test.status;
  await updateTest(db, testId, {
    verdict: after.verdict,
    flaggedCount: after.gauges.filter((g) => g.outcome === 'flagged' && g.disposition?.outcome !== 'accepted').length,
    status,
  });
  await auditBy(user, 'gauge-dispositioned', testId, { dispositionId: id, reductionId: reduction.id, ...d });
  if (status !== record.test.status)
    await auditBy(user, 'review-withdrawn', testId, { reason: `disposition of ${d.gaugeId} after the review` });
  return { id, verdict: after.verdict };
}

/** The engineer's review: only on a finished, complete reduction whose every flag has a disposition. */
export async function signReview(user: RequestUser, testId: number) {
  if (!can(user.role, 'review')) throw errors.forbidden('review');
  const record = await loadTestRecord(testId);
  unlocked(record);
  const { reduction, result } = requireDoneReduction(record);
  if (record.test.status === 'reviewed')
    throw new AppError('already-reviewed', 'This reduction has been reviewed already.');
  if (record.test.status !== 'reduced')
    throw new AppError(
      'not-reduced',
      'The newest logs have not been reduced yet: run a reduction that covers every log, then review.',
    );
  if (result.verdict === 'incomplete')
    throw new AppError(
      'incomplete',
      'The log has not reached test pressure and come back to zero; a partial record cannot be reviewed.',
    );
  if (record.openFlags.length)
    throw new AppError('open-flags', `Disposition every flagged gauge first: ${record.openFlags.join(', ')}.`, {
      gaugeIds: record.openFlags,
    });
  const statement = `Engineering review of reduction ${reduction.id} (engine ${reduction.engineVersion}), verdict ${record.verdict}.`;
  const db = getDb();
  const id = await insertSignature(db, {
    testId,
    reductionId: reduction.id,
    kind: 'review',
    userId: user.id,
    statement,
  });
  await updateTest(db, testId, { status: 'reviewed' });
  await auditBy(user, 'review-signed', testId, { signatureId: id, reductionId: reduction.id, verdict: record.verdict });
  const base = getConfig().PUBLIC_BASE_URL;
  const qa = (await listUsers(db)).filter((u) => can(u.role, 'release') && !u.disabled);
  for (const q of qa)
    await queueMail(
      q.email,
      `Hoopline: "${record.test.name}" is reviewed and waits for release`,
      `${user.name} signed the engineering review of "${record.test.name}" (verdict: ${record.verdict}).\n\nRelease it here: ${base}/tests/${testId}/review\n\n— Hoopline`,
      testId,
    );
  return { id, reductionId: reduction.id };
}

/** QA's release: locks the test. The reviewer of this reduction cannot release it. */
export async function releaseTest(user: RequestUser, testId: number) {
  if (!can(user.role, 'release')) throw errors.forbidden('release');
  const record = await loadTestRecord(testId);
  unlocked(record);
  const { reduction } = requireDoneReduction(record);
  if (record.test.status !== 'reviewed')
    throw new AppError('not-reviewed', 'Only a reviewed test can be released; the engineering review is not signed.');
  const review = [...record.signatures].reverse().find((s) => s.kind === 'review' && s.reductionId === reduction.id);
  if (!review) throw new AppError('not-reviewed', 'The engineering review does not cover the current reduction.');
  if (review.userId === user.id)
    throw new AppError('own-review', 'You signed the engineering review of this test; another person must release it.');
  const statement = `Release of reduction ${reduction.id} reviewed by ${review.name}, verdict ${record.verdict}.`;
  const db = getDb();
  const id = await insertSignature(db, {
    testId,
    reductionId: reduction.id,
    kind: 'release',
    userId: user.id,
    statement,
  });
  await updateTest(db, testId, { status: 'released' });
  await auditBy(user, 'test-released', testId, { signatureId: id, reductionId: reduction.id, verdict: record.verdict });
  return { id, reductionId: reduction.id };
}
