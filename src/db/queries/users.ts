import { and, asc, eq, isNull } from 'drizzle-orm';
import type { Db } from '../client.server';
import { apiTokens, users, type Role } from '../schema';
import { insertedId } from './inserted-id';

export function findUserByEmail(db: Db, email: string) {
  return db.query.users.findFirst({ where: eq(users.email, email.trim().toLowerCase()) });
}

export function findUserById(db: Db, id: number) {
  return db.query.users.findFirst({ where: eq(users.id, id) });
}

export function listUsers(db: Db) {
  return db
    .select({
      id: users.id,
      email: users.email,
      name: users.name,
      role: users.role,
      disabled: users.disabled,
      createdAt: users.createdAt,
      lastSignInAt: users.lastSignInAt,
    })
    .from(users)
    .orderBy(asc(users.email));
}

export async function createUser(db: Db, u: { email: string; name: string; role: Role; passwordHash: string }) {
  return insertedId(
    await db
      .insert(users)
      .values({ ...u, email: u.email.trim().toLowerCase() })
      .$returningId(),
  );
}

/** Put an account back to a known role, password and enabled state (the demo seed). */
export async function resetUser(db: Db, id: number, u: { role: Role; passwordHash: string }) {
  await db
    .update(users)
    .set({ ...u, disabled: false })
    .where(eq(users.id, id));
}

export async function setUserRole(db: Db, id: number, role: Role) {
  await db.update(users).set({ role }).where(eq(users.id, id));
}

export async function setUserPassword(db: Db, id: number, passwordHash: string) {
  await db.update(users).set({ passwordHash }).where(eq(users.id, id));
}

export async function markSignedIn(db: Db, id: number) {
  await db.update(users).set({ lastSignInAt: new Date() }).where(eq(users.id, id));
}

/** The active user behind a token hash, or undefined (unknown, revoked, or user disabled). */
export async function findUserByTokenHash(db: Db, tokenHash: string) {
  const [row] = await db
    .select({ tokenId: apiTokens.id, user: users })
    .from(apiTokens)
    .innerJoin(users, eq(users.id, apiTokens.userId))
    .where(and(eq(apiTokens.tokenHash, tokenHash), isNull(apiTokens.revokedAt), eq(users.disabled, false)))
    .limit(1);
  return row;
}

export async function touchApiToken(db: Db, tokenId: number) {
  await db.update(apiTokens).set({ lastUsedAt: new Date() }).where(eq(apiTokens.id, tokenId));
}

export async function insertApiToken(db: Db, t: { userId: number; name: string; tokenHash: string; prefix: string }) {
  return insertedId(await db.insert(apiTokens).values(t).$returningId());
}

export function listApiTokens(db: Db, userId: number) {
  return db
    .select({
      id: apiTokens.id,
      name: apiTokens.name,
      prefix: apiTokens.prefix,
      createdAt: apiTokens.createdAt,
      lastUsedAt: apiTokens.lastUsedAt,
      revokedAt: apiTokens.revokedAt,
    })
    .from(apiTokens)
    .where(eq(apiTokens.userId, userId))
    .orderBy(asc(apiTokens.createdAt));
}

/** Revoke one of the user's own tokens; false when it is not theirs or already revoked. */
export async function revokeApiToken(db: Db, userId: number, tokenId: number) {
  const [res] = await db
    .update(apiTokens)
    .set({ revokedAt: new Date() })
    .where(and(eq(apiTokens.id, tokenId), eq(apiTokens.userId, userId), isNull(apiTokens.revokedAt)));
  return res.affectedRows > 0;
}
