import { useRef, useState, type DragEvent } from 'react';
import ProgressBar from './ProgressBar';
import { formatBytes, formatSeconds, uploadWithProgress, type UploadProgress } from './upload-progress';
import { messageForStatus } from '../api';

interface Props {
  testId: number;
  onUploaded: () => void;
}
interface Problem {
  message: string;
  missing?: string[];
  columns?: string[];
  line?: number;
}

/** Drag-and-drop or pick a log; shows bytes sent, rate and time left; reports the server's answer. */
export default function LogUploader({ testId, onUploaded }: Props) {
  const input = useRef<HTMLInputElement>(null);
  const [over, setOver] = useState(false);
  const [progress, setProgress] = useState<UploadProgress | null>(null);
  const [name, setName] = useState<string | null>(null);
  const [problem, setProblem] = useState<Problem | null>(null);
  const [message, setMessage] = useState<string | null>(null);

  async function send(file: File) {
    setName(file.name);
    setProblem(null);
    setMessage(null);
    setProgress({ sent: 0, total: file.size, rateBytesPerSecond: 0, secondsLeft: null });
    try {
      const r = await uploadWithProgress(`/api/tests/${testId}/logs`, file, setProgress);
      if (r.status === 201 || r.status === 200) {
        setMessage(
          r.status === 201
            ? `Stored ${file.name}: ${r.body?.rows} rows, sha256 ${String(r.body?.sha256).slice(0, 12)}…`
            : `${file.name} has the same bytes as a log already stored; nothing new was added.`,
        );
        onUploaded();
      } else {
        const e = r.body?.error ?? {};
        setProblem({
          message: e.message ?? messageForStatus(r.status),
          missing: e.details?.missingColumns,
          columns: e.details?.columns,
          line: e.details?.line,
        });
      }
    } catch (err) {
      setProblem({ message: (err as Error).message });
    } finally {
      setProgress(null);
    }
  }

  function onDrop(e: DragEvent) {
    e.preventDefault();
    setOver(false);
    const f = e.dataTransfer.files[0];
    if (f) void send(f);
  }

  const pct = progress && progress.total ? Math.round((progress.sent / progress.total) * 100) : 0;
  return (
    <div className="space-y-3">
      <div
        onDragOver={(e) => {
          e.preventDefault();
          setOver(true);
        }}
        onDragLeave={() => setOver(false)}
        onDrop={onDrop}
        className={`rounded-lg border-2 border-dashed p-6 text-center ${over ? 'border-brass-500 bg-brass-100' : 'border-ink-800/30 bg-ink-50'}`}
      >
        <p className="mb-3 font-medium">Drop a log file here (CSV, semicolon or tab separated)</p>
        <label htmlFor="log-file" className="btn-primary cursor-pointer">
          Choose a file…
        </label>
        <input
          id="log-file"
          ref={input}
          type="file"
          accept=".csv,.txt,.tsv,text/csv,text/plain"
          className="sr-only"
          onChange={(e) => {
            const f = e.target.files?.[0];
            if (f) void send(f);
            e.target.value = '';
          }}
          disabled={!!progress}
        />
      </div>
      {progress && (
        <div role="status" aria-live="polite">
          <div className="mb-1 flex justify-between text-sm">
            <span>Uploading {name}</span>
            <span className="num">{pct} %</span>
          </div>
          <ProgressBar value={pct} label="Upload progress" />
          <p className="num mt-1 text-sm text-ink-700">
            {formatBytes(progress.sent)} of {formatBytes(progress.total)} · {formatBytes(progress.rateBytesPerSecond)}/s
            · {formatSeconds(progress.secondsLeft)} left
          </p>
        </div>
      )}
      {message && (
        <p role="status" className="text-sm font-medium text-ok">
          {message}
        </p>
      )}
      {problem && (
        <div role="alert" className="rounded-md border-l-4 border-flag bg-white p-3 text-sm">
          <p className="font-semibold text-flag-ink">The log was not stored.</p>
          <p>{problem.message}</p>
          {problem.missing && problem.missing.length > 0 && (
            <p className="mt-1">
              Missing:{' '}
              {problem.missing.map((c) => (
                <code key={c} className="mr-1 rounded bg-ink-100 px-1">
                  {c}
                </code>
              ))}
              {problem.columns && (
                <>
                  {' '}
                  — the header{problem.line ? ` (line ${problem.line})` : ''} has: {problem.columns.join(', ')}
                </>
              )}
            </p>
          )}
        </div>
      )}
    </div>
  );
}
