import type { GaugeOutcome } from '../../lib/reduction/types';
import OutcomeMarker from './OutcomeMarker';
import { OUTCOME_LOOK } from './outcome-style';

/** Shape-and-colour key for the outcome markers of the overview and the shell map. */
export function OutcomeLegend({
  outcomes = ['in-band', 'flagged', 'excluded', 'not-compared'],
}: {
  outcomes?: GaugeOutcome[];
}) {
  return (
    <ul className="flex flex-wrap gap-x-5 gap-y-1 text-sm text-ink-900" aria-label="Outcome key">
      {outcomes.map((o) => (
        <li key={o} className="inline-flex items-center gap-1.5">
          <svg width="16" height="16" viewBox="0 0 16 16" aria-hidden="true">
            <OutcomeMarker outcome={o} x={8} y={8} r={5.5} />
          </svg>
          {OUTCOME_LOOK[o].label}
        </li>
      ))}
    </ul>
  );
}
