// The live reducer: the same bytes cut anywhere give the same events and the batch result, bit
// for bit; warnings fire at the hold where a known fault first shows, and never on a healthy log.
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { LiveReducer, type LiveEvent, type LiveWarningEvent } from './live';
import { reduceLog } from './reduce';
import { parsePlan, type Plan, type PlanInput } from './plan';
import { shellInputFromPlan, yieldCheckAt, predictForPlan } from './shell';
import { demoPlan, demoPlanInput } from './testing/fixtures';
import { syntheticLog, type SyntheticOptions } from './testing/synthetic-log';
import { writeLog } from './testing/reference/log-writer';
import { scenario } from './testing/reference/scenario';

const enc = new TextEncoder();

async function batch(plan: Plan, bytes: Uint8Array) {
  return reduceLog(
    plan,
    (async function* () {
      yield bytes;
    })(),
  );
}

/** Feed the bytes cut at `cuts` (sorted, unique, inside the log); check the per-push contract on the way. */
function feed(plan: Plan, bytes: Uint8Array, cuts: readonly number[]) {
  const live = new LiveReducer(plan);
  const pushed: LiveEvent[] = [];
  let from = 0;
  for (const at of [...cuts, bytes.length]) {
    const out = live.push(bytes.subarray(from, at));
    const statuses = out.filter((e) => e.type === 'status');
    expect(statuses.length).toBeLessThanOrEqual(1);
    if (statuses.length) expect(out[out.length - 1]!.type).toBe('status');
    pushed.push(...out);
    from = at;
  }
  const done = live.finish();
  pushed.push(...done.caused);
  // what the pushes returned, without status events, is the numbered stream finish() gives
  expect(pushed.filter((e) => e.type !== 'status')).toStrictEqual(done.events);
  return done;
}

/** Byte offsets worth cutting at: between CR and LF, inside a UTF-8 character, inside a number (before its decimal mark). */
function trickyCuts(bytes: Uint8Array): number[] {
  const out: number[] = [];
  for (let i = 1; i < bytes.length; i++) {
    const b = bytes[i]!;
    if (b === 0x0a && bytes[i - 1] === 0x0d) out.push(i);
    else if ((b & 0xc0) === 0x80) out.push(i);
    else if ((b === 0x2e || b === 0x2c) && out.length < 400) out.push(i); // before a decimal point or comma, or a delimiter
  }
  return out;
}

const small: SyntheticOptions = { holdSeconds: 30, rampSeconds: 15, rateHz: 2 };

const refPlanInput: PlanInput = {
  ...demoPlanInput,
  gauges: [
    { id: 'H1', kind: 'uniaxial', channels: ['SG1'], angleDeg: 90, distanceToDiscontinuity: 1500 },
    { id: 'A1', kind: 'uniaxial', channels: ['SG2'], angleDeg: 0, distanceToDiscontinuity: 1500 },
    {
      id: 'R1',
      kind: 'rosette-rectangular',
      channels: ['SG4', 'SG5', 'SG6'],
      angleDeg: 0,
      distanceToDiscontinuity: 1500,
    },
  ],
};

function referenceLog(): string {
  const plan = parsePlan(refPlanInput);
  const sc = scenario(refPlanInput, { behaviour: { H1: { creepPerSecond: 0.8 }, A1: { offset: 55 } } });
  return writeLog({
    testPressure: plan.testPressure,
    pressureHeader: plan.columns.pressure,
    timeHeader: plan.columns.time ?? null,
    channels: sc.channels,
    cycles: [
      [0, 0.3, 0.6, 0],
      [0, 0.25, 0.5, 0.75, 1, 0.5, 0],
    ],
    holdSeconds: 30,
    stepSeconds: 15,
    preamble: ['Site: Prüfhalle Süd – bay 2', 'Operator: Ōtsuka'],
    delimiter: ';',
  });
}

