// The OpenAPI 3.1 document of the API, generated from the registry (description.ts) with zod 4's
// own JSON Schema output (draft 2020-12, the dialect of OpenAPI 3.1). Request schemas are given
// as the client must send them (`io: 'input'`: fields with defaults are optional), answers as
// the server produces them.
import { z } from 'zod';
import { errorCatalogue } from '../errors';
import {
  areas,
  pathParamNames,
  pathParams,
  rolesOf,
  routes,
  tokenScopeOf,
  whoMayCall,
  type ResponseDoc,
  type RouteDoc,
} from './description';
import { errorEnvelope, errorCodes } from './responses';

export type JsonSchema = Record<string, unknown>;

/** A zod schema as JSON Schema 2020-12, without the `$schema` key (the document sets the dialect). */
export function jsonSchemaOf(schema: z.ZodType, io: 'input' | 'output'): JsonSchema {
  const out = z.toJSONSchema(schema, { target: 'draft-2020-12', io, unrepresentable: 'any', reused: 'inline' });
  const { $schema: _dialect, ...rest } = out as JsonSchema;
  return rest;
}

const ERROR_REF = { $ref: '#/components/schemas/Error' };

const STATUS_TEXT: Record<number, string> = {
  400: 'The request is not valid (the message names the field).',
  401: 'Not signed in, a wrong password, or a token that is not one.',
  403: 'Signed in, but the role or the token may not do this.',
  404: 'Nothing with that id.',
  405: 'The address is read-only.',
  409: 'The record’s state does not allow it (the code says why); nothing was changed.',
  410: 'The link expired or was revoked.',
  413: 'The body is larger than the limit.',
  422: 'The plan or the log is not valid (line and column for a log).',
  429: 'Too many attempts; wait (Retry-After).',
  503: 'A service Hoopline needs is not answering; nothing was changed.',
};

/** The error answers of a route: what its access and parameters imply, and its own extras. */
export function errorStatuses(route: RouteDoc): number[] {
  const s = new Set<number>(route.errors ?? []);
  const a = route.access.kind;
  if (a !== 'anyone' && a !== 'share-link') s.add(401).add(403);
  if (route.body || route.query) s.add(400);
  if (pathParamNames(route.path).length) s.add(404);
  if (route.body && route.body.content['application/json']) s.add(413);
  if (!route.path.startsWith('/api/openapi') && !route.path.startsWith('/api/docs') && route.path !== '/api/metrics')
    s.add(503);
  for (const ok of Object.keys(route.responses)) s.delete(Number(ok));
  return [...s].sort((x, y) => x - y);
}

function mediaOf(r: ResponseDoc): Record<string, unknown> | undefined {
  if (r.events)
    return {
      'text/event-stream': {
        schema: { type: 'string', description: 'Server-Sent Events: `id`, `event` and `data` (JSON) lines.' },
        'x-events': Object.fromEntries(Object.entries(r.events).map(([k, v]) => [k, jsonSchemaOf(v, 'output')])),
      },
    };
  if (r.schema) return { [r.contentType ?? 'application/json']: { schema: jsonSchemaOf(r.schema, 'output') } };
  if (r.contentType)
    return {
      [r.contentType]: {
        schema: r.contentType === 'application/json' ? { type: 'object' } : { type: 'string', format: 'binary' },
      },
    };
  return undefined;
}

