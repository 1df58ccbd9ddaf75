import { and, asc, desc, eq, gt, isNull, lt, or, sql } from 'drizzle-orm';
import type { Conn } from '../client.server';
import { accountLinks, apiTokens, knownSignInAddresses, users, type Role } from '../schema';
import { insertedId } from './inserted-id';

export function findUserByEmail(db: Conn, email: string) {
  return db.query.users.findFirst({ where: eq(users.email, email.trim().toLowerCase()) });
}

export function findUserById(db: Conn, id: number) {
  return db.query.users.findFirst({ where: eq(users.id, id) });
}

export function listUsers(db: Conn) {
  return db
    .select({
      id: users.id,
      email: users.email,
      name: users.name,
      role: users.role,
      disabled: users.disabled,
      /** an invited account that has not set its password yet */
      invited: sql<number>`${users.passwordHash} = ''`.mapWith(Boolean),
      createdAt: users.createdAt,
      lastSignInAt: users.lastSignInAt,
    })
    .from(users)
    .orderBy(asc(users.email));
}

export async function createUser(db: Conn, u: { email: string; name: string; role: Role; passwordHash: string }) {
  return insertedId(
    await db
      .insert(users)
      .values({ ...u, email: u.email.trim().toLowerCase() })
      .$returningId(),
  );
}

/** Put an account back to a known role, password and enabled state (the demo seed with DEMO_RESET). */
export async function resetUser(db: Conn, id: number, u: { role: Role; passwordHash: string }) {
  await db
    .update(users)
    .set({ ...u, disabled: false, sessionEpoch: sql`${users.sessionEpoch} + 1` })
    .where(eq(users.id, id));
}

/** End every session of the user at once (sign-out, disabling, a new password). */
export async function bumpSessionEpoch(db: Conn, id: number) {
  await db
    .update(users)
    .set({ sessionEpoch: sql`${users.sessionEpoch} + 1` })
    .where(eq(users.id, id));
}

/** Disable or re-enable an account; either way its sessions end. */
export async function setUserDisabled(db: Conn, id: number, disabled: boolean) {
  await db
    .update(users)
    .set({ disabled, sessionEpoch: sql`${users.sessionEpoch} + 1` })
    .where(eq(users.id, id));
}

export async function setUserRole(db: Conn, id: number, role: Role) {
  await db.update(users).set({ role }).where(eq(users.id, id));
}

/** A new password ends every session of the account. */
export async function setUserPassword(db: Conn, id: number, passwordHash: string) {
  await db
    .update(users)
    .set({ passwordHash, sessionEpoch: sql`${users.sessionEpoch} + 1` })
    .where(eq(users.id, id));
}

export async function markSignedIn(db: Conn, id: number) {
  await db.update(users).set({ lastSignInAt: new Date() }).where(eq(users.id, id));
}

/** The active user behind a token hash, or undefined (unknown, revoked, expired, or user disabled). */
export async function findUserByTokenHash(db: Conn, tokenHash: string, now = new Date()) {
  const [row] = await db
    .select({ tokenId: apiTokens.id, scopes: apiTokens.scopes, lastUsedAt: apiTokens.lastUsedAt, user: users })
    .from(apiTokens)
    .innerJoin(users, eq(users.id, apiTokens.userId))
    .where(
      and(
        eq(apiTokens.tokenHash, tokenHash),
        isNull(apiTokens.revokedAt),
        gt(apiTokens.expiresAt, now),
        eq(users.disabled, false),
      ),
    )
    .limit(1);
  return row;
}

/** Record a token's use, at most once a minute (a script may call many times a second). */
export async function touchApiToken(db: Conn, tokenId: number, now = new Date()) {
  await db
    .update(apiTokens)
    .set({ lastUsedAt: now })
    .where(
      and(
        eq(apiTokens.id, tokenId),
        or(isNull(apiTokens.lastUsedAt), lt(apiTokens.lastUsedAt, new Date(now.getTime() - 60_000))),
      ),
    );
}

export async function insertApiToken(
  db: Conn,
  t: { userId: number; name: string; tokenHash: string; prefix: string; scopes: string; expiresAt: Date },
) {
  return insertedId(await db.insert(apiTokens).values(t).$returningId());
}

