// The uncertainty budget (DESIGN 3.4; JCGM 100:2008): the propagation against the REFERENCES
// worked example, and the plan-level budget against analytic derivatives written out here.
import { describe, expect, it } from 'vitest';
import { parsePlan, type PlanInput } from './plan';
import { planGridSetups } from './installation';
import { predictForPlan, shellInputFromPlan } from './shell';
import { gridBudget, propagateCentral, resolveUncertainty } from './uncertainty';

describe('GUM first-order propagation — REFERENCES "Added for engine v2" worked check', () => {
  // thin closed cylinder hoop gauge, membrane: ε_h per MPa = r(1 − ν/2)/(E t) with r 900 mm fixed,
  // t 16 mm, E 200 GPa, ν 0.3 → 239.06 µε; u(t) 0.8 mm (5 %), u(E) 3 %, u(ν) 0.015
  // → relative contributions 5 %, 3 %, 0.015·0.5/0.85 = 0.88 %; u_c 5.90 %, U (k = 2) 11.8 % [derived]
  const f = ([t, E, nu]: readonly number[]) => ((900 * (1 - nu! / 2)) / (E! * t!)) * 1e6;
  const x = [16, 200000, 0.3];
  const { combined, contributions } = propagateCentral(f, x, [0.8, 0.03 * 200000, 0.015]);
  const slope = f(x);
  it('the slope is 239.06 µε/MPa', () => expect(slope).toBeCloseTo(239.06, 2));
  it.each([
    ['thickness', 0, 0.05],
    ['elastic modulus', 1, 0.03],
    ["Poisson's ratio", 2, 0.00882],
  ])('%s contributes %#', (_n, i, rel) => expect(contributions[i]! / slope).toBeCloseTo(rel, 3));
  it('u_c 5.90 % and U 11.8 % of the slope', () => {
    expect(combined / slope).toBeCloseTo(0.059, 3);
    expect((2 * combined) / slope).toBeCloseTo(0.118, 2);
  });
});

const thinPlan = (over: Partial<PlanInput> = {}): PlanInput => ({
  units: 'SI',
  // D 1784 mm, t 16 mm: mean radius 900 mm as in the worked check
  vessel: { shape: 'cylinder', ends: 'closed', insideDiameter: 1784, wallThickness: 16, length: 6000 },
  material: { elasticModulus: 200000, poissonRatio: 0.3, yieldStrength: 260 },
  model: 'membrane',
  testPressure: 3.4,
  columns: { pressure: 'P' },
  gauges: [
    { id: 'H1', kind: 'uniaxial', channels: ['SG1'], angleDeg: 90 },
    { id: 'D1', kind: 'uniaxial', channels: ['SG2'], angleDeg: 45 },
    { id: 'A1', kind: 'uniaxial', channels: ['SG3'], angleDeg: 0, transverseSensitivity: 0.02 },
  ],
  ...over,
});
function budgets(input: PlanInput) {
  const plan = parsePlan(input);
  const { predicted, gauges } = predictForPlan(plan);
  const model = predicted[plan.model];
  const setups = planGridSetups(plan, gauges, model);
  return {
    plan,
    model,
    of: (id: string) => {
      const s = setups.find((x) => x.grid.id === id)!;
      const b = gridBudget(plan, shellInputFromPlan(plan), s, setups, model);
      const c = (input: string) => b.budget.find((e) => e.input === input)!.contribution;
      return { ...b, c, slope: s.grid.predictedSlope };
    },
  };
}

