// A small test record made over HTTP: a three-gauge plan on an invented closed cylinder, a
// stepped log with one gauge reading 15 % low, an upload and a finished reduction. For tests
// of what happens around a record (read path, scale drill) rather than of the record itself.
import { makeHydrotestCsv, type SyntheticChannel } from './hydrotest-log';
import type { Client } from './http';

export const smallPlan = (name = 'read-path steel') => ({
  units: 'SI',
  vessel: { shape: 'cylinder', ends: 'closed', insideDiameter: 1000, wallThickness: 10, length: 4000 },
  material: { name, elasticModulus: 200_000, poissonRatio: 0.3, yieldStrength: 260 },
  testPressure: 2,
  columns: { time: 'time_s', pressure: 'P [MPa]' },
  gauges: [
    { id: 'H1', kind: 'uniaxial', channels: ['SG1'], angleDeg: 90, distanceToDiscontinuity: 1500 },
    { id: 'A1', kind: 'uniaxial', channels: ['SG2'], angleDeg: 0, distanceToDiscontinuity: 1500 },
    { id: 'H2', kind: 'uniaxial', channels: ['SG3'], angleDeg: 90, distanceToDiscontinuity: 1500 },
  ],
});

const CHANNELS: SyntheticChannel[] = [
  { name: 'SG1', angleDeg: 90 },
  { name: 'SG2', angleDeg: 0 },
  { name: 'SG3', angleDeg: 90, scale: 0.85 },
];

/** The log for smallPlan; `rateHz` and `holdSeconds` make it longer (a slower reduction). */
export const smallLog = (o: { rateHz?: number; holdSeconds?: number } = {}) =>
  makeHydrotestCsv({
    insideDiameter: 1000,
    wallThickness: 10,
    E: 200_000,
    nu: 0.3,
    testPressure: 2,
    channels: CHANNELS,
    ...o,
  });

export function uploadLog(c: Client, testId: number, body: string, filename = 'hold-log.csv') {
  const form = new FormData();
  form.append('file', new Blob([body], { type: 'text/csv' }), filename);
  return c.json(`/api/tests/${testId}/logs`, { method: 'POST', body: form });
}

// eslint-disable-next-line @typescript-eslint/no-explicit-any -- the answer of GET /api/reductions/{id}
export async function waitForReduction(c: Client, id: number, timeoutMs = 60_000): Promise<any> {
  const deadline = Date.now() + timeoutMs;
  for (;;) {
    const r = await c.json(`/api/reductions/${id}`);
    if (r.body.status === 'done' || r.body.status === 'failed') return r.body;
    if (Date.now() > deadline) throw new Error(`reduction ${id} still ${r.body.status} after ${timeoutMs} ms`);
    await new Promise((res) => setTimeout(res, 100));
  }
}

/** Create a test (engineer), upload the log and queue a reduction (technician); the reduction id. */
export async function createReducedTest(engineer: Client, technician: Client, name: string, log = smallLog()) {
  const made = await engineer.json('/api/tests', { method: 'POST', json: { name, plan: smallPlan() } });
  if (made.status !== 201) throw new Error(`creating the test answered ${made.status}`);
  const up = await uploadLog(technician, made.body.id, log);
  if (up.status !== 201) throw new Error(`the upload answered ${up.status}`);
  const q = await technician.json(`/api/tests/${made.body.id}/reductions`, { method: 'POST', json: {} });
  if (q.status !== 202) throw new Error(`queueing the reduction answered ${q.status}`);
  return { testId: made.body.id as number, reductionId: q.body.id as number };
}
