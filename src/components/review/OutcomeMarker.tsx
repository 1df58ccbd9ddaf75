import type { GaugeOutcome } from '../../lib/reduction/types';
import { OUTCOME_LOOK } from './outcome-style';

interface Props {
  outcome: GaugeOutcome;
  x: number;
  y: number;
  /** half-width of the marker in SVG units */
  r?: number;
}

/** The outcome's shape in SVG: circle in band, triangle flagged, cross excluded, diamond not compared. */
export default function OutcomeMarker({ outcome, x, y, r = 6 }: Props) {
  const { color, shape } = OUTCOME_LOOK[outcome];
  const common = { fill: color, stroke: '#ffffff', strokeWidth: 1.2 };
  if (shape === 'circle') return <circle cx={x} cy={y} r={r} {...common} />;
  if (shape === 'triangle')
    return (
      <polygon
        points={`${x},${y - r * 1.15} ${x + r * 1.1},${y + r * 0.8} ${x - r * 1.1},${y + r * 0.8}`}
        {...common}
      />
    );
  if (shape === 'diamond')
    return <polygon points={`${x},${y - r * 1.2} ${x + r},${y} ${x},${y + r * 1.2} ${x - r},${y}`} {...common} />;
  const d = r * 0.8;
  return (
    <g stroke={color} strokeWidth={r * 0.55} strokeLinecap="round">
      <line x1={x - d} y1={y - d} x2={x + d} y2={y + d} />
      <line x1={x - d} y1={y + d} x2={x + d} y2={y - d} />
    </g>
  );
}
