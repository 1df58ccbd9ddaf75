// Accounts: invitations (the admin names the person and the role; the person chooses their own
// password through a one-time e-mailed link, so no administrator ever knows it), password resets
// by e-mail link, disabling and re-enabling (which ends every session), roles, and API tokens
// with scopes and an expiry. Every change commits with its audit row.
import { type z } from 'zod';
import { getDb, inTransaction } from '../db/client.server';
import {
  createUser,
  expireAccountLinks,
  findAccountLink,
  findApiToken,
  findUserByEmail,
  findUserById,
  hasRecentResetLink,
  insertAccountLink,
  insertApiToken,
  lockAccountLink,
  markAccountLinkUsed,
  revokeApiToken,
  setUserDisabled,
  setUserPassword,
  setUserRole,
} from '../db/queries/users';
import type { Conn } from '../db/client.server';
import type { Role } from '../lib/roles';
import { getConfig } from '../config.server';
import { audit, auditBy } from './audit.server';
import { hashPassword, NO_PASSWORD } from './auth/passwords.server';
import { assertAcceptablePassword } from './auth/password-policy.server';
import { API_TOKEN_PREFIX, hashToken, newToken } from './auth/tokens.server';
import { AppError, errors } from './errors';
import type { RequestUser } from './http';
import type { inviteBody, tokenBody } from './api/schemas';
import { enqueueMailIn, kickOutbox } from './outbox.server';

const INVITE_DAYS = 7;
const RESET_MINUTES = 60;
const base = () => getConfig().PUBLIC_BASE_URL.replace(/\/$/, '');

/** A one-time link for `purpose`, its hash stored and the e-mail queued in the same transaction. */
async function sendAccountLink(
  tx: Conn,
  user: { id: number; email: string; name: string },
  purpose: 'invite' | 'reset',
  intro: string,
) {
  const token = newToken();
  const minutes = purpose === 'invite' ? INVITE_DAYS * 24 * 60 : RESET_MINUTES;
  const expiresAt = new Date(Date.now() + minutes * 60_000);
  await expireAccountLinks(tx, user.id);
  await insertAccountLink(tx, { userId: user.id, purpose, tokenHash: hashToken(token), expiresAt });
  const url = `${base()}/set-password/${token}`;
  await enqueueMailIn(tx, {
    to: user.email,
    subject: purpose === 'invite' ? 'Your Hoopline account: choose your password' : 'Hoopline: reset your password',
    text: [
      intro,
      '',
      `Choose your password here: ${url}`,
      `The link works once, until ${expiresAt.toUTCString()}.`,
      '',
      'Nobody at Hoopline will ever ask you for your password.',
    ].join('\n'),
  });
}

/** POST /api/admin/users: a new account that the person activates by choosing a password. */
export async function inviteUser(admin: RequestUser, body: z.infer<typeof inviteBody>): Promise<number> {
  const id = await inTransaction(async (tx) => {
    if (await findUserByEmail(tx, body.email))
      throw new AppError('email-taken', 'An account with that e-mail exists already.');
    const userId = await createUser(tx, {
      email: body.email,
      name: body.name,
      role: body.role,
      passwordHash: NO_PASSWORD,
    });
    await sendAccountLink(
      tx,
      { id: userId, email: body.email.trim().toLowerCase(), name: body.name },
      'invite',
      `${admin.name} made a Hoopline account for you (${body.email}, role ${body.role}).`,
    );
    await auditBy(tx, admin, 'user-invited', null, { userId, email: body.email, role: body.role });
    return userId;
  });
  kickOutbox();
  return id;
}

/** An administrator sends a reset link to a person (the administrator never sees it). */
export async function sendResetByAdmin(admin: RequestUser, userId: number): Promise<void> {
  await inTransaction(async (tx) => {
    const user = await findUserById(tx, userId);
    if (!user) throw errors.notFound('user');
    if (user.disabled) throw errors.invalid('The account is disabled: enable it first.');
    await sendAccountLink(
      tx,
      user,
      user.passwordHash === NO_PASSWORD ? 'invite' : 'reset',
      `${admin.name} sent you a link to choose a new Hoopline password for ${user.email}.`,
    );
    await auditBy(tx, admin, 'password-link-sent', null, { userId, email: user.email });
  });
  kickOutbox();
}

/**
 * POST /api/password/forgot: a reset link to the address if it belongs to an active account;
 * the answer is the same either way. At most one such link every five minutes per account.
 */
export async function requestPasswordReset(emailRaw: string): Promise<void> {
  const email = emailRaw.trim().toLowerCase();
  const sent = await inTransaction(async (tx) => {
    const user = await findUserByEmail(tx, email);
    if (!user || user.disabled) {
      await audit(tx, { actor: email, action: 'password-reset-requested', details: { sent: false } });
      return false;
    }
    if (await hasRecentResetLink(tx, user.id, new Date(Date.now() - 5 * 60_000))) return false;
    await sendAccountLink(
      tx,
      user,
      'reset',
      `Someone (we hope you) asked to reset the Hoopline password of ${user.email}. If it was not you, ignore this message: your password stays as it is.`,
    );
    await audit(tx, { userId: user.id, actor: email, action: 'password-reset-requested', details: { sent: true } });
    return true;
  });
  if (sent) kickOutbox();
}

