// Auth.js (auth-astro) configuration: e-mail and password, JWT sessions carrying id and role.
// secret and trustHost come from process.env at run time, never import.meta.env, so a .env
// present at build time is not inlined into dist/ (STACK.md).
import Credentials from '@auth/core/providers/credentials';
import { defineConfig } from 'auth-astro';
import { checkCredentials } from './src/server/auth/credentials.server';
import { endSessionsOnSignOut } from './src/server/auth/sessions.server';

export default defineConfig({
  secret: process.env.AUTH_SECRET,
  trustHost: true,
  session: { strategy: 'jwt', maxAge: 12 * 60 * 60 },
  pages: { signIn: '/signin', error: '/signin' },
  // A wrong password is an expected event (audited), not a server error worth a stack trace.
  logger: {
    error(error) {
      if ((error as { type?: string }).type === 'CredentialsSignin' || error.name === 'CredentialsSignin') return;
      console.error(`[auth] ${error.name}: ${error.message}`);
    },
    warn() {},
  },
  providers: [
    Credentials({
      credentials: { email: { label: 'E-mail', type: 'email' }, password: { label: 'Password', type: 'password' } },
      authorize: (credentials) => checkCredentials(credentials?.email, credentials?.password),
    }),
  ],
  callbacks: {
    jwt({ token, user }) {
      if (user) {
        token.uid = (user as { id?: string }).id;
        token.role = (user as { role?: string }).role;
        token.epoch = (user as { epoch?: number }).epoch;
      }
      return token;
    },
    session({ session, token }) {
      const s = session as typeof session & { uid?: string; role?: string; epoch?: number };
      s.uid = typeof token.uid === 'string' ? token.uid : undefined;
      s.role = typeof token.role === 'string' ? token.role : undefined;
      s.epoch = typeof token.epoch === 'number' ? token.epoch : undefined;
      return s;
    },
  },
  // Signing out ends every session of the account, on every device (the session epoch).
  events: {
    async signOut(message) {
      const uid = 'token' in message ? message.token?.uid : undefined;
      if (typeof uid === 'string') await endSessionsOnSignOut(Number(uid));
    },
  },
});
