import { useState } from 'react';
import { formatDateTime } from '../api';
import { formatBytes } from './upload-progress';

export interface LogRow {
  id: number;
  filename: string;
  sha256: string;
  sizeBytes: number;
  rows: number | null;
  timeStart: number | null;
  timeEnd: number | null;
  createdAt: string;
  columnMap: {
    columns?: string[];
    preview?: string[][];
    headerLine?: number;
    delimiter?: string;
    pressureUnit?: string | null;
  };
}
interface Props {
  logs: LogRow[];
  expected: { pressure: string; time?: string; channels: string[]; channelGauge?: Record<string, string> };
}

const span = (a: number | null, b: number | null) =>
  a === null || b === null
    ? '—'
    : b > 1e8
      ? `${new Date(a * 1000).toISOString().slice(0, 19).replace('T', ' ')} → ${new Date(b * 1000).toISOString().slice(11, 19)} UTC`
      : `${a.toFixed(1)} – ${b.toFixed(1)} s (${((b - a) / 60).toFixed(1)} min)`;
const delimiterName = (d?: string) => (d === '\t' ? 'tab' : d === ';' ? 'semicolon' : d === ',' ? 'comma' : (d ?? '?'));

/** The test's logs, and for the chosen one its first rows and the mapping of the plan's columns. */
export default function LogList({ logs, expected }: Props) {
  const [chosen, setChosen] = useState<number | null>(logs.at(-1)?.id ?? null);
  const log = logs.find((l) => l.id === chosen) ?? logs.at(-1);
  if (!logs.length)
    return (
      <p className="text-sm text-ink-700">
        No logs yet. Upload the data-acquisition export above, or push it from the DAQ PC with an API token.
      </p>
    );
  const cols = log?.columnMap.columns ?? [];
  const wanted = [
    { role: 'pressure', name: expected.pressure },
    ...(expected.time ? [{ role: 'time', name: expected.time }] : []),
    ...expected.channels.map((c) => ({ role: expected.channelGauge?.[c] ?? 'gauge channel', name: c })),
  ];
  const missing = wanted.filter((w) => !cols.includes(w.name));
  return (
    <div className="space-y-5">
      <div className="overflow-x-auto">
        <table className="table-base">
          <thead>
            <tr>
              <th scope="col">File</th>
              <th scope="col">Size</th>
              <th scope="col">Rows</th>
              <th scope="col">Time span</th>
              <th scope="col">sha256</th>
              <th scope="col">Uploaded</th>
              <th scope="col">
                <span className="sr-only">Preview</span>
              </th>
            </tr>
          </thead>
          <tbody>
            {logs.map((l) => (
              <tr key={l.id} className={l.id === log?.id ? 'bg-brass-100/50' : undefined}>
                <td className="font-medium">{l.filename}</td>
                <td className="num">{formatBytes(l.sizeBytes)}</td>
                <td className="num">{l.rows?.toLocaleString('en') ?? '—'}</td>
                <td className="num">{span(l.timeStart, l.timeEnd)}</td>
                <td className="font-mono text-xs" title={l.sha256}>
                  {l.sha256.slice(0, 16)}…
                </td>
                <td>{formatDateTime(l.createdAt)}</td>
                <td>
                  <button
                    type="button"
                    className="btn-secondary"
                    aria-pressed={l.id === log?.id}
                    onClick={() => setChosen(l.id)}
                  >
                    Preview
                  </button>
                </td>
              </tr>
            ))}
          </tbody>
        </table>
      </div>
      {log && (
        <div className="grid gap-5 xl:grid-cols-[22rem_1fr]">
          <div>
            <h3 className="mb-2 font-semibold">Column mapping</h3>
            <p className="mb-2 text-xs text-ink-700">
              {delimiterName(log.columnMap.delimiter)}-separated, header on line {log.columnMap.headerLine ?? '?'}
              {log.columnMap.pressureUnit ? `, pressure in ${log.columnMap.pressureUnit}` : ''}
            </p>
            <ul className="space-y-1 text-sm">
              {wanted.map((w) => (
                <li key={w.role + w.name} className="flex items-center gap-2">
                  {cols.includes(w.name) ? (
                    <span className="font-bold text-ok" aria-label="found">
                      ✓
                    </span>
                  ) : (
                    <span className="font-bold text-flag-ink" aria-label="missing">
                      ✗
                    </span>
                  )}
                  <code className="rounded bg-ink-100 px-1">{w.name}</code>
                  <span className="text-ink-700">{w.role}</span>
                </li>
              ))}
            </ul>
            {missing.length > 0 && (
              <p role="alert" className="error-text">
                The current plan maps {missing.length} column{missing.length > 1 ? 's' : ''} this log lacks:{' '}
                {missing.map((m) => m.name).join(', ')}. A reduction will fail until the plan or the log is fixed.
              </p>
            )}
          </div>
          <div className="min-w-0">
            <h3 className="mb-2 font-semibold">First rows of {log.filename}</h3>
            <div className="max-h-72 overflow-auto rounded border border-ink-800/15">
              <table className="table-base text-xs">
                <thead className="sticky top-0">
                  <tr>
                    {cols.map((c) => (
                      <th key={c} scope="col" className="whitespace-nowrap">
                        {c}
                      </th>
                    ))}
                  </tr>
                </thead>
                <tbody>
                  {(log.columnMap.preview ?? []).map((r, i) => (
                    <tr key={i}>
                      {r.map((v, j) => (
                        <td key={j} className="num whitespace-nowrap">
                          {v}
                        </td>
                      ))}
                    </tr>
                  ))}
                </tbody>
              </table>
            </div>
          </div>
        </div>
      )}
    </div>
  );
}
