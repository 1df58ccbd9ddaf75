// The whole reduction against an independent truth: every log here is written by
// testing/reference (textbook formulas, no engine code), and every expected value comes from the
// same reference, including true fields that differ from the plan's prediction, so a model error
// in the engine fails a test.
import { describe, expect, it } from 'vitest';
import { reduceLog, Reducer } from './reduce';
import { parsePlan, type PlanInput } from './plan';
import { InputError } from './errors';
import type { GaugeResult, ReductionResult } from './types';
import { writeLog, type RefLogSpec } from './testing/reference/log-writer';
import { fieldOf, planVessel, scenario, type Behaviour } from './testing/reference/scenario';
import { indicatedByTransverse, NU0, planeStressFromStrains, waterHeadPa } from './testing/reference/gauges';
import { lameCylinder, strainAlong, vonMises, type Vessel } from './testing/reference/shells';
import { effectiveCount, lag1, leastSquares } from './testing/reference/statistics';
import { demoPlanInput } from './testing/fixtures';

/** DESIGN 4.1's example vessel: ID 1800 mm, wall 16 mm, closed, E 200 GPa, ν 0.3. */
const base: PlanInput = {
  ...demoPlanInput,
  gauges: [
    { id: 'H1', kind: 'uniaxial', channels: ['SG1'], angleDeg: 90, distanceToDiscontinuity: 1500 },
    { id: 'A1', kind: 'uniaxial', channels: ['SG2'], angleDeg: 0, distanceToDiscontinuity: 1500 },
    { id: 'D1', kind: 'uniaxial', channels: ['SG3'], angleDeg: 45, distanceToDiscontinuity: 1500 },
    {
      id: 'R1',
      kind: 'rosette-rectangular',
      channels: ['SG4', 'SG5', 'SG6'],
      angleDeg: 0,
      distanceToDiscontinuity: 1500,
    },
    { id: 'R2', kind: 'rosette-delta', channels: ['SG7', 'SG8', 'SG9'], angleDeg: 30, distanceToDiscontinuity: 1500 },
  ],
};

interface Case {
  plan?: PlanInput;
  truth?: Vessel;
  behaviour?: Record<string, Behaviour>;
  rotation?: Record<string, number>;
  log?: Partial<RefLogSpec>;
  chunk?: number;
}

async function run(c: Case = {}) {
  const input = c.plan ?? base;
  const plan = parsePlan(input);
  const sc = scenario(input, { truth: c.truth, behaviour: c.behaviour, rotation: c.rotation });
  const csv = writeLog({
    testPressure: plan.testPressure,
    pressureHeader: plan.columns.pressure,
    timeHeader: plan.columns.time ?? null,
    channels: sc.channels,
    ...c.log,
  });
  const { result, series } = await reduceLog(plan, text(csv, c.chunk ?? 4093));
  return { plan, result, series, csv, ...sc };
}

/** The text as byte chunks of `size`, as a stream delivers it. */
async function* text(csv: string, size: number): AsyncGenerator<Uint8Array> {
  const bytes = new TextEncoder().encode(csv);
  for (let i = 0; i < bytes.length; i += size) yield bytes.subarray(i, i + size);
}

const gauge = (r: ReductionResult, id: string): GaugeResult => {
  const g = r.gauges.find((x) => x.id === id);
  if (!g) throw new Error(`no gauge ${id}`);
  return g;
};
const rel = (got: number | null, want: number) => Math.abs(got! / want - 1);

