import { describe, expect, it } from 'vitest';
import {
  computeTestPressure,
  computeTestPressures,
  isStressRatioSuspect,
  TEST_PRESSURE_RULES,
  type TestPressureRuleId,
} from './test-pressure';

// Source for every check: REFERENCES.md, "Test pressure rules" — the values are tagged [derived]
// (computed from the table's formulas) and the table itself [memory]: the governing code edition
// and the jurisdiction decide, not these tests.
const TOL = 1e-9;

describe('computeTestPressure — MAWP 1.5 MPa, stress ratio 1 (REFERENCES.md, Test pressure rules, check [derived])', () => {
  it.each<[TestPressureRuleId, number, string]>([
    ['asme-viii-1-ug-99b', 1.95, 'ASME VIII-1 UG-99(b): 1.3 × 1.5 × 1'],
    ['asme-viii-2-part-8', 2.145, 'ASME VIII-2 Part 8: max(1.43 × 1.5, 1.25 × 1.5 × 1)'],
    ['ped-annex-i-7-4', 2.145, 'PED 2014/68/EU Annex I 7.4: max(1.25 × 1.5 × 1, 1.43 × 1.5)'],
    ['asme-b31-3-345-4-2', 2.25, 'ASME B31.3 345.4.2: 1.5 × 1.5 × 1'],
  ])('%s → %f MPa (%s)', (rule, expected) => {
    expect(computeTestPressure(rule, 1.5, 1).testPressure).toBeCloseTo(expected, 9);
  });

  it('ASME VIII-1 UG-99(b) with ratio 138/118 → 2.2805 MPa (REFERENCES.md, Test pressure rules [derived])', () => {
    const r = computeTestPressure('asme-viii-1-ug-99b', 1.5, 138 / 118);
    expect(Math.abs(r.testPressure - 2.2805)).toBeLessThan(5e-5); // the reference rounds to 4 decimals
  });

  it('ASME VIII-1 UG-100 pneumatic is 1.1 × MAWP × ratio → 1.65 MPa (REFERENCES.md, Test pressure rules [memory], value derived here)', () => {
    expect(computeTestPressure('asme-viii-1-ug-100', 1.5, 1).testPressure).toBeCloseTo(1.65, 9);
  });
});

describe('where the max() of VIII-2 and PED switches branch (REFERENCES.md, Test pressure rules [memory] formulas)', () => {
  // 1.25 × ratio exceeds 1.43 once ratio > 1.144: the stress-ratio term governs.
  it('VIII-2 with ratio 1.2: 1.25 × 1.5 × 1.2 = 2.25 beats 1.43 × 1.5 = 2.145', () => {
    expect(computeTestPressure('asme-viii-2-part-8', 1.5, 1.2).testPressure).toBeCloseTo(2.25, 9);
  });
  it('PED with ratio 1.2 gives the same 2.25', () => {
    expect(computeTestPressure('ped-annex-i-7-4', 1.5, 1.2).testPressure).toBeCloseTo(2.25, 9);
  });
  it('scales linearly with MAWP in psi too: 217.56 psi × 1.3 = 282.828 psi (VIII-1; derived here from the table formula, not a published value)', () => {
    expect(computeTestPressure('asme-viii-1-ug-99b', 217.56, 1).testPressure).toBeCloseTo(282.828, 9);
  });
});

describe('computeTestPressures', () => {
  it('returns every rule, each labelled with its rule, formula and a note', () => {
    const all = computeTestPressures(1.5, 1);
    expect(all.map((r) => r.id)).toEqual(TEST_PRESSURE_RULES.map((r) => r.id));
    for (const r of all) {
      expect(r.label.length).toBeGreaterThan(5);
      expect(r.formula).toMatch(/×/);
      expect(r.note.length).toBeGreaterThan(10);
      expect(r.testPressure).toBeGreaterThan(1.5 - TOL);
    }
    expect(all.find((r) => r.id === 'asme-viii-1-ug-100')?.medium).toBe('pneumatic');
    expect(all.find((r) => r.id === 'asme-b31-3-345-4-2')?.note).toMatch(/10 minutes/); // REFERENCES.md: hold at least 10 min
  });

  it.each([
    [0, 1],
    [-1, 1],
    [Number.NaN, 1],
    [1.5, 0],
    [1.5, Number.POSITIVE_INFINITY],
  ])('rejects MAWP %f with ratio %f', (mawp, ratio) => {
    expect(() => computeTestPressures(mawp, ratio)).toThrow(RangeError);
  });

  it('marks a stress ratio below 1 as suspect (allowables swapped)', () => {
    expect(isStressRatioSuspect(118 / 138)).toBe(true);
    expect(isStressRatioSuspect(1)).toBe(false);
  });
});
