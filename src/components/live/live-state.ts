// What the live panel knows, built from the Server-Sent Events of a live test (DESIGN 8). Pure, so
// a replay after a reconnect (the same events again) leaves the state as it was.

import type { LiveHoldEvent, LiveWarningCode, LiveWarningEvent } from '../../lib/reduction/live';

export type LiveHold = LiveHoldEvent;
export type LiveWarning = LiveWarningEvent;

export interface LiveState {
  /** the stream answers (an open EventSource); false while it reconnects */
  connected: boolean;
  /** an event of a live session has arrived: the panel shows itself */
  active: boolean;
  rows: number;
  pressure: number | null;
  verdict: 'pending' | 'flagged' | string;
  holds: LiveHold[];
  warnings: LiveWarning[];
  /** the session finished: its log is stored and this reduction was queued */
  finishedReductionId: number | null;
  abandoned: boolean;
  /** the session the events so far belong to (the first part of an event id), '' before any */
  session: string;
}

export const INITIAL_LIVE_STATE: LiveState = {
  connected: false,
  active: false,
  rows: 0,
  pressure: null,
  verdict: 'pending',
  holds: [],
  warnings: [],
  finishedReductionId: null,
  abandoned: false,
  session: '',
};

export type LiveEventType = 'hold' | 'warning' | 'status' | 'finished' | 'abandoned' | 'session';

/** The state after one event; unknown events and malformed data leave it unchanged. */
export function applyLiveEvent(state: LiveState, type: string, data: unknown): LiveState {
  if (!data || typeof data !== 'object') return state;
  const d = data as Record<string, unknown>;
  switch (type) {
    case 'session':
      // a new session starts: what an earlier (abandoned or finished) one showed is history
      return { ...INITIAL_LIVE_STATE, connected: state.connected, session: state.session, active: true };
    case 'hold': {
      if (typeof d.index !== 'number' || typeof d.pressure !== 'number' || !Array.isArray(d.gauges)) return state;
      const hold = data as LiveHold;
      const holds = state.holds.filter((h) => h.index !== hold.index);
      holds.push(hold);
      holds.sort((a, b) => a.index - b.index);
      return { ...state, active: true, holds };
    }
    case 'warning': {
      if (typeof d.gaugeId !== 'string' || typeof d.code !== 'string') return state;
      const w = data as LiveWarning;
      if (state.warnings.some((x) => x.gaugeId === w.gaugeId && x.code === w.code)) return state;
      return { ...state, active: true, warnings: [...state.warnings, w] };
    }
    case 'status':
      // the server marks an abandoned session with a last status event
      if (d.session === 'abandoned') return { ...state, abandoned: true };
      return {
        ...state,
        active: true,
        rows: typeof d.rows === 'number' ? d.rows : state.rows,
        pressure: typeof d.pressure === 'number' ? d.pressure : state.pressure,
        verdict: typeof d.verdict === 'string' ? d.verdict : state.verdict,
      };
    case 'finished':
      return {
        ...state,
        active: true,
        finishedReductionId: typeof d.reductionId === 'number' ? d.reductionId : state.finishedReductionId,
      };
    case 'abandoned':
      return { ...state, abandoned: true };
    default:
      return state;
  }
}

/** What a person at the rig should check for each early warning, in the trade's words. */
export const WARNING_ADVICE: Record<LiveWarningCode, { title: string; check: string }> = {
  'trend-outside-band': {
    title: 'Trend outside the band',
    check:
      'Hold the pressure. Check the gauge factor and channel mapping, the lead wires and the bond before raising the pressure further; the engineer decides whether to go on.',
  },
  'hold-creep': {
    title: 'Strain creeps during the hold',
    check:
      'Keep the pressure steady and watch whether it settles. Check for a leak or a falling pressure, a temperature change, and the bond of the gauge.',
  },
  'zero-drift': {
    title: 'Zero drifts before pressure',
    check:
      'Do not pressurise yet. Let the temperature settle, check the connections and the bridge balance, and zero again.',
  },
  'near-yield': {
    title: 'Projected near yield at test pressure',
    check:
      'Do not raise the pressure further until the engineer has checked the measured trend against the yield limit and the test pressure against the governing code; depressurise if the written procedure says so.',
  },
};

export function adviceFor(code: string): { title: string; check: string } {
  return (
    WARNING_ADVICE[code as LiveWarningCode] ?? {
      title: code,
      check: 'Ask the responsible engineer before going on.',
    }
  );
}

/** The latest provisional ratio of each grid (measured over predicted), from the last hold that has one. */
export function latestRatios(holds: LiveHold[]): Map<string, number> {
  const out = new Map<string, number>();
  for (const h of holds)
    for (const g of h.gauges)
      if (g.provisionalRatio !== null && Number.isFinite(g.provisionalRatio)) out.set(g.id, g.provisionalRatio);
  return out;
}
