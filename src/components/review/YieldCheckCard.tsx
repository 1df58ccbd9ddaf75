import type { ReductionResult } from '../../lib/reduction/types';
import { formatPercent, formatPressure, formatStress, type PressureUnit } from '../../lib/ui-format';
import { SURFACE_WORDS } from './budget-words';
import { FLAG_GLOSSARY } from './flag-glossary';
import YieldBar from './YieldBar';
import { MODEL_NAME } from '../../lib/verdict-words';

interface Props {
  yieldCheck: ReductionResult['yieldCheck'];
  pressureUnit: PressureUnit;
}

/** The largest stress in the wall at test pressure against yield (DESIGN 3.1), and what to do when it is near. */
export default function YieldCheckCard({ yieldCheck: y, pressureUnit }: Props) {
  return (
    <section className="card" aria-labelledby="yield-h">
      <h2 id="yield-h" className="mb-2 text-lg font-semibold">
        Yield check
      </h2>
      <YieldBar fraction={y.fraction} nearYieldFraction={y.limit} label="Largest stress in the wall / yield" />
      <p className="mt-2 text-sm text-ink-800">
        {SURFACE_WORDS[y.surface]}, {MODEL_NAME[y.model]}:{' '}
        <strong className="num">{formatStress(y.stress, pressureUnit)}</strong> at{' '}
        <span className="num">{formatPressure(y.pressure, pressureUnit)}</span>, {formatPercent(y.fraction, 1)} of yield
        (near-yield limit {formatPercent(y.limit, 0)}).
      </p>
      {y.nearYield && (
        <p
          role="alert"
          className="mt-2 rounded-md border border-flag/40 bg-flag/5 px-3 py-2 text-sm font-semibold text-ink-900"
        >
          <span aria-hidden="true" className="text-flag-ink">
            ▲{' '}
          </span>
          Near yield. {FLAG_GLOSSARY['near-yield'].next}
        </p>
      )}
    </section>
  );
}
