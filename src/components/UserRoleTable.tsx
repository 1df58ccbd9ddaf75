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
  invited: boolean;
  lastSignInAt: string | null;
}
const ROLES: Role[] = ['technician', 'engineer', 'qa', 'admin'];

const stateOf = (u: UserRow) => (u.disabled ? 'disabled' : u.invited ? 'invited' : 'active');

/** The admin's list of accounts: role picker, disable / enable, and a password link by e-mail. */
export default function UserRoleTable({ selfId }: { selfId: number }) {
  const [rows, setRows] = useState<UserRow[]>([]);
  const [message, setMessage] = useState<{ kind: 'ok' | 'error'; text: string } | null>(null);
  const load = () => api<{ items: UserRow[] }>('/api/admin/users').then((r) => setRows(r.items));
  useEffect(() => {
    void load().catch((e) => setMessage({ kind: 'error', text: e.message }));
  }, []);

  async function act(run: () => Promise<unknown>, done: string) {
    try {
      await run();
      setMessage({ kind: 'ok', text: done });
      await load();
    } catch (e) {
      setMessage({ kind: 'error', text: (e as Error).message });
    }
  }
  const patch = (u: UserRow, body: object) => api(`/api/admin/users/${u.id}`, { method: 'PATCH', jsonBody: body });

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
            <th scope="col">State</th>
            <th scope="col">Last sign-in</th>
            <th scope="col">
              <span className="sr-only">Actions</span>
            </th>
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
                  onChange={(e) =>
                    void act(() => patch(u, { role: e.target.value }), `${u.email} is now ${e.target.value}.`)
                  }
                >
                  {ROLES.map((r) => (
                    <option key={r} value={r}>
                      {r}
                    </option>
                  ))}
                </select>
              </td>
              <td>{stateOf(u)}</td>
              <td>{formatDateTime(u.lastSignInAt)}</td>
              <td className="flex flex-wrap gap-2">
                {u.id !== selfId && (
                  <button
                    type="button"
                    className="btn-secondary"
                    onClick={() =>
                      void act(
                        () => patch(u, { disabled: !u.disabled }),
                        u.disabled ? `${u.email} can sign in again.` : `${u.email} is disabled; its sessions ended.`,
                      )
                    }
                  >
                    {u.disabled ? `Enable ${u.email}` : `Disable ${u.email}`}
                  </button>
                )}
                {!u.disabled && (
                  <button
                    type="button"
                    className="btn-secondary"
                    onClick={() =>
                      void act(
                        () => api(`/api/admin/users/${u.id}/password-reset`, { method: 'POST' }),
                        `A link to choose a password was e-mailed to ${u.email}.`,
                      )
                    }
                  >
                    E-mail a password link
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