describe('the budget of a plan, against analytic derivatives of the membrane formula', () => {
  const { of, model } = budgets(
    thinPlan({
      uncertainty: {
        wallThickness: 0.8,
        insideDiameter: 0,
        gaugeFactor: 0,
        transverseSensitivity: 0,
        misalignmentDeg: 0,
      },
    }),
  );
  const h = of('H1');
  it('thickness: with r = (D + t)/2, ∂ln f/∂t = −D/(t(D + t)) → 1784·0.8/(16·1800) = 4.956 % (central differences 4.968 %)', () =>
    expect(h.c('wallThickness') / h.slope).toBeCloseTo(0.0496, 3));
  it('E 3 %, ν 0.88 % as in the worked check; combined about 5.86 %', () => {
    expect(h.c('elasticModulus') / h.slope).toBeCloseTo(0.03, 3);
    expect(h.c('poissonRatio') / h.slope).toBeCloseTo(0.00882, 4);
    expect(h.predictedU95 / 2 / h.slope).toBeCloseTo(0.0586, 3);
  });
  it('largest first, shares summing to 1, defaults marked as assumed', () => {
    expect(h.budget.map((b) => b.input).slice(0, 3)).toEqual(['wallThickness', 'elasticModulus', 'poissonRatio']);
    expect(h.budget.reduce((s, b) => s + b.share, 0)).toBeCloseTo(1, 12);
    expect(h.budget.find((b) => b.input === 'elasticModulus')!.assumed).toBe(true);
    expect(h.budget.find((b) => b.input === 'wallThickness')!.assumed).toBe(false);
  });
  it('misalignment 1° at 45°: dε/dθ = (εh − εa)·sin 2θ per radian', () => {
    const d = budgets(thinPlan({ uncertainty: { misalignmentDeg: 1 } })).of('D1');
    const want = (model.hoopStrainPerPressure - model.axialStrainPerPressure) * (Math.PI / 180);
    // the central difference over ±1° gives sin(2°)/(2° in rad) = 0.99980 of the derivative
    expect(d.c('misalignmentDeg') / want).toBeCloseTo(Math.sin((2 * Math.PI) / 180) / ((2 * Math.PI) / 180), 9);
  });
  it('a gauge factor stated as certain contributes nothing', () => expect(of('H1').c('gaugeFactor')).toBe(0));
  it('gauge factor (default 0.5 %) contributes 0.5 % of the slope', () => {
    const d = budgets(thinPlan()).of('H1');
    expect(d.c('gaugeFactor') / d.slope).toBeCloseTo(0.005, 12);
  });
  it('Kt ± 0.005 on a hoop gauge with Kt 0: ∂ε̂/∂Kt = ε_across + ν0 ε_along (TN-509 forward model)', () => {
    const d = budgets(thinPlan()).of('H1');
    const want = 0.005 * (model.axialStrainPerPressure + 0.285 * model.hoopStrainPerPressure);
    expect(d.c('transverseSensitivity')).toBeCloseTo(want, 3);
  });
});

describe('Lamé budget against the analytic derivative of A(2 − ν)/E', () => {
  // hoop at the outer surface: f = 1e6·a²(2 − ν)/((b² − a²) E), b = a + t;
  // ∂f/∂t = −f·2b/(b² − a²); ∂f/∂D = f·(1/a − a/(b² − a²)·… ) written out below
  const plan = thinPlan({
    model: 'lame',
    vessel: { shape: 'cylinder', ends: 'closed', insideDiameter: 200, wallThickness: 40, length: 1000 },
    uncertainty: { wallThickness: 0.4, insideDiameter: 0.2 },
  });
  const { of } = budgets(plan);
  const h = of('H1');
  const a = 100,
    b = 140,
    f = h.slope;
  it('thickness', () => expect(h.c('wallThickness')).toBeCloseTo(f * ((2 * b) / (b * b - a * a)) * 0.4, 2));
  it('inside diameter', () => {
    // d/da of a²/(b² − a²) with b = a + t: [2a(b² − a²) − a²(2b − 2a)]/(b² − a²)²; D = 2a
    const dA = (2 * a * (b * b - a * a) - a * a * (2 * b - 2 * a)) / (b * b - a * a) ** 2;
    const A = (a * a) / (b * b - a * a);
    expect(h.c('insideDiameter')).toBeCloseTo(f * (dA / A) * 0.5 * 0.2, 2);
  });
  it('resolveUncertainty: the defaults of DESIGN 3.4 where the plan is silent', () => {
    const r = resolveUncertainty(parsePlan(plan));
    expect(r.find((x) => x.input === 'elasticModulus')).toMatchObject({ standardUncertainty: 0.03, assumed: true });
    expect(r.find((x) => x.input === 'poissonRatio')).toMatchObject({ standardUncertainty: 0.015, assumed: true });
    expect(r.find((x) => x.input === 'misalignmentDeg')).toMatchObject({ standardUncertainty: 1, assumed: true });
    expect(resolveUncertainty(parsePlan(thinPlan())).find((x) => x.input === 'wallThickness')).toMatchObject({
      standardUncertainty: 0.32, // 2 % of 16 mm
      assumed: true,
    });
  });
});