const logs: { name: string; plan: Plan; text: string; warnings: string[]; holds?: false }[] = [
  {
    name: 'healthy, CRLF, BOM, a preamble with multi-byte characters',
    plan: demoPlan(),
    text: syntheticLog(demoPlan(), {
      ...small,
      seed: 3,
      format: { crlf: true, bom: true, preamble: ['Rig: Öl-Prüfstand №2', 'Note: µε, 25 °C'] },
    }),
    warnings: [],
  },
  {
    name: 'faults: a low gauge, a creeping gauge, a drifting zero, decimal comma',
    plan: demoPlan(),
    text: syntheticLog(demoPlan(), {
      ...small,
      seed: 5,
      format: { delimiter: ';', decimalComma: true },
      gauges: {
        H2: { scale: 0.7 },
        H1: { creep: { level: 0.75, microstrainPerSecond: 2 } },
        A1: { zeroDrift: 2 },
      },
    }),
    // the drifted zero also tilts the small axial trend of A1
    warnings: ['A1 zero-drift', 'H2 trend-outside-band', 'A1 trend-outside-band', 'H1 hold-creep'],
  },
  {
    name: 'reference writer: a shakedown cycle, then the test, a creeping hoop gauge, a preamble',
    plan: parsePlan(refPlanInput),
    text: referenceLog(),
    warnings: ['H1 hold-creep'],
  },
  {
    name: 'stopped mid-test (a live upload still rising)',
    plan: demoPlan(),
    text: syntheticLog(demoPlan(), { ...small, seed: 9, stopAfterSeconds: 170 }),
    warnings: [],
  },
  {
    name: 'a steady ramp without holds: no hold events, the batch fallback result',
    plan: demoPlan(),
    text: syntheticLog(demoPlan(), { profile: 'ramp', rampSeconds: 120, rateHz: 4, seed: 10 }),
    warnings: [],
    holds: false,
  },
];

describe('the same bytes cut anywhere: the same events, and the batch result bit for bit', () => {
  for (const log of logs) {
    it(log.name, async () => {
      const bytes = enc.encode(log.text);
      const whole = await batch(log.plan, bytes);
      const once = feed(log.plan, bytes, []);
      expect(once.result).toStrictEqual(whole.result);
      expect(once.series).toStrictEqual(whole.series);
      expect(once.events.some((e) => e.type === 'hold')).toBe(log.holds !== false);
      expect(warningsOf(once.events).map((w) => `${w.gaugeId} ${w.code}`)).toEqual(log.warnings);
      const tricky = trickyCuts(bytes);
      expect(tricky.length).toBeGreaterThan(0);
      const cut = fc.uniqueArray(fc.oneof(fc.integer({ min: 1, max: bytes.length - 1 }), fc.constantFrom(...tricky)), {
        minLength: 1,
        maxLength: 60,
      });
      fc.assert(
        fc.property(cut, (raw) => {
          const cuts = [...raw].sort((a, b) => a - b);
          const got = feed(log.plan, bytes, cuts);
          expect(got.events).toStrictEqual(once.events);
          expect(got.result).toStrictEqual(whole.result);
          expect(got.series).toStrictEqual(whole.series);
        }),
        { numRuns: 15 },
      );
      // one byte at a time, the hardest cut of all (on the smaller logs)
      if (bytes.length < 120_000) {
        const bytewise = feed(
          log.plan,
          bytes,
          Array.from({ length: bytes.length - 1 }, (_, i) => i + 1),
        );
        expect(bytewise.events).toStrictEqual(once.events);
        expect(bytewise.result).toStrictEqual(whole.result);
      }
    });
  }

  it('two cycles: each hold named by its branch as it completes, the ratio restarts with the second cycle', () => {
    const log = logs[2]!;
    const holds = feed(log.plan, enc.encode(log.text), []).events.flatMap((e) => (e.type === 'hold' ? [e.data] : []));
    expect(holds.map((h) => h.branch)).toEqual([
      'loading', // zero
      'loading',
      'loading',
      'unloading', // the shakedown's return to zero starts the test cycle
      'loading',
      'loading',
      'loading',
      'loading',
      'unloading',
      'unloading', // return
    ]);
    const h1 = (k: number) => holds[k]!.gauges.find((g) => g.id === 'H1')!.provisionalRatio;
    expect(h1(1)).toBeNull();
    expect(h1(2)).not.toBeNull();
    expect(h1(4)).toBeNull(); // one loading hold into the second cycle
    expect(h1(5)).not.toBeNull();
  });

  it('text chunks give the events of byte chunks', () => {
    const { plan, text } = logs[1]!;
    const live = new LiveReducer(plan);
    for (let i = 0; i < text.length; i += 777) live.push(text.slice(i, i + 777));
    expect(live.finish().events).toStrictEqual(feed(plan, enc.encode(text), []).events);
  });
});

