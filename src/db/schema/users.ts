import { boolean, index, mysqlEnum, mysqlTable, uniqueIndex, varchar } from 'drizzle-orm/mysql-core';
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
    createdAt: createdAt(),
    lastUsedAt: at('last_used_at'),
    revokedAt: at('revoked_at'),
  },
  (t) => [uniqueIndex('api_tokens_hash_uq').on(t.tokenHash), index('api_tokens_user_idx').on(t.userId)],
);

export type User = typeof users.$inferSelect;
export type NewUser = typeof users.$inferInsert;
export type ApiToken = typeof apiTokens.$inferSelect;
export type NewApiToken = typeof apiTokens.$inferInsert;
