// Who may call what: every API route and method, asked by an anonymous caller, each role
// (signed in), API tokens of each scope and a share-link token. The expected answers are written
// here from the contract (DESIGN §1: the roles; §5: tokens carry scopes — `upload` for logs, live
// sessions and reductions, `read` for every GET — and can neither create tokens nor sign; a share
// link reads one test and nothing else) and never read from the code's own permission table.
//   ok  the request passed authorisation (whatever the handler then said, never 401, 403 or 5xx)
//   401 not signed in (or a credential that is not one)      403 signed in, but not allowed
import { beforeAll, describe, expect, it } from 'vitest';
import { readdirSync, statSync } from 'node:fs';
import path from 'node:path';
import { Client, signedIn } from './support/http';

type Who =
  | 'anon'
  | 'technician'
  | 'engineer'
  | 'qa'
  | 'admin'
  | 'adminReadToken'
  | 'adminUploadToken'
  | 'engineerToken'
  | 'qaToken'
  | 'shareToken';
const WHO: Who[] = [
  'anon',
  'technician',
  'engineer',
  'qa',
  'admin',
  'adminReadToken',
  'adminUploadToken',
  'engineerToken',
  'qaToken',
  'shareToken',
];
type Cell = 'ok' | 401 | 403 | 405;
const ok = 'ok' as const;

