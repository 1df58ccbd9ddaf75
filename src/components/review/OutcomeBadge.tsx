import type { GaugeOutcome } from '../../lib/reduction/types';
import { OUTCOME_LOOK } from './outcome-style';

interface Props {
  outcome: GaugeOutcome;
  /** smaller text for dense tables */
  compact?: boolean;
}

/** A gauge outcome as colour, shape glyph and word together (never colour alone). */
export default function OutcomeBadge({ outcome, compact = false }: Props) {
  const look = OUTCOME_LOOK[outcome];
  return (
    <span
      className={`inline-flex items-center gap-1.5 rounded-full border font-semibold whitespace-nowrap ${compact ? 'px-2 py-0.5 text-xs' : 'px-2.5 py-1 text-sm'}`}
      style={{ borderColor: look.color, color: look.color, backgroundColor: `${look.color}14` }}
      data-outcome={outcome}
    >
      <span aria-hidden="true">{look.glyph}</span>
      <span className="text-ink-950">{look.label}</span>
    </span>
  );
}
