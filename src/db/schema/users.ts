import { boolean, index, int, mysqlEnum, mysqlTable, primaryKey, uniqueIndex, varchar } from 'drizzle-orm/mysql-core';
import { at, createdAt, id, ref } from './columns';
import { roles } from '../../lib/roles';
export { roles };
export type { Role } from '../../lib/roles';

export const users = mysqlTable(
  'users',
  {
    id: id(),
    email: varchar('email', { length: 254 }).notNull(),
    name: varchar('name', { length: 120 }).notNull(),
    role: mysqlEnum('role', roles).notNull(),
    passwordHash: varchar('password_hash', { length: 100 }).notNull(),
    disabled: boolean('disabled').notNull().default(false),
    /** bumped by sign-out, disabling and a password change: every older session ends at once */
    sessionEpoch: int('session_epoch').notNull().default(0),
    createdAt: createdAt(),
    lastSignInAt: at('last_sign_in_at'),
  },
  (t) => [uniqueIndex('users_email_uq').on(t.email)],
);

export const apiTokens = mysqlTable(
  'api_tokens',
  {
    id: id(),
    userId: ref('user_id')
      .notNull()
      .references(() => users.id),
    name: varchar('name', { length: 120 }).notNull(),
    /** sha256 hex of the token; the token itself is shown once and never stored */
    tokenHash: varchar('token_hash', { length: 64 }).notNull(),
    /** the first characters of the token, to recognise it in a list */
    prefix: varchar('prefix', { length: 16 }).notNull(),
    /** what the token may do, comma-separated: `read` (every GET), `upload` (logs, live, reductions) */
    scopes: varchar('scopes', { length: 40 }).notNull().default('read,upload'),
    createdAt: createdAt(),
    /** null only for tokens made before expiry existed (the migration gives them 90 days) */
    expiresAt: at('expires_at'),
    lastUsedAt: at('last_used_at'),
    revokedAt: at('revoked_at'),
  },
  (t) => [uniqueIndex('api_tokens_hash_uq').on(t.tokenHash), index('api_tokens_user_idx').on(t.userId)],
);

/** One-time links e-mailed to a person: an invitation to set a first password, or a reset. */
export const accountLinks = mysqlTable(
  'account_links',
  {
    id: id(),
    userId: ref('user_id')
      .notNull()
      .references(() => users.id),
    purpose: mysqlEnum('purpose', ['invite', 'reset']).notNull(),
    /** sha256 hex of the 256-bit token; the token is only in the e-mailed URL */
    tokenHash: varchar('token_hash', { length: 64 }).notNull(),
    createdAt: createdAt(),
    expiresAt: at('expires_at').notNull(),
    usedAt: at('used_at'),
  },
  (t) => [uniqueIndex('account_links_hash_uq').on(t.tokenHash), index('account_links_user_idx').on(t.userId)],
);

/** Failed sign-ins and signatures per key (e-mail, client address, or both), shared by every server. */
export const signInThrottle = mysqlTable(
  'sign_in_throttle',
  {
    /** sha256 hex of `kind:value` */
    keyHash: varchar('key_hash', { length: 64 }).primaryKey(),
    kind: mysqlEnum('kind', ['email', 'address', 'pair']).notNull(),
    failures: int('failures').notNull().default(0),
    lastFailureAt: at('last_failure_at').notNull(),
  },
  (t) => [index('sign_in_throttle_last_idx').on(t.lastFailureAt)],
);

/** Client addresses an account signed in from successfully (its owner's usual places). */
export const knownSignInAddresses = mysqlTable(
  'known_sign_in_addresses',
  {
    userId: ref('user_id')
      .notNull()
      .references(() => users.id),
    /** sha256 hex of the address */
    addressHash: varchar('address_hash', { length: 64 }).notNull(),
    lastOkAt: at('last_ok_at').notNull(),
  },
  (t) => [primaryKey({ columns: [t.userId, t.addressHash] })],
);

export type User = typeof users.$inferSelect;
export type NewUser = typeof users.$inferInsert;
export type ApiToken = typeof apiTokens.$inferSelect;
export type NewApiToken = typeof apiTokens.$inferInsert;
export type AccountLink = typeof accountLinks.$inferSelect;
