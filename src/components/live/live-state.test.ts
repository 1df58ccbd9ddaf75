import { describe, expect, it } from 'vitest';
import { applyLiveEvent, INITIAL_LIVE_STATE, latestRatios, type LiveState } from './live-state';

const hold = (index: number, pressure: number, ratio: number | null) => ({
  index,
  pressure,
  branch: 'loading' as const,
  gauges: [{ id: 'H1', strain: pressure * 100, provisionalRatio: ratio }],
});

function feed(events: [string, unknown][], from: LiveState = INITIAL_LIVE_STATE): LiveState {
  return events.reduce((s, [t, d]) => applyLiveEvent(s, t, d), from);
}

describe('the live panel state', () => {
  const events: [string, unknown][] = [
    ['status', { rows: 120, pressure: 0.1, verdict: 'pending' }],
    ['hold', hold(0, 0, null)],
    ['hold', hold(1, 5, null)],
    ['hold', hold(2, 10, 0.71)],
    ['warning', { gaugeId: 'H1', code: 'trend-outside-band', message: 'low', pressure: 10 }],
    ['status', { rows: 900, pressure: 12.5, verdict: 'flagged' }],
  ];

  it('collects holds in order, warnings once, and the latest status', () => {
    const s = feed(events);
    expect(s.active).toBe(true);
    expect(s.holds.map((h) => h.index)).toEqual([0, 1, 2]);
    expect(s.warnings).toHaveLength(1);
    expect(s).toMatchObject({ rows: 900, pressure: 12.5, verdict: 'flagged' });
    expect(latestRatios(s.holds).get('H1')).toBe(0.71);
  });

  it('is unchanged by a replay of the same events after a reconnect', () => {
    const once = feed(events);
    expect(feed(events, once)).toEqual(once);
  });

  it('ignores malformed data and unknown events', () => {
    const s = feed(events);
    expect(applyLiveEvent(s, 'hold', { index: 'x' })).toBe(s);
    expect(applyLiveEvent(s, 'warning', null)).toBe(s);
    expect(applyLiveEvent(s, 'something-else', { a: 1 })).toBe(s);
  });

  it('starts afresh when a new session opens, and records the reduction a finish queued', () => {
    const s = feed([...events, ['finished', { reductionId: 42 }]]);
    expect(s.finishedReductionId).toBe(42);
    const next = applyLiveEvent(s, 'session', { sessionId: 7 });
    expect(next.holds).toEqual([]);
    expect(next.warnings).toEqual([]);
    expect(next.finishedReductionId).toBeNull();
  });

  it('marks a session the server says was abandoned', () => {
    const s = feed([...events, ['status', { rows: 900, pressure: null, verdict: null, session: 'abandoned' }]]);
    expect(s.abandoned).toBe(true);
    expect(s.rows).toBe(900);
  });
});
