import { index, int, mysqlEnum, mysqlTable, text, varchar } from 'drizzle-orm/mysql-core';
import { at, createdAt, id, ref, json } from './columns';
import { tests } from './tests';
import { users } from './users';
import { outboxStatuses } from '../../lib/domain';
export { outboxStatuses };

/** Append-only: the code has no update or delete path for this table. */
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
  },
  (t) => [
    index('audit_test_idx').on(t.testId, t.at),
    index('audit_at_idx').on(t.at),
    index('audit_action_idx').on(t.action),
  ],
);

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
