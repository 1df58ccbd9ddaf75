import { useEffect, useState, type SubmitEvent } from 'react';
import { signIn } from 'auth-astro/client';
import { safeNextPath } from '../lib/safe-redirect';

interface Props {
  next: string;
  initialError?: string | null;
}

/** E-mail and password sign-in. One generic message for every failure. */
export default function SignInForm({ next, initialError = null }: Props) {
  const [error, setError] = useState<string | null>(initialError);
  const [busy, setBusy] = useState(false);
  // The button stays disabled until the island runs, so a submit can never fall back to the
  // browser's default (which would put the password into the address bar).
  const [ready, setReady] = useState(false);
  useEffect(() => setReady(true), []);

  async function onSubmit(e: SubmitEvent<HTMLFormElement>) {
    e.preventDefault();
    const form = new FormData(e.currentTarget);
    setBusy(true);
    setError(null);
    // the credentials travel as extra sign-in options, which the client's type does not list
    const options = { email: form.get('email'), password: form.get('password'), redirect: false } as Parameters<
      typeof signIn
    >[1];
    const res = await signIn('credentials', options);
    const url = typeof res === 'object' && res && 'url' in res ? String(res.url) : '';
    if (!res || (res as { ok?: boolean }).ok === false || url.includes('error=')) {
      setBusy(false);
      setError(
        'That e-mail and password do not match an active account, or there have been too many attempts. Wait a minute and try again.',
      );
      return;
    }
    window.location.href = safeNextPath(next);
  }

  return (
    <form onSubmit={onSubmit} method="post" className="space-y-4" noValidate>
      <div>
        <label htmlFor="email" className="label">
          E-mail
        </label>
        <input id="email" name="email" type="email" autoComplete="username" required className="field" />
      </div>
      <div>
        <label htmlFor="password" className="label">
          Password
        </label>
        <input
          id="password"
          name="password"
          type="password"
          autoComplete="current-password"
          required
          className="field"
        />
      </div>
      {error && (
        <p role="alert" className="error-text">
          {error}
        </p>
      )}
      <button type="submit" className="btn-primary w-full justify-center" disabled={busy || !ready}>
        {busy ? 'Signing in…' : 'Sign in'}
      </button>
    </form>
  );
}
