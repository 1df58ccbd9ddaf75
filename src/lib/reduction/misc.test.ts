import { describe, expect, it } from 'vitest';
import { applyDispositions } from './dispositions';
import { decimateSeries, SeriesBuilder } from './series';
import { detectHolds } from './holds';
import { InputError } from './errors';
import type { GaugeResult, Series } from './types';

const g = (id: string, outcome: GaugeResult['outcome']): GaugeResult => ({
  id,
  channel: id,
  angleDeg: 90,
  measuredSlope: 1,
  predictedSlope: 1,
  ratio: 1,
  deviation: 0,
  slopeCI95: null,
  rSquared: 1,
  residualSD: 0,
  intercept: 0,
  unloadingSlope: 1,
  hysteresis: 0,
  zeroShift: 0,
  peakStrain: 100,
  effectiveThickness: 16,
  distanceToDiscontinuity: null,
  flags: outcome === 'flagged' ? ['outside-band'] : [],
  outcome,
  predictedU95: null,
  uncertaintyBudget: [],
  bandSlope: null,
  bandBasis: 'relative',
  transverseCorrection: 'none',
  pairedWith: null,
  holdCreep: null,
  headPressure: 0,
  effectiveSamples: null,
  holdStrains: [],
  points: [],
  notes: [],
});

describe('applyDispositions (DESIGN 3.3)', () => {
  const result = {
    verdict: 'flagged' as const,
    gauges: [g('H1', 'in-band'), g('H2', 'flagged'), g('R1/A', 'flagged'), g('R1/B', 'in-band')],
  };
  it.each([
    ['nothing dispositioned', [], 'flagged'],
    [
      'H2 accepted, R1/A retest',
      [
        { gaugeId: 'H2', outcome: 'accepted', reason: 'r' },
        { gaugeId: 'R1/A', outcome: 'retest', reason: 'r' },
      ],
      'flagged',
    ],
    [
      'H2 accepted, R1/A excluded',
      [
        { gaugeId: 'H2', outcome: 'accepted', reason: 'r' },
        { gaugeId: 'R1/A', outcome: 'excluded', reason: 'debonded' },
      ],
      'conforms',
    ],
    [
      'H2 excluded, rosette R1 accepted as a whole',
      [
        { gaugeId: 'H2', outcome: 'excluded', reason: 'r' },
        { gaugeId: 'R1', outcome: 'accepted', reason: 'r' },
      ],
      'conforms',
    ],
    [
      'the last disposition wins',
      [
        { gaugeId: 'H2', outcome: 'accepted', reason: 'r' },
        { gaugeId: 'H2', outcome: 'retest', reason: 'r' },
        { gaugeId: 'R1/A', outcome: 'excluded', reason: 'r' },
      ],
      'flagged',
    ],
  ] as const)('%s → %s', (_n, ds, verdict) => expect(applyDispositions(result, ds).verdict).toBe(verdict));
  it('excluded sets the outcome; incomplete stays incomplete', () => {
    const r = applyDispositions(result, [{ gaugeId: 'H2', outcome: 'excluded', reason: 'lead broken' }]);
    expect(r.gauges[1]!.outcome).toBe('excluded');
    expect(r.gauges[1]!.disposition!.reason).toBe('lead broken');
    expect(applyDispositions({ ...result, verdict: 'incomplete' }, []).verdict).toBe('incomplete');
  });
});

describe('series', () => {
  const b = new SeriesBuilder(['pressure', 'SG1'], 100, false);
  for (let i = 0; i < 10000; i++) b.add(i * 0.01, [i % 500 === 0 ? 99 : 1, -i]);
  const s = b.build();
  it('stays within its buckets and keeps spikes', () => {
    expect(s.t.length).toBeLessThanOrEqual(100);
    expect(Math.max(...s.max.pressure!)).toBe(99);
    expect(Math.min(...s.min.SG1!)).toBe(-9999);
  });
  it('decimateSeries re-buckets a window keeping min and max', () => {
    const d = decimateSeries(s, { from: 20, to: 60, points: 10 });
    expect(d.t.length).toBeLessThanOrEqual(10);
    expect(d.t[0]!).toBeGreaterThanOrEqual(20);
    expect(Math.max(...d.max.pressure!)).toBe(99);
    const all = decimateSeries(s, { points: 3 });
    expect(Math.min(...all.min.SG1!)).toBe(-9999);
  });
  it('works on JSON (missing values are null)', () => {
    const j = JSON.parse(
      JSON.stringify({ ...s, min: { ...s.min, SG1: s.min.SG1!.map((v, i) => (i === 0 ? NaN : v)) } }),
    ) as Series;
    expect(decimateSeries(j, { points: 5 }).t.length).toBeLessThanOrEqual(5);
  });
  it('rejects points < 1', () => expect(() => decimateSeries(s, { points: 0 })).toThrow(InputError));
});

describe('detectHolds', () => {
  // 1 Hz: 60 s at 0, ramp 30 s, 60 s at 1, ramp, 60 s at 2, down to 0
  const p: number[] = [];
  const seg = (from: number, to: number, n: number) => {
    for (let i = 0; i < n; i++) p.push(from + ((to - from) * i) / n);
  };
  seg(0, 0, 60);
  seg(0, 1, 30);
  seg(1, 1, 60);
  seg(1, 2, 30);
  seg(2, 2, 60);
  seg(2, 0, 30);
  seg(0, 0, 60);
  const t = p.map((_, i) => i);
  it.each([
    ['1 Hz', 1],
    ['1 kHz', 1000],
  ])('%s: four holds with branches', (_n, rate) => {
    const tt: number[] = [],
      pp: number[] = [];
    t.forEach((x, i) => {
      for (let k = 0; k < rate / 10 + 1; k++) {
        tt.push(x + k / (rate / 10 + 1));
        pp.push(p[i]! + (k % 2 ? 0.001 : -0.001));
      }
    });
    const holds = detectHolds(tt, pp, { bandAbs: 0.04, minDuration: 10, minSamples: 5, settleFraction: 0.3 });
    expect(holds.map((h) => h.branch)).toEqual(['zero', 'loading', 'loading', 'return']);
    expect(holds[2]!.pressure).toBeCloseTo(2, 2);
  });
  it('a slow ramp is not a hold', () => {
    const tt = Array.from({ length: 2000 }, (_, i) => i);
    expect(
      detectHolds(
        tt,
        tt.map((x) => x / 1000),
        { bandAbs: 0.04, minDuration: 10, minSamples: 5, settleFraction: 0.3 },
      ),
    ).toEqual([]);
  });
});
