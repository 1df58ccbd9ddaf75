import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { listPlanIssues, parsePlan, predictForPlan } from '../../lib/reduction/browser';
import {
  cleanFloat,
  convertPlanUnits,
  createBlankPlan,
  formatNumberForInput,
  getIn,
  nextGaugeId,
  parseNumberText,
  setIn,
  withGaugeKind,
  type PlanDraft,
} from './plan-draft';

/** A full SI plan with every convertible field present, and an extra field the editor does not know. */
const siPlan = (): PlanDraft => ({
  units: 'SI',
  remarks: 'kept as imported',
  vessel: {
    name: 'AR-9',
    shape: 'cylinder',
    ends: 'closed',
    insideDiameter: 1800,
    wallThickness: 16,
    length: 6000,
    features: [
      { kind: 'nozzle', name: 'N1', axialPosition: 2100, clockDeg: 0, size: 150 },
      { kind: 'support', axialPosition: 700 },
    ],
  },
  material: { name: 'carbon steel, generic', elasticModulus: 200000, poissonRatio: 0.3, yieldStrength: 260 },
  model: 'lame',
  testPressure: 3.4,
  columns: { time: 'time_s', pressure: 'P [MPa]' },
  tolerances: { slopeBand: 0.1, zeroShiftMicrostrain: 20 },
  gauges: [
    {
      id: 'H1',
      kind: 'uniaxial',
      channels: ['SG1'],
      angleDeg: 90,
      gaugeFactor: 2.1,
      distanceToDiscontinuity: 1500,
      label: 'hoop, mid-shell',
    },
    {
      id: 'R1',
      kind: 'rosette-rectangular',
      channels: ['SG4', 'SG5', 'SG6'],
      angleDeg: 0,
      axialPosition: 3000,
      clockDeg: 90,
      transverseSensitivity: 0.01,
    },
  ],
});

