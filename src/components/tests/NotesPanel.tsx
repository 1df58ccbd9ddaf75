import { useCallback, useEffect, useState, type SubmitEvent } from 'react';
import { api, formatDateTime } from '../api';

interface Note {
  id: number;
  kind: string;
  body: string;
  createdAt: string;
  author: string;
}
const KINDS: { value: string; label: string }[] = [
  { value: 'pressure-held', label: 'Pressure held' },
  { value: 'leak-seen', label: 'Leak seen' },
  { value: 'gauge-rezeroed', label: 'Gauge re-zeroed' },
  { value: 'general', label: 'General' },
];
const labelOf = (k: string) => KINDS.find((x) => x.value === k)?.label ?? k;

/** The test log book: what happened during the test, added by whoever was there. */
export default function NotesPanel({ testId, canAdd }: { testId: number; canAdd: boolean }) {
  const [notes, setNotes] = useState<Note[]>([]);
  const [error, setError] = useState<string | null>(null);
  const load = useCallback(
    () =>
      api<{ items: Note[] }>(`/api/tests/${testId}/notes`)
        .then((r) => setNotes(r.items))
        .catch((e: Error) => setError(e.message)),
    [testId],
  );
  useEffect(() => {
    void load();
  }, [load]);

  async function add(e: SubmitEvent<HTMLFormElement>) {
    e.preventDefault();
    const form = e.currentTarget;
    const data = new FormData(form);
    setError(null);
    try {
      await api(`/api/tests/${testId}/notes`, {
        method: 'POST',
        jsonBody: { kind: data.get('kind'), body: data.get('body') },
      });
      form.reset();
      await load();
    } catch (err) {
      setError((err as Error).message);
    }
  }

  return (
    <div className="space-y-4">
      {canAdd && (
        <form onSubmit={add} className="grid gap-3 sm:grid-cols-[12rem_1fr_auto] sm:items-end">
          <div>
            <label htmlFor="note-kind" className="label">
              Kind
            </label>
            <select id="note-kind" name="kind" className="field">
              {KINDS.map((k) => (
                <option key={k.value} value={k.value}>
                  {k.label}
                </option>
              ))}
            </select>
          </div>
          <div>
            <label htmlFor="note-body" className="label">
              Note
            </label>
            <input
              id="note-body"
              name="body"
              className="field"
              required
              maxLength={4000}
              placeholder="e.g. held 1.95 MPa for 10 min, no leak at N1"
            />
          </div>
          <button type="submit" className="btn-primary">
            Add note
          </button>
        </form>
      )}
      {error && (
        <p role="alert" className="error-text">
          {error}
        </p>
      )}
      {notes.length === 0 ? (
        <p className="text-sm text-ink-700">No notes yet.</p>
      ) : (
        <ul className="divide-y divide-ink-800/10">
          {notes.map((n) => (
            <li key={n.id} className="py-2 text-sm">
              <span className="mr-2 rounded bg-ink-100 px-1.5 py-0.5 text-xs font-semibold">{labelOf(n.kind)}</span>
              {n.body}
              <span className="ml-2 text-xs text-ink-700">
                — {n.author}, {formatDateTime(n.createdAt)}
              </span>
            </li>
          ))}
        </ul>
      )}
    </div>
  );
}
