// What every response carries (DESIGN 6): a Content-Security-Policy that allows no inline script
// but the framework's own, hashed; no framing; nosniff; Referrer-Policy; HSTS over HTTPS. And
// JSON bodies over 1 MB answer 413 before anything parses them.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { inject } from 'vitest';
import { createHash } from 'node:crypto';
import http from 'node:http';
import { Client, signedIn } from './support/http';
import { startAppServer } from './support/processes';

let engineer: Client;
beforeAll(async () => {
  engineer = await signedIn('engineer@example.com');
});

function directives(policy: string): Map<string, string[]> {
  return new Map(
    policy
      .split(';')
      .map((d) => d.trim().split(/\s+/))
      .filter((d) => d[0])
      .map(([name, ...values]) => [name!, values]),
  );
}

describe('security headers', () => {
  it.each(['/signin', '/', '/vessels', '/account', '/tests/new'])(
    '%s: every inline script is hashed in a CSP that allows no other inline script, and no framing',
    async (path) => {
      const c = path === '/signin' ? new Client() : engineer;
      const res = await c.fetch(path);
      expect(res.status).toBe(200);
      const policy = res.headers.get('content-security-policy')!;
      const d = directives(policy);
      expect(d.get('frame-ancestors')).toEqual(["'none'"]);
      expect(d.get('object-src')).toEqual(["'none'"]);
      const scripts = d.get('script-src')!;
      expect(scripts).toContain("'self'");
      expect(scripts).not.toContain("'unsafe-inline'");
      expect(scripts).not.toContain("'unsafe-eval'");
      const html = await res.text();
      const inline = [...html.matchAll(/<script(?![^>]*\bsrc=)[^>]*>([\s\S]*?)<\/script>/g)].map((m) => m[1]!);
      for (const body of inline) {
        const hash = `'sha256-${createHash('sha256').update(body).digest('base64')}'`;
        expect(scripts, body.slice(0, 60)).toContain(hash);
      }
      // no inline event handlers either (no hash can allow those)
      expect(html).not.toMatch(/\son(click|load|submit|error)=/i);
      expect(res.headers.get('x-frame-options')).toBe('DENY');
      expect(res.headers.get('x-content-type-options')).toBe('nosniff');
      expect(res.headers.get('referrer-policy')).toBe('same-origin');
      expect(res.headers.get('strict-transport-security')).toBeNull(); // plain http here
    },
  );

  it('puts a deny-all policy and the same headers on API answers, errors and redirects', async () => {
    for (const [c, path] of [
      [engineer, '/api/tests'],
      [new Client(), '/api/tests'],
      [new Client(), '/account'],
      [engineer, '/api/tests/99999999'],
    ] as const) {
      const res = await c.fetch(path);
      expect(res.headers.get('content-security-policy'), path).toContain("default-src 'none'");
      expect(res.headers.get('content-security-policy')).toContain("frame-ancestors 'none'");
      expect(res.headers.get('x-content-type-options')).toBe('nosniff');
      expect(res.headers.get('referrer-policy')).toBe('same-origin');
    }
  });

  describe('behind a TLS proxy', () => {
    let proxied: Awaited<ReturnType<typeof startAppServer>>;
    beforeAll(async () => {
      proxied = await startAppServer(inject('env'), { TRUST_PROXY: 'true' });
    });
    afterAll(async () => {
      await proxied.stop();
    });

    it('sends HSTS when the proxy says the client came over HTTPS, and not otherwise', async () => {
      const tls = await fetch(`${proxied.url}/signin`, { headers: { 'x-forwarded-proto': 'https' } });
      expect(tls.headers.get('strict-transport-security')).toMatch(/max-age=\d{7,}/);
      const plain = await fetch(`${proxied.url}/signin`);
      expect(plain.headers.get('strict-transport-security')).toBeNull();
      // without TRUST_PROXY the header is the client's word, and ignored
      const direct = await new Client().fetch('/signin', { headers: { 'x-forwarded-proto': 'https' } });
      expect(direct.headers.get('strict-transport-security')).toBeNull();
    });
  });
});

describe('request bodies', () => {
  const big = JSON.stringify({ name: 'too big', plan: { padding: 'x'.repeat(2 * 1024 * 1024) } });

  it('answers 413 to a JSON body over 1 MB, before it is parsed, and creates nothing', async () => {
    const before = (await engineer.json('/api/tests?limit=1')).body.total;
    const r = await engineer.json('/api/tests', {
      method: 'POST',
      body: big,
      headers: { 'content-type': 'application/json' },
    });
    expect(r.status).toBe(413);
    expect(r.body.error.code).toBe('too-large');
    expect((await engineer.json('/api/tests?limit=1')).body.total).toBe(before);
  });

  it('answers 413 to a streamed JSON body with no length that grows past 1 MB', async () => {
    const chunk = new TextEncoder().encode('x'.repeat(64 * 1024));
    let sent = 0;
    const body = new ReadableStream<Uint8Array>({
      pull(controller) {
        if (sent === 0) controller.enqueue(new TextEncoder().encode('{"name":"'));
        if (sent >= 40) controller.close();
        else {
          controller.enqueue(chunk);
          sent++;
        }
      },
    });
    const res = await engineer.fetch('/api/vessels', {
      method: 'POST',
      body,
      headers: { 'content-type': 'application/json' },
      duplex: 'half',
    } as RequestInit);
    expect(res.status).toBe(413);
  });

  it('keeps a connection usable after refusing a streamed body it stopped reading', async () => {
    // one kept-alive connection: the next request goes on the very socket the 413 answered on
    const agent = new http.Agent({ keepAlive: true, maxSockets: 1 });
    const url = new URL(inject('baseUrl'));
    const send = (method: string, path: string, body?: Buffer[]) =>
      new Promise<number>((resolve, reject) => {
        const req = http.request(
          {
            host: url.hostname,
            port: url.port,
            method,
            path,
            agent,
            headers: {
              cookie: engineer.cookieHeader(),
              origin: url.origin,
              ...(body ? { 'content-type': 'application/json', 'transfer-encoding': 'chunked' } : {}),
            },
            timeout: 10_000,
          },
          (res) => {
            res.resume();
            res.on('end', () => resolve(res.statusCode ?? 0));
          },
        );
        req.on('timeout', () => req.destroy(new Error(`${method} ${path}: no answer in 10 s`)));
        req.on('error', reject);
        for (const part of body ?? []) req.write(part);
        req.end();
      });
    try {
      const parts = [Buffer.from('{"name":"'), ...Array.from({ length: 40 }, () => Buffer.alloc(64 * 1024, 120))];
      expect(await send('POST', '/api/vessels', parts)).toBe(413);
      expect(await send('GET', '/api/health')).toBe(200);
    } finally {
      agent.destroy();
    }
  });

  it('still takes a log upload larger than 1 MB (logs stream, with their own limit)', async () => {
    const res = await engineer.json('/api/tests/99999999/logs', {
      method: 'POST',
      body: 'time_s,P [MPa]\n' + '0,0\n'.repeat(400_000),
      headers: { 'content-type': 'text/csv' },
    });
    expect(res.status).toBe(404); // past the body limit, the endpoint itself answered
  });
});
