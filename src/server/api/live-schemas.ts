// Live test mode (DESIGN 8): the path parameters, answers and Server-Sent Event payloads of the
// live endpoints, for those endpoints and for the API description. A chunk's body is raw
// text/csv (consecutive byte ranges of one log, numbered from 1; a chunk may end mid-line).
import { z } from 'zod';

const id = z.number().int().positive();

/** `{sessionId}` in …/live/{sessionId}/… */
export const liveSessionIdParam = z.string().min(1).max(100).describe('The id of a live session.');
/** `{n}` in …/chunks/{n}: numbered from 1; the first chunk holds the preamble and the header. */
export const liveChunkNumberParam = z.coerce.number().int().min(1).describe('The chunk number, from 1.');

/** `Last-Event-ID` on a reconnect to …/live/events. */
export const lastEventIdHeader = z.string().max(100);

/** POST /api/tests/{id}/live → 201; one open session per test (409 otherwise). */
export const liveSessionCreated = z.object({ sessionId: z.string() });

/** PUT …/chunks/{n} → 201 stored, 200 the same bytes again (a retry after a lost answer). */
export const liveChunkStored = z.object({
  n: z.number().int().min(1),
  bytes: z.number().int().min(0).describe('Bytes in this chunk.'),
  rows: z.number().int().min(0).describe('Complete data rows received so far.'),
});

/** The `details` of a 409 for a chunk out of turn or with other bytes under a stored number. */
export const liveChunkConflictDetails = z.object({ expected: z.number().int().min(1) });

/** POST …/finish → 201: one stored log (SHA-256 of the whole) and a queued reduction. */
export const liveFinished = z.object({ logId: id, reductionId: id });

/** DELETE …/live/{sessionId}: the session and its chunks are gone. */
export const liveAbandoned = z.object({ sessionId: z.string(), abandoned: z.literal(true) });

export const liveWarningCodes = ['trend-outside-band', 'hold-creep', 'zero-drift', 'near-yield'] as const;

/** `event: hold` — a hold completed. */
export const liveHoldEvent = z.object({
  index: z.number().int().min(0),
  pressure: z.number(),
  branch: z.enum(['loading', 'unloading']),
  gauges: z.array(z.object({ id: z.string(), strain: z.number().nullable(), provisionalRatio: z.number().nullable() })),
});

/** `event: warning` — an early warning, e-mailed once per gauge and code. */
export const liveWarningEvent = z.object({
  gaugeId: z.string(),
  code: z.enum(liveWarningCodes),
  message: z.string(),
  pressure: z.number().nullable(),
});

/** `event: status` — how far the log has come. */
export const liveStatusEvent = z.object({
  rows: z.number().int().min(0),
  pressure: z.number().nullable(),
  verdict: z.string().nullable(),
});

/** `event: finished` — the session became a log and its reduction was queued. */
export const liveFinishedEvent = z.object({ reductionId: id });

/** Each event's name and data; every event carries an `id` for `Last-Event-ID` on reconnect. */
export const liveEvents = {
  hold: liveHoldEvent,
  warning: liveWarningEvent,
  status: liveStatusEvent,
  finished: liveFinishedEvent,
} as const;
