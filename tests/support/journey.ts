// A test taken through the record's states over HTTP, for tests that need one reduced,
// reviewed or released (a worker must be running). Every gauge reads true, so nothing is flagged.
import { expect } from 'vitest';
import type { Client } from './http';
import { makeHydrotestCsv, type SyntheticLogOptions } from './hydrotest-log';
import { TEST_PASSWORD } from './processes';

export const journeyPlan = {
  units: 'SI',
  vessel: { shape: 'cylinder', ends: 'closed', insideDiameter: 1000, wallThickness: 10, length: 4000 },
  material: { name: 'journey steel', elasticModulus: 200_000, poissonRatio: 0.3, yieldStrength: 260 },
  testPressure: 2,
  columns: { time: 'time_s', pressure: 'P [MPa]' },
  gauges: [
    { id: 'H1', kind: 'uniaxial', channels: ['SG1'], angleDeg: 90, distanceToDiscontinuity: 1500 },
    { id: 'A1', kind: 'uniaxial', channels: ['SG2'], angleDeg: 0, distanceToDiscontinuity: 1500 },
  ],
};

/**
 * A log of the journey plan; `variant` changes the bytes (a second, different log); `timing`
 * makes it longer (a higher rate, longer holds).
 */
export function journeyLog(
  variant = 0,
  timing: Pick<SyntheticLogOptions, 'rateHz' | 'holdSeconds' | 'rampSeconds'> = {},
): string {
  return (
    makeHydrotestCsv({
      insideDiameter: 1000,
      wallThickness: 10,
      E: 200_000,
      nu: 0.3,
      testPressure: 2,
      channels: [
        { name: 'SG1', angleDeg: 90 },
        { name: 'SG2', angleDeg: 0 },
      ],
      ...timing,
    }) + '\n'.repeat(variant)
  );
}

export interface Crew {
  engineer: Client;
  technician: Client;
  qa: Client;
}

export function uploadLog(c: Client, testId: number, body: string, filename = 'journey.csv') {
  const form = new FormData();
  form.append('file', new Blob([body], { type: 'text/csv' }), filename);
  return c.json(`/api/tests/${testId}/logs`, { method: 'POST', body: form });
}

export async function waitForReduction(c: Client, id: number, timeoutMs = 60_000) {
  const deadline = Date.now() + timeoutMs;
  for (;;) {
    const r = await c.json(`/api/reductions/${id}`);
    if (r.body.status === 'done' || r.body.status === 'failed') return r.body;
    if (Date.now() > deadline) throw new Error(`reduction ${id} still ${r.body.status} after ${timeoutMs} ms`);
    await new Promise((res) => setTimeout(res, 100));
  }
}

export async function createTest(crew: Crew, name: string): Promise<number> {
  const r = await crew.engineer.json('/api/tests', { method: 'POST', json: { name, plan: journeyPlan } });
  expect(r.status).toBe(201);
  return r.body.id;
}

/** Created, logged and reduced: status `reduced`. */
export async function reducedTest(crew: Crew, name: string): Promise<{ testId: number; reductionId: number }> {
  const testId = await createTest(crew, name);
  expect((await uploadLog(crew.technician, testId, journeyLog())).status).toBe(201);
  const q = await crew.technician.json(`/api/tests/${testId}/reductions`, { method: 'POST', json: {} });
  expect(q.status).toBe(202);
  expect((await waitForReduction(crew.technician, q.body.id)).status).toBe('done');
  return { testId, reductionId: q.body.id };
}

export function signBody(reductionId: number, password = TEST_PASSWORD) {
  return { reductionId, password };
}

/** Reduced and reviewed by the engineer: status `reviewed`. */
export async function reviewedTest(crew: Crew, name: string) {
  const t = await reducedTest(crew, name);
  const r = await crew.engineer.json(`/api/tests/${t.testId}/review`, {
    method: 'POST',
    json: signBody(t.reductionId),
  });
  expect(r.status).toBe(201);
  return t;
}

/** Reviewed and released by QA: status `released`, record frozen. */
export async function releasedTest(crew: Crew, name: string) {
  const t = await reviewedTest(crew, name);
  const r = await crew.qa.json(`/api/tests/${t.testId}/release`, { method: 'POST', json: signBody(t.reductionId) });
  expect(r.status).toBe(201);
  return t;
}