describe('healthy vessel, true field = Lamé at the plan dimensions (Timoshenko, from memory)', async () => {
  const { result, truth, predicted } = await run({ behaviour: { H1: { offset: 120 }, A1: { offset: -40 } } });
  it('one cycle: zero, loading ×4, unloading ×3, return', () => {
    expect(result.holds.map((h) => h.branch)).toEqual([
      'zero',
      'loading',
      'loading',
      'loading',
      'loading',
      'unloading',
      'unloading',
      'unloading',
      'return',
    ]);
    expect(result.cycles).toHaveLength(1);
    expect(result.cycles[0]!.compared).toBe(true);
  });
  it.each(Object.keys(truth))('%s: slope within 0.3 % of the reference, ratio 1, in band', (id) => {
    const g = gauge(result, id);
    expect(rel(g.measuredSlope, truth[id]!)).toBeLessThan(0.003);
    // the engine's prediction against the reference's Lamé formula at the outer surface
    expect(rel(g.predictedSlope, predicted[id]!)).toBeLessThan(1e-9);
    expect(g.slopeCI95![0]).toBeLessThan(truth[id]!);
    expect(g.slopeCI95![1]).toBeGreaterThan(truth[id]!);
    expect(g.flags).toEqual([]);
    expect(g.outcome).toBe('in-band');
  });
  it('zeroing removes the offset', () => expect(Math.abs(gauge(result, 'H1').holdStrains[0]!)).toBeLessThan(0.5));
  it('rosette R1: principal strains = hoop and axial, ε1 along the hoop as expected', () => {
    const f = fieldOf(planVessel(base));
    const r = result.rosettes.find((x) => x.id === 'R1')!;
    expect(rel(r.principalStrains[0], f.hoop)).toBeLessThan(0.003);
    expect(rel(r.principalStrains[1], f.axial)).toBeLessThan(0.01);
    expect(Math.abs(r.principalAngleDeg)).toBeGreaterThan(89);
    expect(r.expectedPrincipalAngleDeg).toBe(90);
    // plane stress from the reference's strains: σ = E/(1−ν²)(ε1 + ν ε2) per unit pressure
    const [s1, s2] = planeStressFromStrains(f.hoop * 1e-6, f.axial * 1e-6, 200000, 0.3);
    expect(rel(r.stressesPerUnitPressure[0], s1)).toBeLessThan(0.003);
    expect(rel(r.stressesPerUnitPressure[1], s2)).toBeLessThan(0.01);
    expect(rel(r.principalStresses[0], s1 * 3.4)).toBeLessThan(0.003);
    expect(rel(r.vonMisesPerUnitPressure, Math.sqrt(s1 * s1 - s1 * s2 + s2 * s2))).toBeLessThan(0.005);
    expect(r.flags).toEqual([]);
  });
  it('verdict conforms, engine 2.0.0, no warnings, a budget for every gauge', () => {
    expect(result.verdict).toBe('conforms');
    expect(result.engineVersion).toBe('2.0.0');
    expect(result.warnings).toEqual([]);
    expect(result.bandMode).toBe('fixed');
    for (const g of result.gauges) {
      expect(g.predictedU95).toBeGreaterThan(0);
      expect(g.uncertaintyBudget).toHaveLength(7);
      expect(g.bandBasis).toBe('relative');
    }
  });
});

describe('a true field that differs from the prediction (wall thinner than the plan says)', async () => {
  // the vessel is really 15 mm (plan 16 mm): every slope is higher by lame(15)/lame(16)
  const thin = { ...planVessel(base), t: 15 };
  const { result, truth, predicted } = await run({ truth: thin });
  it.each(Object.keys(truth))('%s: ratio = reference truth / reference prediction within 0.3 %', (id) => {
    const g = gauge(result, id);
    const want = truth[id]! / predicted[id]!;
    expect(want).toBeGreaterThan(1.05);
    expect(Math.abs(g.ratio! - want)).toBeLessThan(0.003);
  });
  it('the effective thickness recovers the true 15 mm', () => {
    expect(gauge(result, 'H1').effectiveThickness!).toBeCloseTo(15, 1);
    expect(gauge(result, 'A1').effectiveThickness!).toBeCloseTo(15, 1);
  });
  it('a 14 mm wall (+14 %) is outside the ±10 % band', async () => {
    const r = (await run({ truth: { ...planVessel(base), t: 14 } })).result;
    expect(gauge(r, 'H1').flags).toContain('outside-band');
    expect(r.verdict).toBe('flagged');
  });
});

