import { useId } from 'react';
import type { RosetteResult } from '../../lib/reduction/types';
import { formatAngle } from '../../lib/ui-format';

interface Props {
  kind: RosetteResult['kind'];
  /** grid A's direction from the vessel axis, degrees */
  gridAngleDeg: number;
  /** ε1 direction from the vessel axis, degrees, counter-clockwise */
  principalAngleDeg: number;
}

const C = 110,
  R = 78,
  RAD = Math.PI / 180;
/** A point at `deg` counter-clockwise from the horizontal vessel axis (SVG y grows downward). */
const at = (deg: number, r: number) => [C + r * Math.cos(deg * RAD), C - r * Math.sin(deg * RAD)] as const;

/** The rosette on the shell: vessel axis horizontal, hoop vertical, the three grids and ε1. */
export default function RosetteDiagram({ kind, gridAngleDeg, principalAngleDeg }: Props) {
  const step = kind === 'rosette-delta' ? 60 : 45;
  const grids = ['A', 'B', 'C'].map((name, k) => ({ name, deg: gridAngleDeg + k * step }));
  const [px, py] = at(principalAngleDeg, R);
  const [qx, qy] = at(principalAngleDeg + 180, R);
  const [ax, ay] = at(principalAngleDeg, 30);
  // ε1 label beside the arrow tip, pushed off the line so it never sits on a grid label
  const [tx1, ty1] = at(principalAngleDeg, R + 4);
  const [nx, ny] = [Math.cos((principalAngleDeg + 90) * RAD) * 14, -Math.sin((principalAngleDeg + 90) * RAD) * 14];
  const arrowId = `rosette-arrow-${useId().replace(/[^a-zA-Z0-9_-]/g, '')}`;
  return (
    <figure className="w-full max-w-56">
      <svg
        viewBox="0 0 220 220"
        className="h-auto w-full"
        role="img"
        aria-label={`Rosette directions: grids ${grids.map((g) => `${g.name} at ${formatAngle(g.deg)}`).join(', ')}; ε1 at ${formatAngle(principalAngleDeg, 1)} from the vessel axis`}
      >
        <defs>
          <marker
            id={arrowId}
            viewBox="0 0 10 10"
            refX="8"
            refY="5"
            markerWidth="5"
            markerHeight="5"
            orient="auto-start-reverse"
          >
            <path d="M0,0 L10,5 L0,10 z" fill="#a86b12" />
          </marker>
        </defs>
        <line x1={8} y1={C} x2={212} y2={C} stroke="#3f6189" strokeWidth={1} strokeDasharray="3 3" />
        <line x1={C} y1={8} x2={C} y2={212} stroke="#3f6189" strokeWidth={1} strokeDasharray="3 3" />
        <text x={8} y={C + 14} fontSize="11" fill="#3f6189">
          vessel axis
        </text>
        <text x={C + 5} y={16} fontSize="11" fill="#3f6189">
          hoop
        </text>
        {grids.map((g) => {
          const [x1, y1] = at(g.deg, 56);
          const [x2, y2] = at(g.deg + 180, 56);
          const [tx0, ty0] = at(g.deg, 66);
          // nudge the letter off its line, to the side away from the ε1 label
          const tx = tx0 + Math.cos((g.deg - 90) * RAD) * 7,
            ty = ty0 - Math.sin((g.deg - 90) * RAD) * 7;
          return (
            <g key={g.name}>
              <line
                x1={x1}
                y1={y1}
                x2={x2}
                y2={y2}
                stroke="#14273d"
                strokeWidth={2.5}
                strokeLinecap="round"
                opacity={0.55}
              />
              <text x={tx} y={ty + 4} textAnchor="middle" fontSize="12" fontWeight="700" fill="#14273d">
                {g.name}
              </text>
            </g>
          );
        })}
        <line
          x1={qx}
          y1={qy}
          x2={px}
          y2={py}
          stroke="#a86b12"
          strokeWidth={2.5}
          markerStart={`url(#${arrowId})`}
          markerEnd={`url(#${arrowId})`}
        />
        <path
          d={`M ${C + 30} ${C} A 30 30 0 0 ${principalAngleDeg >= 0 ? 0 : 1} ${ax} ${ay}`}
          fill="none"
          stroke="#a86b12"
          strokeWidth={1}
        />
        <text
          x={tx1 + nx}
          y={ty1 + ny + 4}
          textAnchor="middle"
          fontSize="13"
          fontWeight="700"
          fill="#a86b12"
          paintOrder="stroke"
          stroke="#ffffff"
          strokeWidth={3}
        >
          ε1
        </text>
      </svg>
      <figcaption className="text-center text-xs text-ink-700">
        ε1 at {formatAngle(principalAngleDeg, 1)} from the vessel axis (counter-clockwise)
      </figcaption>
    </figure>
  );
}
