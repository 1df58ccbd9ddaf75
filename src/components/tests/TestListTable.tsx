import { useMemo, useState } from 'react';
import { formatDateTime } from '../api';
import { verdictLabel } from '../../lib/verdict-words';

export interface TestListRow {
  id: number;
  name: string;
  status: string;
  verdict: string | null;
  flaggedCount: number;
  vesselTag: string;
  lastActivityAt: string;
}
type Key = 'name' | 'vesselTag' | 'status' | 'verdict' | 'flaggedCount' | 'lastActivityAt';
const STATUS_ORDER = ['draft', 'logging', 'reduced', 'reviewed', 'released'];
const VERDICT_LOOK: Record<string, { glyph: string; cls: string }> = {
  conforms: { glyph: '●', cls: 'text-ok' },
  flagged: { glyph: '▲', cls: 'text-flag-ink' },
  incomplete: { glyph: '◐', cls: 'text-ink-700' },
};
const COLUMNS: { key: Key; label: string; numeric?: boolean }[] = [
  { key: 'name', label: 'Test' },
  { key: 'vesselTag', label: 'Vessel' },
  { key: 'status', label: 'Status' },
  { key: 'verdict', label: 'Verdict' },
  { key: 'flaggedCount', label: 'Flagged gauges', numeric: true },
  { key: 'lastActivityAt', label: 'Last activity' },
];

/** The tests list, sortable by any column (click or Enter on a header). */
export default function TestListTable({ rows, caption }: { rows: TestListRow[]; caption: string }) {
  const [sort, setSort] = useState<{ key: Key; dir: 1 | -1 }>({ key: 'lastActivityAt', dir: -1 });
  const sorted = useMemo(() => {
    const v = (r: TestListRow) =>
      sort.key === 'status'
        ? STATUS_ORDER.indexOf(r.status)
        : sort.key === 'lastActivityAt'
          ? Date.parse(r.lastActivityAt)
          : (r[sort.key] ?? '');
    return [...rows].sort((a, b) => (v(a) < v(b) ? -sort.dir : v(a) > v(b) ? sort.dir : 0));
  }, [rows, sort]);
  const toggle = (key: Key) => setSort((s) => ({ key, dir: s.key === key ? (s.dir === 1 ? -1 : 1) : 1 }));
  return (
    <table className="table-base">
      <caption className="sr-only">{caption}</caption>
      <thead>
        <tr>
          {COLUMNS.map((c) => (
            <th
              key={c.key}
              scope="col"
              aria-sort={sort.key === c.key ? (sort.dir === 1 ? 'ascending' : 'descending') : 'none'}
              className={c.numeric ? 'text-right' : undefined}
            >
              <button
                type="button"
                className="inline-flex items-center gap-1 font-semibold"
                onClick={() => toggle(c.key)}
              >
                {c.label}
                <span aria-hidden="true" className="text-xs">
                  {sort.key === c.key ? (sort.dir === 1 ? '▲' : '▼') : '↕'}
                </span>
              </button>
            </th>
          ))}
        </tr>
      </thead>
      <tbody>
        {sorted.length === 0 && (
          <tr>
            <td colSpan={6} className="text-ink-700">
              No tests match.
            </td>
          </tr>
        )}
        {sorted.map((t) => (
          <tr key={t.id}>
            <td>
              <a className="font-medium text-ink-800 underline" href={`/tests/${t.id}`}>
                {t.name}
              </a>
            </td>
            <td>{t.vesselTag}</td>
            <td>{t.status}</td>
            <td>
              {t.verdict ? (
                <span
                  className={`font-semibold ${VERDICT_LOOK[t.verdict]?.cls ?? ''}`}
                  title={`strain comparison verdict (code: ${t.verdict})`}
                >
                  <span aria-hidden="true">{VERDICT_LOOK[t.verdict]?.glyph} </span>
                  {verdictLabel(t.verdict)}
                </span>
              ) : (
                '—'
              )}
            </td>
            <td className="num text-right">{t.flaggedCount}</td>
            <td>{formatDateTime(t.lastActivityAt)}</td>
          </tr>
        ))}
      </tbody>
    </table>
  );
}