describe('thick wall at 94 % of yield reads as flagged, never clear (REFERENCES "Added for engine v2")', async () => {
  // ID 200, wall 40 (a 100, b 140), 80 MPa, yield 300: von Mises at the bore √3·p·b²/(b² − a²)
  // = √3 · 80 · 19600/9600 = 282.90 MPa (REFERENCES prints 282.87; the closed form and the
  // stresses it lists, σθ 246.67, σr −80, σz 83.33, both give 282.90), 0.943 of yield
  const plan: PlanInput = {
    ...base,
    vessel: { shape: 'cylinder', ends: 'closed', insideDiameter: 200, wallThickness: 40, length: 1000 },
    material: { elasticModulus: 200000, poissonRatio: 0.3, yieldStrength: 300 },
    testPressure: 80,
    gauges: base.gauges.slice(0, 2),
  };
  const { result } = await run({ plan });
  it('yieldCheck: 282.90 MPa at the bore, 0.943 of yield', () => {
    const bore = lameCylinder(80, 100, 140, 100, true);
    expect(bore.hoop).toBeCloseTo(246.67, 2); // REFERENCES [derived from Lamé]
    expect(vonMises(bore)).toBeCloseTo((Math.sqrt(3) * 80 * 140 ** 2) / (140 ** 2 - 100 ** 2), 9);
    expect(result.yieldCheck.stress).toBeCloseTo(282.9, 2);
    expect(result.yieldCheck.fraction).toBeCloseTo(0.943, 3);
    expect(result.yieldCheck.surface).toBe('inner');
    expect(result.yieldCheck.nearYield).toBe(true);
  });
  it('every gauge is near-yield and flagged; the verdict is flagged', () => {
    for (const g of result.gauges) {
      expect(g.flags).toContain('near-yield');
      expect(g.outcome).toBe('flagged');
      expect(g.notes.join(' ')).toMatch(/94\.3 % of yield/);
    }
    expect(result.verdict).toBe('flagged');
    expect(result.warnings.join(' ')).toMatch(/near yield: von Mises at the bore/);
  });
  it('Lamé predicts the thick wall: both gauges within 0.3 % of the reference', () => {
    const f = fieldOf(planVessel(plan));
    expect(rel(gauge(result, 'H1').measuredSlope, f.hoop)).toBeLessThan(0.003);
    expect(rel(gauge(result, 'A1').measuredSlope, f.axial)).toBeLessThan(0.003);
  });
});

describe('Lamé with open ends, and a gauge where the prediction is near zero', async () => {
  // open ends: εa = −ν εh at the outer surface, so ε(θ) = 0 at tan²θ = ν → 28.71° for ν 0.3 [derived]
  const zeroAngle = (Math.atan(Math.sqrt(0.3)) * 180) / Math.PI;
  const plan: PlanInput = {
    ...base,
    vessel: { shape: 'cylinder', ends: 'open', insideDiameter: 300, wallThickness: 30, length: 1000 },
    material: { elasticModulus: 200000, poissonRatio: 0.3, yieldStrength: 600 },
    testPressure: 60,
    gauges: [
      { id: 'H1', kind: 'uniaxial', channels: ['SG1'], angleDeg: 90, distanceToDiscontinuity: 500 },
      { id: 'A1', kind: 'uniaxial', channels: ['SG2'], angleDeg: 0, distanceToDiscontinuity: 500 },
      {
        id: 'Z1',
        kind: 'uniaxial',
        channels: ['SG3'],
        angleDeg: Number(zeroAngle.toFixed(2)),
        distanceToDiscontinuity: 500,
      },
    ],
  };
  // the vessel is 3 % stiffer than the plan says: a relative band would explode near zero
  const truth = { ...planVessel(plan), E: 206000 };
  const { result, truth: t } = await run({ plan, truth });
  it('hoop and axial slopes match the reference open-ended Lamé field', () => {
    const f = fieldOf(planVessel(plan));
    expect(f.axial / f.hoop).toBeCloseTo(-0.3, 10);
    expect(rel(gauge(result, 'H1').predictedSlope, f.hoop)).toBeLessThan(1e-9);
    expect(rel(gauge(result, 'A1').measuredSlope, t.A1!)).toBeLessThan(0.005);
  });
  it('Z1 (28.7°) is compared as an absolute deviation against band × the hoop strain, and says so', () => {
    const g = gauge(result, 'Z1');
    const hoop = fieldOf(planVessel(plan)).hoop;
    expect(Math.abs(g.predictedSlope)).toBeLessThan(0.01 * hoop);
    expect(g.bandBasis).toBe('near-zero');
    expect(Math.abs(g.measuredSlope! - t.Z1!)).toBeLessThan(0.01 * hoop);
    expect(g.bandSlope![1] - g.predictedSlope).toBeCloseTo(0.1 * hoop, 9);
    expect(g.flags).not.toContain('outside-band');
    expect(g.flags).not.toContain('reversed-sign');
    expect(g.effectiveThickness).toBeNull();
    expect(g.notes.join(' ')).toMatch(/below a fifth of the largest principal strain/);
    expect(result.verdict).toBe('conforms');
  });
});

