import { useEffect, useState } from 'react';
import { api, formatDateTime } from './api';
import UserCreateForm from './UserCreateForm';

type Role = 'technician' | 'engineer' | 'qa' | 'admin';
interface UserRow {
  id: number;
  email: string;
  name: string;
  role: Role;
  disabled: boolean;
  lastSignInAt: string | null;
}
const ROLES: Role[] = ['technician', 'engineer', 'qa', 'admin'];

/** The admin's list of accounts with a role picker per row. */
export default function UserRoleTable({ selfId }: { selfId: number }) {
  const [rows, setRows] = useState<UserRow[]>([]);
  const [message, setMessage] = useState<{ kind: 'ok' | 'error'; text: string } | null>(null);
  const load = () => api<{ items: UserRow[] }>('/api/admin/users').then((r) => setRows(r.items));
  useEffect(() => {
    void load().catch((e) => setMessage({ kind: 'error', text: e.message }));
  }, []);

  async function change(u: UserRow, role: Role) {
    try {
      await api(`/api/admin/users/${u.id}`, { method: 'PATCH', jsonBody: { role } });
      setMessage({ kind: 'ok', text: `${u.email} is now ${role}.` });
      await load();
    } catch (e) {
      setMessage({ kind: 'error', text: (e as Error).message });
    }
  }

  return (
    <div className="space-y-5">
      <UserCreateForm onCreated={() => void load()} />
      {message && (
        <p
          role={message.kind === 'error' ? 'alert' : 'status'}
          className={message.kind === 'error' ? 'error-text' : 'text-sm text-ok'}
        >
          {message.text}
        </p>
      )}
      <table className="table-base">
        <thead>
          <tr>
            <th scope="col">Name</th>
            <th scope="col">E-mail</th>
            <th scope="col">Role</th>
            <th scope="col">Last sign-in</th>
          </tr>
        </thead>
        <tbody>
          {rows.map((u) => (
            <tr key={u.id}>
              <td>{u.name}</td>
              <td>{u.email}</td>
              <td>
                <label className="sr-only" htmlFor={`role-${u.id}`}>
                  Role of {u.email}
                </label>
                <select
                  id={`role-${u.id}`}
                  className="field w-44"
                  value={u.role}
                  disabled={u.id === selfId}
                  onChange={(e) => change(u, e.target.value as Role)}
                >
                  {ROLES.map((r) => (
                    <option key={r} value={r}>
                      {r}
                    </option>
                  ))}
                </select>
              </td>
              <td>{formatDateTime(u.lastSignInAt)}</td>
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}
