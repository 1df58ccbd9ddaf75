// Auth.js (auth-astro) configuration: e-mail and password, JWT sessions carrying id and role.
// secret and trustHost come from process.env at run time, never import.meta.env, so a .env
// present at build time is not inlined into dist/ (STACK.md).
import Credentials from '@auth/core/providers/credentials';
import { defineConfig } from 'auth-astro';
import { checkCredentials } from './src/server/auth/credentials.server';

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
      }
      return token;
    },
    session({ session, token }) {
      const s = session as typeof session & { uid?: string; role?: string };
      s.uid = typeof token.uid === 'string' ? token.uid : undefined;
      s.role = typeof token.role === 'string' ? token.role : undefined;
      return s;
    },
  },
});