describe('pressure units (DESIGN 3.2.1; factors NIST SP 811 B.8, standard atmosphere 101.325 kPa)', () => {
  const small: PlanInput = {
    ...base,
    // a low test pressure: 0.3 MPa, where an absolute zero (0.101 MPa) would look like a third of the test
    vessel: { shape: 'cylinder', ends: 'closed', insideDiameter: 600, wallThickness: 3, length: 2000 },
    testPressure: 0.3,
    columns: { time: 'time_s', pressure: 'P' },
    gauges: base.gauges.slice(0, 2),
  };
  it.each([
    ['P (bar)', 10, 0, 'bar', false],
    ['P [bar]', 10, 0, 'bar', false],
    ['P [bar(a)]', 10, 1.01325, 'bar', true],
    ['P (bara)', 10, 1.01325, 'bar', true],
    ['P [psia]', 1e6 / 6894.757293168, 101325 / 6894.757293168, 'psi', true],
    ['P [kPa abs]', 1000, 101.325, 'kPa', true],
    ['P (kPa)', 1000, 0, 'kPa', false],
  ])('%s: slopes right, holds found, conversion recorded', async (header, scale, offset, unit, absolute) => {
    const { result, truth } = await run({
      plan: small,
      log: { pressureHeader: header, pressureScale: scale, pressureOffset: offset },
    });
    expect(rel(gauge(result, 'H1').measuredSlope, truth.H1!)).toBeLessThan(0.003);
    expect(result.holds[0]!.branch).toBe('zero');
    expect(result.holds.at(-1)!.branch).toBe('return');
    expect(result.verdict).toBe('conforms');
    expect(result.log.pressureConversion).toMatchObject({ fromUnit: unit, toUnit: 'MPa', absolute });
    if (absolute) {
      expect(result.log.pressureConversion!.atmosphere).toBeCloseTo(0.101325, 12);
      expect(result.warnings.join(' ')).toMatch(
        /absolute pressure in .*subtracting the standard atmosphere 0\.101325 MPa/,
      );
    }
  });
  it('the plan’s barometric reading replaces the standard atmosphere', async () => {
    const plan = { ...small, columns: { ...small.columns, atmosphericPressure: 0.0985 } };
    const { result, truth } = await run({
      plan,
      log: { pressureHeader: 'P [bar(a)]', pressureScale: 10, pressureOffset: 0.985 },
    });
    expect(result.log.pressureConversion).toMatchObject({ atmosphereSource: 'plan', atmosphere: 0.0985 });
    expect(rel(gauge(result, 'H1').measuredSlope, truth.H1!)).toBeLessThan(0.003);
    expect(result.verdict).toBe('conforms');
  });
  it.each([
    ['bar', 10],
    ['kPa', 1000],
  ])('a unitless column in %s is refused, naming the unit that fits, the line and the column', async (unit, scale) => {
    const err = await run({ plan: base, log: { pressureHeader: 'P', pressureScale: scale } }).catch((e: unknown) => e);
    const planP = { ...base, columns: { time: 'time_s', pressure: 'P' } };
    const err2 = await run({ plan: planP, log: { pressureHeader: 'P', pressureScale: scale } }).catch(
      (e: unknown) => e,
    );
    expect(err).toBeInstanceOf(InputError); // the plan names 'P [MPa]': header 'P' is missing
    expect(err2).toBeInstanceOf(InputError);
    const e = err2 as InputError;
    expect(e.code).toBe('implausible-pressure');
    expect(e.message).toMatch(
      new RegExp(`the values look like ${unit}: name the unit in the header, e.g. 'P \\[${unit}\\]'`),
    );
    expect(e.details?.column).toBe('P');
    expect(e.details?.line).toBeGreaterThan(1);
  });
});

describe('two cycles: a shakedown to part pressure with a permanent set, then the test (DESIGN 3.2.5)', async () => {
  const { result, truth } = await run({
    log: {
      cycles: [
        [0, 0.25, 0.5, 0.25, 0],
        [0, 0.25, 0.5, 0.75, 1, 0.75, 0.5, 0.25, 0],
      ],
    },
    behaviour: { H1: { setPerCycle: [35, 0] } },
  });
  it('both cycles are listed; the second, which reaches the test pressure, is compared', () => {
    expect(result.cycles.map((c) => [c.reachesTestPressure, c.compared])).toEqual([
      [false, false],
      [true, true],
    ]);
    expect(result.cycles[0]!.peakPressure).toBeCloseTo(1.7, 1);
    expect(result.holds.map((h) => h.cycle)).toEqual([0, 0, 0, 0, 1, 1, 1, 1, 1, 1, 1, 1, 1]);
  });
  it('the first cycle’s permanent set shows in its zero shift and in a warning', () => {
    const h1 = result.cycles[0]!.gauges.find((g) => g.id === 'H1')!;
    expect(h1.zeroShift!).toBeCloseTo(35, 0);
    expect(Math.abs(result.cycles[0]!.gauges.find((g) => g.id === 'A1')!.zeroShift!)).toBeLessThan(1.5);
    expect(result.warnings.join(' ')).toMatch(/cycle 1 \(peak 1\.\d+ MPa\) left a permanent set: H1 \+3\d µε/);
    expect(result.warnings.join(' ')).toMatch(
      /the log holds 2 pressure cycles; cycle 2 \(peak 3\.\d+ MPa\) is compared/,
    );
  });
  it('the compared cycle is zeroed at its own start: slopes right, no zero shift, conforms', () => {
    const g = gauge(result, 'H1');
    expect(rel(g.measuredSlope, truth.H1!)).toBeLessThan(0.003);
    expect(Math.abs(g.zeroShift!)).toBeLessThan(1.5);
    expect(result.holds[4]!.branch).toBe('zero'); // ends cycle 1 and starts cycle 2
    expect(Math.abs(g.holdStrains[4]!)).toBeLessThan(1);
    expect(result.cycles[1]!.gauges.find((x) => x.id === 'H1')!.loadingSlope).toBeCloseTo(g.measuredSlope!, 9);
    expect(result.verdict).toBe('conforms');
  });
});