const warningsOf = (events: readonly LiveEvent[]) =>
  events.filter((e): e is { type: 'warning'; data: LiveWarningEvent } => e.type === 'warning').map((e) => e.data);

/** The warnings of a log, each with the hold event just before it. */
function run(plan: Plan, opts: SyntheticOptions) {
  const live = new LiveReducer(plan);
  const bytes = enc.encode(syntheticLog(plan, opts));
  const statuses: ('pending' | 'flagged')[] = [];
  for (let i = 0; i < bytes.length; i += 4096)
    for (const e of live.push(bytes.subarray(i, i + 4096))) if (e.type === 'status') statuses.push(e.data.verdict);
  const done = live.finish();
  const holds = done.events.flatMap((e) => (e.type === 'hold' ? [e.data] : []));
  const raisedAt = (w: LiveWarningEvent) => {
    const k = done.events.findIndex((e) => e.type === 'warning' && e.data === w);
    const hold = done.events
      .slice(0, k)
      .reverse()
      .find((e) => e.type === 'hold');
    return hold?.type === 'hold' ? hold.data : undefined;
  };
  return { done, holds, warnings: warningsOf(done.events), raisedAt, statuses };
}

describe('warnings at the hold where a known fault first shows', () => {
  const plan = demoPlan();
  const tp = plan.testPressure;

  it('a gauge reading 30 % low: trend-outside-band at the second loading hold at pressure, not earlier', () => {
    const r = run(plan, { ...small, seed: 21, gauges: { H2: { scale: 0.7 } } });
    expect(r.warnings.map((w) => [w.gaugeId, w.code])).toEqual([['H2', 'trend-outside-band']]);
    const w = r.warnings[0]!;
    const at = r.raisedAt(w)!;
    expect(at.index).toBe(2); // zero hold, 25 %, 50 %: the second hold at pressure
    expect(w.pressure).toBe(at.pressure);
    expect(Math.abs(w.pressure / tp - 0.5)).toBeLessThan(0.01);
    expect(w.message).toMatch(
      /^Gauge H2 reads 30 % below its predicted hoop trend after the second loading hold; check/,
    );
    // before the second loading hold the ratio is not given
    expect(r.holds[1]!.gauges.find((g) => g.id === 'H2')!.provisionalRatio).toBeNull();
    expect(r.holds[2]!.gauges.find((g) => g.id === 'H2')!.provisionalRatio).toBeCloseTo(0.7, 2);
    expect(r.statuses[0]).toBe('pending');
    expect(r.statuses[r.statuses.length - 1]).toBe('flagged');
    expect(r.done.result.gauges.find((g) => g.id === 'H2')!.flags).toContain('outside-band');
  });

  it('a gauge creeping during the 75 % hold: hold-creep at that hold', () => {
    // 1.5 µε/s over the hold's settled part: the late third sits about 20 µε above the early third
    const r = run(plan, { ...small, seed: 22, gauges: { H1: { creep: { level: 0.75, microstrainPerSecond: 1.5 } } } });
    const creep = r.warnings.filter((w) => w.code === 'hold-creep');
    expect(creep.map((w) => w.gaugeId)).toEqual(['H1']);
    expect(Math.abs(creep[0]!.pressure / tp - 0.75)).toBeLessThan(0.01);
    expect(r.raisedAt(creep[0]!)!.index).toBe(3);
    expect(creep[0]!.message).toMatch(/^Gauge H1 moved \+\d+(\.\d+)? µε during the hold at 2\.5\d* MPa/);
    expect(r.warnings.filter((w) => w.gaugeId !== 'H1')).toEqual([]);
  });

  it('a channel drifting before any pressure: zero-drift at the zero hold', () => {
    // 2 µε/s through the 30 s zero hold: the late third of its settled part reads about 28 µε above the early third
    const r = run(plan, { ...small, seed: 23, gauges: { H1: { zeroDrift: 2 } } });
    expect(r.warnings.map((w) => [w.gaugeId, w.code])).toEqual([['H1', 'zero-drift']]);
    const w = r.warnings[0]!;
    expect(r.raisedAt(w)!.index).toBe(0);
    expect(Math.abs(w.pressure)).toBeLessThan(0.02 * tp);
    expect(w.message).toMatch(/^Gauge H1 moved \+\d+(\.\d+)? µε at zero pressure, before any pressure was applied/);
  });

  it('a drift that starts once pressure is on is not zero-drift', () => {
    // the same channel, drifting during the 25 % hold only: that is creep's business, if anything
    const r = run(plan, { ...small, seed: 24, gauges: { A1: { creep: { level: 0.25, microstrainPerSecond: 0.2 } } } });
    expect(r.warnings.filter((w) => w.code === 'zero-drift')).toEqual([]);
  });

  it('a wall thinner than planned: near-yield once the trend projects past the limit at test pressure', () => {
    // yield strength set so that the plan's own check sits at 80 % of yield; the true field is 20 % stiffer-looking
    const base = demoPlan();
    const yc = yieldCheckAt(shellInputFromPlan(base), base.model, base.testPressure);
    const tight = demoPlan({ material: { ...demoPlanInput.material, yieldStrength: yc.stress / 0.8 } });
    const m = predictForPlan(tight).predicted[tight.model];
    const truth = { axial: 1.2 * m.axialStrainPerPressure, hoop: 1.2 * m.hoopStrainPerPressure };
    const r = run(tight, { ...small, seed: 25, truth });
    const near = r.warnings.filter((w) => w.code === 'near-yield');
    const grids = r.done.result.gauges.map((g) => g.id);
    expect(near.map((w) => w.gaugeId).sort()).toEqual([...grids].sort());
    for (const w of near) {
      expect(r.raisedAt(w)!.index).toBe(2);
      expect(w.message).toMatch(/about 9[56](\.\d+)? % of yield \(limit 90 %\)/);
    }
    // the same plan with the planned wall raises nothing: 80 % is below the limit
    const healthy = run(tight, { ...small, seed: 25 });
    expect(healthy.warnings).toEqual([]);
  });

  it('each warning once per gauge and code', () => {
    const r = run(plan, {
      ...small,
      levels: [0, 0.25, 0.5, 0.75, 1, 0.5, 0, 0.5, 1, 0],
      seed: 26,
      gauges: { H2: { scale: 0.6 } },
    });
    const keys = r.warnings.map((w) => `${w.gaugeId} ${w.code}`);
    expect(new Set(keys).size).toBe(keys.length);
    expect(keys).toContain('H2 trend-outside-band');
  });
});

