// Live test mode (DESIGN 8): a session collects numbered chunks of one growing log; the chunks
// live in object storage, their rows here; the events the live reducer derives from the bytes
// are stored with a deterministic ordinal per session, so every app server serves the same stream.
import { sql } from 'drizzle-orm';
import {
  bigint,
  char,
  index,
  int,
  mysqlEnum,
  mysqlTable,
  primaryKey,
  uniqueIndex,
  varchar,
} from 'drizzle-orm/mysql-core';
import { at, createdAt, id, json, ref } from './columns';
import { logFiles } from './logs';
import { reductions } from './reductions';
import { tests } from './tests';
import { users } from './users';

export const liveSessionStatuses = ['open', 'finished', 'abandoned'] as const;
export type LiveSessionStatus = (typeof liveSessionStatuses)[number];

export const liveEventTypes = ['hold', 'warning', 'status', 'finished'] as const;
export type LiveEventType = (typeof liveEventTypes)[number];

export const liveSessions = mysqlTable(
  'live_sessions',
  {
    id: id(),
    testId: ref('test_id')
      .notNull()
      .references(() => tests.id),
    openedBy: ref('opened_by').references(() => users.id),
    status: mysqlEnum('status', liveSessionStatuses).notNull().default('open'),
    /** the test id while the session is open, else NULL: its unique index allows one open session per test */
    openTestId: bigint('open_test_id', { mode: 'number', unsigned: true }).generatedAlwaysAs(
      sql`(case when \`status\` = 'open' then \`test_id\` else null end)`,
      { mode: 'virtual' },
    ),
    /** the plan in force when the session opened: the live events are derived with it */
    plan: json('plan').$type<unknown>().notNull(),
    nextChunk: int('next_chunk').notNull().default(1),
    bytes: bigint('bytes', { mode: 'number', unsigned: true }).notNull().default(0),
    rows: int('rows').notNull().default(0),
    /** SHA-256 of the whole log, computed at finish */
    sha256: char('sha256', { length: 64 }),
    logId: ref('log_id').references(() => logFiles.id),
    reductionId: ref('reduction_id').references(() => reductions.id),
    createdAt: createdAt(),
    finishedAt: at('finished_at'),
  },
  (t) => [uniqueIndex('live_sessions_open_uq').on(t.openTestId), index('live_sessions_test_idx').on(t.testId)],
);

export const liveChunks = mysqlTable(
  'live_chunks',
  {
    sessionId: ref('session_id')
      .notNull()
      .references(() => liveSessions.id),
    n: int('n').notNull(),
    bytes: int('bytes').notNull(),
    rows: int('rows').notNull(),
    sha256: char('sha256', { length: 64 }).notNull(),
    objectKey: varchar('object_key', { length: 400 }).notNull(),
    createdAt: createdAt(),
  },
  (t) => [primaryKey({ columns: [t.sessionId, t.n], name: 'live_chunks_pk' })],
);

export const liveEvents = mysqlTable(
  'live_events',
  {
    sessionId: ref('session_id')
      .notNull()
      .references(() => liveSessions.id),
    /** 1, 2, 3… within the session, in the order the reducer derived them from the bytes */
    ordinal: int('ordinal').notNull(),
    type: mysqlEnum('type', liveEventTypes).notNull(),
    data: json('data').$type<Record<string, unknown>>().notNull(),
    createdAt: createdAt(),
  },
  (t) => [primaryKey({ columns: [t.sessionId, t.ordinal], name: 'live_events_pk' })],
);

/** One row per (session, gauge, warning code) that was e-mailed: each warning goes out once. */
export const liveWarningMails = mysqlTable(
  'live_warning_mails',
  {
    sessionId: ref('session_id')
      .notNull()
      .references(() => liveSessions.id),
    gaugeId: varchar('gauge_id', { length: 60 }).notNull(),
    code: varchar('code', { length: 40 }).notNull(),
    createdAt: createdAt(),
  },
  (t) => [primaryKey({ columns: [t.sessionId, t.gaugeId, t.code], name: 'live_warning_mails_pk' })],
);

export type LiveSession = typeof liveSessions.$inferSelect;
export type LiveChunk = typeof liveChunks.$inferSelect;
export type LiveEventRow = typeof liveEvents.$inferSelect;
