// flagGauge flag by flag (DESIGN 3.3): one healthy grid, then one thing wrong at a time.
import { describe, expect, it } from 'vitest';
import { flagGauge, isNearZeroPrediction, type GaugeFlagInput } from './flags';
import { tolerancesSchema } from './plan';

const tolerances = tolerancesSchema.parse({});
/** A hoop gauge on the DESIGN 4.1 vessel, in band: 236.9 µε/MPa predicted, 3.4 MPa test pressure. */
const healthy: GaugeFlagInput = {
  predictedSlope: 236.9,
  measuredSlope: 240,
  slopeCI95: [238, 242],
  rSquared: 0.9999,
  peakStrain: 816,
  predictedPeak: 805.5,
  zeroShift: 2,
  hysteresis: 0.01,
  saturatedAt: null,
  holdCreep: 1,
  edgeZone: false,
  largestPrincipal: 236.9,
  predictedU95: 14,
  yieldFraction: 0.72,
  yieldWhere: 'von Mises at the bore, Lamé',
  rosetteYieldFraction: null,
  rosetteFlags: [],
  tolerances,
  pressureUnit: 'MPa',
};
const flags = (over: Partial<GaugeFlagInput>) => flagGauge({ ...healthy, ...over });

describe('flagGauge', () => {
  it('a healthy grid: no flag, in band, ±10 % relative band', () => {
    const f = flagGauge(healthy);
    expect(f.flags).toEqual([]);
    expect(f.outcome).toBe('in-band');
    expect(f.bandBasis).toBe('relative');
    expect(f.bandSlope![0]).toBeCloseTo(236.9 * 0.9, 9);
    expect(f.bandSlope![1]).toBeCloseTo(236.9 * 1.1, 9);
  });
  it.each<[string, Partial<GaugeFlagInput>, string]>([
    ['11 % high', { measuredSlope: 263 }, 'outside-band'],
    ['R² 0.99', { rSquared: 0.99 }, 'nonlinear'],
    ['hysteresis 6 % of peak', { hysteresis: 0.06 }, 'hysteresis'],
    ['zero shift 25 µε (above 20 µε and 2 % of 816)', { zeroShift: 25 }, 'zero-shift'],
    ['peak 8 µε', { peakStrain: 8 }, 'no-response'],
    ['saturated above 2 MPa', { saturatedAt: 2 }, 'no-response'],
    ['negative slope', { measuredSlope: -236 }, 'reversed-sign'],
    ['creep 12 µε during the top hold', { holdCreep: 12 }, 'hold-creep'],
    ['creep −11 µε', { holdCreep: -11 }, 'hold-creep'],
    ['the wall at 90 % of yield', { yieldFraction: 0.9 }, 'near-yield'],
    ['the rosette at 93 % of yield', { rosetteYieldFraction: 0.93 }, 'near-yield'],
    ['the rosette ε1 off its direction', { rosetteFlags: ['principal-direction'] }, 'principal-direction'],
  ])('%s → %s, flagged', (_n, over, code) => {
    const f = flags(over);
    expect(f.flags).toContain(code);
    expect(f.outcome).toBe('flagged');
  });
  it.each<[string, Partial<GaugeFlagInput>]>([
    ['9.9 % high', { measuredSlope: 236.9 * 1.099 }],
    ['zero shift 16 µε: 2 % of 816 µε is 16.3', { zeroShift: 16 }],
    ['creep 9 µε', { holdCreep: 9 }],
    ['the wall at 89.9 % of yield', { yieldFraction: 0.899 }],
  ])('%s → no flag', (_n, over) => expect(flags(over).flags).toEqual([]));
  it('the creep limit grows with the peak: 1 % of 2000 µε is 20 µε', () => {
    expect(flags({ peakStrain: 2000, holdCreep: 15 }).flags).not.toContain('hold-creep');
    expect(flags({ peakStrain: 2000, holdCreep: 21 }).flags).toContain('hold-creep');
  });
  it('a dead channel gets only no-response (band, sign and linearity mean nothing)', () => {
    const f = flags({ peakStrain: 3, measuredSlope: -1, rSquared: 0.2 });
    expect(f.flags).toEqual(['no-response']);
    expect(f.bandSlope).toBeNull();
  });
  it('an edge-zone gauge is not compared, but its quality flags are kept', () => {
    const f = flags({ edgeZone: true, measuredSlope: 300, rSquared: 0.98 });
    expect(f.flags).toEqual(['edge-zone', 'nonlinear']);
    expect(f.outcome).toBe('not-compared');
  });
  it('near yield is never passed over, even in the edge zone', () => {
    expect(flags({ edgeZone: true, yieldFraction: 0.95 }).outcome).toBe('flagged');
  });
  it('uncertainty band mode: √(U_pred² + U_fit²) around the prediction', () => {
    const t = { ...tolerances, bandMode: 'uncertainty' as const };
    // U_pred 14, U_fit 2 → ±14.14 µε/MPa: 250 is in (13.1 off), 252 is out (15.1 off)
    expect(flags({ tolerances: t, measuredSlope: 250 }).flags).toEqual([]);
    const f = flags({ tolerances: t, measuredSlope: 252, slopeCI95: [250, 254] });
    expect(f.flags).toEqual(['outside-band']);
    expect(f.bandBasis).toBe('uncertainty');
    expect(f.bandSlope![1] - 236.9).toBeCloseTo(Math.hypot(14, 2), 9);
  });
  it('a prediction near zero is compared as an absolute deviation of band × the largest principal strain', () => {
    // open ends, 28.7° from the axis: predicted 3 µε/MPa against a hoop strain of 300
    const near = { predictedSlope: 3, largestPrincipal: 300, predictedPeak: 10, peakStrain: 40, rSquared: 0.5 };
    expect(isNearZeroPrediction(3, 300)).toBe(true);
    expect(isNearZeroPrediction(61, 300)).toBe(false);
    const ok = flags({ ...near, measuredSlope: 12 }); // 9 off, within ±30
    expect(ok.flags).toEqual([]);
    expect(ok.bandBasis).toBe('near-zero');
    expect(flags({ ...near, measuredSlope: -25 }).flags).toEqual([]); // 28 off, and the opposite sign is no reversal here
    expect(flags({ ...near, measuredSlope: 34 }).flags).toEqual(['outside-band']);
  });
  it('a predicted strain below twice the floor is not checked for no-response, and says so', () => {
    const f = flags({ predictedSlope: 3, largestPrincipal: 300, predictedPeak: 10, peakStrain: 4, measuredSlope: 1 });
    expect(f.flags).not.toContain('no-response');
    expect(f.notes.join(' ')).toMatch(/too small to tell a dead channel/);
  });
});
