import { describe, expect, it } from 'vitest';
import { parsePlan, listPlanIssues, planSchema } from './plan';
import { InputError } from './errors';
import { demoPlanInput } from './testing/fixtures';

const withVessel = (v: object) => ({ ...demoPlanInput, vessel: { ...demoPlanInput.vessel, ...v } });
const withMaterial = (m: object) => ({ ...demoPlanInput, material: { ...demoPlanInput.material, ...m } });
const withGauge = (g: object) => ({
  ...demoPlanInput,
  gauges: [{ ...demoPlanInput.gauges[0]!, ...g }, ...demoPlanInput.gauges.slice(1)],
});

describe('parsePlan: defaults', () => {
  const plan = parsePlan(demoPlanInput);
  it('fills tolerances with DESIGN 3.3 defaults and hold detection defaults', () => {
    expect(plan.tolerances).toEqual({
      slopeBand: 0.1,
      minRSquared: 0.995,
      hysteresis: 0.05,
      zeroShiftMicrostrain: 20,
      zeroShiftFraction: 0.02,
      noResponseMicrostrain: 10,
      yieldFraction: 0.9,
    });
    expect(plan.holdDetection).toEqual({ band: 0.02, minDurationSeconds: 10, minSamples: 5, settleFraction: 0.3 });
    expect(plan.model).toBe('lame');
    expect(plan.gauges[0]!.instrumentGaugeFactor).toBe(2.0);
    expect(plan.gauges[0]!.transverseSensitivity).toBe(0);
  });
  it('accepts its own JSON text (import/export round trip)', () =>
    expect(parsePlan(JSON.stringify(plan))).toEqual(plan));
  it('keeps a partial tolerance override', () =>
    expect(parsePlan({ ...demoPlanInput, tolerances: { slopeBand: 0.05 } }).tolerances.minRSquared).toBe(0.995));
});

describe('parsePlan: friendly errors naming the field', () => {
  it.each([
    ['negative thickness', withVessel({ wallThickness: -3 }), 'vessel.wallThickness: must be greater than 0'],
    [
      "Poisson's ratio 0.7",
      withMaterial({ poissonRatio: 0.7 }),
      "material.poissonRatio: must be between 0 and 0.5 (Poisson's ratio)",
    ],
    [
      'a rosette with two channels',
      { ...demoPlanInput, gauges: [{ ...demoPlanInput.gauges[4]!, channels: ['a', 'b'] }] },
      'gauges[0].channels: a rosette-rectangular needs exactly 3 channels (grids A, B, C), got 2',
    ],
    [
      'an unknown gauge kind',
      withGauge({ kind: 'biaxial' }),
      "gauges[0].kind: must be one of uniaxial, rosette-rectangular, rosette-delta (got 'biaxial')",
    ],
    ['no gauges', { ...demoPlanInput, gauges: [] }, 'gauges: must list at least one gauge'],
    ['missing test pressure', { ...demoPlanInput, testPressure: undefined }, 'testPressure: is required'],
    ['pressure as text', { ...demoPlanInput, testPressure: '3.4' }, 'testPressure: must be a number'],
    [
      'E in GPa',
      withMaterial({ elasticModulus: 200 }),
      'material.elasticModulus: 200 MPa is implausibly low: enter MPa (200 GPa = 200000)',
    ],
    [
      'Kt in percent',
      withGauge({ transverseSensitivity: 2 }),
      'gauges[0].transverseSensitivity: must be between −0.1 and 0.1 (a fraction: 0.02 for 2 %)',
    ],
    [
      'duplicate gauge id',
      { ...demoPlanInput, gauges: [demoPlanInput.gauges[0]!, { ...demoPlanInput.gauges[1]!, id: 'H1' }] },
      "gauges[1].id: duplicate gauge id 'H1' (also gauges[0])",
    ],
    [
      'channel used twice',
      { ...demoPlanInput, gauges: [demoPlanInput.gauges[0]!, { ...demoPlanInput.gauges[1]!, channels: ['SG1'] }] },
      "gauges[1].channels[0]: channel 'SG1' is already used by gauge H1",
    ],
    ['unknown units', { ...demoPlanInput, units: 'metric' }, "units: must be one of SI, US (got 'metric')"],
    ['cylinder without length', withVessel({ length: undefined }), 'vessel.length: is required for a cylinder'],
    ['not an object', 42, 'plan: must be a JSON object'],
  ])('%s', (_n, input, message) => {
    let err: unknown;
    try {
      parsePlan(input);
    } catch (e) {
      err = e;
    }
    expect(err).toBeInstanceOf(InputError);
    expect((err as InputError).code).toBe('invalid-plan');
    expect((err as InputError).message.split(' (and ')[0]).toBe(message);
    expect((err as InputError).details!.issues!.length).toBeGreaterThan(0);
  });
  it('bad JSON text', () => expect(() => parsePlan('{"units": ')).toThrow(/plan: not valid JSON/));
  it('lists every problem for the editor', () => {
    const issues = listPlanIssues({
      ...demoPlanInput,
      testPressure: -1,
      vessel: { ...demoPlanInput.vessel, insideDiameter: 0 },
    });
    expect(issues.map((i) => i.path).sort()).toEqual(['testPressure', 'vessel.insideDiameter']);
  });
  it('US customary plan', () => {
    expect(
      planSchema.safeParse({
        ...demoPlanInput,
        units: 'US',
        material: { elasticModulus: 29.5e6, poissonRatio: 0.3, yieldStrength: 38000 },
      }).success,
    ).toBe(true);
  });
});
