// The one registry of the HTTP API (DESIGN 5 and 8): every route with who may call it, how it
// authenticates, and the zod schemas of its parameters, body and answers. The endpoints parse with
// the same schema objects (src/server/api/schemas.ts), GET /api/openapi.json is generated from
// this list (openapi.ts) and GET /api/docs renders it. A new endpoint gets its entry here;
// tests/api-description.test.ts fails on a route file missing from this list and vice versa.
import type { z } from 'zod';
import { rolesFor, roles, type Permission, type Role } from '../../lib/roles';
import * as live from './live-schemas';
import * as res from './responses';
import * as req from './schemas';
import type { TokenScope } from './schemas';

export type Method = 'GET' | 'POST' | 'PUT' | 'PATCH' | 'DELETE';

/** Who may call a route, and how they prove it. */
export type Access =
  /** no credentials needed */
  | { kind: 'anyone' }
  /**
   * a signed-in role holding `permission` (src/lib/roles.ts); with an API token a GET needs the
   * `read` scope and a write the scope `tokenWrite` (no `tokenWrite`: tokens are refused)
   */
  | { kind: 'permission'; permission: Permission; tokenWrite?: TokenScope }
  /** a person signed in with the browser, never a token (signing, managing one's own tokens) */
  | { kind: 'session'; permission?: Permission }
  /** any signed-in person; a token with the `read` scope may read */
  | { kind: 'signed-in' }
  /** whoever holds the share link in the path; nothing else is needed or used */
  | { kind: 'share-link' }
  /** loopback callers, or an administrator's API token */
  | { kind: 'metrics' };

export interface BodyDoc {
  /** content type → schema (zod) or a note for raw bodies */
  content: Record<string, z.ZodType | { raw: string }>;
  required?: boolean;
}

export interface ResponseDoc {
  description: string;
  /** JSON answers: the zod schema; other answers: their content type and a note */
  schema?: z.ZodType;
  contentType?: string;
  /** Server-Sent Events: event name → data schema */
  events?: Record<string, z.ZodType>;
  headers?: Record<string, string>;
}

export interface RouteDoc {
  method: Method;
  /** OpenAPI style: `/api/tests/{id}` */
  path: string;
  area: Area;
  summary: string;
  description?: string;
  access: Access;
  /** path parameters (default: every `{name}` from `pathParams` below) */
  query?: z.ZodObject;
  headers?: Record<string, { description: string; schema: z.ZodType }>;
  body?: BodyDoc;
  responses: Record<number, ResponseDoc>;
  /** error answers besides the ones the access and parameters imply (400, 401, 403, 404, 503) */
  errors?: number[];
}

export const areas = [
  'Service',
  'Vessels and materials',
  'Tests and plans',
  'Logs and reductions',
  'Live test mode',
  'Review and release',
  'Exports and time history',
  'Inspector share links',
  'Audit',
  'Account and API tokens',
  'Administration',
  'Password links',
  'API description',
] as const;
export type Area = (typeof areas)[number];

/** The schema of each kind of path parameter, by its name in the path. */
export const pathParams: Record<string, z.ZodType> = {
  id: req.idPathParam,
  token: req.shareTokenPathParam,
  sessionId: live.liveSessionIdParam,
  n: live.liveChunkNumberParam,
};

const read = (permission: Permission = 'read'): Access => ({ kind: 'permission', permission });
const write = (permission: Permission, tokenWrite?: TokenScope): Access =>
  tokenWrite ? { kind: 'permission', permission, tokenWrite } : { kind: 'permission', permission };
const json = (schema: z.ZodType): BodyDoc => ({ content: { 'application/json': schema }, required: true });
const ok = (description: string, schema?: z.ZodType): ResponseDoc =>
  schema ? { description, schema } : { description };
const file = (contentType: string, description: string): ResponseDoc => ({ description, contentType });

const CSV_EXPORT =
  'The summary as CSV: UTF-8 with a BOM, a commented header block, one row per gauge and a rosette section; cells that are not numbers are neutralised against spreadsheet formulas. DRAFT until released.';
const PDF_EXPORT = 'The report as PDF: one strain–pressure figure per gauge; DRAFT on every page until released.';
const SERIES =
  'Compact columns (min and max per bucket, delta-coded whole numbers of each channel’s resolution step). Weak ETag per reduction and window; 304 on If-None-Match.';

