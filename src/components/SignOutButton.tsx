import { signOut } from 'auth-astro/client';

export default function SignOutButton() {
  return (
    <button
      type="button"
      className="rounded border border-white/40 px-3 py-1 text-sm hover:bg-ink-700"
      onClick={() => signOut({ callbackUrl: '/signin' } as Parameters<typeof signOut>[0])}
    >
      Sign out
    </button>
  );
}