describe('a healthy vessel never raises a warning', () => {
  it('over seeds, noise, offsets, formats and hold programmes', () => {
    const arb = fc.record({
      seed: fc.integer({ min: 1, max: 1_000_000 }),
      strainNoise: fc.double({ min: 0, max: 3, noNaN: true }),
      pressureNoise: fc.double({ min: 0, max: 0.002, noNaN: true }),
      offset: fc.integer({ min: -800, max: 800 }),
      levels: fc.constantFrom(
        [0, 0.25, 0.5, 0.75, 1, 0.75, 0.5, 0.25, 0],
        [0, 0.5, 1, 0.5, 0],
        [0, 0.3, 0.6, 0.9, 1, 0],
        [0, 0.2, 0.4, 0.6, 0.8, 1, 0.6, 0, 0.5, 1, 0],
      ),
      model: fc.constantFrom<'lame' | 'membrane'>('lame', 'membrane'),
      // open ends put grid A of the delta rosette R2 (30°) next to a zero prediction (28.7°)
      ends: fc.constantFrom<'closed' | 'open'>('closed', 'open'),
      withTime: fc.boolean(),
      holdSeconds: fc.integer({ min: 20, max: 60 }),
    });
    fc.assert(
      fc.property(arb, (o) => {
        const plan = demoPlan({
          model: o.model,
          vessel: { ...demoPlanInput.vessel, ends: o.ends },
          columns: o.withTime ? demoPlanInput.columns : { pressure: demoPlanInput.columns.pressure },
        });
        const r = run(plan, {
          seed: o.seed,
          strainNoise: o.strainNoise,
          pressureNoise: o.pressureNoise,
          levels: [...o.levels],
          holdSeconds: o.holdSeconds,
          rampSeconds: 15,
          gauges: { H1: { offset: o.offset }, R2: { offset: -o.offset } },
        });
        expect(r.warnings).toEqual([]);
        expect(r.statuses.every((s) => s === 'pending')).toBe(true);
        const ratios = r.holds.flatMap((h) => h.gauges.map((g) => g.provisionalRatio)).filter((x) => x !== null);
        expect(ratios.length).toBeGreaterThan(0);
        const nearZero = new Set(r.done.result.gauges.filter((g) => g.bandBasis === 'near-zero').map((g) => g.id));
        for (const h of r.holds)
          for (const g of h.gauges)
            if (g.provisionalRatio !== null && !nearZero.has(g.id))
              expect(Math.abs(g.provisionalRatio - 1)).toBeLessThan(0.05);
      }),
      { numRuns: 20 },
    );
  });
});

