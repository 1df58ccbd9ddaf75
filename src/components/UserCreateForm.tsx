import { useState, type SubmitEvent } from 'react';
import { api } from './api';

const ROLES = ['technician', 'engineer', 'qa', 'admin'] as const;

/**
 * The admin's form for a new account. The person receives an e-mail with a one-time link and
 * chooses their own password: no administrator ever knows it.
 */
export default function UserCreateForm({ onCreated }: { onCreated: () => void }) {
  const [error, setError] = useState<string | null>(null);
  const [done, setDone] = useState<string | null>(null);

  async function create(e: SubmitEvent<HTMLFormElement>) {
    e.preventDefault();
    const form = e.currentTarget;
    const d = new FormData(form);
    setError(null);
    setDone(null);
    try {
      await api('/api/admin/users', {
        method: 'POST',
        jsonBody: { email: d.get('email'), name: d.get('name'), role: d.get('role') },
      });
      setDone(`Invitation sent to ${d.get('email')}: they choose their password from the e-mailed link (7 days).`);
      form.reset();
      onCreated();
    } catch (err) {
      setError((err as Error).message);
    }
  }

  return (
    <form
      onSubmit={create}
      className="grid gap-3 md:grid-cols-[1fr_1fr_10rem_auto] md:items-end"
      aria-label="New account"
    >
      <div>
        <label htmlFor="nu-name" className="label">
          Name
        </label>
        <input id="nu-name" name="name" required maxLength={120} className="field" />
      </div>
      <div>
        <label htmlFor="nu-email" className="label">
          E-mail
        </label>
        <input id="nu-email" name="email" type="email" required className="field" />
      </div>
      <div>
        <label htmlFor="nu-role" className="label">
          Role
        </label>
        <select id="nu-role" name="role" className="field">
          {ROLES.map((r) => (
            <option key={r} value={r}>
              {r}
            </option>
          ))}
        </select>
      </div>
      <button type="submit" className="btn-primary">
        Send invitation
      </button>
      {error && (
        <p role="alert" className="error-text md:col-span-4">
          {error}
        </p>
      )}
      {done && (
        <p role="status" className="text-sm text-ok md:col-span-4">
          {done}
        </p>
      )}
    </form>
  );
}
