import { char, index, int, mysqlEnum, mysqlTable, text, uniqueIndex, varchar } from 'drizzle-orm/mysql-core';
import { at, createdAt, id, json, ref } from './columns';
import { reductions } from './reductions';
import { tests } from './tests';
import { users } from './users';
import { dispositionOutcomes, signatureKinds } from '../../lib/domain';
export { dispositionOutcomes, signatureKinds };

export type { DispositionOutcome } from '../../lib/domain';

/** Every disposition is kept; the latest per gauge and reduction counts. */
export const dispositions = mysqlTable(
  'dispositions',
  {
    id: id(),
    testId: ref('test_id')
      .notNull()
      .references(() => tests.id),
    reductionId: ref('reduction_id')
      .notNull()
      .references(() => reductions.id),
    gaugeId: varchar('gauge_id', { length: 64 }).notNull(),
    outcome: mysqlEnum('outcome', dispositionOutcomes).notNull(),
    reason: text('reason').notNull(),
    userId: ref('user_id')
      .notNull()
      .references(() => users.id),
    createdAt: createdAt(),
  },
  (t) => [index('dispositions_test_idx').on(t.testId, t.reductionId, t.gaugeId)],
);

export const signatures = mysqlTable(
  'signatures',
  {
    id: id(),
    testId: ref('test_id')
      .notNull()
      .references(() => tests.id),
    reductionId: ref('reduction_id')
      .notNull()
      .references(() => reductions.id),
    kind: mysqlEnum('kind', signatureKinds).notNull(),
    userId: ref('user_id')
      .notNull()
      .references(() => users.id),
    statement: text('statement').notNull(),
    createdAt: createdAt(),
  },
  (t) => [index('signatures_test_idx').on(t.testId, t.kind)],
);

export const shareLinks = mysqlTable(
  'share_links',
  {
    id: id(),
    testId: ref('test_id')
      .notNull()
      .references(() => tests.id),
    /** sha256 hex of the 256-bit token; the token is only in the URL */
    tokenHash: varchar('token_hash', { length: 64 }).notNull(),
    email: varchar('email', { length: 254 }),
    createdBy: ref('created_by')
      .notNull()
      .references(() => users.id),
    createdAt: createdAt(),
    expiresAt: at('expires_at').notNull(),
    revokedAt: at('revoked_at'),
    lastUsedAt: at('last_used_at'),
    useCount: int('use_count').notNull().default(0),
  },
  (t) => [uniqueIndex('share_links_hash_uq').on(t.tokenHash), index('share_links_test_idx').on(t.testId)],
);

/**
 * The record as released, frozen: plan, vessel, material, result, dispositions, signatures and
 * logs, with SHA-256 of its canonical JSON. Written once in the release's transaction; triggers
 * refuse any UPDATE or DELETE. Exports, the report page and share links read only this.
 */
export const releaseSnapshots = mysqlTable('release_snapshots', {
  testId: ref('test_id')
    .primaryKey()
    .references(() => tests.id),
  reductionId: ref('reduction_id')
    .notNull()
    .references(() => reductions.id),
  body: json('body').$type<unknown>().notNull(),
  sha256: char('sha256', { length: 64 }).notNull(),
  createdAt: createdAt(),
});

export type Disposition = typeof dispositions.$inferSelect;
export type ReleaseSnapshot = typeof releaseSnapshots.$inferSelect;
export type Signature = typeof signatures.$inferSelect;
export type ShareLink = typeof shareLinks.$inferSelect;
