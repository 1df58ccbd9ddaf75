import { formatPercent } from '../../lib/ui-format';

interface Props {
  /** von Mises (or membrane) stress over yield at test pressure, 0–1+ */
  fraction: number;
  /** the near-yield flag threshold, 0.9 by default (DESIGN 3.3) */
  nearYieldFraction?: number;
  label?: string;
}

/** Stress over yield as a bar with the near-yield threshold and yield marked. */
export default function YieldBar({
  fraction,
  nearYieldFraction = 0.9,
  label = 'von Mises / yield at test pressure',
}: Props) {
  const top = Math.max(1.1, fraction * 1.05);
  const pos = (v: number) => `${(Math.min(v, top) / top) * 100}%`;
  const near = fraction >= nearYieldFraction;
  return (
    <div>
      <div className="flex flex-wrap items-baseline justify-between gap-x-3 text-sm">
        <span className="font-medium text-ink-900">{label}</span>
        <span className={`num font-semibold ${near ? 'text-flag-ink' : 'text-ink-900'}`}>
          {near && '⚠ '}
          {formatPercent(fraction, 0)}
          {near ? ' — near yield' : ''}
        </span>
      </div>
      <div
        className="relative mt-1 h-4 rounded bg-ink-100"
        role="meter"
        aria-label={label}
        aria-valuemin={0}
        aria-valuemax={top}
        aria-valuenow={fraction}
        aria-valuetext={`${formatPercent(fraction, 0)} of yield; near-yield limit ${formatPercent(nearYieldFraction, 0)}`}
      >
        <div
          className="absolute inset-y-0 left-0 rounded"
          style={{ width: pos(fraction), backgroundColor: near ? '#d55e00' : '#0072b2' }}
        />
        <div className="absolute -inset-y-1 w-0.5 bg-caution" style={{ left: pos(nearYieldFraction) }} />
        <div className="absolute -inset-y-1 w-0.5 bg-ink-950" style={{ left: pos(1) }} />
      </div>
      <div className="relative mt-1 h-4 text-xs text-ink-700">
        <span className="absolute -translate-x-full pr-1 whitespace-nowrap" style={{ left: pos(nearYieldFraction) }}>
          near-yield {formatPercent(nearYieldFraction, 0)}
        </span>
        <span className="absolute pl-1 whitespace-nowrap" style={{ left: pos(1) }}>
          yield
        </span>
      </div>
    </div>
  );
}
