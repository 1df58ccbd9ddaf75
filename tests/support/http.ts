// An HTTP client for tests that signs in through Auth.js like a browser does and keeps cookies.
import { inject } from 'vitest';

export const baseUrl = () => inject('baseUrl');

export class Client {
  private cookies = new Map<string, string>();
  /** `base`: the app to talk to (default: the test run's app server) */
  constructor(
    private bearer: string | null = null,
    private base = '',
  ) {}

  static withToken(token: string, base = '') {
    return new Client(token, base);
  }

  private root(): string {
    return this.base || baseUrl();
  }

  cookieHeader(): string {
    return [...this.cookies].map(([k, v]) => `${k}=${v}`).join('; ');
  }

  private keep(res: Response) {
    for (const c of res.headers.getSetCookie()) {
      const [pair] = c.split(';');
      const i = pair!.indexOf('=');
      const name = pair!.slice(0, i);
      const value = pair!.slice(i + 1);
      if (/expires=Thu, 01 Jan 1970/i.test(c) || value === '') this.cookies.delete(name);
      else this.cookies.set(name, value);
    }
  }

  async fetch(path: string, init: RequestInit & { json?: unknown } = {}): Promise<Response> {
    const headers = new Headers(init.headers);
    if (this.cookies.size) headers.set('cookie', this.cookieHeader());
    if (this.bearer) headers.set('authorization', `Bearer ${this.bearer}`);
    let body = init.body;
    if (init.json !== undefined) {
      headers.set('content-type', 'application/json');
      body = JSON.stringify(init.json);
    }
    const method = (init.method ?? 'GET').toUpperCase();
    if (!['GET', 'HEAD'].includes(method) && !this.bearer && !headers.has('origin')) headers.set('origin', this.root());
    const res = await fetch(this.root() + path, { ...init, headers, body, redirect: 'manual' });
    this.keep(res);
    return res;
  }

  // Tests read answers loosely (`body.id`); a wrong shape fails the test's own assertions.
  // eslint-disable-next-line @typescript-eslint/no-explicit-any
  async json<T = any>(path: string, init: RequestInit & { json?: unknown } = {}): Promise<{ status: number; body: T }> {
    const res = await this.fetch(path, init);
    const text = await res.text();
    let body: unknown = text;
    try {
      body = JSON.parse(text);
    } catch {
      /* not JSON */
    }
    return { status: res.status, body: body as T };
  }

  /** Sign in with the credentials provider; resolves to true when a session cookie was set. */
  async signIn(email: string, password = inject('testPassword')): Promise<boolean> {
    const csrf = await this.json<{ csrfToken: string }>('/api/auth/csrf');
    const form = new URLSearchParams({
      csrfToken: csrf.body.csrfToken,
      email,
      password,
      callbackUrl: this.root() + '/',
    });
    await this.fetch('/api/auth/callback/credentials', {
      method: 'POST',
      body: form,
      headers: { 'content-type': 'application/x-www-form-urlencoded' },
    });
    return [...this.cookies.keys()].some((k) => k.includes('session-token'));
  }

  /** Sign out through Auth.js, as the Sign out button does. */
  async signOut(): Promise<void> {
    const csrf = await this.json<{ csrfToken: string }>('/api/auth/csrf');
    await this.fetch('/api/auth/signout', {
      method: 'POST',
      body: new URLSearchParams({ csrfToken: csrf.body.csrfToken, callbackUrl: this.root() + '/signin' }),
      headers: { 'content-type': 'application/x-www-form-urlencoded' },
    });
  }
}

export async function signedIn(email: string, password?: string): Promise<Client> {
  const c = new Client();
  if (!(await c.signIn(email, password))) throw new Error(`could not sign in as ${email}`);
  return c;
}