// Routes use :test, :vessel, :material, :share, :none (an id that does not exist); bodies are
// left invalid on purpose, so an allowed write changes nothing and answers 4xx from the handler.
//                                                  anon  tech  eng   qa    admin tkRd  tkUp  tkEng tkQa  share
const MATRIX: [method: string, route: string, body: unknown, ...cells: Cell[]][] = [
  ['GET', '/api/health', undefined, ok, ok, ok, ok, ok, ok, ok, ok, ok, 401],
  ['GET', '/api/ready', undefined, ok, ok, ok, ok, ok, ok, ok, ok, ok, 401],
  // metrics: this machine (the matrix asks from loopback) or an admin token; proxied callers in read-path.test.ts
  ['GET', '/api/metrics', undefined, ok, ok, ok, ok, ok, ok, ok, ok, ok, 401],
  // vessels, materials, tests, plans — read: all; write: engineer (admin may do all but sign)
  ['GET', '/api/vessels', undefined, 401, ok, ok, ok, ok, ok, 403, ok, ok, 401],
  ['POST', '/api/vessels', {}, 401, 403, ok, 403, ok, 403, 403, 403, 403, 401],
  ['GET', '/api/vessels/:vessel', undefined, 401, ok, ok, ok, ok, ok, 403, ok, ok, 401],
  ['PATCH', '/api/vessels/:vessel', { tag: '' }, 401, 403, ok, 403, ok, 403, 403, 403, 403, 401],
  ['GET', '/api/materials', undefined, 401, ok, ok, ok, ok, ok, 403, ok, ok, 401],
  ['POST', '/api/materials', {}, 401, 403, ok, 403, ok, 403, 403, 403, 403, 401],
  ['GET', '/api/materials/:material', undefined, 401, ok, ok, ok, ok, ok, 403, ok, ok, 401],
  ['PATCH', '/api/materials/:material', { poissonRatio: 5 }, 401, 403, ok, 403, ok, 403, 403, 403, 403, 401],
  ['GET', '/api/tests', undefined, 401, ok, ok, ok, ok, ok, 403, ok, ok, 401],
  ['POST', '/api/tests', {}, 401, 403, ok, 403, ok, 403, 403, 403, 403, 401],
  ['GET', '/api/tests/:test', undefined, 401, ok, ok, ok, ok, ok, 403, ok, ok, 401],
  ['PATCH', '/api/tests/:test', {}, 401, 403, ok, 403, ok, 403, 403, 403, 403, 401],
  ['GET', '/api/tests/:test/plan', undefined, 401, ok, ok, ok, ok, ok, 403, ok, ok, 401],
  ['PUT', '/api/tests/:test/plan', 'not a plan', 401, 403, ok, 403, ok, 403, 403, 403, 403, 401],
  ['GET', '/api/tests/:test/record', undefined, 401, ok, ok, ok, ok, ok, 403, ok, ok, 401],
  // logs and reductions — technician+ (QA only reads); tokens with the upload scope
  ['GET', '/api/tests/:test/logs', undefined, 401, ok, ok, ok, ok, ok, 403, ok, ok, 401],
  ['POST', '/api/tests/:test/logs', '', 401, ok, ok, 403, ok, 403, ok, ok, 403, 401],
  ['GET', '/api/tests/:test/reductions', undefined, 401, ok, ok, ok, ok, ok, 403, ok, ok, 401],
  ['POST', '/api/tests/:test/reductions', {}, 401, ok, ok, 403, ok, 403, ok, ok, 403, 401],
  ['GET', '/api/reductions/:none', undefined, 401, ok, ok, ok, ok, ok, 403, ok, ok, 401],
  ['GET', '/api/tests/:test/series', undefined, 401, ok, ok, ok, ok, ok, 403, ok, ok, 401],
  // live test mode — writes like logs (technician+, token scope upload); the event stream like every GET
  ['POST', '/api/tests/:test/live', {}, 401, ok, ok, 403, ok, 403, ok, ok, 403, 401],
  [
    'PUT',
    '/api/tests/:test/live/:none/chunks/:chunk',
    'time_s,P [MPa],SG1',
    401,
    ok,
    ok,
    403,
    ok,
    403,
    ok,
    ok,
    403,
    401,
  ],
  ['POST', '/api/tests/:test/live/:none/finish', {}, 401, ok, ok, 403, ok, 403, ok, ok, 403, 401],
  ['DELETE', '/api/tests/:test/live/:none', undefined, 401, ok, ok, 403, ok, 403, ok, ok, 403, 401],
  ['GET', '/api/tests/:test/live/events', undefined, 401, ok, ok, ok, ok, ok, 403, ok, ok, 401],
  // test notes — technicians (and so engineers and admins); not a token scope
  ['GET', '/api/tests/:test/notes', undefined, 401, ok, ok, ok, ok, ok, 403, ok, ok, 401],
  ['POST', '/api/tests/:test/notes', {}, 401, ok, ok, 403, ok, 403, 403, 403, 403, 401],
  // dispositions — engineer (admin too); signatures — the engineer's and QA's own, never a token
  ['GET', '/api/tests/:test/dispositions', undefined, 401, ok, ok, ok, ok, ok, 403, ok, ok, 401],
  ['POST', '/api/tests/:test/dispositions', {}, 401, 403, ok, 403, ok, 403, 403, 403, 403, 401],
  ['POST', '/api/tests/:test/review', {}, 401, 403, ok, 403, 403, 403, 403, 403, 403, 401],
  ['POST', '/api/tests/:test/release', {}, 401, 403, 403, ok, 403, 403, 403, 403, 403, 401],
  // exports — all, and the share link (its own routes below)
  ['GET', '/api/tests/:test/export.csv', undefined, 401, ok, ok, ok, ok, ok, 403, ok, ok, 401],
  ['GET', '/api/tests/:test/export.pdf', undefined, 401, ok, ok, ok, ok, ok, 403, ok, ok, 401],
  // share links — qa (admin too)
  ['GET', '/api/tests/:test/share-links', undefined, 401, 403, 403, ok, ok, ok, 403, 403, ok, 401],
  ['POST', '/api/tests/:test/share-links', { expiresInDays: 0 }, 401, 403, 403, ok, ok, 403, 403, 403, 403, 401],
  ['DELETE', '/api/share-links/:none', undefined, 401, 403, 403, ok, ok, 403, 403, 403, 403, 401],
  // audit trail — qa, admin
  ['GET', '/api/tests/:test/audit', undefined, 401, 403, 403, ok, ok, ok, 403, 403, ok, 401],
  ['GET', '/api/tests/:test/audit/verify', undefined, 401, 403, 403, ok, ok, ok, 403, 403, ok, 401],
  // one's own API tokens — any signed-in person; a token can read the list but never make or revoke one
  ['GET', '/api/account/tokens', undefined, 401, ok, ok, ok, ok, ok, 403, ok, ok, 401],
  ['POST', '/api/account/tokens', {}, 401, ok, ok, ok, ok, 403, 403, 403, 403, 401],
  ['DELETE', '/api/account/tokens/:none', undefined, 401, ok, ok, ok, ok, 403, 403, 403, 403, 401],
  // users and everyone's tokens — admin
  ['GET', '/api/admin/users', undefined, 401, 403, 403, 403, ok, ok, 403, 403, 403, 401],
  ['POST', '/api/admin/users', {}, 401, 403, 403, 403, ok, 403, 403, 403, 403, 401],
  ['PATCH', '/api/admin/users/:none', {}, 401, 403, 403, 403, ok, 403, 403, 403, 403, 401],
  ['POST', '/api/admin/users/:none/password-reset', {}, 401, 403, 403, 403, ok, 403, 403, 403, 403, 401],
  ['GET', '/api/admin/tokens', undefined, 401, 403, 403, 403, ok, ok, 403, 403, 403, 401],
  ['DELETE', '/api/admin/tokens/:none', undefined, 401, 403, 403, 403, ok, 403, 403, 403, 403, 401],
  // password links — anyone (the link itself is the credential)
  ['POST', '/api/password/forgot', {}, ok, ok, ok, ok, ok, ok, ok, ok, ok, 401],
  ['POST', '/api/password/set', {}, ok, ok, ok, ok, ok, ok, ok, ok, ok, 401],
  // the inspector's link: whoever holds it reads that one test; any other method answers 405
  ['GET', '/api/share/:share', undefined, ok, ok, ok, ok, ok, ok, ok, ok, ok, ok],
  ['POST', '/api/share/:share', {}, 405, 405, 405, 405, 405, 405, 405, 405, 405, 405],
  ['GET', '/api/share/:share/export.csv', undefined, ok, ok, ok, ok, ok, ok, ok, ok, ok, ok],
  ['GET', '/api/share/:share/export.pdf', undefined, ok, ok, ok, ok, ok, ok, ok, ok, ok, ok],
  ['DELETE', '/api/share/:share/export.pdf', undefined, 405, 405, 405, 405, 405, 405, 405, 405, 405, 405],
  ['GET', '/api/share/:share/series', undefined, ok, ok, ok, ok, ok, ok, ok, ok, ok, ok],
  // the API description — anyone (a share-link token sent as a Bearer token is not a credential)
  ['GET', '/api/openapi.json', undefined, ok, ok, ok, ok, ok, ok, ok, ok, ok, 401],
  ['GET', '/api/docs', undefined, ok, ok, ok, ok, ok, ok, ok, ok, ok, 401],
  ['GET', '/api/share/:share/live/events', undefined, ok, ok, ok, ok, ok, ok, ok, ok, ok, ok],
  ['POST', '/api/share/:share/live/events', {}, 405, 405, 405, 405, 405, 405, 405, 405, 405, 405],
];

