import { useCallback, useEffect, useState, type SubmitEvent } from 'react';
import { api, formatDateTime } from '../api';

interface LinkRow {
  id: number;
  email: string | null;
  createdAt: string;
  expiresAt: string;
  revokedAt: string | null;
  lastUsedAt: string | null;
  useCount: number;
  createdBy: string;
}

/** QA's inspector links: create (optionally e-mailed), list with last use, revoke. */
export default function ShareLinkManager({ testId }: { testId: number }) {
  const [rows, setRows] = useState<LinkRow[]>([]);
  const [made, setMade] = useState<{ url: string; email: string | null } | null>(null);
  const [error, setError] = useState<string | null>(null);
  const load = useCallback(
    () =>
      api<{ items: LinkRow[] }>(`/api/tests/${testId}/share-links`)
        .then((r) => setRows(r.items))
        .catch((e: Error) => setError(e.message)),
    [testId],
  );
  useEffect(() => {
    void load();
  }, [load]);

  async function create(e: SubmitEvent<HTMLFormElement>) {
    e.preventDefault();
    const form = e.currentTarget;
    const data = new FormData(form);
    const email = String(data.get('email') ?? '').trim();
    setError(null);
    try {
      const r = await api<{ url: string }>(`/api/tests/${testId}/share-links`, {
        method: 'POST',
        jsonBody: { ...(email ? { email } : {}), expiresInDays: Number(data.get('days')) },
      });
      setMade({ url: r.url, email: email || null });
      form.reset();
      await load();
    } catch (err) {
      setError((err as Error).message);
    }
  }

  async function revoke(id: number) {
    if (!window.confirm('Revoke this link? Whoever has it will see "link no longer works" at once.')) return;
    try {
      await api(`/api/share-links/${id}`, { method: 'DELETE' });
      await load();
    } catch (err) {
      setError((err as Error).message);
    }
  }

  const state = (l: LinkRow) =>
    l.revokedAt ? `revoked ${formatDateTime(l.revokedAt)}` : new Date(l.expiresAt) < new Date() ? 'expired' : 'active';
  return (
    <div className="space-y-4">
      <form onSubmit={create} className="grid gap-3 sm:grid-cols-[1fr_9rem_auto] sm:items-end">
        <div>
          <label htmlFor="share-email" className="label">
            Inspector's e-mail (optional)
          </label>
          <input id="share-email" name="email" type="email" className="field" placeholder="inspector@example.com" />
        </div>
        <div>
          <label htmlFor="share-days" className="label">
            Valid for (days)
          </label>
          <input
            id="share-days"
            name="days"
            type="number"
            min={1}
            max={90}
            defaultValue={14}
            required
            className="field"
          />
        </div>
        <button type="submit" className="btn-primary">
          Create link
        </button>
      </form>
      {error && (
        <p role="alert" className="error-text">
          {error}
        </p>
      )}
      {made && (
        <div role="status" className="rounded-md border-2 border-brass-500 bg-brass-100 p-3 text-sm">
          <p className="font-semibold">
            {made.email ? `Link created and e-mailed to ${made.email}.` : 'Link created.'} It is shown only now:
          </p>
          <div className="mt-2 flex gap-2">
            <input
              readOnly
              aria-label="Share link"
              className="field font-mono"
              value={made.url}
              onFocus={(e) => e.currentTarget.select()}
            />
            <button
              type="button"
              className="btn-secondary"
              onClick={() => void navigator.clipboard?.writeText(made.url)}
            >
              Copy
            </button>
          </div>
        </div>
      )}
      <table className="table-base">
        <thead>
          <tr>
            <th scope="col">Sent to</th>
            <th scope="col">Created</th>
            <th scope="col">Expires</th>
            <th scope="col">Last used</th>
            <th scope="col">Uses</th>
            <th scope="col">State</th>
            <th scope="col">
              <span className="sr-only">Actions</span>
            </th>
          </tr>
        </thead>
        <tbody>
          {rows.length === 0 && (
            <tr>
              <td colSpan={7} className="text-ink-700">
                No links yet.
              </td>
            </tr>
          )}
          {rows.map((l) => (
            <tr key={l.id}>
              <td>{l.email ?? '(not e-mailed)'}</td>
              <td>
                {formatDateTime(l.createdAt)} · {l.createdBy}
              </td>
              <td>{formatDateTime(l.expiresAt)}</td>
              <td>{formatDateTime(l.lastUsedAt)}</td>
              <td className="num">{l.useCount}</td>
              <td>{state(l)}</td>
              <td>
                {state(l) === 'active' && (
                  <button type="button" className="btn-secondary" onClick={() => revoke(l.id)}>
                    Revoke
                  </button>
                )}
              </td>
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}
