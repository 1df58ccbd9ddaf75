import { useRef, useState } from 'react';
import { ApiError, api } from '../api';

interface Props {
  testId: number;
}

type Phase =
  | { kind: 'idle' }
  | { kind: 'sending'; sent: number; total: number; chunk: number }
  | { kind: 'retrying'; sent: number; total: number; chunk: number; reason: string }
  | { kind: 'finished'; reductionId: number }
  | { kind: 'stopped'; message: string };

const CHUNK_BYTES = 64 * 1024;
const PACES = [
  { value: 0, label: 'as fast as the server takes it' },
  { value: 1000, label: 'one piece (64 KiB) a second' },
  { value: 5000, label: 'one piece every 5 seconds' },
] as const;

const sleep = (ms: number) => new Promise((r) => setTimeout(r, ms));

/**
 * Runs a live session from the browser, for a rig without the push script: the chosen file is sent
 * in numbered pieces (DESIGN 8), each retried after a network fault (a repeat of the same piece is
 * harmless), then finished, which stores the log and queues its reduction.
 */
export default function LiveStreamer({ testId }: Props) {
  const [file, setFile] = useState<File | null>(null);
  const [pace, setPace] = useState<number>(1000);
  const [phase, setPhase] = useState<Phase>({ kind: 'idle' });
  const [sessionId, setSessionId] = useState<number | null>(null);
  const cancel = useRef(false);
  const base = `/api/tests/${testId}/live`;
  const busy = phase.kind === 'sending' || phase.kind === 'retrying';

  async function putChunk(id: number, n: number, body: Blob, sent: number, total: number): Promise<void> {
    for (let attempt = 0; ; attempt++) {
      if (cancel.current) throw new Error('cancelled');
      try {
        await api(`${base}/${id}/chunks/${n}`, {
          method: 'PUT',
          body,
          headers: { 'content-type': 'text/csv' },
        });
        return;
      } catch (err) {
        // an answer from the server about the piece itself is final; a lost connection or an
        // unavailable server is tried again with the same bytes under the same number
        if (err instanceof ApiError && ![502, 503, 504].includes(err.status)) throw err;
        const reason = err instanceof ApiError ? err.message : 'the connection to the server failed';
        setPhase({ kind: 'retrying', sent, total, chunk: n, reason });
        await sleep(Math.min(30_000, 1000 * 2 ** Math.min(attempt, 5)));
      }
    }
  }

  async function start() {
    if (!file) return;
    cancel.current = false;
    let id: number;
    try {
      const opened = await api<{ sessionId: number }>(base, { method: 'POST', jsonBody: {} });
      id = opened.sessionId;
      setSessionId(id);
    } catch (err) {
      setPhase({
        kind: 'stopped',
        message:
          err instanceof ApiError
            ? `${err.message}${err.status === 409 ? ' Another live session (perhaps the push script) is open for this test: wait for it to finish.' : ''}`
            : 'The server could not be reached; nothing was sent. Check the connection and try again.',
      });
      return;
    }
    const total = file.size;
    let n = 1;
    try {
      for (let offset = 0; offset < total; offset += CHUNK_BYTES, n++) {
        const end = Math.min(total, offset + CHUNK_BYTES);
        setPhase({ kind: 'sending', sent: offset, total, chunk: n });
        await putChunk(id, n, file.slice(offset, end), offset, total);
        if (pace && end < total) await sleep(pace);
      }
      const done = await api<{ logId: number; reductionId: number }>(`${base}/${id}/finish`, {
        method: 'POST',
        jsonBody: {},
      });
      setPhase({ kind: 'finished', reductionId: done.reductionId });
      setSessionId(null);
    } catch (err) {
      if (cancel.current) return;
      setPhase({
        kind: 'stopped',
        message: `${err instanceof ApiError ? err.message : String(err)} The pieces already sent are kept in the open session; abandon it to start again.`,
      });
    }
  }

  async function abandon() {
    cancel.current = true;
    if (sessionId === null) return;
    try {
      await api(`${base}/${sessionId}`, { method: 'DELETE' });
      setSessionId(null);
      setPhase({ kind: 'stopped', message: 'The live session was abandoned; nothing of it was stored as a log.' });
    } catch (err) {
      setPhase({
        kind: 'stopped',
        message: err instanceof ApiError ? err.message : 'The server could not be reached.',
      });
    }
  }

  const percent = busy ? Math.round((100 * phase.sent) / Math.max(1, phase.total)) : 0;
  return (
    <details className="rounded-md border border-ink-100 p-3 text-sm" open={busy || undefined}>
      <summary className="cursor-pointer font-semibold">Run a live session from this browser</summary>
      <p className="mt-2 text-ink-700">
        For a rig without the push script: pick the log file and Hoopline sends it in pieces as a live session, so each
        hold is reduced as it arrives. A file that the acquisition unit is still writing is better sent by the push
        script, which follows the file as it grows.
      </p>
      <div className="mt-3 flex flex-wrap items-end gap-3">
        <label className="block">
          <span className="label">Log file</span>
          <input
            type="file"
            accept=".csv,.txt,.tsv,.dat,text/csv,text/plain"
            className="block"
            disabled={busy}
            onChange={(e) => setFile(e.target.files?.[0] ?? null)}
          />
        </label>
        <label className="block">
          <span className="label">Pace</span>
          <select className="field" value={pace} disabled={busy} onChange={(e) => setPace(Number(e.target.value))}>
            {PACES.map((p) => (
              <option key={p.value} value={p.value}>
                {p.label}
              </option>
            ))}
          </select>
        </label>
        <button type="button" className="btn-primary" disabled={!file || busy} onClick={() => void start()}>
          Start the live session
        </button>
        {sessionId !== null && (
          <button type="button" className="btn-danger" onClick={() => void abandon()}>
            Abandon the session
          </button>
        )}
      </div>
      <p className="mt-2" aria-live="polite" data-live-streamer={phase.kind}>
        {phase.kind === 'sending' && `Sending piece ${phase.chunk}: ${percent} % of ${file?.name ?? 'the file'} sent.`}
        {phase.kind === 'retrying' &&
          `Piece ${phase.chunk} did not arrive (${phase.reason}); trying again with the same bytes.`}
        {phase.kind === 'finished' &&
          `All sent. The log is stored and reduction ${phase.reductionId} is queued; the full result replaces the live figures when it is done.`}
        {phase.kind === 'stopped' && phase.message}
      </p>
    </details>
  );
}
