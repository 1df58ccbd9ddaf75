// The server's one view of the engine's live reducer (DESIGN 8): bytes in, events out. Events are
// a pure function of the bytes, so any app server that replays the same chunks derives the same
// events in the same order; the live service numbers them and stores them once.
import { LiveReducer, type LiveEvent } from '../lib/reduction/live';
import type { Plan } from '../lib/reduction/plan';

export type LiveEventType = LiveEvent['type'];

export interface LiveEngineEvent {
  type: LiveEventType;
  data: Record<string, unknown>;
}

export interface LiveEngine {
  /** The next bytes of the log (a chunk may end mid-line); the events they complete. */
  push(chunk: Uint8Array): LiveEngineEvent[];
  /** The end of the log: the events its end completes (those `push` did not report already). */
  finish(): LiveEngineEvent[];
  /** Data rows read so far. */
  readonly rows: number;
}

const plain = (e: LiveEvent): LiveEngineEvent => ({ type: e.type, data: { ...e.data } });

/**
 * Hold and warning events are a pure function of the bytes; status events also depend on where
 * the chunks end. Every server replays a session's stored chunks exactly as they arrived, so the
 * whole list, status events included, is the same on every server and can be numbered.
 */
class EngineLive implements LiveEngine {
  private readonly reducer: LiveReducer;

  constructor(plan: Plan) {
    // the live view needs no time history: keep the reducer's series small
    this.reducer = new LiveReducer(plan, { seriesBuckets: 16 });
  }

  get rows(): number {
    return this.reducer.snapshot().rows;
  }

  push(chunk: Uint8Array): LiveEngineEvent[] {
    return this.reducer.push(chunk).map(plain);
  }

  finish(): LiveEngineEvent[] {
    return this.reducer.finish().caused.map(plain);
  }
}

export function createLiveEngine(plan: Plan): LiveEngine {
  return new EngineLive(plan);
}
