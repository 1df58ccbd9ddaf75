// Uncertainty of each grid's predicted slope (DESIGN 3.4; JCGM 100:2008, the GUM): first-order
// propagation u_c² = Σ (∂f/∂x_i)² u²(x_i) for uncorrelated inputs (GUM 5.1.2), the sensitivity
// coefficients taken by central differences of the model itself, U = 2·u_c. Pure, browser-safe.
import type { Plan } from './plan';
import { NU0_CALIBRATION } from './corrections';
import type { GridSetup } from './installation';
import { predictedSlopeAt, strainAtAngle, type ShellInput } from './shell';
import type { BudgetEntry, ModelPrediction } from './types';
import { planLengthUnit } from './units';

/** Defaults of DESIGN 3.4, marked as assumptions in the result when the plan gives none. */
export const UNCERTAINTY_DEFAULTS = {
  /** of the nominal thickness */
  wallThicknessRelative: 0.02,
  /** of the nominal inside diameter */
  insideDiameterRelative: 0.002,
  elasticModulus: 0.03,
  poissonRatio: 0.015,
  gaugeFactor: 0.005,
  transverseSensitivity: 0.005,
  misalignmentDeg: 1,
} as const;

export type UncertaintyInput = BudgetEntry['input'];

export interface ResolvedUncertainty {
  input: UncertaintyInput;
  /** nominal value (for the relative inputs E and GF: the value itself; Kt per grid, so 0 here) */
  value: number;
  /** as the plan states it: absolute in `unit`, or relative for E and GF */
  standardUncertainty: number;
  unit: string;
  assumed: boolean;
}

/** The plan's uncertainties with the defaults filled in, in the order of DESIGN 3.4. */
export function resolveUncertainty(plan: Plan): ResolvedUncertainty[] {
  const u = plan.uncertainty ?? {};
  const len = planLengthUnit(plan.units);
  const t = plan.vessel.wallThickness;
  const D = plan.vessel.insideDiameter;
  const entry = (
    input: UncertaintyInput,
    value: number,
    given: number | undefined,
    fallback: number,
    unit: string,
  ): ResolvedUncertainty => ({
    input,
    value,
    standardUncertainty: given ?? fallback,
    unit,
    assumed: given === undefined,
  });
  return [
    entry('wallThickness', t, u.wallThickness, UNCERTAINTY_DEFAULTS.wallThicknessRelative * t, len),
    entry('insideDiameter', D, u.insideDiameter, UNCERTAINTY_DEFAULTS.insideDiameterRelative * D, len),
    entry(
      'elasticModulus',
      plan.material.elasticModulus,
      u.elasticModulus,
      UNCERTAINTY_DEFAULTS.elasticModulus,
      'relative',
    ),
    entry('poissonRatio', plan.material.poissonRatio, u.poissonRatio, UNCERTAINTY_DEFAULTS.poissonRatio, ''),
    entry('gaugeFactor', 1, u.gaugeFactor, UNCERTAINTY_DEFAULTS.gaugeFactor, 'relative'),
    entry('transverseSensitivity', 0, u.transverseSensitivity, UNCERTAINTY_DEFAULTS.transverseSensitivity, 'absolute'),
    entry('misalignmentDeg', 0, u.misalignmentDeg, UNCERTAINTY_DEFAULTS.misalignmentDeg, '°'),
  ];
}

/**
 * First-order propagation with central differences: for each input i, c_i = (f(x + u_i e_i) −
 * f(x − u_i e_i)) / (2 u_i) and the contribution |c_i|·u_i. Returns u_c and the contributions.
 */
export function propagateCentral(
  f: (x: readonly number[]) => number,
  x: readonly number[],
  u: readonly number[],
): { combined: number; contributions: number[] } {
  const contributions = x.map((xi, i) => {
    const ui = u[i] ?? 0;
    if (!(ui > 0)) return 0;
    const up = [...x];
    const down = [...x];
    up[i] = xi + ui;
    down[i] = xi - ui;
    return Math.abs((f(up) - f(down)) / 2);
  });
  return { combined: Math.sqrt(contributions.reduce((s, c) => s + c * c, 0)), contributions };
}

/** Indicated strain of a grid, (ε_along + Kt ε_across)/(1 − ν0 Kt) (TN-509 forward model). */
function indicated(along: number, across: number, kt: number): number {
  return (along + kt * across) / (1 - NU0_CALIBRATION * kt);
}

/**
 * The grid's corrected slope if every grid that enters its correction had a true Kt off by δ while
 * the engine corrects with the plan's: the transverse-sensitivity input of the budget. `all` is in
 * plan channel order (one setup per channel), so a term's channel index is its grid's setup.
 */