const tokenColumns = {
  id: apiTokens.id,
  name: apiTokens.name,
  prefix: apiTokens.prefix,
  scopes: apiTokens.scopes,
  createdAt: apiTokens.createdAt,
  expiresAt: apiTokens.expiresAt,
  lastUsedAt: apiTokens.lastUsedAt,
  revokedAt: apiTokens.revokedAt,
};

export function listApiTokens(db: Conn, userId: number) {
  return db.select(tokenColumns).from(apiTokens).where(eq(apiTokens.userId, userId)).orderBy(asc(apiTokens.createdAt));
}

/** Every account's tokens with their owners (the administrator's list), newest first. */
export function listAllApiTokens(db: Conn) {
  return db
    .select({ ...tokenColumns, userId: users.id, userEmail: users.email, userName: users.name })
    .from(apiTokens)
    .innerJoin(users, eq(users.id, apiTokens.userId))
    .orderBy(desc(apiTokens.id))
    .limit(1000);
}

export const findApiToken = (db: Conn, id: number) => db.query.apiTokens.findFirst({ where: eq(apiTokens.id, id) });

/** Revoke a token; with `userId`, only if it is theirs. False when not found or already revoked. */
export async function revokeApiToken(db: Conn, userId: number | null, tokenId: number) {
  const [res] = await db
    .update(apiTokens)
    .set({ revokedAt: new Date() })
    .where(
      and(
        eq(apiTokens.id, tokenId),
        userId === null ? undefined : eq(apiTokens.userId, userId),
        isNull(apiTokens.revokedAt),
      ),
    );
  return res.affectedRows > 0;
}

/** Store a one-time link (its hash only). */
export async function insertAccountLink(
  db: Conn,
  l: { userId: number; purpose: 'invite' | 'reset'; tokenHash: string; expiresAt: Date },
) {
  return insertedId(await db.insert(accountLinks).values(l).$returningId());
}

/** The link behind a token hash, locked for the transaction that uses it up. */
export async function lockAccountLink(db: Conn, tokenHash: string) {
  const [row] = await db.select().from(accountLinks).where(eq(accountLinks.tokenHash, tokenHash)).for('update');
  return row;
}

/** Peek at a link without using it (the set-password page). */
export const findAccountLink = (db: Conn, tokenHash: string) =>
  db.query.accountLinks.findFirst({ where: eq(accountLinks.tokenHash, tokenHash) });

export async function markAccountLinkUsed(db: Conn, id: number) {
  await db.update(accountLinks).set({ usedAt: new Date() }).where(eq(accountLinks.id, id));
}

/** Whether a reset link was sent to the user since `since` (resets are rate-limited per account). */
export async function hasRecentResetLink(db: Conn, userId: number, since: Date) {
  const [row] = await db
    .select({ id: accountLinks.id })
    .from(accountLinks)
    .where(and(eq(accountLinks.userId, userId), eq(accountLinks.purpose, 'reset'), gt(accountLinks.createdAt, since)))
    .limit(1);
  return !!row;
}

/** Older unused links of the same user stop working when a new one is sent. */
export async function expireAccountLinks(db: Conn, userId: number) {
  await db
    .update(accountLinks)
    .set({ expiresAt: new Date() })
    .where(and(eq(accountLinks.userId, userId), isNull(accountLinks.usedAt), gt(accountLinks.expiresAt, new Date())));
}

/** Remember that the account signed in from this address (its owner's usual place). */
export async function rememberSignInAddress(db: Conn, userId: number, addressHash: string) {
  await db
    .insert(knownSignInAddresses)
    .values({ userId, addressHash, lastOkAt: new Date() })
    .onDuplicateKeyUpdate({ set: { lastOkAt: new Date() } });
}

/** Whether the account signed in from this address since `since`. */
export async function isKnownSignInAddress(db: Conn, userId: number, addressHash: string, since: Date) {
  const [row] = await db
    .select({ at: knownSignInAddresses.lastOkAt })
    .from(knownSignInAddresses)
    .where(
      and(
        eq(knownSignInAddresses.userId, userId),
        eq(knownSignInAddresses.addressHash, addressHash),
        gt(knownSignInAddresses.lastOkAt, since),
      ),
    );
  return !!row;
}
