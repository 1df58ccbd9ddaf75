// Test pressure from MAWP (or design pressure) and the stress ratio, for the rules most test plans
// name. The multipliers are recalled, not read from the codes: the governing code edition and the
// jurisdiction decide, and the responsible engineer confirms the value. Pure; no React.

export type TestPressureRuleId =
  'asme-viii-1-ug-99b' | 'asme-viii-1-ug-100' | 'asme-viii-2-part-8' | 'ped-annex-i-7-4' | 'asme-b31-3-345-4-2';

export interface TestPressureRule {
  id: TestPressureRuleId;
  /** the rule as the code names it */
  label: string;
  medium: 'hydrostatic' | 'pneumatic';
  /** the formula in words, MAWP and ratio as entered */
  formula: string;
  note: string;
  /** test pressure in the unit of MAWP */
  compute: (mawp: number, stressRatio: number) => number;
}

export interface TestPressureResult {
  id: TestPressureRuleId;
  label: string;
  medium: 'hydrostatic' | 'pneumatic';
  formula: string;
  note: string;
  /** same unit as the MAWP entered */
  testPressure: number;
}

/** A reminder shown with every result. */
export const TEST_PRESSURE_CAUTION =
  'Multipliers as commonly stated; the governing code edition and the jurisdiction decide the test pressure, and the responsible engineer confirms it.';

/** The rules of the "Test pressure rules" table in the project's references. */
export const TEST_PRESSURE_RULES: readonly TestPressureRule[] = [
  {
    id: 'asme-viii-1-ug-99b',
    label: 'ASME VIII-1 UG-99(b)',
    medium: 'hydrostatic',
    formula: '1.3 × MAWP × stress ratio',
    note: 'Use the lowest stress ratio (allowable stress at test temperature over that at design temperature) of the materials in the vessel.',
    compute: (mawp, ratio) => 1.3 * mawp * ratio,
  },
  {
    id: 'asme-viii-1-ug-100',
    label: 'ASME VIII-1 UG-100 (pneumatic)',
    medium: 'pneumatic',
    formula: '1.1 × MAWP × stress ratio',
    note: 'Pneumatic test: gas stores far more energy than water at the same pressure. Only where a hydrostatic test is not practicable, with the precautions the code requires.',
    compute: (mawp, ratio) => 1.1 * mawp * ratio,
  },
  {
    id: 'asme-viii-2-part-8',
    label: 'ASME VIII-2 Part 8',
    medium: 'hydrostatic',
    formula: 'max(1.43 × MAWP, 1.25 × MAWP × stress ratio)',
    note: 'Division 2 vessels; the larger of the two values governs.',
    compute: (mawp, ratio) => Math.max(1.43 * mawp, 1.25 * mawp * ratio),
  },
  {
    id: 'ped-annex-i-7-4',
    label: 'PED 2014/68/EU Annex I 7.4',
    medium: 'hydrostatic',
    formula: 'max(1.25 × PS × stress ratio, 1.43 × PS)',
    note: 'Here the maximum allowable loading is taken as PS; where other loads govern, the harmonised standard and the notified body decide.',
    compute: (ps, ratio) => Math.max(1.25 * ps * ratio, 1.43 * ps),
  },
  {
    id: 'asme-b31-3-345-4-2',
    label: 'ASME B31.3 345.4.2 (piping)',
    medium: 'hydrostatic',
    formula: '1.5 × design pressure × stress ratio',
    note: 'Process piping, not vessels. Hold the test pressure for at least 10 minutes.',
    compute: (p, ratio) => 1.5 * p * ratio,
  },
];

/** Throws RangeError unless MAWP and the stress ratio are finite and positive. */
function assertInputs(mawp: number, stressRatio: number): void {
  if (!Number.isFinite(mawp) || mawp <= 0) throw new RangeError(`MAWP must be a positive number (got ${mawp})`);
  if (!Number.isFinite(stressRatio) || stressRatio <= 0)
    throw new RangeError(`The stress ratio must be a positive number (got ${stressRatio})`);
}

/** Test pressure under one rule, labelled with the rule and its note. */
export function computeTestPressure(ruleId: TestPressureRuleId, mawp: number, stressRatio = 1): TestPressureResult {
  assertInputs(mawp, stressRatio);
  const rule = TEST_PRESSURE_RULES.find((r) => r.id === ruleId);
  if (!rule) throw new RangeError(`Unknown test pressure rule '${ruleId}'`);
  const { compute, ...rest } = rule;
  return { ...rest, testPressure: compute(mawp, stressRatio) };
}

/** Test pressure under every rule, in the order of TEST_PRESSURE_RULES. */
export function computeTestPressures(mawp: number, stressRatio = 1): TestPressureResult[] {
  assertInputs(mawp, stressRatio);
  return TEST_PRESSURE_RULES.map((r) => computeTestPressure(r.id, mawp, stressRatio));
}

/**
 * A stress ratio below 1 usually means the two allowables were entered the wrong way round
 * (test temperature is normally colder, so its allowable is at least the design one).
 */
export function isStressRatioSuspect(stressRatio: number): boolean {
  return Number.isFinite(stressRatio) && stressRatio < 1;
}
