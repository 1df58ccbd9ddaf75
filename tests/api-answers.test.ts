// The answers the running app gives match the schemas the API description publishes (the very
// zod objects in src/server/api/responses.ts that /api/openapi.json is generated from), so the
// documentation says what the server really sends. No worker runs here: a reduction stays queued.
import { beforeAll, describe, expect, it } from 'vitest';
import type { z } from 'zod';
import { findRoute, type Method } from '../src/server/api/description';
import { Client, signedIn } from './support/http';
import { makeHydrotestCsv } from './support/hydrotest-log';

const plan = {
  units: 'SI',
  vessel: { shape: 'cylinder', ends: 'closed', insideDiameter: 1000, wallThickness: 10, length: 4000 },
  material: { name: 'answers-test steel', elasticModulus: 200_000, poissonRatio: 0.3, yieldStrength: 260 },
  testPressure: 2,
  columns: { time: 'time_s', pressure: 'P [MPa]' },
  gauges: [{ id: 'H1', kind: 'uniaxial', channels: ['SG1'], angleDeg: 90 }],
};
const log = makeHydrotestCsv({
  insideDiameter: 1000,
  wallThickness: 10,
  E: 200_000,
  nu: 0.3,
  testPressure: 2,
  channels: [{ name: 'SG1', angleDeg: 90 }],
});

let engineer: Client;
let qa: Client;
let admin: Client;
const ids = { test: 0, vessel: 0, material: 0, reduction: 0 };

/** The published schema of a route's answer with that status. */
function published(method: Method, path: string, status: number): z.ZodType {
  const schema = findRoute(method, path)?.responses[status]?.schema;
  if (!schema) throw new Error(`${method} ${path} publishes no JSON schema for ${status}`);
  return schema;
}

function expectFits(method: Method, path: string, got: { status: number; body: unknown }) {
  const parsed = published(method, path, got.status).safeParse(got.body);
  expect(parsed.success ? [] : parsed.error.issues, `${method} ${path} → ${got.status}`).toEqual([]);
}

beforeAll(async () => {
  engineer = await signedIn('engineer@example.com');
  qa = await signedIn('qa@example.com');
  admin = await signedIn('admin@example.com');
  const t = await engineer.json('/api/tests', { method: 'POST', json: { name: 'Answers', plan } });
  expect(t.status).toBe(201);
  expectFits('POST', '/api/tests', t);
  ids.test = t.body.id;
});

describe('answers fit their published schemas', () => {
  it('service and catalogue', async () => {
    expectFits('GET', '/api/health', await new Client().json('/api/health'));
    expectFits('GET', '/api/ready', await new Client().json('/api/ready'));
    const summary = await engineer.json(`/api/tests/${ids.test}`);
    expect(summary.status).toBe(200);
    expectFits('GET', '/api/tests/{id}', summary);
    ids.vessel = summary.body.vessel.id;
    ids.material = summary.body.material.id;
    expectFits('GET', '/api/tests', await engineer.json('/api/tests?limit=5&status=draft,logging'));
    expectFits('GET', '/api/vessels', await engineer.json('/api/vessels'));
    expectFits('GET', '/api/vessels/{id}', await engineer.json(`/api/vessels/${ids.vessel}`));
    expectFits('GET', '/api/materials', await engineer.json('/api/materials'));
    expectFits('GET', '/api/materials/{id}', await engineer.json(`/api/materials/${ids.material}`));
    expectFits(
      'PATCH',
      '/api/tests/{id}',
      await engineer.json(`/api/tests/${ids.test}`, { method: 'PATCH', json: { name: 'Answers, renamed' } }),
    );
  });

  it('logs, reductions, notes and the record', async () => {
    const up = await engineer.json(`/api/tests/${ids.test}/logs`, {
      method: 'POST',
      body: log,
      headers: { 'content-type': 'text/csv' },
    });
    expect(up.status).toBe(201);
    expectFits('POST', '/api/tests/{id}/logs', up);
    expectFits('GET', '/api/tests/{id}/logs', await engineer.json(`/api/tests/${ids.test}/logs`));
    const q = await engineer.json(`/api/tests/${ids.test}/reductions`, { method: 'POST' });
    expect(q.status).toBe(202);
    expectFits('POST', '/api/tests/{id}/reductions', q);
    ids.reduction = q.body.id;
    expectFits('GET', '/api/reductions/{id}', await engineer.json(`/api/reductions/${ids.reduction}`));
    expectFits('GET', '/api/tests/{id}/reductions', await engineer.json(`/api/tests/${ids.test}/reductions`));
    const note = await engineer.json(`/api/tests/${ids.test}/notes`, {
      method: 'POST',
      json: { kind: 'pressure-held', body: 'held at 2 MPa' },
    });
    expectFits('POST', '/api/tests/{id}/notes', note);
    expectFits('GET', '/api/tests/{id}/notes', await engineer.json(`/api/tests/${ids.test}/notes`));
    expectFits('GET', '/api/tests/{id}/record', await engineer.json(`/api/tests/${ids.test}/record`));
    expectFits('GET', '/api/tests/{id}/dispositions', await engineer.json(`/api/tests/${ids.test}/dispositions`));
  });

  it('share links, audit, tokens and accounts', async () => {
    const link = await qa.json(`/api/tests/${ids.test}/share-links`, { method: 'POST', json: {} });
    expect(link.status).toBe(201);
    expectFits('POST', '/api/tests/{id}/share-links', link);
    expectFits('GET', '/api/tests/{id}/share-links', await qa.json(`/api/tests/${ids.test}/share-links`));
    const token = String(link.body.url).split('/share/')[1]!;
    expectFits('GET', '/api/share/{token}', await new Client().json(`/api/share/${token}`));
    expectFits('GET', '/api/tests/{id}/audit', await qa.json(`/api/tests/${ids.test}/audit`));
    expectFits('GET', '/api/tests/{id}/audit/verify', await qa.json(`/api/tests/${ids.test}/audit/verify`));
    const made = await engineer.json('/api/account/tokens', { method: 'POST', json: { name: 'answers' } });
    expect(made.status).toBe(201);
    expectFits('POST', '/api/account/tokens', made);
    expectFits('GET', '/api/account/tokens', await engineer.json('/api/account/tokens'));
    expectFits('GET', '/api/admin/tokens', await admin.json('/api/admin/tokens'));
    expectFits('GET', '/api/admin/users', await admin.json('/api/admin/users'));
    expectFits(
      'DELETE',
      '/api/account/tokens/{id}',
      await engineer.json(`/api/account/tokens/${made.body.id}`, { method: 'DELETE' }),
    );
  });

  it('errors fit the published envelope', async () => {
    const { errorEnvelope } = await import('../src/server/api/responses');
    for (const got of [
      await engineer.json('/api/tests/999999999'),
      await engineer.json('/api/tests?status=nope'),
      await new Client().json('/api/tests'),
      await engineer.json(`/api/tests/${ids.test}/dispositions`, { method: 'POST', json: { gaugeId: 'H1' } }),
    ]) {
      expect(got.status).toBeGreaterThanOrEqual(400);
      const parsed = errorEnvelope.safeParse(got.body);
      expect(parsed.success ? [] : parsed.error.issues, JSON.stringify(got.body)).toEqual([]);
    }
  });
});
