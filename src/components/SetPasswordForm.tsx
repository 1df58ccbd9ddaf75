import { useEffect, useState, type SubmitEvent } from 'react';
import { api } from './api';

/** Choose a password with a one-time link (an invitation or a reset). */
export default function SetPasswordForm({ token, email }: { token: string; email: string }) {
  const [error, setError] = useState<string | null>(null);
  const [done, setDone] = useState(false);
  const [busy, setBusy] = useState(false);
  const [ready, setReady] = useState(false);
  useEffect(() => setReady(true), []);

  async function submit(e: SubmitEvent<HTMLFormElement>) {
    e.preventDefault();
    const d = new FormData(e.currentTarget);
    const password = String(d.get('password') ?? '');
    if (password !== String(d.get('again') ?? '')) {
      setError('The two passwords differ.');
      return;
    }
    setBusy(true);
    setError(null);
    try {
      await api('/api/password/set', { method: 'POST', jsonBody: { token, password } });
      setDone(true);
    } catch (err) {
      setError((err as Error).message);
    } finally {
      setBusy(false);
    }
  }

  if (done)
    return (
      <p role="status">
        Your password is set.{' '}
        <a className="underline" href="/signin">
          Sign in
        </a>{' '}
        as {email}.
      </p>
    );
  return (
    <form onSubmit={submit} method="post" className="space-y-4" noValidate>
      <input type="hidden" name="username" autoComplete="username" defaultValue={email} />
      <div>
        <label htmlFor="new-password" className="label">
          New password (at least 12 characters, not easy to guess)
        </label>
        <input
          id="new-password"
          name="password"
          type="password"
          autoComplete="new-password"
          required
          minLength={12}
          className="field"
        />
      </div>
      <div>
        <label htmlFor="again" className="label">
          The same again
        </label>
        <input id="again" name="again" type="password" autoComplete="new-password" required className="field" />
      </div>
      {error && (
        <p role="alert" className="error-text">
          {error}
        </p>
      )}
      <button type="submit" className="btn-primary w-full justify-center" disabled={busy || !ready}>
        Set password
      </button>
    </form>
  );
}
