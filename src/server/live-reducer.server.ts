// The server's one view of the engine's live reducer (DESIGN 8): bytes in, events out. Events are
// a pure function of the bytes, so any app server that replays the same chunks derives the same
// events in the same order; the live service numbers them and stores them once.
import { LogReader } from '../lib/reduction';
import type { Plan } from '../lib/reduction/plan';

export type LiveEventType = 'hold' | 'warning' | 'status';

export interface LiveEngineEvent {
  type: LiveEventType;
  data: Record<string, unknown>;
}

export interface LiveEngine {
  /** The next bytes of the log (a chunk may end mid-line); the events they complete. */
  push(chunk: Uint8Array): LiveEngineEvent[];
  /** The end of the log: events its last line completes. */
  finish(): LiveEngineEvent[];
  /** Data rows read so far. */
  readonly rows: number;
}

/**
 * Stand-in until the engine's LiveReducer is merged: the engine's own reader, reporting rows and
 * the newest pressure after every chunk as a `status` event (no holds or warnings yet).
 */
class ReaderStatusEngine implements LiveEngine {
  private readonly reader: LogReader;
  private count = 0;
  private pressure: number | null = null;

  constructor(plan: Plan) {
    this.reader = new LogReader(plan, (_t, p) => {
      this.count++;
      this.pressure = p;
    });
    this.reader.beginSegment();
  }

  get rows(): number {
    return this.count;
  }

  push(chunk: Uint8Array): LiveEngineEvent[] {
    this.reader.push(chunk);
    return [{ type: 'status', data: { rows: this.count, pressure: this.pressure, verdict: 'incomplete' } }];
  }

  finish(): LiveEngineEvent[] {
    this.reader.endSegment();
    return [{ type: 'status', data: { rows: this.count, pressure: this.pressure, verdict: 'incomplete' } }];
  }
}

export function createLiveEngine(plan: Plan): LiveEngine {
  return new ReaderStatusEngine(plan);
}
