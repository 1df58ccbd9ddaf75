export type SwatchKind = 'dot' | 'square-open' | 'line' | 'dashed' | 'band';

export interface LegendItem {
  label: string;
  color: string;
  kind: SwatchKind;
}

/** A swatch drawn the way the chart draws the series, so the legend matches shape and colour. */
export function LegendSwatch({ kind, color }: Omit<LegendItem, 'label'>) {
  return (
    <svg width="26" height="14" viewBox="0 0 26 14" aria-hidden="true" className="shrink-0">
      {kind === 'dot' && <circle cx="13" cy="7" r="4.5" fill={color} />}
      {kind === 'square-open' && (
        <rect x="8.5" y="2.5" width="9" height="9" fill="#fff" stroke={color} strokeWidth="2" />
      )}
      {kind === 'line' && <line x1="1" y1="7" x2="25" y2="7" stroke={color} strokeWidth="2.5" />}
      {kind === 'dashed' && (
        <line x1="1" y1="7" x2="25" y2="7" stroke={color} strokeWidth="2.5" strokeDasharray="6 4" />
      )}
      {kind === 'band' && <rect x="1" y="2" width="24" height="10" fill={color} stroke="#c98a1b" strokeOpacity="0.5" />}
    </svg>
  );
}

/** The legend under a chart: a list of swatches with labels. */
export default function ChartLegend({ items, label = 'Legend' }: { items: LegendItem[]; label?: string }) {
  return (
    <ul className="flex flex-wrap gap-x-5 gap-y-1 text-sm text-ink-900" aria-label={label}>
      {items.map((it) => (
        <li key={it.label} className="inline-flex items-center gap-1.5">
          <LegendSwatch kind={it.kind} color={it.color} />
          {it.label}
        </li>
      ))}
    </ul>
  );
}
