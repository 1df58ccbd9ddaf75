// Pressure cycles (DESIGN 3.2.5): a cycle runs from a zero hold through its highest hold back to
// zero. A log may hold several (a shakedown cycle to part pressure, a repeat); the last one that
// reaches the test pressure is the one compared. Works on the list of holds alone, so it can be
// recomputed whenever a hold completes.
import type { HoldBranch } from './types';

export interface CycleSpan {
  index: number;
  /** index of the zero hold it starts from; null when the log starts at pressure */
  start: number | null;
  /** index of its highest hold (the first of equal ones) */
  peak: number;
  /** index of the zero hold it ends at; null when the log has not come back to zero */
  end: number | null;
  /** indices of its holds at pressure, in time order */
  members: number[];
  peakPressure: number;
}

/**
 * Split holds into cycles and name every hold's branch and cycle. A zero hold (|p| ≤ zeroBand)
 * after holds at pressure ends the cycle; the latest zero hold before the next holds at pressure
 * starts the next. Branches: the starting zero hold `zero`, holds up to the peak `loading`, after
 * it `unloading`, a zero hold that ends a cycle and starts no other `return`.
 */
export function splitCycles(
  holds: readonly { pressure: number }[],
  zeroBand: number,
): { cycles: CycleSpan[]; branch: HoldBranch[]; cycleOf: number[] } {
  const atZero = holds.map((h) => Math.abs(h.pressure) <= zeroBand);
  const cycles: CycleSpan[] = [];
  let start: number | null = null;
  let members: number[] = [];
  const close = (end: number | null) => {
    let peak = members[0]!;
    for (const i of members) if (holds[i]!.pressure > holds[peak]!.pressure) peak = i;
    cycles.push({ index: cycles.length, start, peak, end, members, peakPressure: holds[peak]!.pressure });
  };
  holds.forEach((_, i) => {
    if (!atZero[i]) members.push(i);
    else if (members.length > 0) {
      close(i);
      start = i;
      members = [];
    } else start = i;
  });
  if (members.length > 0) close(null);

  const branch: HoldBranch[] = holds.map(() => 'zero');
  const cycleOf: number[] = holds.map(() => 0);
  const starts = new Set(cycles.map((c) => c.start).filter((s): s is number => s !== null));
  const firstLoaded = cycles[0]?.members[0] ?? Infinity;
  holds.forEach((_, i) => {
    if (atZero[i]) branch[i] = starts.has(i) || i < firstLoaded ? 'zero' : 'return';
  });
  for (const c of cycles) {
    for (const i of c.members) {
      branch[i] = i <= c.peak ? 'loading' : 'unloading';
      cycleOf[i] = c.index;
    }
    if (c.end !== null) cycleOf[c.end] = c.index;
    if (c.start !== null) cycleOf[c.start] = c.index; // a shared zero hold belongs to the later cycle
  }
  // zero holds outside any cycle's start or end: leading ones go with the first cycle, trailing with the last
  const last = cycles.length - 1;
  holds.forEach((_, i) => {
    if (!atZero[i] || starts.has(i) || cycles.some((c) => c.end === i)) return;
    cycleOf[i] = i < firstLoaded ? 0 : Math.max(0, last);
  });
  return { cycles, branch, cycleOf };
}

/** The cycle compared: the last that reaches 95 % of the test pressure, else the highest (the latest of equals). */
export function comparedCycle(cycles: readonly CycleSpan[], testPressure: number): CycleSpan | null {
  for (let k = cycles.length - 1; k >= 0; k--) if (cycles[k]!.peakPressure >= 0.95 * testPressure) return cycles[k]!;
  let best: CycleSpan | null = null;
  for (const c of cycles) if (!best || c.peakPressure >= best.peakPressure) best = c;
  return best;
}
