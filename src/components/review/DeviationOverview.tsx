import { useState, type KeyboardEvent } from 'react';
import type { GaugeResult } from '../../lib/reduction/types';
import { formatFixed, formatInterval, formatPercent, formatRatio } from '../../lib/ui-format';
import OutcomeMarker from './OutcomeMarker';
import { OUTCOME_LOOK } from './outcome-style';
import { layoutDeviation, ratioTicks } from './deviation-layout';
import { OutcomeLegend } from './OutcomeLegend';
import { useElementWidth } from './use-element-width';

interface Props {
  gauges: GaugeResult[];
  /** tolerance band as a fraction, 0.10 for ±10 % */
  slopeBand: number;
  selectedId?: string | null;
  onSelect?: (gaugeId: string) => void;
}

const LEFT = 96,
  ROW = 30,
  HEAD = 26,
  TOP = 30;

/** Every compared gauge's measured/predicted ratio with its 95 % interval against the band. */
export default function DeviationOverview({ gauges, slopeBand, selectedId = null, onSelect }: Props) {
  const [focused, setFocused] = useState<string | null>(null);
  const [boxRef, boxWidth] = useElementWidth<HTMLDivElement>(720);
  const W = Math.max(420, boxWidth);
  const RIGHT = W - 24;
  const layout = layoutDeviation(gauges, slopeBand);
  const [d0, d1] = layout.domain;
  const sx = (v: number) => LEFT + ((Math.min(d1, Math.max(d0, v)) - d0) / (d1 - d0)) * (RIGHT - LEFT);
  let y = TOP;
  const placed = layout.groups.map((grp) => {
    const head = y;
    y += HEAD;
    const rows = grp.rows.map((row) => ({ row, y: (y += ROW) - ROW / 2 }));
    return { ...grp, head, rows };
  });
  const bottom = y + 6;
  const height = bottom + 44;
  const ticks = ratioTicks(layout.domain);
  const key = (id: string) => (e: KeyboardEvent) => {
    if (e.key === 'Enter' || e.key === ' ') {
      e.preventDefault();
      onSelect?.(id);
    }
  };

  return (
    <div className="space-y-2" ref={boxRef}>
      <svg
        viewBox={`0 0 ${W} ${height}`}
        width="100%"
        className="block h-auto"
        role="group"
        aria-label={`Measured over predicted slope per gauge, band ±${formatPercent(slopeBand, 0)}`}
      >
        <rect
          x={sx(1 - slopeBand)}
          y={TOP - 4}
          width={sx(1 + slopeBand) - sx(1 - slopeBand)}
          height={bottom - TOP + 4}
          fill="rgba(201,138,27,0.16)"
        />
        {ticks.map((t) => (
          <g key={t}>
            <line
              x1={sx(t)}
              x2={sx(t)}
              y1={TOP - 4}
              y2={bottom}
              stroke={t === 1 ? '#a86b12' : 'rgba(29,53,87,0.12)'}
              strokeDasharray={t === 1 ? '6 4' : undefined}
              strokeWidth={t === 1 ? 1.5 : 1}
            />
            <text x={sx(t)} y={bottom + 16} textAnchor="middle" fontSize="12" fill="#14273d">
              {formatFixed(t, 2)}
            </text>
          </g>
        ))}
        <text x={sx(1)} y={TOP - 12} textAnchor="middle" fontSize="12" fill="#a86b12" fontWeight="600">
          band ±{formatPercent(slopeBand, 0)} around 1
        </text>
        {placed.map((grp) => (
          <g key={grp.group}>
            <text x={8} y={grp.head + 17} fontSize="13" fontWeight="700" fill="#14273d">
              {grp.label}
            </text>
            {grp.rows.map(({ row, y: cy }) => {
              const g = row.gauge;
              const off = row.ratio < d0 ? 'low' : row.ratio > d1 ? 'high' : null;
              const highlight = focused === g.id || selectedId === g.id;
              return (
                <g
                  key={g.id}
                  role="button"
                  tabIndex={0}
                  className="cursor-pointer"
                  data-gauge={g.id}
                  aria-label={`${g.id}: ratio ${formatRatio(row.ratio)}, 95 % interval ${formatInterval(row.ci, formatRatio)}, ${OUTCOME_LOOK[g.outcome].label}`}
                  aria-pressed={selectedId === g.id}
                  onClick={() => onSelect?.(g.id)}
                  onKeyDown={key(g.id)}
                  onFocus={() => setFocused(g.id)}
                  onBlur={() => setFocused(null)}
                >
                  <rect
                    x={2}
                    y={cy - ROW / 2 + 1}
                    width={W - 4}
                    height={ROW - 2}
                    rx={4}
                    fill={highlight ? 'rgba(201,138,27,0.18)' : 'transparent'}
                  />
                  <text
                    x={LEFT - 10}
                    y={cy + 4.5}
                    textAnchor="end"
                    fontSize="13"
                    fill="#0d1b2a"
                    fontWeight={highlight ? 700 : 500}
                  >
                    {g.id}
                  </text>
                  {row.ci && (
                    <line x1={sx(row.ci[0])} x2={sx(row.ci[1])} y1={cy} y2={cy} stroke="#14273d" strokeWidth={1.5} />
                  )}
                  {row.ci &&
                    [row.ci[0], row.ci[1]].map((v, i) => (
                      <line key={i} x1={sx(v)} x2={sx(v)} y1={cy - 5} y2={cy + 5} stroke="#14273d" strokeWidth={1.5} />
                    ))}
                  <OutcomeMarker outcome={g.outcome} x={sx(row.ratio)} y={cy} r={6.5} />
                  {off && (
                    <text
                      x={off === 'low' ? sx(d0) + 12 : sx(d1) - 12}
                      y={cy + 4.5}
                      textAnchor={off === 'low' ? 'start' : 'end'}
                      fontSize="12"
                      fill="#0d1b2a"
                    >
                      {off === 'low' ? '◀ ' : ''}
                      {formatRatio(row.ratio)} off scale{off === 'high' ? ' ▶' : ''}
                    </text>
                  )}
                </g>
              );
            })}
          </g>
        ))}
        <text x={(LEFT + RIGHT) / 2} y={height - 6} textAnchor="middle" fontSize="12" fill="#3f6189">
          measured / predicted slope (whiskers: 95 % interval)
        </text>
      </svg>
      <OutcomeLegend outcomes={['in-band', 'flagged', 'excluded']} />
      {layout.notPlotted.length > 0 && (
        <p className="text-sm text-ink-900">
          <span className="font-semibold">Not plotted:</span>{' '}
          {layout.notPlotted.map((g, i) => (
            <span key={g.id}>
              {i > 0 && ', '}
              <button
                type="button"
                className="font-semibold text-ink-800 underline decoration-dotted underline-offset-2"
                onClick={() => onSelect?.(g.id)}
              >
                {g.id}
              </button>{' '}
              (
              {g.outcome === 'not-compared'
                ? `not compared${g.flags.includes('edge-zone') ? ', edge zone' : ''}`
                : 'no ratio'}
              )
            </span>
          ))}
        </p>
      )}
    </div>
  );
}
