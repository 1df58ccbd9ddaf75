// An engine 1 result (stored before engine 2) still reads: normalizeResult derives the new fields
// that follow exactly from the old ones, and leaves the rest empty.
import { describe, expect, it } from 'vitest';
import { normalizeResult, type StoredResult } from './compat';
import { reduceLog } from './reduce';
import { demoPlan } from './testing/fixtures';
import { chunked, syntheticLog } from './testing/synthetic-log';

/** Strip what engine 2 added, as an engine 1 result in the database looks. */
function asEngine1(r: Awaited<ReturnType<typeof reduceLog>>['result']): StoredResult {
  const old = JSON.parse(JSON.stringify(r)) as Record<string, unknown> & StoredResult;
  for (const k of ['yieldCheck', 'bandMode', 'cycles', 'uncertaintyInputs'] as const) delete old[k];
  delete (old.log as Record<string, unknown>).pressureConversion;
  for (const m of [old.predicted.lame, old.predicted.membrane]) {
    delete m.dimensionChanges;
    delete m.yieldCheck;
  }
  for (const g of old.gauges)
    for (const k of [
      'predictedU95',
      'uncertaintyBudget',
      'bandSlope',
      'bandBasis',
      'transverseCorrection',
      'pairedWith',
      'holdCreep',
      'headPressure',
      'effectiveSamples',
    ] as const)
      delete g[k];
  for (const x of old.rosettes) {
    delete x.expectedPrincipalAngleDeg;
    delete x.stressesPerUnitPressure;
    delete x.vonMisesPerUnitPressure;
    delete x.notes;
  }
  old.engineVersion = '1.0.0';
  return old;
}

describe('normalizeResult on an engine 1 result', async () => {
  const plan = demoPlan();
  const { result } = await reduceLog(plan, chunked(syntheticLog(plan, { seed: 4 })));
  const back = normalizeResult(asEngine1(result), {
    yieldStrength: plan.material.yieldStrength,
    yieldFraction: plan.tolerances.yieldFraction,
    slopeBand: plan.tolerances.slopeBand,
  });
  it('named dimension changes follow exactly from diameterChange and thicknessChange', () => {
    for (const m of ['lame', 'membrane'] as const)
      for (const k of ['insideDiameter', 'meanDiameter', 'outsideDiameter', 'thickness'] as const)
        expect(back.predicted[m].dimensionChanges[k]).toBeCloseTo(result.predicted[m].dimensionChanges[k], 12);
  });
  it('the yield check comes back (Lamé: the bore, from the stored fraction)', () => {
    expect(back.yieldCheck.fraction).toBeCloseTo(result.yieldCheck.fraction, 12);
    expect(back.yieldCheck.surface).toBe(result.yieldCheck.surface);
    expect(back.yieldCheck.stress).toBeCloseTo(result.yieldCheck.stress, 9);
  });
  it('rosettes get stresses per unit pressure and the expected direction', () => {
    back.rosettes.forEach((r, i) => {
      expect(r.stressesPerUnitPressure[0]).toBeCloseTo(result.rosettes[i]!.stressesPerUnitPressure[0], 12);
      expect(r.expectedPrincipalAngleDeg).toBe(90);
    });
  });
  it('what cannot be derived is empty, not invented', () => {
    expect(back.gauges[0]!.predictedU95).toBeNull();
    expect(back.gauges[0]!.uncertaintyBudget).toEqual([]);
    expect(back.cycles).toEqual([]);
    expect(back.bandMode).toBe('fixed');
    expect(back.log.pressureConversion).toMatchObject({ fromUnit: 'MPa', factor: 1 });
  });
  it('a current result passes through unchanged', () => {
    const same = normalizeResult(result, { yieldStrength: 260, yieldFraction: 0.9, slopeBand: 0.1 });
    expect(same).toEqual(result);
  });
});
