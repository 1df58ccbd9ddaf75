import { useState, type SubmitEvent } from 'react';
import { api } from '../api';
import type { RecordDisposition } from './record-types';

interface Props {
  testId: number;
  gaugeId: string;
  current?: RecordDisposition;
  onSaved: () => void;
}
const OUTCOMES = [
  { value: 'accepted', label: 'Accept', help: 'the deviation is explained and acceptable' },
  { value: 'excluded', label: 'Exclude', help: 'the gauge is unreliable and is left out of the comparison' },
  { value: 'retest', label: 'Ask for a retest', help: 'the record cannot conform until the gauge is tested again' },
] as const;

/** The engineer's disposition of one gauge: an outcome and a required reason. */
export default function DispositionForm({ testId, gaugeId, current, onSaved }: Props) {
  const [error, setError] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);
  const ids = { reason: `reason-${gaugeId}`, err: `reason-err-${gaugeId}` };

  async function save(e: SubmitEvent<HTMLFormElement>) {
    e.preventDefault();
    const data = new FormData(e.currentTarget);
    const reason = String(data.get('reason') ?? '').trim();
    if (reason.length < 3) {
      setError('Give the reason for this disposition (a few words at least).');
      return;
    }
    setBusy(true);
    setError(null);
    try {
      await api(`/api/tests/${testId}/dispositions`, {
        method: 'POST',
        jsonBody: { gaugeId, outcome: data.get('outcome'), reason },
      });
      onSaved();
    } catch (err) {
      setError((err as Error).message);
    } finally {
      setBusy(false);
    }
  }

  return (
    <form onSubmit={save} className="space-y-3" aria-label={`Disposition of ${gaugeId}`}>
      <fieldset>
        <legend className="label">Disposition of {gaugeId}</legend>
        <div className="space-y-1">
          {OUTCOMES.map((o) => (
            <label key={o.value} className="flex items-start gap-2 text-sm">
              <input
                type="radio"
                name="outcome"
                value={o.value}
                defaultChecked={(current?.outcome ?? 'accepted') === o.value}
                className="mt-1"
              />
              <span>
                <strong>{o.label}</strong> — {o.help}
              </span>
            </label>
          ))}
        </div>
      </fieldset>
      <div>
        <label htmlFor={ids.reason} className="label">
          Reason (required)
        </label>
        <textarea
          id={ids.reason}
          name="reason"
          rows={3}
          className="field"
          defaultValue={current?.reason ?? ''}
          aria-invalid={!!error}
          aria-describedby={error ? ids.err : undefined}
          placeholder="e.g. UT at the gauge reads 13.1 mm against 12 mm nominal; the effective thickness agrees"
        />
        {error && (
          <p id={ids.err} role="alert" className="error-text">
            {error}
          </p>
        )}
      </div>
      <button type="submit" className="btn-primary" disabled={busy}>
        {busy ? 'Saving…' : current ? 'Record a new disposition' : 'Record disposition'}
      </button>
    </form>
  );
}
