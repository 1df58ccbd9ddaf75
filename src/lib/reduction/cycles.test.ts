// Pressure cycles from the list of holds (DESIGN 3.2.5).
import { describe, expect, it } from 'vitest';
import { comparedCycle, splitCycles } from './cycles';

const holds = (...p: number[]) => p.map((pressure) => ({ pressure }));

describe('splitCycles', () => {
  it('one cycle: zero, loading, unloading, return', () => {
    const r = splitCycles(holds(0, 1, 2, 3, 2, 1, 0), 0.1);
    expect(r.branch).toEqual(['zero', 'loading', 'loading', 'loading', 'unloading', 'unloading', 'return']);
    expect(r.cycles).toEqual([{ index: 0, start: 0, peak: 3, end: 6, members: [1, 2, 3, 4, 5], peakPressure: 3 }]);
  });
  it('a shakedown cycle, then the test: the shared zero hold starts the second', () => {
    const r = splitCycles(holds(0, 1, 0, 1, 2, 3, 0), 0.1);
    expect(r.cycles.map((c) => [c.start, c.peak, c.end])).toEqual([
      [0, 1, 2],
      [2, 5, 6],
    ]);
    expect(r.branch).toEqual(['zero', 'loading', 'zero', 'loading', 'loading', 'loading', 'return']);
    expect(r.cycleOf).toEqual([0, 0, 1, 1, 1, 1, 1]);
  });
  it('a log that starts at pressure has a first cycle without a start; an open last cycle has no end', () => {
    const r = splitCycles(holds(2, 3, 0, 1, 2), 0.1);
    expect(r.cycles.map((c) => [c.start, c.end])).toEqual([
      [null, 2],
      [2, null],
    ]);
  });
  it('two zero holds in a row: the later one starts the cycle, the earlier is a zero hold too', () => {
    const s = splitCycles(holds(0, 0, 1, 0), 0.1);
    expect(s.cycles[0]!.start).toBe(1);
    expect(s.branch).toEqual(['zero', 'zero', 'loading', 'return']);
  });
  it('holds that never leave zero make no cycle', () => expect(splitCycles(holds(0, 0.05), 0.1).cycles).toEqual([]));
});

describe('comparedCycle', () => {
  const c = (peakPressure: number, index: number) => ({
    index,
    start: null,
    peak: 0,
    end: null,
    members: [],
    peakPressure,
  });
  it('the last cycle that reaches 95 % of the test pressure', () => {
    expect(comparedCycle([c(3.4, 0), c(1.7, 1), c(3.3, 2), c(2, 3)], 3.4)!.index).toBe(2);
  });
  it('none reaches it (a live log): the highest, the latest of equal ones', () => {
    expect(comparedCycle([c(1.7, 0), c(2.5, 1), c(2.5, 2)], 3.4)!.index).toBe(2);
  });
  it('no cycle', () => expect(comparedCycle([], 3.4)).toBeNull());
});
