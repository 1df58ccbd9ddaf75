// Synthetic hydrotest logs with known truth (testing/synthetic-log.ts) through reduceLog.
import { describe, expect, it } from 'vitest';
import { reduceLog } from './reduce';
import { parsePlan, type PlanInput } from './plan';
import { demoPlan, demoPlanInput } from './testing/fixtures';
import { chunked, syntheticLog, syntheticTruth, type SyntheticOptions } from './testing/synthetic-log';
import { predictForPlan } from './shell';
import type { ReductionResult } from './types';

async function reduce(planIn: PlanInput | ReturnType<typeof demoPlan>, opts: SyntheticOptions = {}) {
  const plan =
    'tolerances' in planIn && planIn.tolerances && 'slopeBand' in planIn.tolerances && planIn.holdDetection
      ? (planIn as ReturnType<typeof demoPlan>)
      : parsePlan(planIn);
  const csv = syntheticLog(plan, opts);
  const { result, series } = await reduceLog(plan, chunked(csv, 4096));
  return { plan, result, series, truth: syntheticTruth(plan, opts), csv };
}
const gauge = (r: ReductionResult, id: string) => {
  const g = r.gauges.find((x) => x.id === id);
  if (!g) throw new Error(`no gauge ${id}`);
  return g;
};

describe('healthy vessel (DESIGN 4.1 example, Lamé): every gauge in band, verdict conforms', async () => {
  const { result, truth } = await reduce(demoPlan(), { gauges: { H1: { offset: 120 }, A1: { offset: -40 } } });
  it('nine holds with branches zero, loading ×4, unloading ×3, return', () => {
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
    expect(result.log.usedHolds).toBe(true);
  });
  it.each(Object.keys(truth))('%s: measured slope within 0.5 % of the truth, CI holds it', (id) => {
    const g = gauge(result, id);
    expect(g.measuredSlope! / truth[id]! - 1).toBeCloseTo(0, 2);
    expect(g.outcome).toBe('in-band');
    expect(g.flags).toEqual([]);
    expect(g.rSquared!).toBeGreaterThan(0.999);
    expect(Math.abs(g.zeroShift!)).toBeLessThan(3);
  });
  it('zeroing removes the offset', () => expect(gauge(result, 'H1').holdStrains[0]!).toBeCloseTo(0, 6));
  it('effective thickness ≈ nominal 16 mm', () => expect(gauge(result, 'H1').effectiveThickness!).toBeCloseTo(16, 0));
  it('rosettes: hoop principal strain and direction ±90° from the axis', () => {
    const r1 = result.rosettes.find((r) => r.id === 'R1')!;
    expect(r1.principalStrains[0] / result.predicted.lame.hoopStrainPerPressure).toBeCloseTo(1, 2);
    expect(Math.abs(r1.principalAngleDeg)).toBeCloseTo(90, 0);
    expect(r1.vonMises).toBeGreaterThan(0);
  });
  it('verdict conforms, engine version, no warnings', () => {
    expect(result.verdict).toBe('conforms');
    expect(result.engineVersion).toBe('1.0.0');
    expect(result.warnings).toEqual([]);
  });
});

describe('faulty gauges are flagged with the right code', async () => {
  const { result } = await reduce(demoPlan(), {
    gauges: {
      H1: { scale: 0.85 },
      H2: { permanentSet: 60 },
      A1: { dead: true },
      A2: { reversed: true },
      R1: { saturateAt: 450 },
    },
  });
  it.each([
    ['H1', 'reads 15 % low', ['outside-band']],
    ['H2', 'permanent set after the peak', ['hysteresis', 'zero-shift']],
    ['A1', 'dead channel', ['no-response']],
    ['A2', 'reversed wiring', ['reversed-sign', 'outside-band']],
    ['R1/C', 'saturates half-way', ['no-response', 'nonlinear']],
  ])('%s %s → %j', (id, _what, flags) => {
    const g = gauge(result, id);
    for (const f of flags) expect(g.flags).toContain(f);
    expect(g.outcome).toBe('flagged');
  });
  it('the low gauge deviates by −15 %', () => expect(gauge(result, 'H1').deviation!).toBeCloseTo(-0.15, 2));
  it('permanent set shows as zero shift ≈ 60 µε', () => expect(gauge(result, 'H2').zeroShift!).toBeCloseTo(60, -1));
  it('healthy gauges stay in band; verdict flagged', () => {
    expect(gauge(result, 'R2/A').outcome).toBe('in-band');
    expect(result.verdict).toBe('flagged');
  });
});

