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
}

/** Test pressure from MAWP and the stress ratio under each common rule, with a "use this" choice. */
export default function TestPressureHelper({ pressureUnit, initialMawp, initialStressRatio = 1, onPick }: Props) {
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
                      setPicked(res.id);
                      onPick?.(res.testPressure, res.id);
                    }}
                  >
                    {picked === res.id ? '✓ Chosen' : 'Use this'}
                  </button>
                </td>
              </tr>
            ))}
          </tbody>
        </table>
      )}
      <p className="text-sm font-medium text-ink-900">{TEST_PRESSURE_CAUTION}</p>
      <SafetyCaution compact />
    </section>
  );
}