describe('convertPlanUnits', () => {
  it('converts every length, pressure and stress with the exact factors', () => {
    const us = convertPlanUnits(siPlan(), 'US');
    expect(us.units).toBe('US');
    expect(getIn(us, ['vessel', 'insideDiameter'])).toBeCloseTo(1800 / 25.4, 12);
    expect(getIn(us, ['vessel', 'wallThickness'])).toBeCloseTo(16 / 25.4, 12);
    expect(getIn(us, ['vessel', 'length'])).toBeCloseTo(6000 / 25.4, 12);
    expect(getIn(us, ['vessel', 'features', 0, 'axialPosition'])).toBeCloseTo(2100 / 25.4, 12);
    expect(getIn(us, ['vessel', 'features', 0, 'size'])).toBeCloseTo(150 / 25.4, 12);
    expect(getIn(us, ['gauges', 0, 'distanceToDiscontinuity'])).toBeCloseTo(1500 / 25.4, 12);
    expect(getIn(us, ['gauges', 1, 'axialPosition'])).toBeCloseTo(3000 / 25.4, 12);
    // 1 psi = 6894.757293168 Pa exactly
    expect(getIn(us, ['testPressure'])).toBeCloseTo(3.4e6 / 6894.757293168, 9);
    expect(getIn(us, ['material', 'elasticModulus'])).toBeCloseTo(200000e6 / 6894.757293168, 4);
    expect(getIn(us, ['material', 'yieldStrength'])).toBeCloseTo(260e6 / 6894.757293168, 6);
  });

  it('converts the test temperature °C ↔ °F and back to what was typed', () => {
    const si = { ...siPlan(), procedure: { testTemperature: 15, testMedium: 'water' } };
    const us = convertPlanUnits(si, 'US');
    expect(getIn(us, ['procedure', 'testTemperature'])).toBe(59);
    expect(getIn(us, ['procedure', 'testMedium'])).toBe('water');
    expect(getIn(convertPlanUnits(us, 'SI'), ['procedure', 'testTemperature'])).toBe(15);
    expect(
      getIn(convertPlanUnits({ ...si, procedure: { testTemperature: 12.5 } }, 'US'), ['procedure', 'testTemperature']),
    ).toBe(54.5);
  });

  it('leaves fractions, angles, microstrain, gauge factors, clock positions and unknown fields alone', () => {
    const us = convertPlanUnits(siPlan(), 'US');
    expect(us.remarks).toBe('kept as imported');
    expect(getIn(us, ['material', 'poissonRatio'])).toBe(0.3);
    expect(us.tolerances).toEqual({ slopeBand: 0.1, zeroShiftMicrostrain: 20 });
    expect(getIn(us, ['gauges', 0, 'gaugeFactor'])).toBe(2.1);
    expect(getIn(us, ['gauges', 0, 'label'])).toBe('hoop, mid-shell');
    expect(getIn(us, ['gauges', 1, 'clockDeg'])).toBe(90);
    expect(getIn(us, ['gauges', 1, 'angleDeg'])).toBe(0);
    expect(getIn(us, ['vessel', 'features', 0, 'clockDeg'])).toBe(0);
    expect(getIn(us, ['columns', 'pressure'])).toBe('P [MPa]');
  });

  it('SI → US → SI gives back the same numbers, exactly', () => {
    const back = convertPlanUnits(convertPlanUnits(siPlan(), 'US'), 'SI');
    expect(back).toEqual(siPlan());
  });

  it('US → SI → US gives back the same numbers, exactly', () => {
    const us: PlanDraft = {
      ...siPlan(),
      units: 'US',
      testPressure: 300,
      material: { elasticModulus: 29.5e6, poissonRatio: 0.3, yieldStrength: 38000 },
      vessel: { shape: 'sphere', insideDiameter: 96, wallThickness: 0.625, features: [] },
    };
    expect(convertPlanUnits(convertPlanUnits(us, 'SI'), 'US')).toEqual(us);
  });

  it('round-trips any length within 15 significant digits', () => {
    fc.assert(
      fc.property(fc.double({ min: 1e-3, max: 1e6, noNaN: true }), (mm) => {
        const plan = { units: 'SI', vessel: { insideDiameter: mm } };
        const back = getIn(convertPlanUnits(convertPlanUnits(plan, 'US'), 'SI'), [
          'vessel',
          'insideDiameter',
        ]) as number;
        expect(Math.abs(back - mm) / mm).toBeLessThan(1e-14);
      }),
    );
  });

  it('predicts the same physics in either unit system', () => {
    const si = predictForPlan(parsePlan(siPlan()));
    const us = predictForPlan(parsePlan(convertPlanUnits(siPlan(), 'US')));
    const psiPerMPa = 1e6 / 6894.757293168;
    // µε per MPa = µε per psi × psi per MPa
    expect(us.predicted.lame.hoopStrainPerPressure * psiPerMPa).toBeCloseTo(si.predicted.lame.hoopStrainPerPressure, 8);
    expect(us.predicted.membrane.diameterChange * 25.4).toBeCloseTo(si.predicted.membrane.diameterChange, 10);
    expect(us.predicted.lame.yieldFraction).toBeCloseTo(si.predicted.lame.yieldFraction, 12);
  });

  it('keeps text the user has not finished typing as text', () => {
    const plan = { units: 'SI', testPressure: '3.4x', vessel: { insideDiameter: 1000 } };
    const us = convertPlanUnits(plan, 'US');
    expect(us.testPressure).toBe('3.4x');
    expect(convertPlanUnits(us, 'US')).toBe(us);
  });
});