const liveEvents: ResponseDoc = {
  description:
    'Server-Sent Events of the live test, each with an `id`; a reconnect with `Last-Event-ID` replays what was missed.',
  contentType: 'text/event-stream',
  events: live.liveEvents,
};
const lastEventId = {
  'Last-Event-ID': {
    description: 'The id of the last event received; missed events are replayed.',
    schema: live.lastEventIdHeader,
  },
};

export const routes: RouteDoc[] = [
  // ── service ──
  {
    method: 'GET',
    path: '/api/health',
    area: 'Service',
    summary: 'Liveness: whether the database and object storage answer.',
    access: { kind: 'anyone' },
    responses: { 200: ok('Both answer.', res.healthAnswer), 503: ok('One of them does not.', res.healthAnswer) },
  },
  {
    method: 'GET',
    path: '/api/ready',
    area: 'Service',
    summary: 'Readiness for a load balancer: database, storage and migrations current, not shutting down.',
    access: { kind: 'anyone' },
    responses: { 200: ok('Ready.', res.readyAnswer), 503: ok('Not ready.', res.readyAnswer) },
  },
  {
    method: 'GET',
    path: '/api/metrics',
    area: 'Service',
    summary: 'Prometheus metrics: requests per route, latency, queue depth, job durations, outbox backlog.',
    access: { kind: 'metrics' },
    responses: { 200: file('text/plain', 'Prometheus text exposition format.') },
  },

  // ── vessels and materials ──
  {
    method: 'GET',
    path: '/api/vessels',
    area: 'Vessels and materials',
    summary: 'Vessels, one page at a time (geometry in SI, mm).',
    access: read(),
    query: req.pageQuery,
    responses: { 200: ok('A page of vessels.', res.lists.vessels) },
  },
  {
    method: 'POST',
    path: '/api/vessels',
    area: 'Vessels and materials',
    summary: 'Create a vessel.',
    access: write('plan'),
    body: json(req.vesselBody),
    responses: { 201: ok('Created.', res.created) },
    errors: [409],
  },
  {
    method: 'GET',
    path: '/api/vessels/{id}',
    area: 'Vessels and materials',
    summary: 'One vessel.',
    access: read(),
    responses: { 200: ok('The vessel.', res.vessel) },
  },
  {
    method: 'PATCH',
    path: '/api/vessels/{id}',
    area: 'Vessels and materials',
    summary: 'Change fields of a vessel; the merged vessel is validated as a whole.',
    access: write('plan'),
    body: json(req.vesselPatchBody),
    responses: { 200: ok('The vessel as stored now.', res.vessel) },
    errors: [409],
  },
  {
    method: 'GET',
    path: '/api/materials',
    area: 'Vessels and materials',
    summary: 'Materials, one page at a time.',
    access: read(),
    query: req.pageQuery,
    responses: { 200: ok('A page of materials.', res.lists.materials) },
  },
  {
    method: 'POST',
    path: '/api/materials',
    area: 'Vessels and materials',
    summary: 'Create a material (moduli and strengths in MPa).',
    access: write('plan'),
    body: json(req.materialBody),
    responses: { 201: ok('Created.', res.created) },
  },
  {
    method: 'GET',
    path: '/api/materials/{id}',
    area: 'Vessels and materials',
    summary: 'One material.',
    access: read(),
    responses: { 200: ok('The material.', res.material) },
  },
  {
    method: 'PATCH',
    path: '/api/materials/{id}',
    area: 'Vessels and materials',
    summary: 'Change fields of a material.',
    access: write('plan'),
    body: json(req.materialPatchBody),
    responses: { 200: ok('The material as stored now.', res.material) },
  },

  // ── tests and plans ──
  {
    method: 'GET',
    path: '/api/tests',
    area: 'Tests and plans',
    summary: 'Tests, filtered by status and vessel, one page at a time.',
    access: read(),
    query: req.testListQuery,
    responses: { 200: ok('A page of tests.', res.lists.tests) },
  },
  {
    method: 'POST',
    path: '/api/tests',
    area: 'Tests and plans',
    summary: 'Create a test from a plan; its vessel and material are created or matched.',
    access: write('plan'),
    body: json(req.testCreateBody),
    responses: { 201: ok('Created.', res.created) },
    errors: [422],
  },
  {
    method: 'GET',
    path: '/api/tests/{id}',
    area: 'Tests and plans',
    summary: 'A test’s summary: status, vessel, material, owner, logs, current reduction.',
    access: read(),
    responses: { 200: ok('The test.', res.testSummary) },
  },
  {
    method: 'PATCH',
    path: '/api/tests/{id}',
    area: 'Tests and plans',
    summary: 'Rename a test.',
    access: write('plan'),
    body: json(req.testPatchBody),
    responses: { 200: ok('Renamed.', res.testRenamed) },
    errors: [409],
  },
  {
    method: 'GET',
    path: '/api/tests/{id}/plan',
    area: 'Tests and plans',
    summary: 'The plan exactly as imported or last saved (DESIGN 4.1).',
    access: read(),
    responses: { 200: ok('The plan.', req.planBody) },
  },
  {
    method: 'PUT',
    path: '/api/tests/{id}/plan',
    area: 'Tests and plans',
    summary: 'Replace the plan; 422 lists every problem. A change after a reduction returns the test to logging.',
    access: write('plan'),
    body: json(req.planBody),
    responses: { 200: ok('Saved.', res.planSaved) },
    errors: [409, 422],
  },
  {
    method: 'GET',
    path: '/api/tests/{id}/record',
    area: 'Tests and plans',
    summary: 'The whole record: result with dispositions, signatures, logs (the frozen record once released).',
    access: read(),
    responses: { 200: ok('The record.', res.record) },
  },
  {
    method: 'GET',
    path: '/api/tests/{id}/notes',
    area: 'Tests and plans',
    summary: 'The test’s notes (pressure held, leak seen, gauge re-zeroed…).',
    access: read(),
    responses: { 200: ok('The notes.', res.lists.notes) },
  },
  {
    method: 'POST',
    path: '/api/tests/{id}/notes',
    area: 'Tests and plans',
    summary: 'Add a note. Not a token scope: sign in to write notes.',
    access: write('upload'),
    body: json(req.noteBody),
    responses: { 201: ok('Added.', res.created) },
    errors: [409],
  },

  // ── logs and reductions ──
  {
    method: 'GET',
    path: '/api/tests/{id}/logs',
    area: 'Logs and reductions',
    summary: 'The test’s logs with size, rows, time span, SHA-256 and header preview.',
    access: read(),
    responses: { 200: ok('The logs.', res.lists.logs) },
  },
  {
    method: 'POST',
    path: '/api/tests/{id}/logs',
    area: 'Logs and reductions',
    summary:
      'Upload a log: multipart field `file`, or a raw text/csv body. The same bytes twice give the existing log.',
    description:
      'The head of the file is checked against the plan before anything is stored; the bytes stream to object storage and the SHA-256 is recorded. A refused upload stores nothing.',
    access: write('upload', 'upload'),
    body: {
      required: true,
      content: {
        'multipart/form-data': { raw: 'A form with the log in the field `file`.' },
        'text/csv': { raw: 'The log itself: delimited text, preamble and header lines allowed.' },
      },
    },
    responses: {
      201: ok('Stored.', res.logUploaded),
      200: ok('The same bytes were stored before: that log.', res.logUploaded),
    },
    errors: [409, 413, 422],
  },
  {
    method: 'GET',
    path: '/api/tests/{id}/reductions',
    area: 'Logs and reductions',
    summary: 'Every reduction of the test, newest first.',
    access: read(),
    responses: { 200: ok('The reductions.', res.lists.reductions) },
  },
  {
    method: 'POST',
    path: '/api/tests/{id}/reductions',
    area: 'Logs and reductions',
    summary: 'Queue a reduction of every log with the current plan.',
    access: write('upload', 'upload'),
    responses: {
      202: {
        description: 'Queued; poll the reduction.',
        schema: res.created,
        headers: { Location: '/api/reductions/{id}' },
      },
    },
    errors: [409],
  },
  {
    method: 'GET',
    path: '/api/reductions/{id}',
    area: 'Logs and reductions',
    summary: 'A reduction: status, progress 0–1, and the result (DESIGN 4.2) when done.',
    access: read(),
    responses: { 200: ok('The reduction.', res.reductionAnswer) },
  },

  // ── live test mode (DESIGN 8) ──
  {
    method: 'POST',
    path: '/api/tests/{id}/live',
    area: 'Live test mode',
    summary: 'Open a live session for the running log; one open session per test.',
    access: write('upload', 'upload'),
    responses: { 201: ok('Opened.', live.liveSessionCreated) },
    errors: [409],
  },
  {
    method: 'PUT',
    path: '/api/tests/{id}/live/{sessionId}/chunks/{n}',
    area: 'Live test mode',
    summary: 'Send chunk n (from 1): consecutive byte ranges of one log; a chunk may end mid-line.',
    description:
      'The first chunk holds the preamble and header. The same n with the same bytes again answers 200 (a retry after a lost answer); the same n with other bytes, or an n past the next expected one, answers 409 with `details.expected`. Chunks are kept in object storage as they arrive.',
    access: write('upload', 'upload'),
    body: { required: true, content: { 'text/csv': { raw: 'The next bytes of the log, raw.' } } },
    responses: {
      201: ok('Stored.', live.liveChunkStored),
      200: ok('The same bytes under this number were stored before.', live.liveChunkStored),
    },
    errors: [409, 413, 422],
  },
  {
    method: 'POST',
    path: '/api/tests/{id}/live/{sessionId}/finish',
    area: 'Live test mode',
    summary: 'Finish: the chunks become one stored log (SHA-256 of the whole) and a reduction is queued.',
    access: write('upload', 'upload'),
    responses: { 201: ok('Stored and queued.', live.liveFinished) },
    errors: [409, 422],
  },
  {
    method: 'DELETE',
    path: '/api/tests/{id}/live/{sessionId}',
    area: 'Live test mode',
    summary: 'Abandon the session and its chunks.',
    access: write('upload', 'upload'),
    responses: { 200: ok('Abandoned.', live.liveAbandoned) },
    errors: [409],
  },
  {
    method: 'GET',
    path: '/api/tests/{id}/live/events',
    area: 'Live test mode',
    summary: 'Follow the live test: each hold as it completes, early warnings, status, finish.',
    access: read(),
    headers: lastEventId,
    responses: { 200: liveEvents },
  },
  {
    method: 'GET',
    path: '/api/share/{token}/live/events',
    area: 'Live test mode',
    summary: 'The same events for the holder of an inspector share link.',
    access: { kind: 'share-link' },
    headers: lastEventId,
    responses: { 200: liveEvents },
    errors: [405, 410],
  },

  // ── review and release ──
  {
    method: 'GET',
    path: '/api/tests/{id}/dispositions',
    area: 'Review and release',
    summary: 'The latest disposition per gauge of the current reduction, and every one made.',
    access: read(),
    responses: { 200: ok('Dispositions.', res.dispositions) },
  },
  {
    method: 'POST',
    path: '/api/tests/{id}/dispositions',
    area: 'Review and release',
    summary: 'Disposition a flagged gauge: accepted, excluded or retest, with the reason.',
    access: write('disposition'),
    body: json(req.dispositionBody),
    responses: { 201: ok('Recorded; the verdict as it is now.', res.dispositionDone) },
    errors: [409, 422],
  },
  {
    method: 'POST',
    path: '/api/tests/{id}/review',
    area: 'Review and release',
    summary: 'Sign the engineering review, in person: a browser session and the password again.',
    access: { kind: 'session', permission: 'review' },
    body: json(req.signatureBody),
    responses: { 201: ok('Signed.', res.signed) },
    errors: [409, 429],
  },
  {
    method: 'POST',
    path: '/api/tests/{id}/release',
    area: 'Review and release',
    summary: 'Release a reviewed test, in person; it is locked and its record frozen from then on.',
    access: { kind: 'session', permission: 'release' },
    body: json(req.signatureBody),
    responses: { 201: ok('Released.', res.signed) },
    errors: [409, 429],
  },

  // ── exports and time history ──
  {
    method: 'GET',
    path: '/api/tests/{id}/export.csv',
    area: 'Exports and time history',
    summary: 'The summary as CSV.',
    access: read(),
    responses: { 200: file('text/csv', CSV_EXPORT) },
    errors: [409],
  },
  {
    method: 'GET',
    path: '/api/tests/{id}/export.pdf',
    area: 'Exports and time history',
    summary: 'The report as PDF.',
    access: read(),
    responses: { 200: file('application/pdf', PDF_EXPORT) },
    errors: [409],
  },
  {
    method: 'GET',
    path: '/api/tests/{id}/series',
    area: 'Exports and time history',
    summary: 'The time history, decimated to at most `points` per channel, keeping each bucket’s min and max.',
    access: read(),
    query: req.seriesQuery,
    responses: { 200: file('application/json', SERIES), 304: { description: 'Not modified (If-None-Match).' } },
    errors: [409, 422],
  },

  // ── inspector share links ──
  {
    method: 'GET',
    path: '/api/tests/{id}/share-links',
    area: 'Inspector share links',
    summary: 'The test’s share links.',
    access: read('share'),
    responses: { 200: ok('The links.', res.lists.shareLinks) },
  },
  {
    method: 'POST',
    path: '/api/tests/{id}/share-links',
    area: 'Inspector share links',
    summary: 'Make a read-only link for an inspector (14 days unless given, at most 90); with `email` it is e-mailed.',
    access: write('share'),
    body: json(req.shareLinkBody),
    responses: { 201: ok('Created; the URL is in this answer only.', res.shareLinkCreated) },
  },
  {
    method: 'DELETE',
    path: '/api/share-links/{id}',
    area: 'Inspector share links',
    summary: 'Revoke a share link; it answers 410 from now on.',
    access: write('share'),
    responses: { 200: ok('Revoked.', res.revoked) },
    errors: [409],
  },
  {
    method: 'GET',
    path: '/api/share/{token}',
    area: 'Inspector share links',
    summary: 'The shared test’s record, read-only, without staff e-mail addresses. Any other method answers 405.',
    access: { kind: 'share-link' },
    responses: { 200: ok('The record.', res.shareRecord) },
    errors: [405, 410],
  },
  {
    method: 'GET',
    path: '/api/share/{token}/export.csv',
    area: 'Inspector share links',
    summary: 'The summary as CSV, for the link’s holder (the e-mail column left empty).',
    access: { kind: 'share-link' },
    responses: { 200: file('text/csv', CSV_EXPORT) },
    errors: [405, 409, 410],
  },
  {
    method: 'GET',
    path: '/api/share/{token}/export.pdf',
    area: 'Inspector share links',
    summary: 'The report as PDF, for the link’s holder.',
    access: { kind: 'share-link' },
    responses: { 200: file('application/pdf', PDF_EXPORT) },
    errors: [405, 409, 410],
  },
  {
    method: 'GET',
    path: '/api/share/{token}/series',
    area: 'Inspector share links',
    summary: 'The time history of the current reduction, for the link’s holder (always revalidated).',
    access: { kind: 'share-link' },
    query: req.seriesQuery,
    responses: { 200: file('application/json', SERIES), 304: { description: 'Not modified (If-None-Match).' } },
    errors: [405, 409, 410, 422],
  },

  // ── audit ──
  {
    method: 'GET',
    path: '/api/tests/{id}/audit',
    area: 'Audit',
    summary: 'Every event of the test, newest first.',
    access: read('audit'),
    query: req.pageQuery,
    responses: { 200: ok('A page of events.', res.lists.audit) },
  },
  {
    method: 'GET',
    path: '/api/tests/{id}/audit/verify',
    area: 'Audit',
    summary: 'The test’s audit hash chain checked end to end, and a released test’s frozen record against its hash.',
    access: read('audit'),
    responses: { 200: ok('The check.', res.auditVerify) },
  },

  // ── account and API tokens ──
  {
    method: 'GET',
    path: '/api/account/tokens',
    area: 'Account and API tokens',
    summary: 'Your own API tokens (never the tokens themselves).',
    access: { kind: 'signed-in' },
    responses: { 200: ok('Your tokens.', res.lists.tokens) },
  },
  {
    method: 'POST',
    path: '/api/account/tokens',
    area: 'Account and API tokens',
    summary: 'Make an API token (scopes read, upload; 90 days unless given, at most 365). A token cannot make tokens.',
    access: { kind: 'session' },
    body: json(req.tokenBody),
    responses: { 201: ok('Created; the token is in this answer only.', res.apiTokenCreated) },
  },
  {
    method: 'DELETE',
    path: '/api/account/tokens/{id}',
    area: 'Account and API tokens',
    summary: 'Revoke one of your own tokens.',
    access: { kind: 'session' },
    responses: { 200: ok('Revoked.', res.revoked) },
  },

  // ── administration ──
  {
    method: 'GET',
    path: '/api/admin/users',
    area: 'Administration',
    summary: 'Every account.',
    access: read('users'),
    responses: { 200: ok('The accounts.', res.lists.users) },
  },
  {
    method: 'POST',
    path: '/api/admin/users',
    area: 'Administration',
    summary: 'Invite a person: they get an e-mail with a one-time link to choose their own password.',
    access: write('users'),
    body: json(req.inviteBody),
    responses: { 201: ok('Invited.', res.invited) },
    errors: [409],
  },
  {
    method: 'PATCH',
    path: '/api/admin/users/{id}',
    area: 'Administration',
    summary: 'Change a role, or disable / re-enable an account (disabling ends its sessions at once).',
    access: write('users'),
    body: json(req.userPatchBody),
    responses: { 200: ok('Changed.', res.userUpdated) },
    errors: [409],
  },
  {
    method: 'POST',
    path: '/api/admin/users/{id}/password-reset',
    area: 'Administration',
    summary: 'E-mail the person a link to choose a new password.',
    access: write('users'),
    responses: { 202: ok('Sent.', res.sent) },
    errors: [429],
  },
  {
    method: 'GET',
    path: '/api/admin/tokens',
    area: 'Administration',
    summary: 'Every account’s API tokens (never the tokens themselves).',
    access: read('users'),
    responses: { 200: ok('The tokens.', res.lists.tokens) },
  },
  {
    method: 'DELETE',
    path: '/api/admin/tokens/{id}',
    area: 'Administration',
    summary: 'Revoke anyone’s API token at once.',
    access: write('users'),
    responses: { 200: ok('Revoked.', res.revoked) },
  },

  // ── password links ──
  {
    method: 'POST',
    path: '/api/password/forgot',
    area: 'Password links',
    summary: 'Ask for a reset link; the answer is 202 whether or not the address has an account.',
    access: { kind: 'anyone' },
    body: json(req.passwordForgotBody),
    responses: { 202: ok('Accepted.', res.accepted) },
    errors: [429],
  },
  {
    method: 'POST',
    path: '/api/password/set',
    area: 'Password links',
    summary: 'Choose the account’s password with a one-time link (invitation or reset).',
    access: { kind: 'anyone' },
    body: json(req.passwordSetBody),
    responses: { 200: ok('Set; sign in with it.', res.passwordSet) },
    errors: [404, 410, 422],
  },

  // ── this description ──
  {
    method: 'GET',
    path: '/api/openapi.json',
    area: 'API description',
    summary: 'This API as an OpenAPI 3.1 document, generated from the endpoints’ own zod schemas.',
    access: { kind: 'anyone' },
    responses: {
      200: file('application/json', 'The OpenAPI 3.1 document (ETag; 304 on If-None-Match).'),
      304: { description: 'Not modified.' },
    },
  },
  {
    method: 'GET',
    path: '/api/docs',
    area: 'API description',
    summary: 'This API as a readable page.',
    access: { kind: 'anyone' },
    responses: { 200: file('text/html', 'The page.') },
  },
];