describe('corrections', async () => {
  it('gauge-factor mismatch: gauge 2.10 on an instrument set to 2.00 is corrected back to the truth', async () => {
    const input = {
      ...demoPlanInput,
      gauges: [
        {
          id: 'H1',
          kind: 'uniaxial' as const,
          channels: ['SG1'],
          angleDeg: 90,
          gaugeFactor: 2.1,
          instrumentGaugeFactor: 2.0,
        },
      ],
    };
    const { result, truth } = await reduce(input);
    const g = gauge(result, 'H1');
    expect(g.measuredSlope! / truth.H1! - 1).toBeCloseTo(0, 2);
    expect(g.notes.join(' ')).toMatch(/gauge factor 2.1/);
  });
  it('rectangular rosette with Kt 3 %: corrected grids match the truth, uniaxial correction says so', async () => {
    const input: PlanInput = {
      ...demoPlanInput,
      gauges: [
        {
          id: 'R1',
          kind: 'rosette-rectangular',
          channels: ['SG4', 'SG5', 'SG6'],
          angleDeg: 0,
          transverseSensitivity: 0.03,
        },
        { id: 'A1', kind: 'uniaxial', channels: ['SG3'], angleDeg: 0, transverseSensitivity: 0.03 },
      ],
    };
    const { result, truth } = await reduce(input, { strainNoise: 0.2 });
    for (const id of ['R1/A', 'R1/B', 'R1/C', 'A1'])
      expect(gauge(result, id).measuredSlope! / truth[id]! - 1).toBeCloseTo(0, 2);
    expect(result.warnings.join(' ')).toMatch(
      /uniaxial gauge A1: transverse sensitivity corrected with the lame model's predicted transverse strain/,
    );
    expect(gauge(result, 'A1').notes.join(' ')).toMatch(/transverse sensitivity Kt 3 %/);
  });
});

describe('edge zone: a gauge near the head seam is reported, not compared', async () => {
  const input: PlanInput = {
    ...demoPlanInput,
    gauges: [
      ...demoPlanInput.gauges,
      { id: 'E1', kind: 'uniaxial', channels: ['SG20'], angleDeg: 90, axialPosition: 100, clockDeg: 0 },
    ],
  };
  const { result } = await reduce(input, { gauges: { E1: { scale: 0.6 } } });
  it('E1 gets edge-zone and outcome not-compared; the verdict ignores it', () => {
    const g = gauge(result, 'E1');
    expect(g.flags).toContain('edge-zone');
    expect(g.flags).not.toContain('outside-band');
    expect(g.outcome).toBe('not-compared');
    expect(g.distanceToDiscontinuity).toBe(100);
    expect(g.notes.join(' ')).toMatch(/head seam at 0/);
    expect(result.verdict).toBe('conforms');
  });
});

describe('thick-walled cylinder (r/t 3): Lamé predicts the truth, membrane is far off', async () => {
  const input: PlanInput = {
    ...demoPlanInput,
    vessel: { shape: 'cylinder', ends: 'closed', insideDiameter: 200, wallThickness: 40, length: 1000 },
    testPressure: 80,
    material: { elasticModulus: 200000, poissonRatio: 0.3, yieldStrength: 600 },
    gauges: [demoPlanInput.gauges[0]!, demoPlanInput.gauges[2]!],
  };
  const { result } = await reduce(input);
  it('in band with Lamé; the membrane model over-predicts by more than 40 %', () => {
    expect(gauge(result, 'H1').outcome).toBe('in-band');
    expect(result.predicted.membraneOverLame).toBeGreaterThan(0.4);
    expect(gauge(result, 'H1').effectiveThickness!).toBeCloseTo(40, 0);
  });
});

describe('sphere in US customary units, log pressure in bar', async () => {
  const input: PlanInput = {
    units: 'US',
    vessel: { shape: 'sphere', insideDiameter: 120, wallThickness: 1.25 },
    material: { elasticModulus: 29.5e6, poissonRatio: 0.3, yieldStrength: 38000 },
    testPressure: 450,
    columns: { time: 'time', pressure: 'P' },
    gauges: [
      { id: 'S1', kind: 'uniaxial', channels: ['ch1'], angleDeg: 0 },
      { id: 'S2', kind: 'uniaxial', channels: ['ch2'], angleDeg: 90 },
    ],
  };
  const { result, truth } = await reduce(input, { format: { pressureUnit: 'bar' } });
  it('slopes in µε/psi match, bar converted to psi and said so', () => {
    expect(result.pressureUnit).toBe('psi');
    expect(result.log.pressureUnitInLog).toBe('bar');
    expect(result.warnings.join(' ')).toMatch(/is in bar; converted to psi/);
    expect(gauge(result, 'S1').measuredSlope! / truth.S1! - 1).toBeCloseTo(0, 2);
    expect(result.holds[4]!.pressure).toBeCloseTo(450, -1);
    expect(result.verdict).toBe('conforms');
  });
});

