import type { TestVerdict } from '../../lib/reduction/types';
import { VERDICT_LOOK } from './outcome-style';

interface Props {
  verdict: TestVerdict;
  /** flagged gauges that no engineer has dispositioned yet */
  undisposedFlaggedCount: number;
}

const EXPLAIN: Record<TestVerdict, string> = {
  conforms: 'Every compared gauge is in band or has a disposition.',
  flagged: 'Some gauges are outside the acceptance limits; each needs a disposition before the review can be signed.',
  incomplete:
    'The log has not yet reached the test pressure and come back to zero: the comparison covers what has been logged so far.',
};

/** The test's verdict with an icon and words, and how many flagged gauges still await a disposition. */
export default function VerdictBanner({ verdict, undisposedFlaggedCount }: Props) {
  const look = VERDICT_LOOK[verdict];
  const n = undisposedFlaggedCount;
  return (
    <div
      role="status"
      className="flex flex-wrap items-center gap-x-4 gap-y-2 rounded-lg border-2 bg-white px-4 py-3"
      style={{ borderColor: look.color }}
      data-verdict={verdict}
    >
      <span
        aria-hidden="true"
        className="grid size-10 shrink-0 place-items-center rounded-full text-xl font-bold text-white"
        style={{ backgroundColor: look.color }}
      >
        {look.glyph}
      </span>
      <div className="min-w-0 flex-1">
        <p className="text-lg font-bold text-ink-950">Verdict: {look.label}</p>
        <p className="text-sm text-ink-900">{EXPLAIN[verdict]}</p>
      </div>
      <p
        className={`num rounded-md px-3 py-1.5 text-sm font-semibold ${n > 0 ? 'bg-flag/10 text-ink-950 ring-1 ring-flag' : 'bg-ink-50 text-ink-900'}`}
      >
        {n > 0 && (
          <span aria-hidden="true" className="text-flag">
            ▲{' '}
          </span>
        )}
        {n === 0
          ? 'No flagged gauge awaits a disposition'
          : `${n} flagged ${n === 1 ? 'gauge awaits' : 'gauges await'} a disposition`}
      </p>
    </div>
  );
}
