import { useState, type SubmitEvent } from 'react';
import { ApiError, api } from '../api';
import { VERDICT_LABEL, VERDICT_MEANING, type VerdictCode } from '../../lib/verdict-words';

interface Props {
  kind: 'review' | 'release';
  testId: number;
  reductionId: number;
  /** the statement the server will store, built by the same function (src/lib/signing.ts) */
  statement: string;
  /** the verdict being signed, restated above the password */
  verdict: VerdictCode | null;
  onSigned: () => void;
  onCancel: () => void;
  /** the record changed under the dialog: reload it, so the statement shown is the one to sign */
  onStale?: () => void;
}

/**
 * The confirmation before a signature: the statement in full, the signer's password (asked
 * again, so a signature is a deliberate act of this person) and an optional remark.
 */
export default function SignatureForm({
  kind,
  testId,
  reductionId,
  statement,
  verdict,
  onSigned,
  onCancel,
  onStale,
}: Props) {
  const [error, setError] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);
  const title = kind === 'review' ? 'Sign the engineering review' : 'Release the strain record and lock it';

  async function submit(e: SubmitEvent<HTMLFormElement>) {
    e.preventDefault();
    const form = new FormData(e.currentTarget);
    const remark = String(form.get('remark') ?? '').trim();
    setBusy(true);
    setError(null);
    try {
      await api(`/api/tests/${testId}/${kind}`, {
        method: 'POST',
        jsonBody: {
          reductionId,
          password: String(form.get('password') ?? ''),
          // the words on screen: the server refuses if the record would now sign other ones
          shownStatement: statement,
          ...(remark ? { statement: remark } : {}),
        },
      });
      onSigned();
    } catch (err) {
      setError((err as Error).message);
      if (err instanceof ApiError && (err.code === 'statement-changed' || err.code === 'stale-reduction')) onStale?.();
      setBusy(false);
    }
  }

  return (
    <form
      onSubmit={submit}
      aria-labelledby={`sign-${kind}-h`}
      className="w-full space-y-3 rounded-md border-2 border-brass-500 bg-brass-100 p-4"
    >
      <h3 id={`sign-${kind}-h`} className="font-semibold">
        {title}
      </h3>
      <p className="text-sm" data-testid="signature-statement">
        {statement}
      </p>
      {verdict && (
        <p className="text-sm" data-testid="signature-verdict">
          <strong>You are signing the strain comparison verdict {VERDICT_LABEL[verdict]}.</strong>{' '}
          {VERDICT_MEANING[verdict]}
        </p>
      )}
      {kind === 'release' && (
        <div className="space-y-1 text-sm" data-testid="release-scope">
          <p className="font-semibold">
            After this nothing about the strain record can change: every write answers “locked”.
          </p>
          <p>It does not return the vessel to service: the statement above says whose decision that is.</p>
        </div>
      )}
      <div className="grid gap-3 md:grid-cols-[16rem_1fr]">
        <div>
          <label htmlFor={`sign-${kind}-password`} className="label">
            Your password
          </label>
          <input
            id={`sign-${kind}-password`}
            name="password"
            type="password"
            autoComplete="current-password"
            required
            className="field"
          />
        </div>
        <div>
          <label htmlFor={`sign-${kind}-remark`} className="label">
            Remark (optional, signed with the statement)
          </label>
          <input id={`sign-${kind}-remark`} name="remark" maxLength={2000} className="field" />
        </div>
      </div>
      {error && (
        <p role="alert" className="error-text">
          {error}
        </p>
      )}
      <div className="flex gap-3">
        <button type="submit" className="btn-primary" disabled={busy}>
          {busy ? 'Signing…' : kind === 'review' ? 'Sign now' : 'Release the record now'}
        </button>
        <button type="button" className="btn-secondary" onClick={onCancel} disabled={busy}>
          Cancel
        </button>
      </div>
    </form>
  );
}
