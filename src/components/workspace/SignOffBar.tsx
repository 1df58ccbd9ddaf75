import { useState } from 'react';
import { can } from '../../lib/roles';
import { api } from '../api';
import { announceTestChanged } from '../tests/TestStatusSteps';
import type { RecordView } from './record-types';

interface Props {
  record: RecordView;
  role: string;
  userEmail: string;
  onChanged: () => void;
}

/** Sign the engineering review (engineer) or release the record (QA), with what still blocks it. */
export default function SignOffBar({ record, role, userEmail, onChanged }: Props) {
  const [error, setError] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);
  const status = record.test.status;
  const review = [...record.signatures]
    .reverse()
    .find((s) => s.kind === 'review' && s.reductionId === record.reduction?.id);
  const release = record.signatures.find((s) => s.kind === 'release');

  async function act(path: 'review' | 'release', question: string) {
    if (!window.confirm(question)) return;
    setBusy(true);
    setError(null);
    try {
      await api(`/api/tests/${record.test.id}/${path}`, { method: 'POST', jsonBody: {} });
      onChanged();
      announceTestChanged(record.test.id);
    } catch (e) {
      setError((e as Error).message);
    } finally {
      setBusy(false);
    }
  }

  const blockers: string[] = [];
  if (!record.result) blockers.push('no finished reduction yet');
  if (record.result?.verdict === 'incomplete')
    blockers.push('the log has not reached test pressure and come back to zero');
  if (record.openFlags.length) blockers.push(`flagged gauges without disposition: ${record.openFlags.join(', ')}`);
  if (status === 'logging') blockers.push('a newer log has not been reduced');

  return (
    <section aria-labelledby="signoff-h" className="flex flex-wrap items-center gap-4 card">
      <h2 id="signoff-h" className="sr-only">
        Sign-off
      </h2>
      <div className="min-w-64 flex-1 text-sm">
        {release ? (
          <p>
            <strong>Released</strong> by {release.name}, {new Date(release.at).toUTCString()} — the record is locked.
          </p>
        ) : review ? (
          <p>
            <strong>Reviewed</strong> by {review.name}, {new Date(review.at).toUTCString()} (reduction{' '}
            {review.reductionId}). Waiting for QA release.
          </p>
        ) : blockers.length ? (
          <p>Not ready for review: {blockers.join('; ')}.</p>
        ) : (
          <p>Ready for the engineering review of reduction {record.reduction?.id}.</p>
        )}
        {error && (
          <p role="alert" className="error-text">
            {error}
          </p>
        )}
      </div>
      {can(role, 'review') && status === 'reduced' && (
        <button
          type="button"
          className="btn-primary"
          disabled={busy || blockers.length > 0}
          onClick={() =>
            act(
              'review',
              `Sign the engineering review of reduction ${record.reduction?.id} as ${userEmail}? The verdict is ${record.result?.verdict}.`,
            )
          }
        >
          Sign engineering review
        </button>
      )}
      {can(role, 'release') && status === 'reviewed' && (
        <button
          type="button"
          className="btn-primary"
          disabled={busy || review?.email === userEmail}
          onClick={() =>
            act(
              'release',
              `Release "${record.test.name}"? The record will be locked: no change can be made after this.`,
            )
          }
        >
          Release and lock
        </button>
      )}
    </section>
  );
}
