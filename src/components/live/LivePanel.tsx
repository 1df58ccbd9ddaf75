import { useEffect, useMemo, useState } from 'react';
import type { PressureUnit } from '../../lib/ui-format';
import { formatPressure } from '../../lib/ui-format';
import LiveGaugePlot, { type LiveGrid } from './LiveGaugePlot';
import LiveStreamer from './LiveStreamer';
import { adviceFor, applyLiveEvent, INITIAL_LIVE_STATE, latestRatios, type LiveState } from './live-state';

interface Props {
  /** `/api/tests/{id}/live/events` or the share link's `/api/share/{token}/live/events` */
  eventsUrl: string;
  grids: LiveGrid[];
  testPressure: number;
  slopeBand: number;
  pressureUnit: PressureUnit;
  /** the test whose live session the browser may run from a file (technician and up, test not released) */
  streamTestId?: number;
  /** where the finished reduction is reviewed (absent on the inspector's page) */
  reviewUrl?: string;
}

const EVENTS = ['session', 'hold', 'warning', 'status', 'finished', 'abandoned'] as const;

/** The live test: rows received, pressure, holds reduced as they complete, early warnings (DESIGN 8). */
export default function LivePanel({
  eventsUrl,
  grids,
  testPressure,
  slopeBand,
  pressureUnit,
  streamTestId,
  reviewUrl,
}: Props) {
  const [state, setState] = useState<LiveState>(INITIAL_LIVE_STATE);
  useEffect(() => {
    if (typeof EventSource === 'undefined') return;
    // EventSource reconnects by itself and sends Last-Event-ID, so the server replays what was missed
    const source = new EventSource(eventsUrl);
    source.onopen = () => setState((s) => ({ ...s, connected: true }));
    source.onerror = () => setState((s) => ({ ...s, connected: false }));
    const handlers = EVENTS.map((type) => {
      const h = (e: MessageEvent<string>) => {
        let data: unknown = null;
        try {
          data = JSON.parse(e.data);
        } catch {
          return;
        }
        // an event id is `{session}.{ordinal}`: a new session starts the panel afresh
        const session = e.lastEventId.split('.')[0] ?? '';
        setState((s) => {
          const fresh = session !== '' && s.session !== '' && session !== s.session;
          const from = fresh ? applyLiveEvent(s, 'session', {}) : s;
          return { ...applyLiveEvent(from, type, data), session: session || from.session };
        });
      };
      source.addEventListener(type, h);
      return [type, h] as const;
    });
    return () => {
      for (const [type, h] of handlers) source.removeEventListener(type, h);
      source.close();
    };
  }, [eventsUrl]);

  const ratios = useMemo(() => latestRatios(state.holds), [state.holds]);
  const warned = useMemo(() => new Set(state.warnings.map((w) => w.gaugeId)), [state.warnings]);
  const lastHold = state.holds.at(-1);
  const finished = state.finishedReductionId !== null;

  if (!state.active && streamTestId === undefined) return null;

  return (
    <section className="space-y-4 card" aria-labelledby="live-h" data-live-panel>
      <div className="flex flex-wrap items-center gap-3">
        <h2 id="live-h" className="text-lg font-semibold">
          Live test
        </h2>
        {state.active && (
          <span
            className={`rounded-full px-2.5 py-0.5 text-sm font-semibold ${
              finished ? 'bg-ink-100 text-ink-900' : 'bg-brass-100 text-ink-950'
            }`}
            data-live-state={finished ? 'finished' : state.abandoned ? 'abandoned' : 'live'}
          >
            {finished
              ? 'Finished: the log is stored and the full reduction is queued'
              : state.abandoned
                ? 'Abandoned: nothing of this session was stored as a log'
                : 'Live, not yet reduced: figures are provisional'}
          </span>
        )}
        <span className="ml-auto text-sm text-ink-700" aria-live="polite">
          {state.connected ? 'Connected' : 'Connecting…'}
        </span>
      </div>

      {state.active && (
        <dl className="grid grid-cols-2 gap-3 text-sm sm:grid-cols-4">
          <div>
            <dt className="text-ink-700">Rows received</dt>
            <dd className="text-lg font-semibold tabular-nums" data-live-rows>
              {state.rows.toLocaleString('en')}
            </dd>
          </div>
          <div>
            <dt className="text-ink-700">Current pressure</dt>
            <dd className="text-lg font-semibold tabular-nums" data-live-pressure>
              {state.pressure === null ? '—' : formatPressure(state.pressure, pressureUnit)}
            </dd>
          </div>
          <div>
            <dt className="text-ink-700">Holds reduced</dt>
            <dd className="text-lg font-semibold tabular-nums" data-live-holds>
              {state.holds.length}
              {lastHold && (
                <span className="ml-1 text-sm font-normal text-ink-700">
                  (last at {formatPressure(lastHold.pressure, pressureUnit)}, {lastHold.branch})
                </span>
              )}
            </dd>
          </div>
          <div>
            <dt className="text-ink-700">Hold in progress</dt>
            <dd className="text-lg font-semibold">
              {finished || state.abandoned ? '—' : `Hold ${state.holds.length + 1}`}
              <span className="ml-1 text-sm font-normal text-ink-700">
                of test pressure {formatPressure(testPressure, pressureUnit)}
              </span>
            </dd>
          </div>
        </dl>
      )}

      {state.warnings.length > 0 && (
        <div role="alert" className="space-y-2" data-live-warnings>
          {state.warnings.map((w) => {
            const advice = adviceFor(w.code);
            return (
              <div
                key={`${w.gaugeId}:${w.code}`}
                className="rounded-md border-l-4 border-flag bg-white px-4 py-3 text-sm"
                data-live-warning={`${w.gaugeId}:${w.code}`}
              >
                <p className="font-semibold">
                  {advice.title}: gauge {w.gaugeId} at {formatPressure(w.pressure, pressureUnit)}
                </p>
                <p>{w.message}</p>
                <p className="mt-1 text-ink-700">
                  <span className="font-semibold">What to check: </span>
                  {advice.check}
                </p>
              </div>
            );
          })}
        </div>
      )}

      {state.active && grids.length > 0 && (
        <div className="grid grid-cols-1 gap-3 sm:grid-cols-2 lg:grid-cols-3 xl:grid-cols-4">
          {grids.map((g) => (
            <LiveGaugePlot
              key={g.id}
              grid={g}
              holds={state.holds}
              testPressure={testPressure}
              slopeBand={slopeBand}
              pressureUnit={pressureUnit}
              warned={warned.has(g.id) || warned.has(g.id.split('/')[0] ?? g.id)}
              ratio={ratios.get(g.id) ?? null}
            />
          ))}
        </div>
      )}

      {finished && reviewUrl && (
        <p className="text-sm">
          The full reduction replaces these provisional figures when it is done:{' '}
          <a className="underline" href={reviewUrl}>
            open the review
          </a>
          .
        </p>
      )}

      {state.active && (
        <p className="text-sm text-ink-700">
          Each hold is reduced as it completes, before the full reduction of the log; a warning is a prompt to check,
          not a verdict. The test director decides whether to hold, go on or depressurise, according to the written test
          procedure and the governing code.
        </p>
      )}

      {streamTestId !== undefined && !state.active && (
        <p className="text-sm text-ink-700">
          No live session is running for this test. The push script on the acquisition PC opens one; or send a log file
          from this browser below.
        </p>
      )}
      {streamTestId !== undefined && <LiveStreamer testId={streamTestId} />}
    </section>
  );
}
