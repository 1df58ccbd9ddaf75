// The HTTP client for tests: HttpClient against the test run's app server (or another `base`),
// signing in with the test accounts' password unless told otherwise.
import { inject } from 'vitest';
import { HttpClient } from './http-client';

export const baseUrl = () => inject('baseUrl');

export class Client extends HttpClient {
  constructor(bearer: string | null = null, base: string | null = null) {
    super(base || baseUrl(), bearer);
  }

  static withToken(token: string, base: string | null = null) {
    return new Client(token, base);
  }

  override signIn(email: string, password = inject('testPassword')): Promise<boolean> {
    return super.signIn(email, password);
  }
}

/** A client signed in as `email` (with `password`, else the test accounts'; on `base`, else the test run's server). */
export async function signedIn(email: string, password?: string, base: string | null = null): Promise<Client> {
  const c = new Client(null, base);
  if (!(await c.signIn(email, password))) throw new Error(`could not sign in as ${email}`);
  return c;
}
