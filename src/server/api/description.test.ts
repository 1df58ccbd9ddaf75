// The API description (description.ts → openapi.ts): a valid OpenAPI 3.1 document, in step with
// the route files under src/pages/api, and built from the very schema objects the endpoints parse
// with, so a body an endpoint refuses is refused by the published schema too.
import SwaggerParser from '@apidevtools/swagger-parser';
import { Ajv2020 } from 'ajv/dist/2020.js';
import { readdirSync, readFileSync, statSync } from 'node:fs';
import path from 'node:path';
import { describe, expect, it } from 'vitest';
import { findRoute, routes, type Method } from './description';
import { buildDocsView } from './docs-view';
import { buildOpenApi, type JsonSchema } from './openapi';
import type { z } from 'zod';
import * as schemas from './schemas';

type SchemaName = {
  [K in keyof typeof schemas]: (typeof schemas)[K] extends z.ZodType ? K : never;
}[keyof typeof schemas];

/**
 * Described routes whose endpoint files are being built elsewhere (live test mode, DESIGN 8).
 * Empty this list when they arrive: the test then fails if one is still missing.
 */
const EXPECTED_TO_COME = new Set<string>([]);

const API_ROOT = path.resolve('src/pages/api');

interface RouteFile {
  file: string;
  path: string;
  methods: Method[];
  source: string;
}

/** Every endpoint file with its OpenAPI-style path and the methods it exports (ALL is the 405 fallback). */
function routeFiles(): RouteFile[] {
  const out: RouteFile[] = [];
  const walk = (dir: string) => {
    for (const f of readdirSync(dir)) {
      const p = path.join(dir, f);
      if (statSync(p).isDirectory()) walk(p);
      else if (/\.(ts|astro)$/.test(f) && !f.endsWith('.test.ts')) {
        const rel = path.relative(API_ROOT, p).split(path.sep).join('/');
        const route =
          '/api/' +
          rel
            .replace(/\.(ts|astro)$/, '')
            .replace(/(^|\/)index$/, '')
            .replace(/\[(\w+)\]/g, '{$1}');
        const source = readFileSync(p, 'utf8');
        const methods = f.endsWith('.astro')
          ? (['GET'] as Method[])
          : (['GET', 'POST', 'PUT', 'PATCH', 'DELETE'] as const).filter((m) =>
              new RegExp(`export const (${m}\\b|\\{[^}]*\\b${m}\\b[^}]*\\})`).test(source),
            );
        out.push({ file: rel, path: route.replace(/\/$/, ''), methods, source });
      }
    }
  };
  walk(API_ROOT);
  return out;
}

describe('the OpenAPI document', () => {
  it('is valid OpenAPI 3.1 (structure and JSON Schema 2020-12 dialect)', async () => {
    const doc = buildOpenApi();
    const api = await SwaggerParser.validate(structuredClone(doc) as never);
    expect(api).toMatchObject({ openapi: '3.1.0' });
    expect(doc.jsonSchemaDialect).toBe('https://json-schema.org/draft/2020-12/schema');
    expect(JSON.stringify(doc)).not.toContain('$defs'); // no reference that would point outside its schema
  });

  it('the validator does refuse a broken document (so the check above can fail)', async () => {
    // an OpenAPI 2 style body parameter: not a place a parameter can be in 3.1
    const broken = structuredClone(buildOpenApi()) as {
      paths: Record<string, Record<string, { parameters: { in: string }[] }>>;
    };
    broken.paths['/api/tests/{id}']!.get!.parameters[0]!.in = 'body';
    await expect(SwaggerParser.validate(broken as never)).rejects.toThrow();
  });

  it('names every operation once, with who may call it and the error envelope', () => {
    const doc = buildOpenApi() as {
      paths: Record<
        string,
        Record<string, { operationId: string; description: string; responses: Record<string, unknown> }>
      >;
      components: { schemas: { Error: JsonSchema } };
    };
    const ops = Object.values(doc.paths).flatMap((p) => Object.values(p));
    expect(ops).toHaveLength(routes.length);
    expect(new Set(ops.map((o) => o.operationId)).size).toBe(ops.length);
    for (const o of ops) expect(o.description).toContain('Who may call it:');
    const code = (doc.components.schemas.Error as { properties: { error: { properties: { code: JsonSchema } } } })
      .properties.error.properties.code;
    expect(code.enum).toEqual(
      expect.arrayContaining(['unauthenticated', 'token-scope', 'stale-reduction', 'too-few-levels']),
    );
    // a route needing a role documents 401 and 403 with the envelope
    expect(doc.paths['/api/tests/{id}/release']!.post!.responses['403']).toEqual({
      description: expect.any(String),
      content: { 'application/json': { schema: { $ref: '#/components/schemas/Error' } } },
    });
  });

  it('says who may call a route from the role table and the token rules', () => {
    const doc = buildOpenApi() as { paths: Record<string, Record<string, Record<string, unknown>>> };
    const upload = doc.paths['/api/tests/{id}/logs']!.post!;
    expect(upload['x-roles']).toEqual(['technician', 'engineer', 'admin']);
    expect(upload.security).toEqual([{ sessionCookie: [] }, { apiToken: ['upload'] }]);
    const review = doc.paths['/api/tests/{id}/review']!.post!;
    expect(review['x-roles']).toEqual(['engineer']);
    expect(review.security).toEqual([{ sessionCookie: [] }]); // never a token
    expect(doc.paths['/api/tests/{id}/notes']!.post!.security).toEqual([{ sessionCookie: [] }]);
    expect(doc.paths['/api/tests']!.get!.security).toEqual([{ sessionCookie: [] }, { apiToken: ['read'] }]);
    expect(doc.paths['/api/share/{token}']!.get!.security).toEqual([]);
  });
});