describe('a steady ramp without holds falls back to all samples', async () => {
  const { result, truth } = await reduce(demoPlan(), { profile: 'ramp', rampSeconds: 400, rateHz: 5 });
  it('fits every sample, warns, still conforms', () => {
    expect(result.log.usedHolds).toBe(false);
    expect(result.warnings.join(' ')).toMatch(/no pressure holds found/);
    expect(gauge(result, 'H1').measuredSlope! / truth.H1! - 1).toBeCloseTo(0, 2);
    expect(gauge(result, 'H1').unloadingSlope! / truth.H1! - 1).toBeCloseTo(0, 2);
    expect(gauge(result, 'H1').points.length).toBeGreaterThan(10);
    expect(result.verdict).toBe('conforms');
  });
});

describe('a partial log (live upload mid-test) is incomplete', async () => {
  const { result } = await reduce(demoPlan(), { stopAfterSeconds: 280 });
  it('reduces what it has, verdict incomplete', () => {
    expect(result.verdict).toBe('incomplete');
    expect(result.warnings.join(' ')).toMatch(/incomplete: the log has reached/);
    expect(gauge(result, 'H1').measuredSlope).not.toBeNull();
  });
  it('a log that reached test pressure but not zero again is incomplete too', async () => {
    const r = await reduce(demoPlan(), { stopAfterSeconds: 560 });
    expect(r.result.verdict).toBe('incomplete');
    expect(r.result.warnings.join(' ')).toMatch(/not come back to zero/);
  });
});

describe('the same log in every format gives the same result', async () => {
  const plan = demoPlan();
  const base = syntheticLog(plan, { seed: 3 });
  const ref = (await reduceLog(plan, chunked(base, 999))).result;
  const slopes = (r: ReductionResult) => r.gauges.map((g) => g.measuredSlope);
  it.each([
    ['comma', { delimiter: ',' }],
    ['semicolon with decimal comma', { delimiter: ';', decimalComma: true }],
    ['tab', { delimiter: '\t' }],
    ['BOM and CRLF', { bom: true, crlf: true }],
    ['preamble of key-value lines', { preamble: ['Device: DAQ-16', 'Operator;J. Doe', 'P [MPa] channel: 3'] }],
    ['ISO 8601 timestamps', { time: 'iso' }],
  ] as const)('%s', async (_n, format) => {
    const csv = syntheticLog(plan, { seed: 3, format });
    for (const asBytes of [true, false]) {
      const r = (await reduceLog(plan, chunked(csv, 1000, asBytes))).result;
      slopes(r).forEach((s, i) => expect(s).toBeCloseTo(slopes(ref)[i]!, 9));
      expect(r.holds.length).toBe(ref.holds.length);
    }
  });
  it('pressure in kPa gives the same slopes (converted)', async () => {
    const r = (await reduceLog(plan, chunked(syntheticLog(plan, { seed: 3, format: { pressureUnit: 'kPa' } })))).result;
    slopes(r).forEach((s, i) => expect(s! / slopes(ref)[i]! - 1).toBeCloseTo(0, 5)); // the kPa log carries more digits
  });
  it('two consecutive segments, each with its own header and a clock starting again', async () => {
    const lines = base.split('\n');
    const header = lines[0]!;
    const cut = 800;
    const second = lines
      .slice(cut)
      .filter(Boolean)
      .map((l) => {
        const cells = l.split(',');
        cells[0] = (Number(cells[0]) - 400).toFixed(4);
        return cells.join(',');
      });
    const a = lines.slice(0, cut).join('\n') + '\n';
    const b = [header, ...second].join('\n') + '\n';
    const r = (await reduceLog(plan, [chunked(a), chunked(b)])).result;
    expect(r.log.rows).toBe(ref.log.rows);
    slopes(r).forEach((s, i) => expect(s).toBeCloseTo(slopes(ref)[i]!, 6));
  });
});

describe('missing samples are counted and named', async () => {
  const plan = demoPlan();
  const lines = syntheticLog(plan).split('\n');
  lines[10] = lines[10]!.replace(/,[^,]*$/, ',');
  lines[20] = lines[20]!.replace(/,([^,]*),([^,]*)$/, ',ERR,$2');
  const { result } = await reduceLog(plan, chunked(lines.join('\n')));
  it('warning names how many and the first line and column', () => {
    expect(result.log.missingSamples).toBe(2);
    expect(result.warnings.join(' ')).toMatch(
      /2 missing samples \(empty or non-numeric cells\), the first at line 11, column 'SG10'/,
    );
  });
});

describe('series', async () => {
  const { series, result } = await reduce(demoPlan(), {});
  it('bounded, pressure first, zeroed strains', () => {
    expect(series.channels[0]).toBe('pressure');
    expect(series.t.length).toBeLessThanOrEqual(5000);
    expect(Math.abs(series.min.SG1![0]!)).toBeLessThan(10);
    expect(Math.max(...series.max.SG1!)).toBeGreaterThan(0.9 * gauge(result, 'H1').peakStrain);
  });
});

describe('predictions in the result match predictForPlan', async () => {
  const plan = demoPlan();
  const { result } = await reduce(plan);
  it('same block', () => expect(result.predicted).toEqual(predictForPlan(plan).predicted));
});