function operationOf(route: RouteDoc): Record<string, unknown> {
  const parameters: unknown[] = pathParamNames(route.path).map((name) => ({
    name,
    in: 'path',
    required: true,
    schema: jsonSchemaOf(pathParams[name] ?? z.string(), 'input'),
  }));
  if (route.query)
    for (const [name, field] of Object.entries(route.query.shape)) {
      const schema = jsonSchemaOf(field, 'input');
      parameters.push({
        name,
        in: 'query',
        required: !field.safeParse(undefined).success,
        ...(schema.description ? { description: schema.description } : {}),
        schema,
      });
    }
  for (const [name, h] of Object.entries(route.headers ?? {}))
    parameters.push({
      name,
      in: 'header',
      required: false,
      description: h.description,
      schema: jsonSchemaOf(h.schema, 'input'),
    });

  const responses: Record<string, unknown> = {};
  for (const [status, r] of Object.entries(route.responses)) {
    const content = mediaOf(r);
    responses[status] = {
      description: r.description,
      ...(r.headers
        ? {
            headers: Object.fromEntries(
              Object.entries(r.headers).map(([k, v]) => [k, { description: v, schema: { type: 'string' } }]),
            ),
          }
        : {}),
      ...(content ? { content } : {}),
    };
  }
  for (const status of errorStatuses(route))
    responses[status] = {
      description: STATUS_TEXT[status] ?? 'An error.',
      content: { 'application/json': { schema: ERROR_REF } },
    };

  const scope = tokenScopeOf(route);
  const a = route.access;
  const security =
    a.kind === 'anyone' || a.kind === 'share-link'
      ? []
      : a.kind === 'session'
        ? [{ sessionCookie: [] }]
        : a.kind === 'metrics'
          ? [{}, { apiToken: [] }]
          : [{ sessionCookie: [] }, ...(scope ? [{ apiToken: [scope] }] : [])];

  const op: Record<string, unknown> = {
    operationId: operationId(route),
    tags: [route.area],
    summary: route.summary,
    description: [route.description, `**Who may call it:** ${whoMayCall(route)}`].filter(Boolean).join('\n\n'),
    'x-roles': rolesOf(a),
    'x-token-scope': scope,
    security,
    ...(parameters.length ? { parameters } : {}),
    responses,
  };
  if (route.body)
    op.requestBody = {
      required: route.body.required ?? true,
      content: Object.fromEntries(
        Object.entries(route.body.content).map(([type, s]) => [
          type,
          'raw' in s
            ? {
                schema:
                  type === 'multipart/form-data'
                    ? { type: 'object', properties: { file: { type: 'string', format: 'binary' } }, required: ['file'] }
                    : { type: 'string', description: s.raw },
              }
            : { schema: jsonSchemaOf(s, 'input') },
        ]),
      ),
    };
  return op;
}

/** `GET /api/tests/{id}/export.csv` → `getTestsIdExportCsv` (unique per method and path). */
export function operationId(route: Pick<RouteDoc, 'method' | 'path'>): string {
  const words = route.path
    .replace(/^\/api\//, '')
    .split(/[/.{}-]+/)
    .filter(Boolean)
    .map((w) => w[0]!.toUpperCase() + w.slice(1));
  return route.method.toLowerCase() + words.join('');
}

export const API_VERSION = '1';

/** The whole OpenAPI 3.1 document. */
export function buildOpenApi(): Record<string, unknown> {
  const paths: Record<string, Record<string, unknown>> = {};
  for (const route of routes) (paths[route.path] ??= {})[route.method.toLowerCase()] = operationOf(route);
  const errorComponent = jsonSchemaOf(errorEnvelope, 'output');
  return {
    openapi: '3.1.0',
    jsonSchemaDialect: 'https://json-schema.org/draft/2020-12/schema',
    info: {
      title: 'Hoopline API',
      version: API_VERSION,
      description:
        'Hydrostatic pressure tests of vessels instrumented with bonded strain gauges: plans, logs, reductions, review, release and inspector links. A verdict supports, and never replaces, the judgement of the responsible engineer and the authorised inspector; the governing code and the jurisdiction decide.',
    },
    tags: areas.map((name) => ({ name })),
    paths,
    components: {
      schemas: {
        Error: {
          ...errorComponent,
          description: `The error envelope. Codes and their usual status: ${errorCodes
            .map((c) => `${c} (${c in errorCatalogue ? errorCatalogue[c as keyof typeof errorCatalogue].status : 422})`)
            .join(', ')}.`,
        },
      },
      securitySchemes: {
        sessionCookie: {
          type: 'apiKey',
          in: 'cookie',
          name: 'authjs.session-token',
          description:
            'The session of a person signed in at /signin (over HTTPS the cookie is `__Secure-authjs.session-token`). Cookie-authenticated writes must come from Hoopline’s own origin.',
        },
        apiToken: {
          type: 'http',
          scheme: 'bearer',
          description:
            'A personal API token from /account: `Authorization: Bearer <token>`. Scopes: `read` (every GET) and `upload` (logs, live sessions, reductions). A token never signs and never manages tokens or accounts.',
        },
      },
    },
  };
}
