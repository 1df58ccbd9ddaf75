// An HTTP client that signs in through Auth.js like a browser does and keeps cookies. Free of
// vitest, so benchmarks and drills outside a test run use it too (tests use ./http.ts).
export class HttpClient {
  protected cookies = new Map<string, string>();
  constructor(
    readonly baseUrl: string,
    protected bearer: string | null = null,
  ) {}

  /** The same caller (cookies or token) talking to another app server. */
  on(baseUrl: string): HttpClient {
    const c = new HttpClient(baseUrl, this.bearer);
    for (const [k, v] of this.cookies) c.cookies.set(k, v);
    return c;
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
    if (!['GET', 'HEAD'].includes(method) && !this.bearer && !headers.has('origin'))
      headers.set('origin', this.baseUrl);
    const res = await fetch(this.baseUrl + path, { ...init, headers, body, redirect: 'manual' });
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
  async signIn(email: string, password: string): Promise<boolean> {
    const csrf = await this.json<{ csrfToken: string }>('/api/auth/csrf');
    const form = new URLSearchParams({
      csrfToken: csrf.body.csrfToken,
      email,
      password,
      callbackUrl: this.baseUrl + '/',
    });
    await this.fetch('/api/auth/callback/credentials', {
      method: 'POST',
      body: form,
      headers: { 'content-type': 'application/x-www-form-urlencoded' },
    });
    return [...this.cookies.keys()].some((k) => k.includes('session-token'));
  }

  /** Sign out through Auth.js (ends every session of the account: the session epoch moves on). */
  async signOut(): Promise<void> {
    const csrf = await this.json<{ csrfToken: string }>('/api/auth/csrf');
    await this.fetch('/api/auth/signout', {
      method: 'POST',
      body: new URLSearchParams({ csrfToken: csrf.body.csrfToken, callbackUrl: this.baseUrl + '/signin' }),
      headers: { 'content-type': 'application/x-www-form-urlencoded' },
    });
  }
}
