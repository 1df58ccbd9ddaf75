import { useMemo, useState, type MouseEvent, type ReactNode } from 'react';
import type { GaugeResult } from '../../lib/reduction/types';
import type { PressureUnit } from '../../lib/ui-format';
import { buildGaugeColumns } from './gauge-columns';
import { sortGauges, type GaugeSortKey, type SortDirection } from './gauge-sort';

interface Props {
  gauges: GaugeResult[];
  pressureUnit: PressureUnit;
  selectedId?: string | null;
  onSelect?: (gaugeId: string) => void;
  /** an extra last column, e.g. disposition controls; clicks inside it do not select the row */
  renderActions?: (gauge: GaugeResult) => ReactNode;
  actionsLabel?: string;
  caption?: string;
  /** start sorted by this column; plan order otherwise */
  initialSort?: { key: GaugeSortKey; dir: SortDirection };
}

/** Every gauge's comparison in a sortable table; a row or its id selects the gauge. */
export default function GaugeTable({
  gauges,
  pressureUnit,
  selectedId = null,
  onSelect,
  renderActions,
  actionsLabel = 'Disposition',
  caption = 'Gauge results',
  initialSort,
}: Props) {
  const columns = useMemo(() => buildGaugeColumns(pressureUnit), [pressureUnit]);
  const [sort, setSort] = useState<{ key: GaugeSortKey; index: number; dir: SortDirection } | null>(() =>
    initialSort
      ? { ...initialSort, index: initialSort.key === 'id' ? -1 : columns.findIndex((c) => c.key === initialSort.key) }
      : null,
  );
  const rows = useMemo(() => (sort ? sortGauges(gauges, sort.key, sort.dir) : gauges), [gauges, sort]);
  const sortBy = (key: GaugeSortKey, index: number) =>
    setSort((s) => ({ key, index, dir: s?.index === index && s.dir === 'ascending' ? 'descending' : 'ascending' }));
  const ariaSort = (index: number) => (sort?.index === index ? sort.dir : undefined);
  const arrow = (index: number) => (sort?.index === index ? (sort.dir === 'ascending' ? '▲' : '▼') : '↕');
  const onRowClick = (e: MouseEvent, id: string) => {
    if ((e.target as HTMLElement).closest('[data-actions], button, a, input, select, textarea')) return;
    onSelect?.(id);
  };
  const headButton = (label: string, index: number, key: GaugeSortKey, unit?: string) => (
    <button
      type="button"
      className="inline-flex items-start gap-1 text-left font-semibold hover:underline"
      onClick={() => sortBy(key, index)}
    >
      <span>
        {label}
        {unit && <span className="block text-xs font-normal text-ink-700">{unit}</span>}
      </span>
      <span aria-hidden="true" className="text-xs text-ink-600">
        {arrow(index)}
      </span>
    </button>
  );

  return (
    <div className="overflow-x-auto rounded-lg border border-ink-800/15 bg-white">
      <table className="table-base [&_td]:px-2.5! [&_th]:px-2.5!">
        <caption className="sr-only">{caption}; select a column header to sort</caption>
        <thead>
          <tr>
            <th scope="col" aria-sort={ariaSort(-1)}>
              {headButton('Gauge', -1, 'id', 'channel')}
            </th>
            {columns.map((c, i) => (
              <th key={c.label} scope="col" aria-sort={ariaSort(i)} className={c.numeric ? 'text-right!' : undefined}>
                {headButton(c.label, i, c.key, c.unit)}
              </th>
            ))}
            {renderActions && <th scope="col">{actionsLabel}</th>}
          </tr>
        </thead>
        <tbody>
          {rows.map((g) => {
            const selected = g.id === selectedId;
            return (
              <tr
                key={g.id}
                onClick={(e) => onRowClick(e, g.id)}
                className={`cursor-pointer ${selected ? 'bg-brass-100' : 'hover:bg-ink-50'}`}
                data-gauge={g.id}
              >
                <td>
                  <button
                    type="button"
                    aria-pressed={selected}
                    className="font-semibold text-ink-900 underline decoration-dotted underline-offset-2"
                    onClick={() => onSelect?.(g.id)}
                  >
                    {g.id}
                  </button>
                  <span className="block font-mono text-xs text-ink-700">{g.channel}</span>
                </td>
                {columns.map((c) => (
                  <td key={c.label} className={`${c.numeric ? 'num text-right' : ''} ${c.className ?? ''}`}>
                    {c.cell(g)}
                  </td>
                ))}
                {renderActions && <td data-actions="">{renderActions(g)}</td>}
              </tr>
            );
          })}
        </tbody>
      </table>
    </div>
  );
}
