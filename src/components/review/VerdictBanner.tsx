import type { TestVerdict } from '../../lib/reduction/types';
import { VERDICT_MEANING, VERDICT_SCOPE, verdictStanding, type VerdictCounts } from '../../lib/verdict-words';
import { VERDICT_LOOK } from './outcome-style';

interface Props {
  verdict: TestVerdict;
  /** flagged gauges awaiting a disposition, and flagged gauges marked for retest */
  counts: VerdictCounts;
}

/** The test's verdict with an icon and words, what it does not mean, and what still awaits a disposition. */
export default function VerdictBanner({ verdict, counts }: Props) {
  const look = VERDICT_LOOK[verdict];
  const blocking = counts.awaiting > 0;
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
      <div className="min-w-0 flex-1 space-y-1">
        <p className="text-lg font-bold text-ink-950">
          Strain comparison verdict: <span title={`verdict code: ${verdict}`}>{look.label}</span>
        </p>
        <p className="text-sm text-ink-900">{VERDICT_MEANING[verdict]}</p>
        <p className="text-sm text-ink-900" data-testid="verdict-scope">
          {VERDICT_SCOPE}
        </p>
      </div>
      <p
        className={`num max-w-sm rounded-md px-3 py-1.5 text-sm font-semibold ${blocking ? 'bg-flag/10 text-ink-950 ring-1 ring-flag' : 'bg-ink-50 text-ink-900'}`}
      >
        {blocking && (
          <span aria-hidden="true" className="text-flag-ink">
            ▲{' '}
          </span>
        )}
        {verdictStanding(verdict, counts)}
      </p>
    </div>
  );
}
