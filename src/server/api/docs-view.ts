// What GET /api/docs shows, built from the registry (description.ts) and the same JSON Schemas the
// OpenAPI document carries: routes grouped by area, each schema as a table of fields (nested
// objects flattened to dotted names) and as pretty JSON Schema.
import { z } from 'zod';
import { areas, pathParamNames, pathParams, routes, tokenScopeOf, whoMayCall, type RouteDoc } from './description';
import { errorStatuses, jsonSchemaOf, operationId, type JsonSchema } from './openapi';
import { errorCatalogue } from '../errors';
import { errorCodes, errorEnvelope } from './responses';

export interface FieldRow {
  name: string;
  type: string;
  required: boolean;
  notes: string;
}

export interface SchemaView {
  rows: FieldRow[];
  json: string;
}

export interface RouteView {
  anchor: string;
  method: string;
  path: string;
  summary: string;
  description?: string;
  who: string;
  tokenScope: string | null;
  params: FieldRow[];
  body: { contentType: string; schema?: SchemaView; note?: string }[];
  responses: {
    status: string;
    description: string;
    contentType?: string;
    schema?: SchemaView;
    events?: { name: string; schema: SchemaView }[];
  }[];
  errors: number[];
}

const asSchema = (v: unknown): JsonSchema => (v && typeof v === 'object' ? (v as JsonSchema) : {});

function typeOf(s: JsonSchema): string {
  if (Array.isArray(s.enum)) return (s.enum as unknown[]).map((v) => JSON.stringify(v)).join(' | ');
  if ('const' in s) return JSON.stringify(s.const);
  const variants = (s.anyOf ?? s.oneOf) as JsonSchema[] | undefined;
  if (Array.isArray(variants)) return variants.map((v) => typeOf(asSchema(v))).join(' | ');
  if (s.type === 'array') return `array of ${typeOf(asSchema(s.items))}`;
  if (Array.isArray(s.type)) return (s.type as string[]).join(' | ');
  if (typeof s.type === 'string') return s.format ? `${s.type} (${String(s.format)})` : s.type;
  return 'any';
}

const count = (n: unknown, word: string) => `${String(n)} ${word}${n === 1 ? '' : 's'}`;

function notesOf(s: JsonSchema): string {
  const n: string[] = [];
  if (typeof s.description === 'string') n.push(s.description);
  if (s.minimum !== undefined) n.push(`≥ ${String(s.minimum)}`);
  if (s.exclusiveMinimum !== undefined) n.push(`> ${String(s.exclusiveMinimum)}`);
  if (s.maximum !== undefined && s.maximum !== Number.MAX_SAFE_INTEGER) n.push(`≤ ${String(s.maximum)}`);
  if (s.exclusiveMaximum !== undefined) n.push(`< ${String(s.exclusiveMaximum)}`);
  if (s.minLength !== undefined) n.push(`at least ${count(s.minLength, 'character')}`);
  if (s.maxLength !== undefined) n.push(`at most ${count(s.maxLength, 'character')}`);
  if (s.minItems !== undefined) n.push(`at least ${count(s.minItems, 'item')}`);
  if (s.default !== undefined) n.push(`default ${JSON.stringify(s.default)}`);
  return n.join('; ');
}

/** The fields of a JSON Schema as rows; objects nested in objects (or arrays of them) get dotted names. */
export function fieldRows(schema: JsonSchema, prefix = '', depth = 0): FieldRow[] {
  const props = asSchema(schema.properties);
  const required = new Set((schema.required as string[] | undefined) ?? []);
  const rows: FieldRow[] = [];
  for (const [name, raw] of Object.entries(props)) {
    const s = asSchema(raw);
    const full = prefix + name;
    rows.push({ name: full, type: typeOf(s), required: required.has(name), notes: notesOf(s) });
    if (depth < 3) {
      if (s.type === 'object' && s.properties) rows.push(...fieldRows(s, `${full}.`, depth + 1));
      const items = asSchema(s.items);
      if (s.type === 'array' && items.properties) rows.push(...fieldRows(items, `${full}[].`, depth + 1));
    }
  }
  return rows;
}

function view(schema: z.ZodType, io: 'input' | 'output'): SchemaView {
  const json = jsonSchemaOf(schema, io);
  const rows =
    json.type === 'object'
      ? fieldRows(json)
      : [{ name: '(whole body)', type: typeOf(json), required: true, notes: notesOf(json) }];
  return { rows, json: JSON.stringify(json, null, 2) };
}

function routeView(route: RouteDoc): RouteView {
  const params: FieldRow[] = pathParamNames(route.path).map((name) => {
    const s = jsonSchemaOf(pathParams[name] ?? z.string(), 'input');
    return { name: `{${name}} (path)`, type: typeOf(s), required: true, notes: notesOf(s) };
  });
  if (route.query)
    for (const [name, field] of Object.entries(route.query.shape)) {
      const s = jsonSchemaOf(field, 'input');
      params.push({
        name: `${name} (query)`,
        type: typeOf(s),
        required: !field.safeParse(undefined).success,
        notes: notesOf(s),
      });
    }
  for (const [name, h] of Object.entries(route.headers ?? {}))
    params.push({ name: `${name} (header)`, type: 'string', required: false, notes: h.description });
  return {
    anchor: operationId(route),
    method: route.method,
    path: route.path,
    summary: route.summary,
    ...(route.description ? { description: route.description } : {}),
    who: whoMayCall(route),
    tokenScope: tokenScopeOf(route),
    params,
    body: Object.entries(route.body?.content ?? {}).map(([contentType, s]) =>
      'raw' in s ? { contentType, note: s.raw } : { contentType, schema: view(s, 'input') },
    ),
    responses: Object.entries(route.responses).map(([status, r]) => ({
      status,
      description: r.description,
      ...(r.events
        ? { contentType: 'text/event-stream' }
        : r.schema
          ? { contentType: 'application/json' }
          : r.contentType
            ? { contentType: r.contentType }
            : {}),
      ...(r.schema ? { schema: view(r.schema, 'output') } : {}),
      ...(r.events
        ? { events: Object.entries(r.events).map(([name, s]) => ({ name, schema: view(s, 'output') })) }
        : {}),
    })),
    errors: errorStatuses(route),
  };
}

export interface DocsView {
  groups: { area: string; anchor: string; routes: RouteView[] }[];
  error: SchemaView;
  codes: { code: string; status: number; message: string }[];
}

export function buildDocsView(): DocsView {
  return {
    groups: areas
      .map((area) => ({
        area,
        anchor: area.toLowerCase().replace(/[^a-z0-9]+/g, '-'),
        routes: routes.filter((r) => r.area === area).map(routeView),
      }))
      .filter((g) => g.routes.length > 0),
    error: view(errorEnvelope, 'output'),
    codes: errorCodes.map((code) => {
      const entry = (errorCatalogue as Record<string, { status: number; message: string }>)[code];
      return entry
        ? { code, status: entry.status, message: entry.message }
        : {
            code,
            status: 422,
            message: 'The plan or the log is not valid (from the reduction engine; line and column for a log).',
          };
    }),
  };
}
