// Dispositions, the engineering review and the QA release. Each runs in one transaction that
// locks the test row first and re-checks the status under the lock, so concurrent changes leave
// one consistent outcome; the audit row commits with the change. A signature names the exact
// reduction and the statement signed, and needs the signer's password; release freezes the record.
import type { Tx } from '../db/client.server';
import { findOpenLiveSession } from '../db/queries/live';
import { cancelOpenReductions } from '../db/queries/reductions';
import { insertDisposition, insertReleaseSnapshot, insertSignature } from '../db/queries/review';
import { updateTest } from '../db/queries/tests';
import { listUsers } from '../db/queries/users';
import type { DispositionOutcome } from '../db/schema';
import { can } from '../lib/roles';
import { procedureFacts, signatureStatement, signedText } from '../lib/signing';
import { RELEASE_SCOPE, VERDICT_LABEL, VERDICT_MEANING } from '../lib/verdict-words';
import { getConfig } from '../config.server';
import { auditBy } from './audit.server';
import { confirmSignerPassword } from './auth/credentials.server';
import { AppError, errors } from './errors';
import type { RequestUser } from './http';
import { withLockedTest } from './locks.server';
import { enqueueMailIn, kickOutbox } from './outbox.server';
import { loadLiveRecord, type TestRecord } from './record.server';
import { freezeRecord } from './snapshot.server';

function requireDoneReduction(r: TestRecord) {
  if (!r.reduction || !r.result)
    throw new AppError(
      'no-result',
      'There is no finished reduction to review yet. Upload a log and run a reduction first.',
    );
  return { reduction: r.reduction, result: r.result };
}

/** The signer saw reduction `seen`; refuse when another one is current now. */
function requireSameReduction(current: number, seen: number) {
  if (current !== seen)
    throw new AppError(
      'stale-reduction',
      `You opened reduction ${seen}, but reduction ${current} is current now. Reload the page and check it before signing.`,
      { currentReductionId: current },
    );
}

/** Record a disposition for a gauge of the current reduction; a review signed earlier is withdrawn. */
export async function dispositionGauge(
  user: RequestUser,
  testId: number,
  d: { gaugeId: string; outcome: DispositionOutcome; reason: string },
) {
  return withLockedTest(testId, { forWrite: true }, async (tx) => {
    const record = await loadLiveRecord(testId, tx);
    const { reduction, result } = requireDoneReduction(record);
    const rosetteIds = new Set(result.rosettes.map((x) => x.id));
    if (!record.gauges.some((g) => g.id === d.gaugeId) && !rosetteIds.has(d.gaugeId))
      throw new AppError('unknown-gauge', `The current reduction has no gauge '${d.gaugeId}'.`, {
        gaugeIds: record.gauges.map((g) => g.id),
      });
    const id = await insertDisposition(tx, {
      testId,
      reductionId: reduction.id,
      gaugeId: d.gaugeId,
      outcome: d.outcome,
      reason: d.reason,
      userId: user.id,
    });
    const after = await loadLiveRecord(testId, tx);
    const status = record.test.status === 'reviewed' ? 'reduced' : record.test.status;
    await updateTest(tx, testId, {
      verdict: after.verdict,
      flaggedCount: after.gauges.filter((g) => g.outcome === 'flagged' && g.disposition?.outcome !== 'accepted').length,
      status,
    });
    await auditBy(tx, user, 'gauge-dispositioned', testId, { dispositionId: id, reductionId: reduction.id, ...d });
    if (status !== record.test.status)
      await auditBy(tx, user, 'review-withdrawn', testId, { reason: `disposition of ${d.gaugeId} after the review` });
    return { id, verdict: after.verdict };
  });
}

export interface SignatureRequest {
  /** the reduction the signer looked at */
  reductionId: number;
  password: string;
  /** the signer's own remark, stored after the statement */
  statement?: string;
  /** the statement the dialog showed; refused (409) when the record now gives other words */
  shownStatement?: string;
}

/** A signer attests the words they read: when the dialog's text is sent, it must be today's. */
function requireShownStatement(current: string, shown: string | undefined) {
  if (shown !== undefined && shown !== current)
    throw new AppError('statement-changed', undefined, { statement: current });
}

/** The statement a reviewer signs for this record now (the sign-off dialog shows the same). */
function reviewStatement(user: RequestUser, r: TestRecord) {
  return signatureStatement({
    kind: 'review',
    signerName: user.name,
    testName: r.test.name,
    testId: r.test.id,
    reductionId: r.reduction!.id,
    engineVersion: r.reduction!.engineVersion,
    verdict: r.verdict ?? 'unknown',
    procedure: procedureFacts(r.plan),
  });
}