/** The roles that may call a route (every role for `signed-in`; none needed for the others). */
export function rolesOf(access: Access): readonly Role[] | null {
  switch (access.kind) {
    case 'permission':
      return rolesFor(access.permission);
    case 'session':
      return access.permission ? rolesFor(access.permission) : roles;
    case 'signed-in':
      return roles;
    case 'metrics':
      return ['admin'];
    default:
      return null;
  }
}

/** Which API-token scope lets a token call the route; null when tokens are refused or not used. */
export function tokenScopeOf(route: Pick<RouteDoc, 'method' | 'access'>): TokenScope | null {
  const a = route.access;
  if (a.kind === 'signed-in') return route.method === 'GET' ? 'read' : null;
  if (a.kind !== 'permission') return null;
  return route.method === 'GET' ? 'read' : (a.tokenWrite ?? null);
}

/** One line on who may call a route and how, for the page and the OpenAPI description. */
export function whoMayCall(route: Pick<RouteDoc, 'method' | 'access'>): string {
  const a = route.access;
  const scope = tokenScopeOf(route);
  const token = scope ? `; or an API token with the \`${scope}\` scope` : '; API tokens are refused';
  switch (a.kind) {
    case 'anyone':
      return 'Anyone; no credentials needed.';
    case 'share-link':
      return 'Whoever holds the share link in the path (no account); 410 once it expired or was revoked.';
    case 'metrics':
      return 'Requests from this machine (loopback, not through a proxy), or an administrator’s API token.';
    case 'session':
      return `${(rolesOf(a) ?? []).join(', ')}, signed in with the browser (session cookie); never an API token.`;
    case 'signed-in':
      return `Any signed-in person (session cookie)${token}.`;
    case 'permission':
      return `${rolesFor(a.permission).join(', ')} (session cookie)${token}.`;
  }
}

/** The names of a path's parameters: `/api/tests/{id}/live/{sessionId}` → id, sessionId. */
export function pathParamNames(path: string): string[] {
  return [...path.matchAll(/\{(\w+)\}/g)].map((m) => m[1]!);
}

/** Look a route up (for tests and for the endpoints that want their own entry). */
export function findRoute(method: Method, path: string): RouteDoc | undefined {
  return routes.find((r) => r.method === method && r.path === path);
}
