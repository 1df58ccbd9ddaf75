import { useId } from 'react';
import type { GaugeOutcome } from '../../lib/reduction/types';
import { formatFixed } from '../../lib/ui-format';
import ShellMapGaugeMark from './ShellMapGaugeMark';
import ShellMapLegend from './ShellMapLegend';
import { useElementWidth } from './use-element-width';
import { layoutShellMap, niceStep, resolveGaugeOutcome, stackTopLabels, type ShellMapPlan } from './shell-map-layout';

interface Props {
  plan: ShellMapPlan;
  /** results keyed by gauge id (`H1`, `R1/A` …) */
  results: Record<string, { outcome: GaugeOutcome } | undefined>;
  /** 2.5·√(r t), plan length unit (result.predicted.edgeZoneDistance) */
  edgeZoneDistance: number;
  lengthUnit: 'mm' | 'in';
  selectedId?: string | null;
  onSelect?: (gaugeId: string) => void;
}

const ML = 58,
  MR = 18,
  MB = 44,
  MAX_PLOT_HEIGHT = 460,
  MIN_PLOT_HEIGHT = 200;

/** The cylinder cut along a generator and laid flat, with features, edge zones and every placed gauge. */
export default function DevelopedShellMap({
  plan,
  results,
  edgeZoneDistance,
  lengthUnit,
  selectedId = null,
  onSelect,
}: Props) {
  const uid = useId().replace(/[^a-zA-Z0-9_-]/g, '');
  const [boxRef, boxWidth] = useElementWidth<HTMLDivElement>(960);
  const layout = layoutShellMap(plan, edgeZoneDistance);
  if (!layout) {
    return (
      <div className="card text-sm text-ink-900" role="note">
        <p>
          {plan.vessel.shape === 'sphere'
            ? 'A sphere has no developed shell map: every point of a sphere under pressure sees the same membrane strain.'
            : 'The plan gives no vessel length, so the shell cannot be laid flat.'}
        </p>
        <p className="mt-1">Gauges: {plan.gauges.map((g) => g.id).join(', ')}.</p>
      </div>
    );
  }
  const { length: L, circumference: C } = layout;
  const aspect = C / L;
  const PW = Math.max(360, boxWidth) - ML - MR;
  const PH = Math.round(Math.min(MAX_PLOT_HEIGHT, Math.max(MIN_PLOT_HEIGHT, PW * aspect)));
  const toScale = Math.abs(PH - PW * aspect) < 1;
  const sx = (x: number) => ML + (x / L) * PW;
  const xStep = niceStep(L, 8);
  const xTicks = Array.from({ length: Math.floor(L / xStep) + 1 }, (_, i) => i * xStep);
  const hatch = `hatch-${uid}`,
    clip = `clip-${uid}`;
  const topLabels = stackTopLabels([
    { text: 'head seam', x: sx(0), anchor: 'start' },
    { text: 'head seam', x: sx(L), anchor: 'end' },
    ...layout.features
      .filter((f) => f.kind !== 'nozzle' || f.arc === null)
      .map((f) => ({
        text: `${f.kind === 'thickness-change' ? 'thickness change' : f.kind} ${f.label}`,
        x: sx(f.axialPosition),
        anchor: 'middle' as const,
      })),
  ]);
  const MT = 20 + 15 * (Math.max(...topLabels.map((l) => l.row)) + 1);
  const H = MT + PH + MB;
  const sy = (arc: number) => MT + (arc / C) * PH;
  const crowdedRight = (x: number, arc: number) =>
    sx(x) > ML + PW - 70 ||
    layout.features.some(
      (f) =>
        f.arc !== null &&
        sx(f.axialPosition) - sx(x) > 0 &&
        sx(f.axialPosition) - sx(x) < 130 &&
        Math.abs(sy(f.arc) - sy(arc)) < 40,
    );

  return (
    <div className="space-y-2" ref={boxRef}>
      <svg
        viewBox={`0 0 ${ML + PW + MR} ${H}`}
        width="100%"
        className="block h-auto"
        role="group"
        aria-label={`Developed shell, ${formatFixed(L, 0)} ${lengthUnit} long by ${formatFixed(C, 0)} ${lengthUnit} around`}
      >
        <defs>
          <pattern id={hatch} width="8" height="8" patternUnits="userSpaceOnUse" patternTransform="rotate(45)">
            <rect width="8" height="8" fill="rgba(230,159,0,0.13)" />
            <line x1="0" y1="0" x2="0" y2="8" stroke="#e69f00" strokeWidth="2" strokeOpacity="0.55" />
          </pattern>
          <clipPath id={clip}>
            <rect x={ML} y={MT} width={PW} height={PH} />
          </clipPath>
        </defs>
        <rect x={ML} y={MT} width={PW} height={PH} fill="#ffffff" stroke="#1d3557" strokeOpacity={0.35} />
        {[0, 90, 180, 270, 360].map((d) => (
          <g key={d}>
            <line x1={ML} x2={ML + PW} y1={sy((d / 360) * C)} y2={sy((d / 360) * C)} stroke="rgba(29,53,87,0.10)" />
            <text x={ML - 8} y={sy((d / 360) * C) + 4} textAnchor="end" fontSize="12" fill="#14273d">
              {d}°
            </text>
          </g>
        ))}
        {xTicks.map((x) => (
          <text key={x} x={sx(x)} y={MT + PH + 18} textAnchor="middle" fontSize="12" fill="#14273d">
            {formatFixed(x, 0)}
          </text>
        ))}
        <text x={ML + PW / 2} y={H - 6} textAnchor="middle" fontSize="12" fontWeight="600" fill="#14273d">
          axial position ({lengthUnit}) — circumference as clock angle, cut at 0°
        </text>
        <g clipPath={`url(#${clip})`}>
          {layout.ringZones.map((z, i) => (
            <rect key={i} x={sx(z.x0)} y={MT} width={sx(z.x1) - sx(z.x0)} height={PH} fill={`url(#${hatch})`} />
          ))}
          {layout.pointZones.flatMap((z, i) =>
            [-C, 0, C].map((shift) => (
              <ellipse
                key={`${i}${shift}`}
                cx={sx(z.x)}
                cy={sy(z.arc + shift)}
                rx={(z.radius / L) * PW}
                ry={(z.radius / C) * PH}
                fill={`url(#${hatch})`}
                stroke="#e69f00"
                strokeOpacity={0.6}
              />
            )),
          )}
          {layout.features.map((f, i) => {
            const size = f.size ?? 0;
            if (f.kind === 'nozzle' && f.arc !== null)
              return (
                <ellipse
                  key={i}
                  cx={sx(f.axialPosition)}
                  cy={sy(f.arc)}
                  rx={Math.max(3, (size / 2 / L) * PW)}
                  ry={Math.max(3, (size / 2 / C) * PH)}
                  fill="#ffffff"
                  stroke="#0d1b2a"
                  strokeWidth={2}
                />
              );
            if (f.kind === 'support')
              return f.arc === null ? (
                <rect
                  key={i}
                  x={sx(f.axialPosition - size / 2)}
                  y={MT}
                  width={Math.max(3, (size / L) * PW)}
                  height={PH}
                  fill="rgba(29,53,87,0.20)"
                  stroke="#1d3557"
                />
              ) : (
                <rect
                  key={i}
                  x={sx(f.axialPosition - size / 2)}
                  y={sy(f.arc) - (size / 2 / C) * PH}
                  width={Math.max(3, (size / L) * PW)}
                  height={Math.max(3, (size / C) * PH)}
                  fill="rgba(29,53,87,0.20)"
                  stroke="#1d3557"
                />
              );
            return (
              <line
                key={i}
                x1={sx(f.axialPosition)}
                x2={sx(f.axialPosition)}
                y1={MT}
                y2={MT + PH}
                stroke="#1d3557"
                strokeWidth={f.kind === 'head' ? 4 : 2}
                strokeDasharray={f.kind === 'head' ? undefined : '6 4'}
              />
            );
          })}
        </g>
        {layout.seams.map((s) => (
          <line key={s.x} x1={sx(s.x)} x2={sx(s.x)} y1={MT - 4} y2={MT + PH + 4} stroke="#0d1b2a" strokeWidth={4} />
        ))}
        {topLabels.map((l, i) => (
          <text
            key={i}
            x={l.x}
            y={MT - 10 - l.row * 15}
            textAnchor={l.anchor}
            fontSize="12"
            fontWeight="600"
            fill="#0d1b2a"
          >
            {l.text}
          </text>
        ))}
        {layout.features
          .filter((f) => f.kind === 'nozzle' && f.arc !== null)
          .map((f, i) => (
            <text
              key={`n${i}`}
              x={sx(f.axialPosition)}
              y={sy(f.arc!) + ((f.size ?? 0) / 2 / C) * PH + 16}
              textAnchor="middle"
              fontSize="12"
              fontWeight="600"
              fill="#1d3557"
              paintOrder="stroke"
              stroke="#ffffff"
              strokeWidth={3}
            >
              nozzle {f.label}
            </text>
          ))}
        {layout.placed.map(({ gauge, x, arc }) => (
          <ShellMapGaugeMark
            key={gauge.id}
            gauge={gauge}
            outcome={resolveGaugeOutcome(gauge.id, results)}
            x={sx(x)}
            y={sy(arc)}
            selected={selectedId === gauge.id || (selectedId?.startsWith(`${gauge.id}/`) ?? false)}
            labelLeft={crowdedRight(x, arc)}
            place={`axial ${formatFixed(x, 0)} ${lengthUnit}, clock ${formatFixed(gauge.clockDeg ?? 0, 0)}°`}
            onSelect={onSelect}
          />
        ))}
      </svg>
      <ShellMapLegend hatchId={hatch} />
      {!toScale && (
        <p className="text-sm text-ink-700">
          The circumference is drawn to a different scale from the length, so round features appear as ellipses.
        </p>
      )}
      {layout.unplaced.length > 0 && (
        <p className="text-sm text-ink-900">
          <span className="font-semibold">No position in the plan:</span>{' '}
          {layout.unplaced.map((g, i) => (
            <span key={g.id}>
              {i > 0 && ', '}
              <button
                type="button"
                className="font-semibold underline decoration-dotted underline-offset-2"
                onClick={() => onSelect?.(g.id)}
              >
                {g.id}
              </button>
            </span>
          ))}
        </p>
      )}
    </div>
  );
}
