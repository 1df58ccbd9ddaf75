import type { PressureUnit } from '../../lib/ui-format';
import { formatMicrostrain, formatPressure, formatRatio } from '../../lib/ui-format';
import type { LiveHold } from './live-state';

export interface LiveGrid {
  /** `H1`, or `R1/A` for a rosette grid: the id the hold events use */
  id: string;
  /** the plan model's prediction, µε per plan pressure unit */
  predictedSlope: number;
  /** what the grid measures, for the caption ("hoop", "45°") */
  label: string;
}

interface Props {
  grid: LiveGrid;
  holds: LiveHold[];
  testPressure: number;
  /** the comparison tolerance as a fraction (0.1 for ±10 %) */
  slopeBand: number;
  pressureUnit: PressureUnit;
  warned: boolean;
  ratio: number | null;
}

const W = 260;
const H = 170;
const PAD = { l: 46, r: 10, t: 10, b: 30 };

/** One grid's strain against pressure, growing hold by hold inside the band around the prediction. */
export default function LiveGaugePlot({ grid, holds, testPressure, slopeBand, pressureUnit, warned, ratio }: Props) {
  const points = holds.flatMap((h) => {
    const g = h.gauges.find((x) => x.id === grid.id);
    return g && Number.isFinite(g.strain) ? [{ p: h.pressure, e: g.strain, branch: h.branch }] : [];
  });
  const pMax = Math.max(testPressure, ...points.map((q) => q.p)) * 1.05 || 1;
  const ends = [0, grid.predictedSlope * pMax * (1 + slopeBand), grid.predictedSlope * pMax * (1 - slopeBand)];
  const all = [...ends, ...points.map((q) => q.e)];
  let lo = Math.min(...all);
  let hi = Math.max(...all);
  const pad = (hi - lo) * 0.08 || 1;
  lo -= pad;
  hi += pad;
  const x = (p: number) => PAD.l + (p / pMax) * (W - PAD.l - PAD.r);
  const y = (e: number) => H - PAD.b - ((e - lo) / (hi - lo)) * (H - PAD.t - PAD.b);
  const band = [
    `${x(0)},${y(0)}`,
    `${x(pMax)},${y(grid.predictedSlope * pMax * (1 + slopeBand))}`,
    `${x(pMax)},${y(grid.predictedSlope * pMax * (1 - slopeBand))}`,
  ].join(' ');
  const last = points.at(-1);
  const caption = `Gauge ${grid.id} (${grid.label}): ${points.length} hold${points.length === 1 ? '' : 's'} so far${
    last ? `, last ${formatMicrostrain(last.e)} µε at ${formatPressure(last.p, pressureUnit)}` : ''
  }${ratio !== null ? `, measured/predicted ${formatRatio(ratio)}` : ''}.`;
  return (
    <figure
      className={`rounded-md border bg-white p-2 ${warned ? 'border-flag ring-2 ring-flag/40' : 'border-ink-100'}`}
      data-live-grid={grid.id}
    >
      <figcaption className="mb-1 flex items-baseline justify-between gap-2 text-sm">
        <span className="font-semibold">
          {grid.id} <span className="font-normal text-ink-700">{grid.label}</span>
        </span>
        <span className="text-ink-700 tabular-nums">{ratio !== null ? `ratio ${formatRatio(ratio)}` : 'ratio —'}</span>
      </figcaption>
      <svg viewBox={`0 0 ${W} ${H}`} className="h-auto w-full" role="img" aria-label={caption}>
        <polygon points={band} fill="rgba(201, 138, 27, 0.16)" stroke="rgba(168, 107, 18, 0.45)" strokeWidth="1" />
        <line
          x1={x(0)}
          y1={y(0)}
          x2={x(pMax)}
          y2={y(grid.predictedSlope * pMax)}
          stroke="#a86b12"
          strokeWidth="1.5"
          strokeDasharray="6 4"
        />
        <line
          x1={x(testPressure)}
          x2={x(testPressure)}
          y1={PAD.t}
          y2={H - PAD.b}
          stroke="#3f6189"
          strokeWidth="1"
          strokeDasharray="2 3"
        />
        <line x1={PAD.l} x2={W - PAD.r} y1={H - PAD.b} y2={H - PAD.b} stroke="#2c4a6e" strokeWidth="1" />
        <line x1={PAD.l} x2={PAD.l} y1={PAD.t} y2={H - PAD.b} stroke="#2c4a6e" strokeWidth="1" />
        <text x={W - PAD.r} y={H - 8} textAnchor="end" fontSize="10" fill="#2c4a6e">
          {`pressure (${pressureUnit}) → ${formatPressure(testPressure, pressureUnit)} test`}
        </text>
        <text x={4} y={PAD.t + 8} fontSize="10" fill="#2c4a6e">
          {Math.round(hi)}
        </text>
        <text x={4} y={H - PAD.b} fontSize="10" fill="#2c4a6e">
          {Math.round(lo)}
        </text>
        <text x={4} y={(PAD.t + H - PAD.b) / 2} fontSize="10" fill="#2c4a6e">
          µε
        </text>
        {points.map((q, i) =>
          q.branch === 'unloading' ? (
            <rect
              key={i}
              x={x(q.p) - 4}
              y={y(q.e) - 4}
              width="8"
              height="8"
              fill="none"
              stroke="#0072b2"
              strokeWidth="1.5"
            />
          ) : (
            <circle key={i} cx={x(q.p)} cy={y(q.e)} r="3.5" fill={warned ? '#d55e00' : '#14273d'} />
          ),
        )}
      </svg>
    </figure>
  );
}