describe('the registry and the route files', () => {
  const files = routeFiles();

  it('describes every method of every route file under src/pages/api', () => {
    const missing = files.flatMap((f) =>
      f.methods.filter((m) => !findRoute(m, f.path)).map((m) => `${m} ${f.path} (${f.file})`),
    );
    expect(missing).toEqual([]);
  });

  it('has a route file for every described route, except the ones expected to come', () => {
    const exported = new Set(files.flatMap((f) => f.methods.map((m) => `${m} ${f.path}`)));
    const orphans = routes
      .map((r) => `${r.method} ${r.path}`)
      .filter((k) => !exported.has(k) && !EXPECTED_TO_COME.has(k));
    expect(orphans).toEqual([]);
    const arrived = [...EXPECTED_TO_COME].filter((k) => exported.has(k));
    expect(arrived, 'these have a file now: remove them from EXPECTED_TO_COME').toEqual([]);
    for (const k of EXPECTED_TO_COME)
      expect(
        routes.some((r) => `${r.method} ${r.path}` === k),
        k,
      ).toBe(true);
  });

  it('publishes the very schema object each endpoint parses its JSON body with', () => {
    let checked = 0;
    for (const f of files)
      for (const m of f.methods) {
        const handler = f.source.split(/export const /).find((part) => part.startsWith(m) || part.startsWith(`{`));
        const used = /readJson\(ctx\.request, (\w+)\)/.exec(handler ?? '')?.[1];
        const route = findRoute(m, f.path)!;
        const published = route.body?.content['application/json'];
        if (!used) {
          expect(published, `${m} ${f.path} reads no JSON body`).toBeUndefined();
          continue;
        }
        expect(
          new RegExp(`import \\{[^}]*\\b${used}\\b[^}]*\\} from '[./]+/server/api/schemas'`).test(f.source),
          `${f.file} imports ${used} from the schemas module`,
        ).toBe(true);
        expect(published, `${m} ${f.path}`).toBe((schemas as Record<string, unknown>)[used]);
        checked++;
      }
    expect(checked).toBeGreaterThanOrEqual(16);
  });
});

describe('query strings: the parser and the published schema are one object', () => {
  // where each query schema is parsed (an endpoint, or the server helper it calls)
  const parsedIn: [route: string, schema: SchemaName, file: string][] = [
    ['GET /api/tests', 'testListQuery', 'src/pages/api/tests/index.ts'],
    ['GET /api/tests/{id}/series', 'seriesQuery', 'src/server/series.server.ts'],
    ['GET /api/share/{token}/series', 'seriesQuery', 'src/server/series.server.ts'],
    ['GET /api/vessels', 'pageQuery', 'src/server/pagination.ts'],
    ['GET /api/materials', 'pageQuery', 'src/server/pagination.ts'],
    ['GET /api/tests/{id}/audit', 'pageQuery', 'src/server/pagination.ts'],
  ];

  it.each(parsedIn)('%s publishes %s, which %s parses with', (key, schema, file) => {
    const [method, p] = key.split(' ') as [Method, string];
    expect(findRoute(method, p)?.query).toBe(schemas[schema]);
    expect(readFileSync(file, 'utf8')).toMatch(new RegExp(`\\b${schema}\\.safeParse\\(`));
  });

  it('covers every route that publishes a query', () => {
    const described = routes.filter((r) => r.query).map((r) => `${r.method} ${r.path}`);
    expect(described.sort()).toEqual(parsedIn.map(([k]) => k).sort());
  });

  it('refuses in both places a status that is not one', () => {
    const doc = buildOpenApi() as { paths: Record<string, Record<string, { parameters: { name: string }[] }>> };
    expect(doc.paths['/api/tests']!.get!.parameters.map((x) => x.name)).toEqual([
      'limit',
      'offset',
      'status',
      'vesselId',
    ]);
    expect(schemas.testListQuery.safeParse({ status: 'logging,reduced' }).success).toBe(true);
    expect(schemas.testListQuery.safeParse({ status: 'logging,nope' }).success).toBe(false);
    expect(schemas.seriesQuery.safeParse({ points: '5' }).success).toBe(false);
    const ajv = new Ajv2020({ strict: false });
    const points = (
      doc.paths['/api/tests/{id}/series']!.get!.parameters as unknown as { name: string; schema: JsonSchema }[]
    ).find((x) => x.name === 'points')!;
    expect(ajv.validate(points.schema, 5)).toBe(false);
    expect(ajv.validate(points.schema, 500)).toBe(true);
  });
});

