import { afterEach, describe, expect, it } from 'vitest';
import { resetConfigForTests } from '../config.server';
import { refuseOversizedBody, withSecurityHeaders } from './security.server';

const req = (method: string, path: string, headers: Record<string, string> = {}) =>
  new Request(`http://127.0.0.1:4321${path}`, { method, headers });

afterEach(() => {
  delete process.env.PUBLIC_BASE_URL;
  delete process.env.TRUST_PROXY;
  resetConfigForTests();
});

describe('refuseOversizedBody', () => {
  it('answers 413 to a JSON body declared over 1 MB, anywhere, before it is read', async () => {
    const r = refuseOversizedBody(
      req('POST', '/api/tests', { 'content-type': 'application/json', 'content-length': String(1024 * 1024 + 1) }),
      '/api/tests',
    );
    expect(r?.status).toBe(413);
    expect((await r!.json()).error.code).toBe('too-large');
    expect(
      refuseOversizedBody(
        req('POST', '/api/tests/1/logs', { 'content-type': 'application/json', 'content-length': '2000000' }),
        '/api/tests/1/logs',
      )?.status,
    ).toBe(413);
  });

  it('lets a body of 1 MB or less through, and log uploads of any size (they stream with their own limit)', () => {
    const mb = String(1024 * 1024);
    expect(
      refuseOversizedBody(
        req('POST', '/api/tests', { 'content-type': 'application/json', 'content-length': mb }),
        '/api/tests',
      ),
    ).toBeNull();
    expect(
      refuseOversizedBody(
        req('POST', '/api/tests/3/logs', { 'content-type': 'text/csv', 'content-length': '90000000' }),
        '/api/tests/3/logs',
      ),
    ).toBeNull();
    expect(
      refuseOversizedBody(
        req('POST', '/api/vessels', { 'content-type': 'text/plain', 'content-length': '90000000' }),
        '/api/vessels',
      )?.status,
    ).toBe(413);
  });
});

describe('withSecurityHeaders', () => {
  it('adds the policy Astro left out, and keeps and extends the one it built for a page', () => {
    const api = withSecurityHeaders(new Response('{}'), req('GET', '/api/tests'), new URL('http://x/api/tests'));
    expect(api.headers.get('content-security-policy')).toBe(
      "default-src 'none'; frame-ancestors 'none'; base-uri 'none'; form-action 'self'",
    );
    const page = new Response('<html>', {
      headers: {
        'content-security-policy': "frame-ancestors 'none'; script-src 'self' 'sha256-abc'; style-src 'self';",
      },
    });
    const out = withSecurityHeaders(page, req('GET', '/'), new URL('http://x/'));
    expect(out.headers.get('content-security-policy')).toBe(
      "frame-ancestors 'none'; script-src 'self' 'sha256-abc'; style-src 'self'; style-src-attr 'unsafe-inline';",
    );
    for (const r of [api, out]) {
      expect(r.headers.get('x-content-type-options')).toBe('nosniff');
      expect(r.headers.get('referrer-policy')).toBe('same-origin');
      expect(r.headers.get('x-frame-options')).toBe('DENY');
      expect(r.headers.get('strict-transport-security')).toBeNull();
    }
  });

  it('sets HSTS when the public address is https, and copes with a redirect\u2019s immutable headers', () => {
    process.env.PUBLIC_BASE_URL = 'https://hoopline.example';
    resetConfigForTests();
    const r = withSecurityHeaders(
      Response.redirect('https://hoopline.example/signin', 302),
      req('GET', '/'),
      new URL('http://x/'),
    );
    expect(r.status).toBe(302);
    expect(r.headers.get('location')).toBe('https://hoopline.example/signin');
    expect(r.headers.get('strict-transport-security')).toMatch(/^max-age=31536000/);
  });
});