/** Whether a set-password link can still be used (the page shows a form or says it is gone). */
export async function accountLinkState(token: string): Promise<{ usable: boolean; email?: string; purpose?: string }> {
  if (!token || token.length > 100) return { usable: false };
  const link = await findAccountLink(getDb(), hashToken(token));
  if (!link || link.usedAt || link.expiresAt.getTime() <= Date.now()) return { usable: false };
  const user = await findUserById(getDb(), link.userId);
  if (!user || user.disabled) return { usable: false };
  return { usable: true, email: user.email, purpose: link.purpose };
}

/** POST /api/password/set: choose a password with a one-time link; every session of the account ends. */
export async function setPasswordWithLink(token: string, password: string): Promise<{ email: string }> {
  if (!token || token.length > 100) throw errors.notFound('password link');
  const hash = hashToken(token);
  const peek = await findAccountLink(getDb(), hash);
  if (!peek) throw errors.notFound('password link');
  const user = await findUserById(getDb(), peek.userId);
  if (!user) throw errors.notFound('password link');
  assertAcceptablePassword(password, [user.email, user.name]);
  const passwordHash = await hashPassword(password);
  return inTransaction(async (tx) => {
    const link = await lockAccountLink(tx, hash);
    if (!link || link.usedAt || link.expiresAt.getTime() <= Date.now()) throw new AppError('account-link-gone');
    const owner = await findUserById(tx, link.userId);
    if (!owner || owner.disabled) throw new AppError('account-link-gone');
    await setUserPassword(tx, owner.id, passwordHash);
    await markAccountLinkUsed(tx, link.id);
    await audit(tx, {
      userId: owner.id,
      actor: owner.email,
      action: link.purpose === 'invite' ? 'account-activated' : 'password-reset',
      details: { linkId: link.id },
    });
    return { email: owner.email };
  });
}

/** PATCH /api/admin/users/{id}: change a role, or disable / re-enable (ending every session). */
export async function updateUserByAdmin(
  admin: RequestUser,
  id: number,
  patch: { role?: Role; disabled?: boolean },
): Promise<{ id: number; role: Role; disabled: boolean }> {
  return inTransaction(async (tx) => {
    const target = await findUserById(tx, id);
    if (!target) throw errors.notFound('user');
    if (target.id === admin.id && patch.role !== undefined && patch.role !== 'admin')
      throw new AppError(
        'own-role',
        'You cannot take the admin role from your own account; ask another administrator.',
      );
    if (target.id === admin.id && patch.disabled) throw new AppError('own-account');
    if (patch.role !== undefined && patch.role !== target.role) {
      await setUserRole(tx, id, patch.role);
      await auditBy(tx, admin, 'role-changed', null, {
        userId: id,
        email: target.email,
        from: target.role,
        to: patch.role,
      });
    }
    if (patch.disabled !== undefined && patch.disabled !== target.disabled) {
      await setUserDisabled(tx, id, patch.disabled);
      await auditBy(tx, admin, patch.disabled ? 'user-disabled' : 'user-enabled', null, {
        userId: id,
        email: target.email,
      });
    }
    return { id, role: patch.role ?? target.role, disabled: patch.disabled ?? target.disabled };
  });
}

/** POST /api/account/tokens: a personal token, shown in this answer only. */
export async function createApiToken(user: RequestUser, body: z.infer<typeof tokenBody>) {
  const token = newToken(API_TOKEN_PREFIX);
  const expiresAt = new Date(Date.now() + body.expiresInDays * 86_400_000);
  const scopes = body.scopes.join(',');
  const id = await inTransaction(async (tx) => {
    const tokenId = await insertApiToken(tx, {
      userId: user.id,
      name: body.name,
      tokenHash: hashToken(token),
      prefix: token.slice(0, 10),
      scopes,
      expiresAt,
    });
    await auditBy(tx, user, 'api-token-created', null, {
      tokenId,
      name: body.name,
      scopes,
      expiresAt: expiresAt.toISOString(),
    });
    return tokenId;
  });
  return { id, name: body.name, token, prefix: token.slice(0, 10), scopes: body.scopes, expiresAt };
}

/** Revoke a token: the caller's own, or (admin: `anyone`) anybody's. 404 when not found or already revoked. */
export async function revokeToken(user: RequestUser, tokenId: number, anyone: boolean): Promise<void> {
  await inTransaction(async (tx) => {
    const token = await findApiToken(tx, tokenId);
    if (!(await revokeApiToken(tx, anyone ? null : user.id, tokenId)))
      throw errors.notFound(anyone ? 'active API token' : 'active API token of yours');
    await auditBy(tx, user, 'api-token-revoked', null, { tokenId, ownerId: token?.userId ?? null });
  });
}
