import { describe, expect, it } from 'vitest';
import { parsePlan, type PlanInput } from './plan';
import { findPerpendicularPartners, headPressureAt, planGridSetups } from './installation';
import { predictForPlan } from './shell';
import { demoPlanInput } from './testing/fixtures';

const withGauges = (gauges: PlanInput['gauges'], over: Partial<PlanInput> = {}) =>
  parsePlan({ ...demoPlanInput, gauges, ...over });

describe('co-located perpendicular partners', () => {
  const g = (id: string, angleDeg: number, axialPosition?: number, clockDeg?: number) => ({
    id,
    kind: 'uniaxial' as const,
    channels: [`c${id}`],
    angleDeg,
    axialPosition,
    clockDeg,
  });
  it('same place (within one wall thickness, 16 mm) and 90° apart (±5°)', () => {
    const p = findPerpendicularPartners(
      withGauges([g('H1', 90, 3000, 90), g('A1', 2, 3010, 90.5), g('H2', 90, 3000, 270), g('A2', 0, 3040, 270)]),
    );
    expect(p.get('H1')).toBe('A1');
    expect(p.get('A1')).toBe('H1');
    expect(p.has('H2')).toBe(false); // A2 is 40 mm away
  });
  it('parallel or 45° gauges at one place are no pair; the nearest perpendicular one wins', () => {
    const p = findPerpendicularPartners(
      withGauges([
        g('H1', 90, 3000, 0),
        g('H9', 90, 3000, 0),
        g('D1', 45, 3000, 0),
        g('A1', 0, 3008, 0),
        g('A2', 0, 3002, 0),
      ]),
    );
    expect(p.get('H1')).toBe('A2');
    expect(p.get('H9')).toBe('A1');
    expect(p.has('D1')).toBe(false);
  });
  it('an explicit pairWith, without positions', () => {
    const p = findPerpendicularPartners(withGauges([g('H1', 90), { ...g('A1', 0), pairWith: 'H1' }]));
    expect(p.get('H1')).toBe('A1');
  });
  it('the pair correction is a two-term combination; without Kt none is needed', () => {
    const plan = withGauges([{ ...g('H1', 90, 3000, 0), transverseSensitivity: 0.02 }, g('A1', 0, 3000, 0)]);
    const { predicted, gauges } = predictForPlan(plan);
    const [h, a] = planGridSetups(plan, gauges, predicted.lame);
    expect(h!.transverseCorrection).toBe('measured-partner');
    expect(h!.terms.map((t) => t.ch)).toEqual([0, 1]);
    expect(a!.transverseCorrection).toBe('none');
  });
});

describe('water head ρ g Δh (common practice)', () => {
  it('SI: 10 m of water at 1000 kg/m³ is 0.0980665 MPa', () => {
    const plan = withGauges([{ ...demoPlanInput.gauges[0]!, elevation: 0 }], { pressureTapElevation: 10000 });
    expect(headPressureAt(plan, plan.gauges[0]!)).toBeCloseTo(0.0980665, 12);
  });
  it('US: one foot of water is 0.433 psi (the usual rule of thumb)', () => {
    const plan = parsePlan({
      ...demoPlanInput,
      units: 'US',
      material: { elasticModulus: 29.5e6, poissonRatio: 0.3, yieldStrength: 38000 },
      pressureTapElevation: 12,
      gauges: [{ ...demoPlanInput.gauges[0]!, elevation: 0 }],
    });
    expect(headPressureAt(plan, plan.gauges[0]!)).toBeCloseTo(0.4335, 4);
  });
  it('a gauge above the tap sees less; no elevation, no head', () => {
    const plan = withGauges(
      [
        { ...demoPlanInput.gauges[0]!, elevation: 2000 },
        { ...demoPlanInput.gauges[1]!, elevation: undefined },
      ],
      { pressureTapElevation: 1000 },
    );
    expect(headPressureAt(plan, plan.gauges[0]!)).toBeLessThan(0);
    expect(headPressureAt(plan, plan.gauges[1]!)).toBe(0);
  });
});
