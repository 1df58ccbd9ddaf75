// Server-Sent Events of a test's live sessions (DESIGN 8). Events are read from MariaDB, so any
// app server serves any test: each open stream looks for rows after its cursor every
// LIVE_POLL_MS. An event's `id` is `{session}.{ordinal}`; a reconnect names the last one it saw
// (the Last-Event-ID header, or `?lastEventId=` for EventSource polyfills) and gets what it missed.
// Without one the stream starts at the first event of the test's newest session. A heartbeat
// comment every LIVE_HEARTBEAT_SECONDS keeps proxies from closing an idle stream. Streams end on
// client disconnect and when the server drains for shutdown (the client reconnects elsewhere).
import { getDb } from '../db/client.server';
import { findLatestLiveSession, liveEventsAfter } from '../db/queries/live';
import { getConfig } from '../config.server';
import { isDraining, onShutdown } from '../lifecycle.server';
import { logger } from './observability/logger.server';

export interface LiveCursor {
  sessionId: number;
  ordinal: number;
}

/** Parse `{session}.{ordinal}`; null for anything else. */
export function parseEventId(value: string | null | undefined): LiveCursor | null {
  const m = /^(\d{1,15})\.(\d{1,9})$/.exec(value?.trim() ?? '');
  if (!m) return null;
  return { sessionId: Number(m[1]), ordinal: Number(m[2]) };
}

export const eventId = (c: LiveCursor) => `${c.sessionId}.${c.ordinal}`;

const open = new Set<() => void>();
let hooked = false;

/** How many event streams this process serves now (a metric). */
export function openLiveStreams(): number {
  return open.size;
}

/** The cursor a new stream starts from: the one the client names, else the newest session's start. */
async function startCursor(testId: number, request: Request): Promise<LiveCursor> {
  const url = new URL(request.url);
  const named = parseEventId(request.headers.get('last-event-id')) ?? parseEventId(url.searchParams.get('lastEventId'));
  if (named) return named;
  const latest = await findLatestLiveSession(getDb(), testId);
  return latest ? { sessionId: latest.id, ordinal: 0 } : { sessionId: 0, ordinal: 0 };
}

/** The event stream of one test's live sessions, as a streamed Response. */
export async function liveEventStream(testId: number, request: Request): Promise<Response> {
  const cfg = getConfig();
  let cursor = await startCursor(testId, request);
  const encoder = new TextEncoder();
  let timer: ReturnType<typeof setTimeout> | null = null;
  let closed = false;
  let close: () => void = () => undefined;
  let failures = 0;
  let lastSent = Date.now();

  if (!hooked) {
    hooked = true;
    onShutdown('live event streams', async () => {
      for (const end of [...open]) end();
    });
  }

  const body = new ReadableStream<Uint8Array>({
    start(controller) {
      const send = (text: string) => {
        if (closed) return;
        controller.enqueue(encoder.encode(text));
        lastSent = Date.now();
      };
      close = () => {
        if (closed) return;
        closed = true;
        if (timer) clearTimeout(timer);
        open.delete(close);
        request.signal.removeEventListener('abort', close);
        try {
          controller.close();
        } catch {
          /* already closed by the client */
        }
      };
      open.add(close);
      request.signal.addEventListener('abort', close);
      // the reconnect delay a client waits; then it names the last id it saw
      send(`retry: 2000\n: live events of test ${testId}\n\n`);

      const tick = async () => {
        timer = null;
        if (closed) return;
        if (isDraining()) return close();
        try {
          for (;;) {
            const rows = await liveEventsAfter(getDb(), testId, cursor);
            for (const r of rows) {
              cursor = { sessionId: r.sessionId, ordinal: r.ordinal };
              send(`id: ${eventId(cursor)}\nevent: ${r.type}\ndata: ${JSON.stringify(r.data)}\n\n`);
            }
            if (rows.length < 200 || closed) break;
          }
          failures = 0;
        } catch (err) {
          // the database did not answer: end after a few tries, so the client reconnects (maybe elsewhere)
          if (++failures >= 5) {
            logger().warn({ err, testId }, 'live event stream ended: the database is not answering');
            return close();
          }
        }
        if (Date.now() - lastSent >= cfg.LIVE_HEARTBEAT_SECONDS * 1000) send(': heartbeat\n\n');
        if (!closed) timer = setTimeout(() => void tick(), cfg.LIVE_POLL_MS);
      };
      void tick();
    },
    cancel() {
      close();
    },
  });

  return new Response(body, {
    status: 200,
    headers: {
      'content-type': 'text/event-stream; charset=utf-8',
      'cache-control': 'no-store, no-transform',
      'x-accel-buffering': 'no',
    },
  });
}