function correctedWithKtError(setup: GridSetup, all: readonly GridSetup[], model: ModelPrediction, delta: number) {
  let v = 0;
  setup.terms.forEach((term, j) => {
    const src = all[term.ch];
    if (!src) return;
    const th = src.grid.angleDeg;
    const along = strainAtAngle(model.axialStrainPerPressure, model.hoopStrainPerPressure, th);
    const across = strainAtAngle(model.axialStrainPerPressure, model.hoopStrainPerPressure, th + 90);
    v += (term.coef / (setup.scales[j] ?? 1)) * indicated(along, across, src.gauge.transverseSensitivity + delta);
  });
  return v;
}

/**
 * The budget of one grid's predicted slope (µε per plan pressure unit): predictedU95 = 2·u_c and
 * every input's contribution, largest first.
 */
export function gridBudget(
  plan: Plan,
  shell: ShellInput,
  setup: GridSetup,
  all: readonly GridSetup[],
  model: ModelPrediction,
  inputs: readonly ResolvedUncertainty[] = resolveUncertainty(plan),
): { predictedU95: number; budget: BudgetEntry[] } {
  const th = setup.grid.angleDeg;
  const at = (over: Partial<ShellInput>, angle = th) => predictedSlopeAt({ ...shell, ...over }, plan.model, angle);
  const nominal = setup.grid.predictedSlope;
  const contributions = inputs.map((inp): number => {
    const u = inp.standardUncertainty;
    if (!(u > 0)) return 0;
    switch (inp.input) {
      case 'wallThickness':
        return propagateCentral((x) => at({ wallThickness: x[0]! }), [shell.wallThickness], [u]).combined;
      case 'insideDiameter':
        return propagateCentral((x) => at({ insideDiameter: x[0]! }), [shell.insideDiameter], [u]).combined;
      case 'elasticModulus':
        return propagateCentral(
          (x) => at({ elasticModulus: x[0]! }),
          [shell.elasticModulus],
          [u * shell.elasticModulus],
        ).combined;
      case 'poissonRatio':
        return propagateCentral((x) => at({ poissonRatio: x[0]! }), [shell.poissonRatio], [u]).combined;
      case 'gaugeFactor':
        // the corrected reading scales with 1/GF: a relative error u moves the compared slope by u·|slope|
        return Math.abs(nominal) * u;
      case 'transverseSensitivity':
        return propagateCentral((x) => correctedWithKtError(setup, all, model, x[0]!), [0], [u]).combined;
      case 'misalignmentDeg':
        return propagateCentral((x) => at({}, x[0]), [th], [u]).combined;
    }
  });
  const uc = Math.sqrt(contributions.reduce((s, c) => s + c * c, 0));
  const budget: BudgetEntry[] = inputs.map((inp, i) => {
    const c = contributions[i] ?? 0;
    return {
      input: inp.input,
      value: inp.input === 'transverseSensitivity' ? setup.gauge.transverseSensitivity : inp.value,
      standardUncertainty: inp.standardUncertainty,
      unit: inp.unit,
      contribution: c,
      share: uc > 0 ? (c * c) / (uc * uc) : 0,
      assumed: inp.assumed,
    };
  });
  budget.sort((a, b) => b.contribution - a.contribution);
  return { predictedU95: 2 * uc, budget };
}

/** Words for the inputs, for notes and the review. */
export const UNCERTAINTY_LABELS: Record<UncertaintyInput, string> = {
  wallThickness: 'wall thickness',
  insideDiameter: 'inside diameter',
  elasticModulus: 'elastic modulus',
  poissonRatio: "Poisson's ratio",
  gaugeFactor: 'gauge factor',
  transverseSensitivity: 'transverse sensitivity',
  misalignmentDeg: 'gauge misalignment',
};

/** "wall thickness ± 0.32 mm (assumed)" for an input as the plan states it. */
export function describeUncertainty(
  e: Pick<ResolvedUncertainty, 'input' | 'standardUncertainty' | 'unit' | 'assumed'>,
): string {
  const v = Number(e.standardUncertainty.toPrecision(3));
  const amount =
    e.unit === 'relative'
      ? `${Number((v * 100).toPrecision(3))} %`
      : e.unit === '°'
        ? `${v}°`
        : e.unit
          ? `${v} ${e.unit}`
          : `${v}`;
  return `${UNCERTAINTY_LABELS[e.input]} ± ${amount}${e.assumed ? ' (assumed)' : ''}`;
}
