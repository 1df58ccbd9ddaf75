import { bigint, char, index, int, mysqlEnum, mysqlTable, text, uniqueIndex, varchar } from 'drizzle-orm/mysql-core';
import { at, createdAt, id, ref, json } from './columns';
import { tests } from './tests';
import { users } from './users';
import { outboxStatuses } from '../../lib/domain';
export { outboxStatuses };

/**
 * Append-only: the code has no update or delete path, and database triggers refuse both. Each
 * row carries its place in its chain (one chain per test, chain 0 for events of no test) and
 * SHA-256 of the previous row's hash and its own canonical content (src/db/queries/audit-chain.ts).
 */
export const auditEvents = mysqlTable(
  'audit_events',
  {
    id: id(),
    at: at('at')
      .notNull()
      .$defaultFn(() => new Date()),
    userId: ref('user_id').references(() => users.id),
    /** who, in words: an e-mail, `share link #7`, `worker w-1` */
    actor: varchar('actor', { length: 254 }).notNull(),
    action: varchar('action', { length: 60 }).notNull(),
    testId: ref('test_id').references(() => tests.id),
    details: json('details')
      .$type<Record<string, unknown>>()
      .notNull()
      .$defaultFn(() => ({})),
    /** the test id, or 0 for events of no test */
    chainKey: bigint('chain_key', { mode: 'number', unsigned: true }).notNull().default(0),
    /** 1, 2, 3… within the chain; null only on rows older than the chain, until they are sealed */
    chainSeq: int('chain_seq', { unsigned: true }),
    prevHash: char('prev_hash', { length: 64 }),
    hash: char('hash', { length: 64 }),
  },
  (t) => [
    index('audit_test_idx').on(t.testId, t.at),
    index('audit_at_idx').on(t.at),
    index('audit_action_idx').on(t.action),
    uniqueIndex('audit_chain_uq').on(t.chainKey, t.chainSeq),
  ],
);

/** The newest row of each audit chain, locked while a row is appended so chains never fork. */
export const auditChainHeads = mysqlTable('audit_chain_heads', {
  chainKey: bigint('chain_key', { mode: 'number', unsigned: true }).primaryKey(),
  lastSeq: int('last_seq', { unsigned: true }).notNull().default(0),
  lastHash: char('last_hash', { length: 64 }).notNull(),
});

/** E-mail goes through this table so a mail-server outage delays a message, never loses it. */
export const outbox = mysqlTable(
  'outbox',
  {
    id: id(),
    toAddress: varchar('to_address', { length: 254 }).notNull(),
    subject: varchar('subject', { length: 250 }).notNull(),
    textBody: text('text_body').notNull(),
    status: mysqlEnum('status', outboxStatuses).notNull().default('pending'),
    attempts: int('attempts').notNull().default(0),
    nextAttemptAt: at('next_attempt_at')
      .notNull()
      .$defaultFn(() => new Date()),
    lastError: text('last_error'),
    testId: ref('test_id').references(() => tests.id),
    createdAt: createdAt(),
    sentAt: at('sent_at'),
  },
  (t) => [index('outbox_due_idx').on(t.status, t.nextAttemptAt)],
);

export type AuditEvent = typeof auditEvents.$inferSelect;
export type NewAuditEvent = typeof auditEvents.$inferInsert;
export type OutboxMessage = typeof outbox.$inferSelect;
