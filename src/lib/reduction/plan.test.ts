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
      holdCreepMicrostrain: 10,
      holdCreepFraction: 0.01,
      principalDirectionDeg: 10,
      bandMode: 'fixed',
    });
    expect(plan.testFluidDensity).toBe(1000);
    expect(plan.uncertainty).toBeUndefined();
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

describe('parsePlan: the test conduct block', () => {
  it('keeps the procedure, code, medium, temperature and witness, trimmed, and drops empty text', () => {
    const plan = parsePlan({
      ...demoPlanInput,
      procedure: { reference: ' WP-12 rev 2 ', codeEdition: '', testMedium: 'water', testTemperature: 15 },
    });
    expect(plan.procedure).toEqual({
      reference: 'WP-12 rev 2',
      codeEdition: undefined,
      testMedium: 'water',
      testTemperature: 15,
      witness: undefined,
    });
    expect(parsePlan(JSON.stringify(plan)).procedure).toEqual(plan.procedure);
  });
  it('is optional, and not an input of the reduction', () =>
    expect(parsePlan(demoPlanInput).procedure).toBeUndefined());
  it.each([
    ['SI', 250, 'Test conduct: metal temperature during the test: must be between -50 and 200 °C'],
    ['US', 15, undefined],
    ['US', 450, 'Test conduct: metal temperature during the test: must be between -58 and 392 °F'],
  ] as const)('a %s temperature of %d: %s', (units, t, message) => {
    const input = { ...demoPlanInput, units, procedure: { testTemperature: t } };
    if (units === 'US')
      Object.assign(input, {
        material: { ...demoPlanInput.material, elasticModulus: 29e6, yieldStrength: 38000 },
      });
    if (!message) return expect(() => parsePlan(input)).not.toThrow();
    expect(() => parsePlan(input)).toThrow(message);
  });
});

describe('plan rules that trip real users', () => {
  const sphere = { ...demoPlanInput, vessel: { shape: 'sphere', insideDiameter: 3000, wallThickness: 20 } };
  it.each([
    ['absent', {}],
    ['0', { length: 0 }],
  ])('a sphere needs no length (%s)', (_n, extra) => {
    const plan = parsePlan({ ...sphere, vessel: { ...sphere.vessel, ...extra } });
    expect(plan.vessel.length).toBeUndefined();
  });
  it('a perpendicular pair by id is accepted both ways', () => {
    const plan = parsePlan({
      ...demoPlanInput,
      gauges: [
        { ...demoPlanInput.gauges[0]!, pairWith: 'A1' },
        { ...demoPlanInput.gauges[2]!, pairWith: 'H1' },
      ],
    });
    expect(plan.gauges[0]!.pairWith).toBe('A1');
  });
  it('two gauges may not claim the same partner', () => {
    const issues = listPlanIssues({
      ...demoPlanInput,
      gauges: [
        { ...demoPlanInput.gauges[0]!, pairWith: 'A1' },
        { ...demoPlanInput.gauges[1]!, pairWith: 'A1' },
        demoPlanInput.gauges[2]!,
      ],
    });
    expect(issues).toContainEqual({ path: 'gauges[1].pairWith', message: "'A1' is already paired with 'H1'" });
  });
});

describe('parsePlan: friendly errors naming the field', () => {
  it.each([
    ['negative thickness', withVessel({ wallThickness: -3 }), 'Vessel wall thickness: must be greater than 0'],
    [
      "Poisson's ratio 0.7",
      withMaterial({ poissonRatio: 0.7 }),
      "Material Poisson's ratio: must be between 0 and 0.5 (Poisson's ratio)",
    ],
    [
      'a rosette with two channels',
      { ...demoPlanInput, gauges: [{ ...demoPlanInput.gauges[4]!, channels: ['a', 'b'] }] },
      'Gauge R1 is a rectangular rosette and needs three channels (grids A, B, C); it lists two.',
    ],
    [
      'an unknown gauge kind',
      withGauge({ kind: 'biaxial' }),
      "Gauge H1, kind: must be one of uniaxial, rosette-rectangular, rosette-delta (got 'biaxial')",
    ],
    ['no gauges', { ...demoPlanInput, gauges: [] }, 'Gauges: must list at least one gauge'],
    ['missing test pressure', { ...demoPlanInput, testPressure: undefined }, 'Test pressure: is required'],
    ['pressure as text', { ...demoPlanInput, testPressure: '3.4' }, 'Test pressure: must be a number'],
    [
      'E in GPa',
      withMaterial({ elasticModulus: 200 }),
      'Material elastic modulus: 200 MPa is implausibly low: enter MPa (200 GPa = 200000)',
    ],
    [
      'Kt in percent',
      withGauge({ transverseSensitivity: 2 }),
      'Gauge H1, transverse sensitivity: must be between −0.1 and 0.1 (a fraction: 0.02 for 2 %)',
    ],
    [
      'duplicate gauge id',
      { ...demoPlanInput, gauges: [demoPlanInput.gauges[0]!, { ...demoPlanInput.gauges[1]!, id: 'H1' }] },
      "Gauge id 'H1' is used twice: gauges 1 and 2 in the list. Give each gauge its own id.",
    ],
    [
      'channel used twice',
      { ...demoPlanInput, gauges: [demoPlanInput.gauges[0]!, { ...demoPlanInput.gauges[1]!, channels: ['SG1'] }] },
      "Gauge H2, channel: channel 'SG1' is already used by gauge H1",
    ],
    ['unknown units', { ...demoPlanInput, units: 'metric' }, "Units: must be one of SI, US (got 'metric')"],
    ['cylinder without length', withVessel({ length: undefined }), 'Vessel length: is required for a cylinder'],
    ['cylinder of length 0', withVessel({ length: 0 }), 'Vessel length: must be greater than 0 for a cylinder'],
    [
      "a strain channel named 'pressure' (the time history's pressure key)",
      withGauge({ channels: ['pressure'] }),
      "Gauge H1, channel: 'pressure' is reserved for the pressure trace of the time history: rename the strain column",
    ],
    [
      'an unknown band mode',
      { ...demoPlanInput, tolerances: { bandMode: 'loose' } },
      "Tolerances band mode: must be one of fixed, uncertainty (got 'loose')",
    ],
    [
      'a negative uncertainty',
      { ...demoPlanInput, uncertainty: { wallThickness: -1 } },
      'Uncertainty of the wall thickness: must not be negative',
    ],
    [
      'an elevation without the tap elevation',
      withGauge({ elevation: 1200 }),
      'Pressure tap elevation: is required when a gauge gives its elevation (water head)',
    ],
    [
      'a gauge resistance without lead resistance',
      withGauge({ gaugeResistance: 350 }),
      'Gauge H1, lead resistance: is required with gaugeResistance or leadWiring',
    ],
    [
      'pairWith an unknown gauge',
      withGauge({ pairWith: 'X9' }),
      "Gauge H1, paired gauge: names no gauge of this plan ('X9')",
    ],
    ['pairWith itself', withGauge({ pairWith: 'H1' }), 'Gauge H1, paired gauge: must name another gauge'],
    [
      'pairWith a parallel gauge',
      withGauge({ pairWith: 'H2' }),
      "Gauge H1, paired gauge: 'H2' is not perpendicular to this gauge (90° against 90°)",
    ],
    ['pairWith a rosette', withGauge({ pairWith: 'R1' }), "Gauge H1, paired gauge: 'R1' is not a uniaxial gauge"],
    ['not an object', 42, 'Plan: must be a JSON object'],
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