describe('createBlankPlan', () => {
  it('asks for exactly the values only the vessel documents can give', () => {
    const issues = listPlanIssues(createBlankPlan());
    expect(issues.map((i) => i.path).sort()).toEqual(['testPressure', 'vessel.insideDiameter', 'vessel.wallThickness']);
    expect(issues.every((i) => i.message === 'is required')).toBe(true);
    // the cross-field check (length of a cylinder) runs once the fields themselves are valid
    let plan = setIn(createBlankPlan(), ['vessel', 'insideDiameter'], 1200);
    plan = setIn(plan, ['vessel', 'wallThickness'], 12);
    plan = setIn(plan, ['testPressure'], 1.95);
    expect(listPlanIssues(plan)).toEqual([{ path: 'vessel.length', message: 'is required for a cylinder' }]);
  });

  it('is a valid plan once those are filled in, with the default tolerances', () => {
    let plan = createBlankPlan();
    plan = setIn(plan, ['vessel', 'insideDiameter'], 1200);
    plan = setIn(plan, ['vessel', 'wallThickness'], 12);
    plan = setIn(plan, ['vessel', 'length'], 4200);
    plan = setIn(plan, ['testPressure'], 1.95);
    expect(listPlanIssues(plan)).toEqual([]);
    expect(parsePlan(plan).tolerances).toEqual(parsePlan({ ...plan, tolerances: undefined }).tolerances);
  });
});

describe('parseNumberText and formatNumberForInput', () => {
  it.each([
    ['', undefined],
    ['  ', undefined],
    ['12', 12],
    ['-0.5', -0.5],
    ['1,5', 1.5],
    ['2e5', 200000],
    ['.25', 0.25],
    ['1.', 1],
    ['abc', 'abc'],
    ['1.2.3', '1.2.3'],
    ['-', '-'],
    ['1,000.5', '1,000.5'],
  ])('%j → %j', (text, value) => {
    expect(parseNumberText(text)).toEqual(value);
  });

  it.each([
    [1800, '1800'],
    [70.86614173228347, '70.8661'],
    [0.6299212598425197, '0.629921'],
    [29007547.8, '29007548'],
    [0, '0'],
    [-12.5, '-12.5'],
    [0.995, '0.995'],
    [undefined, ''],
    ['3.4x', '3.4x'],
  ])('shows %j as %j', (v, text) => {
    expect(formatNumberForInput(v)).toBe(text);
  });
});

describe('setIn', () => {
  it('copies along the path, creates missing steps and removes a key set to undefined', () => {
    const plan: PlanDraft = { vessel: { shape: 'cylinder', length: 10 }, gauges: [{ id: 'H1' }] };
    const a = setIn(plan, ['vessel', 'length'], undefined);
    expect(a.vessel).toEqual({ shape: 'cylinder' });
    expect(plan.vessel).toEqual({ shape: 'cylinder', length: 10 });
    const b = setIn(plan, ['gauges', 0, 'channels', 1], 'CH2');
    expect(getIn(b, ['gauges', 0, 'channels'])).toEqual([undefined, 'CH2']);
    expect(setIn({}, ['tolerances', 'slopeBand'], 0.05)).toEqual({ tolerances: { slopeBand: 0.05 } });
  });
});

describe('gauge helpers', () => {
  it('resizes channels to the kind and keeps the ones typed', () => {
    expect(withGaugeKind({ id: 'R1', channels: ['CH1'] }, 'rosette-delta').channels).toEqual(['CH1', '', '']);
    expect(withGaugeKind({ id: 'R1', channels: ['CH1', 'CH2', 'CH3'] }, 'uniaxial').channels).toEqual(['CH1']);
  });
  it('finds the next free id', () => {
    expect(nextGaugeId({ gauges: [{ id: 'G1' }, { id: 'G3' }] })).toBe('G2');
    expect(nextGaugeId({})).toBe('G1');
  });
  it('cleanFloat removes conversion noise only', () => {
    expect(cleanFloat(1800.0000000000002)).toBe(1800);
    expect(cleanFloat(0.1 + 0.2)).toBe(0.3);
    expect(cleanFloat(1.23456789012345)).toBe(1.23456789012345);
    expect(cleanFloat(3000 / 25.4)).toBe(3000 / 25.4);
  });
});
