import { useEffect, useState, type SubmitEvent } from 'react';
import { api, formatDateTime } from './api';

interface TokenRow {
  id: number;
  name: string;
  prefix: string;
  scopes: string;
  createdAt: string;
  expiresAt: string | null;
  lastUsedAt: string | null;
  revokedAt: string | null;
}

const stateOf = (t: TokenRow) =>
  t.revokedAt
    ? `revoked ${formatDateTime(t.revokedAt)}`
    : !t.expiresAt || new Date(t.expiresAt).getTime() <= Date.now()
      ? 'expired'
      : 'active';

/** Create (shown once), list and revoke personal API tokens, each with scopes and an expiry. */
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
    const data = new FormData(form);
    const name = String(data.get('name') ?? '');
    const scopes = data.getAll('scopes').map(String);
    const expiresInDays = Number(data.get('days') ?? 90);
    setError(null);
    try {
      const r = await api<{ token: string; name: string }>('/api/account/tokens', {
        method: 'POST',
        jsonBody: { name, scopes, expiresInDays },
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
        <fieldset className="flex items-center gap-3">
          <legend className="label">Scopes</legend>
          <label className="flex items-center gap-1 text-sm">
            <input type="checkbox" name="scopes" value="upload" defaultChecked /> upload logs, run reductions
          </label>
          <label className="flex items-center gap-1 text-sm">
            <input type="checkbox" name="scopes" value="read" defaultChecked /> read (every GET)
          </label>
        </fieldset>
        <div className="w-32">
          <label htmlFor="token-days" className="label">
            Valid for (days)
          </label>
          <input id="token-days" name="days" type="number" min={1} max={365} defaultValue={90} className="field" />
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
            <th scope="col">Scopes</th>
            <th scope="col">Created</th>
            <th scope="col">Expires</th>
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
              <td colSpan={8} className="text-ink-700">
                No tokens yet.
              </td>
            </tr>
          )}
          {rows.map((t) => (
            <tr key={t.id}>
              <td>{t.name}</td>
              <td className="font-mono">{t.prefix}…</td>
              <td>{t.scopes.replace(',', ', ')}</td>
              <td>{formatDateTime(t.createdAt)}</td>
              <td>{formatDateTime(t.expiresAt)}</td>
              <td>{formatDateTime(t.lastUsedAt)}</td>
              <td>{stateOf(t)}</td>
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