/** The engineer's review: only on a finished, complete reduction whose every flag has a disposition. */
export async function signReview(user: RequestUser, testId: number, body: SignatureRequest) {
  if (!can(user.role, 'review')) throw errors.forbidden('review');
  await confirmSignerPassword(user, body.password, `review of test ${testId}`);
  const out = await withLockedTest(testId, { forWrite: true }, async (tx) => {
    const record = await loadLiveRecord(testId, tx);
    const { reduction, result } = requireDoneReduction(record);
    requireSameReduction(reduction.id, body.reductionId);
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
      throw new AppError(
        'open-flags',
        `Gauges outside tolerance await a disposition: ${record.openFlags.join(', ')}. Accept, exclude or mark each for retest, then sign.`,
        {
          gaugeIds: record.openFlags,
        },
      );
    const attested = reviewStatement(user, record);
    requireShownStatement(attested, body.shownStatement);
    const statement = signedText(attested, body.statement);
    const id = await insertSignature(tx, {
      testId,
      reductionId: reduction.id,
      kind: 'review',
      userId: user.id,
      statement,
    });
    await updateTest(tx, testId, { status: 'reviewed' });
    await auditBy(tx, user, 'review-signed', testId, {
      signatureId: id,
      reductionId: reduction.id,
      verdict: record.verdict,
      statement,
    });
    await queueReleaseNotices(tx, user, record);
    return { id, reductionId: reduction.id, statement };
  });
  kickOutbox();
  return out;
}

async function queueReleaseNotices(tx: Tx, reviewer: RequestUser, record: TestRecord) {
  const base = getConfig().PUBLIC_BASE_URL.replace(/\/$/, '');
  const qa = (await listUsers(tx)).filter((u) => can(u.role, 'release') && !u.disabled && u.id !== reviewer.id);
  for (const q of qa)
    await enqueueMailIn(tx, {
      to: q.email,
      subject: `Hoopline: "${record.test.name}" is reviewed and waits for release`,
      text: `${reviewer.name} signed the engineering review of "${record.test.name}" (strain comparison verdict: ${record.verdict ? VERDICT_LABEL[record.verdict] : 'unknown'}).\n${record.verdict ? `${VERDICT_MEANING[record.verdict]}\n` : ''}\nRelease the strain record here: ${base}/tests/${record.test.id}/review\n\n${RELEASE_SCOPE}\n\n— Hoopline`,
      testId: record.test.id,
    });
}

/** The reviewer's signature on the current reduction, or 409. */
function currentReview(r: TestRecord, reductionId: number) {
  const review = [...r.signatures].reverse().find((s) => s.kind === 'review' && s.reductionId === reductionId);
  if (!review) throw new AppError('not-reviewed', 'The engineering review does not cover the current reduction.');
  return review;
}

/**
 * QA's release: locks the test and freezes its record (plan, vessel, material, result,
 * dispositions, signatures) with its SHA-256; reductions still queued or running for the test
 * are cancelled. The reviewer of this reduction cannot release it.
 */
export async function releaseTest(user: RequestUser, testId: number, body: SignatureRequest) {
  if (!can(user.role, 'release')) throw errors.forbidden('release');
  await confirmSignerPassword(user, body.password, `release of test ${testId}`);
  return withLockedTest(testId, { forWrite: true }, async (tx) => {
    const record = await loadLiveRecord(testId, tx);
    const { reduction } = requireDoneReduction(record);
    requireSameReduction(reduction.id, body.reductionId);
    if (record.test.status !== 'reviewed')
      throw new AppError('not-reviewed', 'Only a reviewed test can be released; the engineering review is not signed.');
    // a log still streaming in is not a record to lock: its session is finished or abandoned first
    const live = await findOpenLiveSession(tx, testId);
    if (live)
      throw new AppError(
        'live-session-open',
        'A live session is still open for this test: finish or abandon it before the release.',
        { sessionId: live.id },
      );
    const review = currentReview(record, reduction.id);
    if (review.userId === user.id)
      throw new AppError(
        'own-review',
        'You signed the engineering review of this test; another person must release it.',
      );
    const attested = signatureStatement({
      kind: 'release',
      signerName: user.name,
      testName: record.test.name,
      testId,
      reductionId: reduction.id,
      engineVersion: reduction.engineVersion,
      verdict: record.verdict ?? 'unknown',
      reviewerName: review.name,
      procedure: procedureFacts(record.plan),
    });
    requireShownStatement(attested, body.shownStatement);
    const statement = signedText(attested, body.statement);
    const id = await insertSignature(tx, {
      testId,
      reductionId: reduction.id,
      kind: 'release',
      userId: user.id,
      statement,
    });
    const releasedAt = new Date();
    const frozen = freezeRecord(await loadLiveRecord(testId, tx), releasedAt);
    await insertReleaseSnapshot(tx, { testId, reductionId: reduction.id, body: frozen.body, sha256: frozen.sha256 });
    const cancelled = await cancelOpenReductions(
      tx,
      testId,
      'The test was released before this reduction ran; the released record keeps the reviewed reduction.',
    );
    await updateTest(tx, testId, { status: 'released' });
    await auditBy(tx, user, 'test-released', testId, {
      signatureId: id,
      reductionId: reduction.id,
      verdict: record.verdict,
      statement,
      snapshotSha256: frozen.sha256,
      cancelledReductions: cancelled,
    });
    return { id, reductionId: reduction.id, statement, snapshotSha256: frozen.sha256 };
  });
}