describe('snapshot', () => {
  it('reports the hold in progress and changes nothing', async () => {
    const plan = demoPlan();
    const text = syntheticLog(plan, { ...small, seed: 31 });
    const bytes = enc.encode(text);
    const live = new LiveReducer(plan);
    expect(live.snapshot()).toMatchObject({ rows: 0, pressure: null, holdInProgress: null, holds: [] });
    // stop 20 s into the 50 % hold (30 s holds, 15 s ramps at 2 Hz: the hold starts at 90 s)
    const lines = text.split('\n');
    const upTo = enc.encode(lines.slice(0, 1 + 2 * 110).join('\n') + '\n').length;
    live.push(bytes.subarray(0, upTo));
    const a = live.snapshot();
    const b = live.snapshot();
    expect(a).toStrictEqual(b);
    expect(a.rows).toBe(220);
    expect(a.holds.map((h) => h.index)).toEqual([0, 1]);
    expect(a.holdInProgress).not.toBeNull();
    expect(a.holdInProgress!.pressure / plan.testPressure).toBeCloseTo(0.5, 2);
    expect(a.holdInProgress!.samples).toBeGreaterThanOrEqual(30);
    expect(a.pressure! / plan.testPressure).toBeCloseTo(0.5, 1);
    a.holds[0]!.gauges[0]!.strain = 1e9; // a copy: editing it touches nothing
    live.push(bytes.subarray(upTo));
    const done = live.finish();
    expect(done.result).toStrictEqual((await batch(plan, bytes)).result);
    expect(live.snapshot().holds[0]!.gauges[0]!.strain).not.toBe(1e9);
  });
});
