import { useState } from 'react';
import { can } from '../../lib/roles';
import { formatUtc } from '../../lib/ui-format';
import { procedureFacts, signatureStatement } from '../../lib/signing';
import { announceTestChanged } from '../tests/TestStatusSteps';
import SignatureForm from './SignatureForm';
import type { RecordView } from './record-types';

interface Props {
  record: RecordView;
  role: string;
  userEmail: string;
  userName: string;
  onChanged: () => void;
}

/** Sign the engineering review (engineer) or release the record (QA), with what still blocks it. */
export default function SignOffBar({ record, role, userEmail, userName, onChanged }: Props) {
  const [signing, setSigning] = useState<'review' | 'release' | null>(null);
  const status = record.test.status;
  const reductionId = record.reduction?.id;
  const review = [...record.signatures].reverse().find((s) => s.kind === 'review' && s.reductionId === reductionId);
  const release = record.signatures.find((s) => s.kind === 'release');

  const blockers: string[] = [];
  if (!record.result) blockers.push('no finished reduction yet');
  if (record.result?.verdict === 'incomplete')
    blockers.push('the log has not reached test pressure and come back to zero');
  if (record.openFlags.length)
    blockers.push(`gauges outside tolerance awaiting a disposition: ${record.openFlags.join(', ')}`);
  if (status === 'logging') blockers.push('a newer log has not been reduced');

  const statement = (kind: 'review' | 'release') =>
    signatureStatement({
      kind,
      signerName: userName,
      testName: record.test.name,
      testId: record.test.id,
      reductionId: reductionId ?? 0,
      engineVersion: record.reduction?.engineVersion ?? null,
      verdict: record.result?.verdict ?? 'unknown',
      reviewerName: review?.name,
      procedure: procedureFacts(record.plan),
    });

  return (
    <section aria-labelledby="signoff-h" className="flex flex-wrap items-center gap-4 card">
      <h2 id="signoff-h" className="sr-only">
        Sign-off
      </h2>
      <div className="min-w-64 flex-1 text-sm">
        {release ? (
          <p>
            <strong>Strain record released</strong> by {release.name}, {formatUtc(release.at)} — the record is locked.
            Returning the vessel to service is the owner’s and the authorised inspector’s decision.
          </p>
        ) : review ? (
          <p>
            <strong>Reviewed</strong> by {review.name}, {formatUtc(review.at)} (reduction {review.reductionId}). Waiting
            for QA to release the strain record.
          </p>
        ) : blockers.length ? (
          <p>Not ready for review: {blockers.join('; ')}.</p>
        ) : (
          <p>Ready for the engineering review of reduction {reductionId}.</p>
        )}
      </div>
      {!signing && can(role, 'review') && status === 'reduced' && (
        <button
          type="button"
          className="btn-primary"
          disabled={blockers.length > 0}
          onClick={() => setSigning('review')}
        >
          Sign engineering review
        </button>
      )}
      {!signing && can(role, 'release') && status === 'reviewed' && (
        <button
          type="button"
          className="btn-primary"
          disabled={review?.email === userEmail}
          onClick={() => setSigning('release')}
        >
          Release the strain record
        </button>
      )}
      {signing && reductionId !== undefined && (
        <SignatureForm
          kind={signing}
          testId={record.test.id}
          reductionId={reductionId}
          statement={statement(signing)}
          verdict={record.result?.verdict ?? null}
          onCancel={() => setSigning(null)}
          onStale={onChanged}
          onSigned={() => {
            setSigning(null);
            onChanged();
            announceTestChanged(record.test.id);
          }}
        />
      )}
    </section>
  );
}
