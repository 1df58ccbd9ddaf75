// GET /api/docs and GET /api/openapi.json on the built app: anyone may read them, the page is
// plain HTML under the app's Content-Security-Policy with nothing loaded from elsewhere, and the
// document is the one the registry builds, cacheable and revalidated by its ETag.
import { describe, expect, it } from 'vitest';
import { routes } from '../src/server/api/description';
import { buildOpenApi } from '../src/server/api/openapi';
import { Client } from './support/http';

const directives = (policy: string) =>
  new Map(
    policy
      .split(';')
      .map((d) => d.trim().split(/\s+/))
      .filter((p) => p[0])
      .map(([name, ...values]) => [name!, values]),
  );

describe('GET /api/docs', () => {
  it('answers 200 HTML to anyone, every route shown, nothing from outside the app', async () => {
    const res = await new Client().fetch('/api/docs');
    expect(res.status).toBe(200);
    expect(res.headers.get('content-type')).toMatch(/^text\/html/);
    const html = await res.text();
    // every src and href is the app's own (a path), never another host or a protocol-relative URL
    const refs = [...html.matchAll(/\b(?:src|href)\s*=\s*["']([^"']*)["']/gi)].map((m) => m[1]!);
    expect(refs.length).toBeGreaterThan(10);
    expect(refs.filter((u) => !/^(\/(?!\/)|#)/.test(u))).toEqual([]);
    expect(html).not.toMatch(/url\(\s*["']?(https?:)?\/\//i);
    // no script at all: the page is static HTML (the policy forbids inline script anyway)
    expect(html).not.toMatch(/<script\b/i);
    for (const r of routes) expect(html, r.path).toContain(r.path.replace(/&/g, '&amp;'));
    expect(html).toContain('Authorization: Bearer');
    expect(html).toContain('/account');
    const d = directives(res.headers.get('content-security-policy')!);
    expect(d.get('default-src')).toEqual(["'self'"]);
    expect(d.get('script-src') ?? []).not.toContain("'unsafe-inline'");
  });

  it('is served with the app’s own stylesheet and Inter', async () => {
    const html = await (await new Client().fetch('/api/docs')).text();
    const css = [...html.matchAll(/<link[^>]+rel="stylesheet"[^>]+href="([^"]+)"/g)].map((m) => m[1]!);
    expect(css.length).toBeGreaterThan(0);
    const sheet = await (await new Client().fetch(css[0]!)).text();
    expect(sheet).toContain('Inter');
  });
});

describe('GET /api/openapi.json', () => {
  it('answers the registry’s OpenAPI 3.1 document to anyone, with cache headers and an ETag', async () => {
    const anon = new Client();
    const res = await anon.fetch('/api/openapi.json');
    expect(res.status).toBe(200);
    expect(res.headers.get('content-type')).toMatch(/^application\/json/);
    expect(res.headers.get('cache-control')).toMatch(/public/);
    const etag = res.headers.get('etag');
    expect(etag).toMatch(/^"/);
    const doc = (await res.json()) as { openapi: string; paths: Record<string, unknown> };
    expect(doc.openapi).toBe('3.1.0');
    expect(doc).toEqual(JSON.parse(JSON.stringify(buildOpenApi())));
    const again = await anon.fetch('/api/openapi.json', { headers: { 'if-none-match': etag! } });
    expect(again.status).toBe(304);
  });
});
