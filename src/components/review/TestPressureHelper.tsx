import { useId, useState } from 'react';
import {
  computeTestPressures,
  isStressRatioSuspect,
  TEST_PRESSURE_CAUTION,
  type TestPressureResult,
  type TestPressureRuleId,
} from '../../lib/test-pressure';
import { formatFixed, type PressureUnit } from '../../lib/ui-format';
import SafetyCaution from './SafetyCaution';

interface Props {
  pressureUnit: PressureUnit;
  initialMawp?: number;
  initialStressRatio?: number;
  /** called with the chosen rule's test pressure (same unit as MAWP) */
  onPick?: (testPressure: number, ruleId: TestPressureRuleId) => void;
  /**
   * the engine's yield check for the plan as typed, scaled to a pressure (linear elasticity):
   * the largest stress in the wall over yield; null while the plan cannot be predicted
   */
  yieldFractionAt?: (testPressure: number) => number | null;
  /** the plan's near-yield limit (fraction of yield) */
  yieldLimit?: number;
}

/** Test pressure from MAWP and the stress ratio under each common rule, with a "use this" choice. */
export default function TestPressureHelper({
  pressureUnit,
  initialMawp,
  initialStressRatio = 1,
  onPick,
  yieldFractionAt,
  yieldLimit = 0.9,
}: Props) {
  const [pendingPneumatic, setPendingPneumatic] = useState<TestPressureRuleId | null>(null);
  const id = useId();
  const [mawp, setMawp] = useState(initialMawp !== undefined ? String(initialMawp) : '');
  const [ratio, setRatio] = useState(String(initialStressRatio));
  const [picked, setPicked] = useState<TestPressureRuleId | null>(null);
  const m = Number(mawp),
    r = Number(ratio);
  const mawpError = mawp.trim() !== '' && !(m > 0) ? 'Enter MAWP as a positive number.' : null;
  const ratioError =
    ratio.trim() !== '' && !(r > 0)
      ? 'Enter the stress ratio as a positive number, e.g. 1 or 138/118 as 1.1695.'
      : null;
  let results: TestPressureResult[] = [];
  if (mawp.trim() !== '' && ratio.trim() !== '' && !mawpError && !ratioError) results = computeTestPressures(m, r);
  const digits = pressureUnit === 'psi' ? 1 : 3;
  const pickedResult = results.find((x) => x.id === picked);
  const chosen = pickedResult
    ? { pressure: pickedResult.testPressure, fraction: yieldFractionAt?.(pickedResult.testPressure) ?? null }
    : null;

  return (
    <section className="space-y-4 card" aria-labelledby={`${id}-h`}>
      <h2 id={`${id}-h`} className="text-lg font-semibold text-ink-900">
        Test pressure from MAWP
      </h2>
      <div className="grid gap-4 sm:grid-cols-2">
        <div>
          <label htmlFor={`${id}-mawp`} className="label">
            MAWP or design pressure ({pressureUnit})
          </label>
          <input
            id={`${id}-mawp`}
            className="num field"
            inputMode="decimal"
            value={mawp}
            onChange={(e) => setMawp(e.target.value)}
            aria-invalid={!!mawpError}
            aria-describedby={mawpError ? `${id}-mawp-err` : undefined}
          />
          {mawpError && (
            <p id={`${id}-mawp-err`} className="error-text">
              {mawpError}
            </p>
          )}
        </div>
        <div>
          <label htmlFor={`${id}-ratio`} className="label">
            Stress ratio (allowable at test ÷ at design temperature)
          </label>
          <input
            id={`${id}-ratio`}
            className="num field"
            inputMode="decimal"
            value={ratio}
            onChange={(e) => setRatio(e.target.value)}
            aria-invalid={!!ratioError}
            aria-describedby={`${id}-ratio-hint`}
          />
          {ratioError ? (
            <p id={`${id}-ratio-hint`} className="error-text">
              {ratioError}
            </p>
          ) : (
            <p id={`${id}-ratio-hint`} className="mt-1 text-xs text-ink-700">
              {isStressRatioSuspect(r)
                ? '⚠ Below 1: check that the two allowables are not swapped.'
                : 'Use the lowest ratio of the materials in the vessel.'}
            </p>
          )}
        </div>
      </div>
      {results.length > 0 && (
        <table className="table-base">
          <caption className="sr-only">Test pressure under each rule</caption>
          <thead>
            <tr>
              <th scope="col">Rule</th>
              <th scope="col">Formula</th>
              <th scope="col" className="text-right!">
                Test pressure
              </th>
              <th scope="col">
                <span className="sr-only">Choose</span>
              </th>
            </tr>
          </thead>
          <tbody>
            {results.map((res) => (
              <tr key={res.id} className={picked === res.id ? 'bg-brass-100' : undefined}>
                <td>
                  <span className="font-semibold">{res.label}</span>
                  {res.medium === 'pneumatic' && (
                    <span className="ml-2 rounded bg-flag px-1.5 text-xs font-bold text-white">⚠ pneumatic</span>
                  )}
                  <p className="mt-0.5 text-xs text-ink-700">{res.note}</p>
                </td>
                <td className="text-sm whitespace-nowrap">{res.formula}</td>
                <td className="num text-right font-semibold whitespace-nowrap">
                  {formatFixed(res.testPressure, digits)} {pressureUnit}
                </td>
                <td>
                  <button
                    type="button"
                    className="btn-secondary whitespace-nowrap"
                    aria-label={`Use ${formatFixed(res.testPressure, digits)} ${pressureUnit} (${res.label})`}
                    onClick={() => {
                      // a pneumatic rule is taken only after the person confirms it is meant
                      if (res.medium === 'pneumatic' && pendingPneumatic !== res.id) {
                        setPendingPneumatic(res.id);
                        return;
                      }
                      setPendingPneumatic(null);
                      setPicked(res.id);
                      onPick?.(res.testPressure, res.id);
                    }}
                  >
                    {picked === res.id ? '✓ Chosen' : pendingPneumatic === res.id ? 'Confirm pneumatic' : 'Use this'}
                  </button>
                </td>
              </tr>
            ))}
          </tbody>
        </table>
      )}
      {pendingPneumatic && (
        <p
          role="alert"
          className="rounded-md border-2 border-flag bg-white px-3 py-2 text-sm font-semibold text-ink-950"
        >
          ⚠ A pneumatic test stores far more energy than a hydrostatic one at the same pressure. Choose it only where
          the governing code and the written procedure call for it, with the exclusion zone they set; press “Confirm
          pneumatic” to use it.
        </p>
      )}
      {chosen && <ChosenPressureCautions {...chosen} pressureUnit={pressureUnit} digits={digits} limit={yieldLimit} />}
      <p className="text-sm font-medium text-ink-900">{TEST_PRESSURE_CAUTION}</p>
      <SafetyCaution compact />
    </section>
  );
}