describe('a body the endpoint refuses is refused by the published schema too', () => {
  const doc = buildOpenApi() as {
    paths: Record<string, Record<string, { requestBody: { content: Record<string, { schema: JsonSchema }> } }>>;
  };
  const ajv = new Ajv2020({ strict: false, validateFormats: false });
  const published = (p: string, m: string) =>
    ajv.compile(doc.paths[p]![m]!.requestBody.content['application/json']!.schema);

  const cases: [path: string, method: string, schema: SchemaName, body: unknown, valid: boolean][] = [
    [
      '/api/tests/{id}/dispositions',
      'post',
      'dispositionBody',
      { gaugeId: 'H1', outcome: 'accepted', reason: 'gauge debonded at the lead' },
      true,
    ],
    ['/api/tests/{id}/dispositions', 'post', 'dispositionBody', { gaugeId: 'H1', outcome: 'accepted' }, false],
    [
      '/api/tests/{id}/dispositions',
      'post',
      'dispositionBody',
      { gaugeId: 'H1', outcome: 'ignored', reason: 'no reason at all' },
      false,
    ],
    ['/api/tests/{id}/share-links', 'post', 'shareLinkBody', {}, true],
    ['/api/tests/{id}/share-links', 'post', 'shareLinkBody', { expiresInDays: 0 }, false],
    ['/api/tests/{id}/share-links', 'post', 'shareLinkBody', { expiresInDays: 91 }, false],
    ['/api/account/tokens', 'post', 'tokenBody', { name: 'DAQ PC', scopes: ['upload'] }, true],
    ['/api/account/tokens', 'post', 'tokenBody', { name: 'DAQ PC', scopes: ['write'] }, false],
    ['/api/account/tokens', 'post', 'tokenBody', { name: 'DAQ PC', expiresInDays: 366 }, false],
    ['/api/tests/{id}/review', 'post', 'signatureBody', { reductionId: 3, password: 'correct horse' }, true],
    ['/api/tests/{id}/review', 'post', 'signatureBody', { reductionId: 3 }, false],
    ['/api/admin/users', 'post', 'inviteBody', { email: 'a@example.com', name: 'A', role: 'superuser' }, false],
  ];

  it.each(cases)('%s %s %s %j → valid %s', (p, m, schema, body, valid) => {
    expect(schemas[schema].safeParse(body).success).toBe(valid); // the endpoint's own parse
    expect(published(p, m)(body)).toBe(valid); // the published JSON Schema
  });
});

describe('the docs page view', () => {
  it('groups every route by area, with who may call it and the fields of its body', () => {
    const view = buildDocsView();
    const shown = view.groups.flatMap((g) => g.routes);
    expect(shown).toHaveLength(routes.length);
    const upload = shown.find((r) => r.method === 'POST' && r.path === '/api/tests/{id}/logs')!;
    expect(upload.who).toContain('`upload` scope');
    expect(upload.body.map((b) => b.contentType)).toEqual(['multipart/form-data', 'text/csv']);
    const disp = shown.find((r) => r.method === 'POST' && r.path === '/api/tests/{id}/dispositions')!;
    expect(disp.body[0]!.schema!.rows.map((r) => [r.name, r.required])).toEqual([
      ['gaugeId', true],
      ['outcome', true],
      ['reason', true],
    ]);
    expect(view.codes.find((c) => c.code === 'token-not-allowed')?.status).toBe(403);
  });
});
