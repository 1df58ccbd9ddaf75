import type { KeyboardEvent } from 'react';
import type { GaugeOutcome } from '../../lib/reduction/types';
import { formatAngle } from '../../lib/ui-format';
import OutcomeMarker from './OutcomeMarker';
import { OUTCOME_LOOK } from './outcome-style';
import { gaugeDirections, type ShellMapGauge } from './shell-map-layout';

interface Props {
  gauge: ShellMapGauge;
  outcome: GaugeOutcome;
  /** SVG position */
  x: number;
  y: number;
  selected: boolean;
  /** plain-text place for the accessible name, e.g. "axial 3000 mm, clock 90°" */
  place: string;
  /** put the id on the left, away from a feature or the right edge */
  labelLeft?: boolean;
  onSelect?: (id: string) => void;
}

const HALF = 15;

/** One gauge on the developed shell: its grid directions as short lines, its outcome marker and id. */
export default function ShellMapGaugeMark({
  gauge,
  outcome,
  x,
  y,
  selected,
  place,
  labelLeft = false,
  onSelect,
}: Props) {
  const look = OUTCOME_LOOK[outcome];
  const dirs = gaugeDirections(gauge);
  const name = `${gauge.id}: ${look.label}, ${place}, direction ${dirs.map((d) => formatAngle(d)).join(' / ')} from the axis`;
  const onKey = (e: KeyboardEvent) => {
    if (e.key === 'Enter' || e.key === ' ') {
      e.preventDefault();
      onSelect?.(gauge.id);
    }
  };
  return (
    <g
      role="button"
      tabIndex={0}
      aria-label={name}
      aria-pressed={selected}
      data-gauge={gauge.id}
      className="cursor-pointer"
      onClick={() => onSelect?.(gauge.id)}
      onKeyDown={onKey}
    >
      <title>{name}</title>
      {selected && (
        <circle cx={x} cy={y} r={HALF + 2} fill="rgba(201,138,27,0.22)" stroke="#a86b12" strokeWidth={1.5} />
      )}
      {dirs.map((d, i) => {
        const dx = Math.cos((d * Math.PI) / 180) * HALF;
        const dy = -Math.sin((d * Math.PI) / 180) * HALF;
        return (
          <line
            key={i}
            x1={x - dx}
            y1={y - dy}
            x2={x + dx}
            y2={y + dy}
            stroke="#0d1b2a"
            strokeWidth={2.2}
            strokeLinecap="round"
          />
        );
      })}
      <OutcomeMarker outcome={outcome} x={x} y={y} r={6} />
      <text
        x={labelLeft ? x - HALF - 3 : x + HALF + 3}
        y={y - 6}
        textAnchor={labelLeft ? 'end' : 'start'}
        fontSize="13"
        fontWeight="700"
        fill="#0d1b2a"
        paintOrder="stroke"
        stroke="#ffffff"
        strokeWidth={3}
      >
        {gauge.id}
      </text>
    </g>
  );
}
