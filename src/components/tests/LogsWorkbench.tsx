import { useEffect, useState } from 'react';
import { api } from '../api';
import LogList, { type LogRow } from './LogList';
import LogUploader from './LogUploader';
import ReductionPanel from './ReductionPanel';
import { announceTestChanged } from './TestStatusSteps';

interface Props {
  testId: number;
  canUpload: boolean;
  locked: boolean;
  initialLogs: LogRow[];
  expected: { pressure: string; time?: string; channels: string[]; channelGauge?: Record<string, string> };
}

/** The Logs page: upload, the list with preview and mapping, and the reduction. */
export default function LogsWorkbench({ testId, canUpload, locked, initialLogs, expected }: Props) {
  const [logs, setLogs] = useState<LogRow[]>(initialLogs);
  const [refreshKey, setRefreshKey] = useState(0);
  const reload = () =>
    api<{ items: LogRow[] }>(`/api/tests/${testId}/logs`).then((r) => {
      setLogs(r.items);
      setRefreshKey((k) => k + 1);
      announceTestChanged(testId);
    });
  useEffect(() => {
    setLogs(initialLogs);
  }, [initialLogs]);
  return (
    <div className="space-y-6">
      {canUpload && !locked && (
        <section className="card" aria-labelledby="up-h">
          <h2 id="up-h" className="mb-3 text-lg font-semibold">
            Upload a log
          </h2>
          <LogUploader testId={testId} onUploaded={() => void reload()} />
        </section>
      )}
      <section className="card" aria-labelledby="logs-h">
        <h2 id="logs-h" className="mb-3 text-lg font-semibold">
          Logs
        </h2>
        <LogList logs={logs} expected={expected} />
      </section>
      <section className="card" aria-labelledby="red-h">
        <h2 id="red-h" className="mb-3 text-lg font-semibold">
          Reduction
        </h2>
        <ReductionPanel
          testId={testId}
          canReduce={canUpload && !locked}
          hasLogs={logs.length > 0}
          refreshKey={refreshKey}
        />
      </section>
    </div>
  );
}