const clients = {} as Record<Who, Client>;
const ids = { test: 0, vessel: 0, material: 0, share: '', none: 987654321 };

const plan = {
  units: 'SI',
  vessel: { shape: 'cylinder', ends: 'closed', insideDiameter: 800, wallThickness: 8, length: 2000 },
  material: { name: 'matrix steel', elasticModulus: 200_000, poissonRatio: 0.3, yieldStrength: 260 },
  testPressure: 2,
  columns: { pressure: 'P [MPa]' },
  gauges: [{ id: 'H1', kind: 'uniaxial', channels: ['SG1'], angleDeg: 90 }],
};

async function token(c: Client, name: string, scopes: string[]) {
  const r = await c.json('/api/account/tokens', { method: 'POST', json: { name, scopes } });
  expect(r.status).toBe(201);
  return Client.withToken(r.body.token);
}

beforeAll(async () => {
  clients.anon = new Client();
  for (const r of ['technician', 'engineer', 'qa', 'admin'] as const) clients[r] = await signedIn(`${r}@example.com`);
  clients.adminReadToken = await token(clients.admin, 'matrix read', ['read']);
  clients.adminUploadToken = await token(clients.admin, 'matrix upload', ['upload']);
  clients.engineerToken = await token(clients.engineer, 'matrix engineer', ['read', 'upload']);
  clients.qaToken = await token(clients.qa, 'matrix qa', ['read', 'upload']);
  ids.test = (
    await clients.engineer.json('/api/tests', { method: 'POST', json: { name: 'Route matrix', plan } })
  ).body.id;
  const t = (await clients.engineer.json(`/api/tests/${ids.test}`)).body;
  ids.vessel = t.vessel.id;
  ids.material = t.material.id;
  const link = await clients.qa.json(`/api/tests/${ids.test}/share-links`, { method: 'POST', json: {} });
  ids.share = link.body.url.split('/share/')[1];
  // a share-link token presented as if it were an API token
  clients.shareToken = Client.withToken(ids.share);
});

