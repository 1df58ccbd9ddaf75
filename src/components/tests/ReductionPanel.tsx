import { useCallback, useEffect, useRef, useState } from 'react';
import { api, formatDateTime } from '../api';
import ProgressBar from './ProgressBar';
import { announceTestChanged } from './TestStatusSteps';
import { verdictLabel } from '../../lib/verdict-words';

interface ReductionRow {
  id: number;
  status: 'queued' | 'running' | 'done' | 'failed';
  progress: number;
  error: string | null;
  superseded: boolean;
  createdAt: string;
  finishedAt: string | null;
}
interface Detail extends ReductionRow {
  result: { verdict: string; gauges: { outcome: string }[]; warnings: string[] } | null;
}
interface Props {
  testId: number;
  canReduce: boolean;
  hasLogs: boolean;
  refreshKey: number;
}

/** Queue a reduction, watch its progress, and see the result when the worker is done. */
export default function ReductionPanel({ testId, canReduce, hasLogs, refreshKey }: Props) {
  const [rows, setRows] = useState<ReductionRow[]>([]);
  const [watching, setWatching] = useState<Detail | null>(null);
  const [error, setError] = useState<string | null>(null);
  const timer = useRef<number | null>(null);

  const load = useCallback(
    () =>
      api<{ items: ReductionRow[] }>(`/api/tests/${testId}/reductions`).then((r) => {
        setRows(r.items);
        return r.items;
      }),
    [testId],
  );

  const watch = useCallback(
    async function poll(id: number): Promise<void> {
      const d = await api<Detail>(`/api/reductions/${id}`);
      setWatching(d);
      if (d.status === 'queued' || d.status === 'running') timer.current = window.setTimeout(() => void poll(id), 700);
      else {
        void load();
        announceTestChanged(testId);
      }
    },
    [load, testId],
  );

  useEffect(() => {
    load()
      .then((items) => {
        const live = items.find((r) => r.status === 'queued' || r.status === 'running');
        if (live) void watch(live.id);
        else if (items[0]) void watch(items[0].id);
      })
      .catch((e) => setError(e.message));
    return () => {
      if (timer.current) window.clearTimeout(timer.current);
    };
  }, [load, watch, refreshKey]);

  async function start() {
    setError(null);
    try {
      const r = await api<{ id: number }>(`/api/tests/${testId}/reductions`, { method: 'POST', jsonBody: {} });
      await load();
      await watch(r.id);
    } catch (e) {
      setError((e as Error).message);
    }
  }

  const pct = watching ? Math.round(watching.progress * 100) : 0;
  const flagged = watching?.result?.gauges.filter((g) => g.outcome === 'flagged').length ?? 0;
  return (
    <div className="space-y-4">
      {canReduce && (
        <button
          type="button"
          className="btn-primary"
          onClick={start}
          disabled={!hasLogs || watching?.status === 'running' || watching?.status === 'queued'}
        >
          Reduce all logs
        </button>
      )}
      {!hasLogs && <p className="text-sm text-ink-700">Upload a log first.</p>}
      {error && (
        <p role="alert" className="error-text">
          {error}
        </p>
      )}
      {watching && (
        <div role="status" aria-live="polite" className="rounded-md border border-ink-800/15 bg-ink-50 p-3">
          <div className="mb-1 flex justify-between text-sm font-medium">
            <span>
              Reduction {watching.id}: {watching.status}
            </span>
            <span className="num">{pct} %</span>
          </div>
          <ProgressBar value={pct} label={`Reduction ${watching.id} progress`} />
          {watching.status === 'done' && watching.result && (
            <p className="mt-2 text-sm">
              Strain comparison before dispositions: <strong>{verdictLabel(watching.result.verdict)}</strong> ·{' '}
              {watching.result.gauges.length} gauges and grids, {flagged} flagged.{' '}
              <a className="font-semibold underline" href={`/tests/${testId}/review`}>
                Open the review
              </a>
            </p>
          )}
          {watching.status === 'done' && watching.result && watching.result.warnings.length > 0 && (
            <details className="mt-2 text-sm">
              <summary className="cursor-pointer">
                {watching.result.warnings.length} warning{watching.result.warnings.length > 1 ? 's' : ''}
              </summary>
              <ul className="list-disc pl-5">
                {watching.result.warnings.map((w, i) => (
                  <li key={i}>{w}</li>
                ))}
              </ul>
            </details>
          )}
          {watching.status === 'failed' && <p className="error-text">{watching.error}</p>}
        </div>
      )}
      {rows.length > 0 && (
        <table className="table-base">
          <thead>
            <tr>
              <th scope="col">Reduction</th>
              <th scope="col">Status</th>
              <th scope="col">Queued</th>
              <th scope="col">Finished</th>
              <th scope="col">Note</th>
            </tr>
          </thead>
          <tbody>
            {rows.map((r) => (
              <tr key={r.id}>
                <td className="num">{r.id}</td>
                <td>{r.status}</td>
                <td>{formatDateTime(r.createdAt)}</td>
                <td>{formatDateTime(r.finishedAt)}</td>
                <td className="text-sm">
                  {r.superseded ? 'superseded by a newer one' : r.status === 'done' ? 'current' : (r.error ?? '')}
                </td>
              </tr>
            ))}
          </tbody>
        </table>
      )}
    </div>
  );
}
