import { useEffect, useState, type SubmitEvent } from 'react';
import { api } from './api';

/** Ask for a password link by e-mail. The answer is the same whether or not the address has an account. */
export default function PasswordRequestForm() {
  const [sent, setSent] = useState(false);
  const [error, setError] = useState<string | null>(null);
  const [ready, setReady] = useState(false);
  useEffect(() => setReady(true), []);

  async function submit(e: SubmitEvent<HTMLFormElement>) {
    e.preventDefault();
    setError(null);
    try {
      await api('/api/password/forgot', {
        method: 'POST',
        jsonBody: { email: String(new FormData(e.currentTarget).get('email') ?? '') },
      });
      setSent(true);
    } catch (err) {
      setError((err as Error).message);
    }
  }

  if (sent)
    return (
      <p role="status">
        If that address belongs to an active account, a link to choose a new password is on its way. It works once, for
        one hour.
      </p>
    );
  return (
    <form onSubmit={submit} method="post" className="space-y-4" noValidate>
      <div>
        <label htmlFor="email" className="label">
          E-mail
        </label>
        <input id="email" name="email" type="email" autoComplete="username" required className="field" />
      </div>
      {error && (
        <p role="alert" className="error-text">
          {error}
        </p>
      )}
      <button type="submit" className="btn-primary w-full justify-center" disabled={!ready}>
        E-mail me a link
      </button>
    </form>
  );
}
