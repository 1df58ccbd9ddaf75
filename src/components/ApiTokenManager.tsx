import { useEffect, useState, type SubmitEvent } from 'react';
import { api, formatDateTime } from './api';

interface TokenRow {
  id: number;
  name: string;
  prefix: string;
  createdAt: string;
  lastUsedAt: string | null;
  revokedAt: string | null;
}

/** Create (shown once), list and revoke personal API tokens. */
export default function ApiTokenManager() {
  const [rows, setRows] = useState<TokenRow[]>([]);
  const [fresh, setFresh] = useState<{ name: string; token: string } | null>(null);
  const [error, setError] = useState<string | null>(null);

  const load = () =>
    api<{ items: TokenRow[] }>('/api/account/tokens')
      .then((r) => setRows(r.items))
      .catch((e) => setError(e.message));
  useEffect(() => {
    void load();
  }, []);

  async function create(e: SubmitEvent<HTMLFormElement>) {
    e.preventDefault();
    const form = e.currentTarget;
    const name = String(new FormData(form).get('name') ?? '');
    setError(null);
    try {
      const r = await api<{ token: string; name: string }>('/api/account/tokens', {
        method: 'POST',
        jsonBody: { name },
      });
      setFresh({ name: r.name, token: r.token });
      form.reset();
      await load();
    } catch (err) {
      setError((err as Error).message);
    }
  }

  async function revoke(id: number) {
    if (!window.confirm('Revoke this token? Scripts using it will stop working at once.')) return;
    try {
      await api(`/api/account/tokens/${id}`, { method: 'DELETE' });
      await load();
    } catch (err) {
      setError((err as Error).message);
    }
  }

  return (
    <div className="space-y-5">
      <form onSubmit={create} className="flex flex-wrap items-end gap-3">
        <div className="min-w-64 flex-1">
          <label htmlFor="token-name" className="label">
            Token name
          </label>
          <input
            id="token-name"
            name="name"
            className="field"
            placeholder="e.g. DAQ laptop, bay 2"
            required
            maxLength={120}
          />
        </div>
        <button className="btn-primary" type="submit">
          Create token
        </button>
      </form>
      {error && (
        <p role="alert" className="error-text">
          {error}
        </p>
      )}
      {fresh && (
        <div role="status" className="rounded-md border-2 border-brass-500 bg-brass-100 p-4">
          <p className="font-semibold">Token “{fresh.name}” — copy it now; it will not be shown again.</p>
          <code className="mt-2 block rounded bg-white p-2 font-mono text-sm break-all" data-testid="new-token">
            {fresh.token}
          </code>
          <p className="mt-2 text-sm">
            Push a log with:{' '}
            <code className="font-mono">
              curl -H "Authorization: Bearer …" -F file=@log.csv{' '}
              {typeof window !== 'undefined' ? window.location.origin : ''}/api/tests/ID/logs
            </code>
          </p>
        </div>
      )}
      <table className="table-base">
        <thead>
          <tr>
            <th scope="col">Name</th>
            <th scope="col">Starts with</th>
            <th scope="col">Created</th>
            <th scope="col">Last used</th>
            <th scope="col">State</th>
            <th scope="col">
              <span className="sr-only">Actions</span>
            </th>
          </tr>
        </thead>
        <tbody>
          {rows.length === 0 && (
            <tr>
              <td colSpan={6} className="text-ink-700">
                No tokens yet.
              </td>
            </tr>
          )}
          {rows.map((t) => (
            <tr key={t.id}>
              <td>{t.name}</td>
              <td className="font-mono">{t.prefix}…</td>
              <td>{formatDateTime(t.createdAt)}</td>
              <td>{formatDateTime(t.lastUsedAt)}</td>
              <td>{t.revokedAt ? `revoked ${formatDateTime(t.revokedAt)}` : 'active'}</td>
              <td>
                {!t.revokedAt && (
                  <button className="btn-secondary" onClick={() => revoke(t.id)}>
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