const fill = (route: string) =>
  route
    .replace(':test', String(ids.test))
    .replace(':vessel', String(ids.vessel))
    .replace(':material', String(ids.material))
    .replace(':share', ids.share)
    .replace(':none', String(ids.none))
    .replace(':chunk', '1');

describe('every API route × every kind of caller', () => {
  it.each(MATRIX)('%s %s', async (method, route, body, ...cells) => {
    const got: Record<string, number> = {};
    const want: Record<string, Cell> = {};
    for (const [i, who] of WHO.entries()) {
      // the share-link holder uses the link on its own routes, and has nothing else
      const c = who === 'shareToken' && route.startsWith('/api/share/') ? clients.anon : clients[who];
      const init: RequestInit & { json?: unknown } = { method };
      if (typeof body === 'string') {
        init.body = body;
        const csv = route.endsWith('/logs') || route.includes('/chunks/');
        init.headers = { 'content-type': csv ? 'text/csv' : 'application/json' };
        if (!csv) init.body = JSON.stringify(body);
      } else if (body !== undefined) init.json = body;
      const res = await c.fetch(fill(route), init);
      // an event stream stays open: its status is the answer
      if (res.headers.get('content-type')?.startsWith('text/event-stream')) await res.body?.cancel();
      else await res.arrayBuffer();
      const cell = cells[i]!;
      want[who] = cell;
      got[who] = res.status;
    }
    const seen = Object.fromEntries(
      WHO.map((w) => [w, want[w] === 'ok' && ![401, 403, 405].includes(got[w]!) && got[w]! < 500 ? 'ok' : got[w]]),
    );
    expect(seen).toEqual(want);
  });

  it('lists every API route file in the matrix', () => {
    const root = path.resolve('src/pages/api');
    const files: string[] = [];
    const walk = (dir: string) => {
      for (const f of readdirSync(dir)) {
        const p = path.join(dir, f);
        if (statSync(p).isDirectory()) walk(p);
        else if (f.endsWith('.ts')) files.push(path.relative(root, p));
      }
    };
    walk(root);
    const covered = new Set(MATRIX.map(([, r]) => r.replace('/api/', '').replace(/:\w+/g, '[x]').replace(/\/$/, '')));
    const missing = files
      .map((f) =>
        f
          .replace(/\.ts$/, '')
          .replace(/\/index$/, '')
          .replace(/^index$/, '')
          .replace(/\[[^\]]+\]/g, '[x]'),
      )
      .filter((r) => !covered.has(r));
    expect(missing).toEqual([]);
  });
});
