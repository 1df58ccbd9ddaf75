import { useEffect, useState } from 'react';
import { api, formatDateTime } from './api';

interface TokenRow {
  id: number;
  name: string;
  prefix: string;
  scopes: string;
  userEmail: string;
  expiresAt: string | null;
  lastUsedAt: string | null;
  revokedAt: string | null;
}

/** Every account's API tokens for the administrator, with revoke (a leaked token stops at once). */
export default function AdminTokenTable() {
  const [rows, setRows] = useState<TokenRow[]>([]);
  const [error, setError] = useState<string | null>(null);
  const load = () =>
    api<{ items: TokenRow[] }>('/api/admin/tokens')
      .then((r) => setRows(r.items))
      .catch((e) => setError((e as Error).message));
  useEffect(() => {
    void load();
  }, []);

  async function revoke(t: TokenRow) {
    if (!window.confirm(`Revoke "${t.name}" of ${t.userEmail}? Scripts using it stop at once.`)) return;
    try {
      await api(`/api/admin/tokens/${t.id}`, { method: 'DELETE' });
      await load();
    } catch (e) {
      setError((e as Error).message);
    }
  }

  const live = (t: TokenRow) => !t.revokedAt && !!t.expiresAt && new Date(t.expiresAt).getTime() > Date.now();
  return (
    <div className="space-y-3">
      {error && (
        <p role="alert" className="error-text">
          {error}
        </p>
      )}
      <table className="table-base">
        <thead>
          <tr>
            <th scope="col">Owner</th>
            <th scope="col">Name</th>
            <th scope="col">Starts with</th>
            <th scope="col">Scopes</th>
            <th scope="col">Expires</th>
            <th scope="col">Last used</th>
            <th scope="col">
              <span className="sr-only">Actions</span>
            </th>
          </tr>
        </thead>
        <tbody>
          {rows.length === 0 && (
            <tr>
              <td colSpan={7} className="text-ink-700">
                No tokens.
              </td>
            </tr>
          )}
          {rows.map((t) => (
            <tr key={t.id}>
              <td>{t.userEmail}</td>
              <td>{t.name}</td>
              <td className="font-mono">{t.prefix}…</td>
              <td>{t.scopes.replace(',', ', ')}</td>
              <td>{formatDateTime(t.expiresAt)}</td>
              <td>{formatDateTime(t.lastUsedAt)}</td>
              <td>
                {live(t) ? (
                  <button type="button" className="btn-secondary" onClick={() => void revoke(t)}>
                    Revoke
                  </button>
                ) : t.revokedAt ? (
                  'revoked'
                ) : (
                  'expired'
                )}
              </td>
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}