/** What to check about a chosen test pressure: the engine's yield check, where it is measured, metal temperature. */
export function ChosenPressureCautions({
  pressure,
  fraction,
  limit,
  pressureUnit,
  digits,
}: {
  pressure: number;
  fraction: number | null;
  limit: number;
  pressureUnit: PressureUnit;
  digits: number;
}) {
  const near = fraction !== null && fraction >= limit;
  const head = pressureUnit === 'psi' ? 'about 0.433 psi per foot' : 'about 0.0098 MPa per metre';
  return (
    <div
      className="space-y-1 rounded-md border border-ink-800/20 bg-ink-50 px-3 py-2 text-sm"
      data-testid="pressure-cautions"
    >
      <p role={near ? 'alert' : undefined} className={near ? 'font-semibold text-flag-ink' : undefined}>
        {fraction === null
          ? 'Yield check: complete the vessel and material to see the largest stress in the wall at this pressure.'
          : `Yield check at ${formatFixed(pressure, digits)} ${pressureUnit}: the largest stress in the wall is ${formatFixed(fraction * 100, 1)} % of yield (near-yield limit ${formatFixed(limit * 100, 0)} %)${near ? ': near yield. Do not use this pressure without the responsible engineer’s review of the wall.' : '.'}`}
      </p>
      <p>
        Where it is measured: the test pressure is read at the top of the vessel; at the lowest point the water adds its
        weight ({head} of height), and that part of the shell sees the sum.
      </p>
      <p>
        Metal temperature: do not pressurise below the minimum design metal temperature with the margin the governing
        code sets (brittle fracture); record the metal and water temperature.
      </p>
    </div>
  );
}