describe('creep during the hold at test pressure', async () => {
  // 0.5 µε/s over the 60 s top hold; the settled part (70 %) is split in thirds: about 0.5 × 28 s = 14 µε between them
  const { result } = await run({ behaviour: { H1: { creepPerSecond: 0.5 } } });
  it('H1 gets hold-creep with the strain it moved; the others do not', () => {
    const h1 = gauge(result, 'H1');
    expect(h1.holdCreep!).toBeGreaterThan(11);
    expect(h1.holdCreep!).toBeLessThan(17);
    expect(h1.flags).toContain('hold-creep');
    expect(h1.notes.join(' ')).toMatch(/yielding, a leak, or a gauge coming loose/);
    for (const id of ['A1', 'D1', 'R1/A']) {
      expect(Math.abs(gauge(result, id).holdCreep!)).toBeLessThan(2);
      expect(gauge(result, id).flags).not.toContain('hold-creep');
    }
  });
});

describe('a steady ramp with serially correlated noise: the interval allows for it', async () => {
  const plan: PlanInput = { ...base, gauges: base.gauges.slice(0, 1) };
  const { result, csv, truth } = await run({
    plan,
    log: { rampSeconds: 400, rateHz: 10, strainNoise: 3, noiseRho: 0.98, seed: 5 },
  });
  it('the 95 % interval is about as wide as Bartlett’s effective sample count makes it', () => {
    // the reference: least squares over the loading samples, r1 of the residuals, n_eff = n(1 − r1)/(1 + r1)
    const rows = csv
      .trim()
      .split('\n')
      .slice(1)
      .map((l) => l.split(',').map(Number));
    const up = rows.filter((r) => r[0]! <= 400);
    const ls = leastSquares(
      up.map((r) => r[1]!),
      up.map((r) => r[2]!),
    );
    const r1 = lag1(ls.residuals);
    const nEff = effectiveCount(ls.n, r1);
    const refHalf = 1.96 * ls.slopeSE * Math.sqrt(ls.n / nEff);
    const g = gauge(result, 'H1');
    const half = (g.slopeCI95![1] - g.slopeCI95![0]) / 2;
    expect(result.log.usedHolds).toBe(false);
    expect(r1).toBeGreaterThan(0.9);
    expect(half / refHalf).toBeGreaterThan(0.6);
    expect(half / refHalf).toBeLessThan(1.8);
    expect(half).toBeGreaterThan(4 * 1.96 * ls.slopeSE); // the independent-sample interval is far too narrow
    expect(g.slopeCI95![0]).toBeLessThan(truth.H1!);
    expect(g.slopeCI95![1]).toBeGreaterThan(truth.H1!);
    expect(g.effectiveSamples!).toBeLessThan(ls.n / 10);
    expect(g.notes.join(' ')).toMatch(/allows for serial correlation/);
  });
});

describe('co-located perpendicular pair: Kt corrected with the measured strain (TN-509 pair)', () => {
  // the true axial strain is 10 % below the prediction (hoop as predicted); Kt 5 % on both grids
  const at = (z: number) => ({ axialPosition: z, clockDeg: 90 });
  const pair = (zA: number): PlanInput => ({
    ...base,
    gauges: [
      { id: 'H1', kind: 'uniaxial', channels: ['SG1'], angleDeg: 90, transverseSensitivity: 0.05, ...at(3000) },
      { id: 'A1', kind: 'uniaxial', channels: ['SG2'], angleDeg: 0, transverseSensitivity: 0.05, ...at(zA) },
    ],
  });
  const lame = fieldOf(planVessel(base));
  const field = { axial: 0.9 * lame.axial, hoop: lame.hoop };
  const reduce = async (plan: PlanInput) => {
    const p = parsePlan(plan);
    const sc = scenario(plan, { field });
    const csv = writeLog({ testPressure: 3.4, pressureHeader: 'P [MPa]', channels: sc.channels, strainNoise: 0.2 });
    return { result: (await reduceLog(p, text(csv, 5000))).result, truth: sc.truth, p };
  };
  it('at the same place: both gauges recover the true strain, and the result says how', async () => {
    const { result, truth } = await reduce(pair(3000));
    for (const id of ['H1', 'A1']) expect(rel(gauge(result, id).measuredSlope, truth[id]!)).toBeLessThan(0.002);
    expect(gauge(result, 'A1').transverseCorrection).toBe('measured-partner');
    expect(gauge(result, 'A1').pairedWith).toBe('H1');
    expect(gauge(result, 'A1').notes.join(' ')).toMatch(/measured by the perpendicular gauge H1/);
    expect(result.warnings.join(' ')).not.toMatch(/predicted transverse strain/);
  });
  it('1 m apart: the model-ratio correction, biased toward the prediction by what TN-509 predicts', async () => {
    const { result, truth } = await reduce(pair(2000));
    const g = gauge(result, 'A1');
    expect(g.transverseCorrection).toBe('model-ratio');
    // what the model-ratio correction gives: ε̂ (1 − ν0 Kt)/(1 + Kt r_model), r_model = εh/εa of the prediction
    const shown = indicatedByTransverse(field.axial, field.hoop, 0.05);
    const expected = (shown * (1 - NU0 * 0.05)) / (1 + (0.05 * lame.hoop) / lame.axial);
    expect(rel(expected, truth.A1!)).toBeGreaterThan(0.015); // the bias the pair removes
    expect(rel(g.measuredSlope, expected)).toBeLessThan(0.002);
    expect(result.warnings.join(' ')).toMatch(/A1: transverse sensitivity corrected with the lame model's predicted/);
  });
  it('an explicit pairWith works without positions', async () => {
    const plan = pair(2000);
    plan.gauges[1] = { ...plan.gauges[1]!, pairWith: 'H1' };
    const { result, truth } = await reduce(plan);
    expect(rel(gauge(result, 'A1').measuredSlope, truth.A1!)).toBeLessThan(0.002);
  });
});

describe('a rosette bonded 20° off the plan’s angle is flagged principal-direction', async () => {
  const { result } = await run({ rotation: { R1: 20 } });
  it('ε1 lies 20° from the hoop; the rosette and its grids are flagged', () => {
    const r = result.rosettes.find((x) => x.id === 'R1')!;
    expect(Math.abs(r.principalAngleDeg - 70)).toBeLessThan(0.5);
    expect(r.flags).toContain('principal-direction');
    expect(gauge(result, 'R1/A').flags).toContain('principal-direction');
    expect(r.notes.join(' ')).toMatch(/20\.\d° from the predicted direction \(hoop\)/);
    // the principal strains are invariants: still the hoop and axial strains
    expect(rel(r.principalStrains[0], fieldOf(planVessel(base)).hoop)).toBeLessThan(0.003);
    expect(result.rosettes.find((x) => x.id === 'R2')!.flags).toEqual([]);
  });
});

describe('water head on a tall vertical vessel (ρ g Δh, common practice)', async () => {
  // tap at the top (20 m); gauges at the bottom, half-way and near the top; water at 20 °C, 998.2 kg/m³
  const plan: PlanInput = {
    ...base,
    vessel: { shape: 'cylinder', ends: 'closed', insideDiameter: 1800, wallThickness: 16, length: 20000 },
    testPressure: 1.0,
    testFluidDensity: 998.2,
    pressureTapElevation: 20000,
    gauges: [
      { id: 'H0', kind: 'uniaxial', channels: ['SG1'], angleDeg: 90, distanceToDiscontinuity: 1500, elevation: 0 },
      { id: 'H1', kind: 'uniaxial', channels: ['SG2'], angleDeg: 90, distanceToDiscontinuity: 1500, elevation: 10000 },
      {
        id: 'R0',
        kind: 'rosette-rectangular',
        channels: ['SG3', 'SG4', 'SG5'],
        angleDeg: 0,
        distanceToDiscontinuity: 1500,
        elevation: 0,
      },
    ],
  };
  const { result, truth } = await run({ plan });
  const head20 = waterHeadPa(998.2, 20) / 1e6; // 0.1958 MPa, 9.79 kPa per metre (REFERENCES)
  it('each gauge carries its head; slopes are unchanged', () => {
    expect(head20).toBeCloseTo(0.19578, 4);
    expect(gauge(result, 'H0').headPressure).toBeCloseTo(head20, 10);
    expect(gauge(result, 'H1').headPressure).toBeCloseTo(head20 / 2, 10);
    expect(rel(gauge(result, 'H0').measuredSlope, truth.H0!)).toBeLessThan(0.003);
    expect(gauge(result, 'H0').points[0]!.pressure).toBeCloseTo(head20, 2);
  });
  it('the bottom rosette’s stresses and the yield check are at test pressure plus the head', () => {
    const r = result.rosettes.find((x) => x.id === 'R0')!;
    expect(r.principalStresses[0] / r.stressesPerUnitPressure[0]).toBeCloseTo(1 + head20, 9);
    expect(result.yieldCheck.pressure).toBeCloseTo(1 + head20, 9);
  });
});

describe('lead wires: a two-wire quarter bridge with long leads (R_G/(R_G + R_L), from memory)', async () => {
  const plan: PlanInput = {
    ...base,
    gauges: [
      { id: 'H1', kind: 'uniaxial', channels: ['SG1'], angleDeg: 90, leadResistance: 5, gaugeResistance: 120 },
      { id: 'H2', kind: 'uniaxial', channels: ['SG2'], angleDeg: 90 },
    ],
  };
  const { result, truth, channels } = await run({ plan });
  it('the 120/130 desensitisation is corrected back to the truth', () => {
    expect(channels[0]!.slope / channels[1]!.slope).toBeCloseTo(120 / 130, 9);
    expect(rel(gauge(result, 'H1').measuredSlope, truth.H1!)).toBeLessThan(0.003);
    expect(gauge(result, 'H1').notes.join(' ')).toMatch(/lead wires: two-wire quarter bridge, 5 Ω per lead/);
  });
});

describe('gauge factor and transverse sensitivity of rosettes (TN-509)', async () => {
  const plan: PlanInput = {
    ...base,
    gauges: [
      { id: 'H1', kind: 'uniaxial', channels: ['SG1'], angleDeg: 90, gaugeFactor: 2.1, instrumentGaugeFactor: 2.0 },
      {
        id: 'R1',
        kind: 'rosette-rectangular',
        channels: ['SG4', 'SG5', 'SG6'],
        angleDeg: 0,
        transverseSensitivity: 0.03,
      },
      { id: 'R2', kind: 'rosette-delta', channels: ['SG7', 'SG8', 'SG9'], angleDeg: 10, transverseSensitivity: -0.02 },
    ],
  };
  const { result, truth } = await run({ plan, truth: { ...planVessel(base), t: 15.2 } });
  it.each(['H1', 'R1/A', 'R1/B', 'R1/C', 'R2/A', 'R2/B', 'R2/C'])('%s corrected to the true strain', (id) => {
    expect(rel(gauge(result, id).measuredSlope, truth[id]!)).toBeLessThan(0.003);
  });
  it('each grid says which correction it got', () => {
    expect(gauge(result, 'H1').transverseCorrection).toBe('none');
    expect(gauge(result, 'R1/B').transverseCorrection).toBe('rosette');
    expect(gauge(result, 'H1').notes.join(' ')).toMatch(/gauge factor 2.1 against instrument setting 2/);
  });
});

describe('faulty gauges are flagged with the right code', async () => {
  const { result } = await run({
    behaviour: {
      H1: { scale: 0.85 },
      A1: { dead: true },
      D1: { reversed: true },
      R1: { clipAt: 450 },
      R2: { setPerCycle: [60] },
    },
  });
  it.each([
    ['H1', 'reads 15 % low', ['outside-band']],
    ['A1', 'dead channel', ['no-response']],
    ['D1', 'reversed wiring', ['reversed-sign', 'outside-band']],
    ['R1/C', 'saturates half-way', ['no-response', 'nonlinear']],
    ['R2/A', 'permanent set after the peak', ['hysteresis', 'zero-shift']],
  ])('%s %s → %j', (id, _what, flags) => {
    const g = gauge(result, id);
    for (const f of flags) expect(g.flags).toContain(f);
    expect(g.outcome).toBe('flagged');
  });
  it('the low gauge deviates by −15 %; the set shows as a zero shift of 60 µε', () => {
    expect(gauge(result, 'H1').deviation!).toBeCloseTo(-0.15, 2);
    expect(gauge(result, 'R2/A').zeroShift!).toBeCloseTo(60, -1);
    expect(result.verdict).toBe('flagged');
  });
});

describe('uncertainty band mode (DESIGN 3.4)', () => {
  // the true wall is 12 % thinner than nominal: +13.6 % on every slope
  const truth = { ...planVessel(base), t: 16 * 0.88 };
  const plan = (u: PlanInput['uncertainty']): PlanInput => ({
    ...base,
    tolerances: { bandMode: 'uncertainty' },
    uncertainty: u,
    gauges: base.gauges.slice(0, 1),
  });
  it('a wall uncertain by 8 % puts a +13.6 % slope in band; the band is √(U_pred² + U_fit²)', async () => {
    const { result } = await run({ plan: plan({ wallThickness: 1.28 }), truth });
    const g = gauge(result, 'H1');
    const fit = (g.slopeCI95![1] - g.slopeCI95![0]) / 2;
    expect(result.bandMode).toBe('uncertainty');
    expect(g.bandBasis).toBe('uncertainty');
    expect(g.bandSlope![1] - g.predictedSlope).toBeCloseTo(Math.hypot(g.predictedU95!, fit), 9);
    expect(g.uncertaintyBudget[0]!.input).toBe('wallThickness');
    expect(g.uncertaintyBudget[0]!.assumed).toBe(false);
    expect(g.flags).not.toContain('outside-band');
  });
  it('with the default (assumed) 2 % it is outside band', async () => {
    const { result } = await run({ plan: plan(undefined), truth });
    const g = gauge(result, 'H1');
    expect(g.uncertaintyBudget.every((b) => b.assumed)).toBe(true);
    expect(g.flags).toContain('outside-band');
  });
});

describe('a partial log (live upload mid-test) is incomplete', () => {
  it('before the test pressure', async () => {
    const { result } = await run({ log: { stopAfterSeconds: 280 } });
    expect(result.verdict).toBe('incomplete');
    expect(result.warnings.join(' ')).toMatch(/incomplete: the log has reached/);
    expect(gauge(result, 'H1').measuredSlope).not.toBeNull();
  });
  it('at the test pressure, not back to zero', async () => {
    const { result } = await run({ log: { stopAfterSeconds: 560 } });
    expect(result.verdict).toBe('incomplete');
    expect(result.warnings.join(' ')).toMatch(/not come back to zero/);
  });
});

describe('fed in any chunks the reducer gives exactly the same result (the live path)', async () => {
  const { csv } = await run({ log: { rateHz: 1, holdSeconds: 30, stepSeconds: 15 } });
  const crlf = csv.replace(/\n/g, '\r\n');
  const plan = parsePlan(base);
  const once = async (chunks: Iterable<Uint8Array>) => {
    const r = new Reducer(plan);
    r.beginSegment();
    for (const c of chunks) r.push(c);
    r.endSegment();
    return JSON.stringify(r.finish());
  };
  const bytes = new TextEncoder().encode(crlf);
  const whole = await once([bytes]);
  it.each([1, 2, 7, 100, 4096])('chunks of %d bytes', async (size) => {
    const parts: Uint8Array[] = [];
    for (let i = 0; i < bytes.length; i += size) parts.push(bytes.subarray(i, i + size));
    expect(await once(parts)).toBe(whole);
  });
  it('random cuts, including between CR and LF', async () => {
    let seed = 3;
    const next = () => (seed = (seed * 1103515245 + 12345) % 2147483648) % 997;
    const parts: Uint8Array[] = [];
    for (let i = 0; i < bytes.length;) {
      const n = 1 + next();
      parts.push(bytes.subarray(i, i + n));
      i += n;
    }
    expect(await once(parts)).toBe(whole);
  });
});

describe('the strain transformation the reference and the engine share only by formula', () => {
  it('ε(45°) is the mean of axial and hoop', () => expect(strainAlong(100, 425, 45)).toBeCloseTo(262.5, 12));
});

describe('a gauge with no place on the shell', () => {
  it('is said to be not checked against the edge zone, in its notes and in a warning', async () => {
    const plan: PlanInput = {
      ...base,
      gauges: base.gauges.map((g) =>
        g.id === 'A1' ? { id: 'A1', kind: 'uniaxial', channels: ['SG2'], angleDeg: 0 } : g,
      ),
    };
    const { result } = await run({ plan });
    const a1 = result.gauges.find((x) => x.id === 'A1')!;
    expect(a1.notes.join(' ')).toMatch(/not checked against the edge zone/);
    expect(result.warnings.join(' ')).toMatch(/not checked against the edge zone .*: A1;/);
    expect(result.gauges.find((x) => x.id === 'H1')!.notes.join(' ')).not.toMatch(/edge zone/);
  });
});
