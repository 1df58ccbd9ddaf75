// Inspector share links: 256 random bits in the URL, only the hash stored (and the e-mail that
// carries it is encrypted in the outbox); default 14 days, at most 90; revocable; every use is
// counted and audited in the same transaction.
import { type z } from 'zod';
import { getDb, inTransaction } from '../db/client.server';
import {
  findShareLink,
  findShareLinkByHash,
  insertShareLink,
  revokeShareLink,
  touchShareLink,
} from '../db/queries/review';
import type { ShareLink } from '../db/schema';
import { audit, auditBy } from './audit.server';
import { hashToken, newToken } from './auth/tokens.server';
import { getConfig } from '../config.server';
import { AppError, errors } from './errors';
import type { RequestUser } from './http';
import { enqueueMailIn, kickOutbox } from './outbox.server';
import { loadTest } from './plans.server';
import type { shareLinkBody } from './api/schemas';

export async function createShareLink(user: RequestUser, testId: number, body: z.infer<typeof shareLinkBody>) {
  const test = await loadTest(testId);
  const token = newToken();
  const expiresAt = new Date(Date.now() + body.expiresInDays * 86_400_000);
  const url = `${getConfig().PUBLIC_BASE_URL.replace(/\/$/, '')}/share/${token}`;
  const id = await inTransaction(async (tx) => {
    const linkId = await insertShareLink(tx, {
      testId,
      tokenHash: hashToken(token),
      email: body.email ?? null,
      createdBy: user.id,
      expiresAt,
    });
    await auditBy(tx, user, 'share-link-created', testId, {
      shareLinkId: linkId,
      email: body.email ?? null,
      expiresAt: expiresAt.toISOString(),
    });
    if (body.email)
      await enqueueMailIn(tx, {
        to: body.email,
        subject: `Hydrotest record "${test.name}" shared with you`,
        text: [
          `${user.name} has shared the hydrotest strain record "${test.name}" with you through Hoopline.`,
          '',
          `Open it (read-only, no account needed): ${url}`,
          `The link works until ${expiresAt.toUTCString()} unless it is revoked earlier.`,
          '',
          'The comparison supports, and does not replace, the judgement of the responsible engineer and the authorised inspector; the governing code and the jurisdiction decide.',
        ].join('\n'),
        testId,
      });
    return linkId;
  });
  if (body.email) kickOutbox();
  return { id, url, expiresAt };
}

export async function revokeLink(user: RequestUser, id: number) {
  await inTransaction(async (tx) => {
    const link = await findShareLink(tx, id);
    if (!link) throw errors.notFound('share link');
    if (!(await revokeShareLink(tx, id))) throw new AppError('already-revoked', 'This link was revoked already.');
    await auditBy(tx, user, 'share-link-revoked', link.testId, { shareLinkId: id });
  });
}

/** The live link behind a token: 404 unknown, 410 expired or revoked. Counts and audits the use. */
export async function useShareLink(token: string | undefined, what: string): Promise<ShareLink> {
  const unknown = () =>
    new AppError(
      'not-found',
      'This share link is not known. Check that the whole address was copied (share links are long), or ask the QA manager who sent it for a new one.',
    );
  if (!token || token.length < 20 || token.length > 100) throw unknown();
  const db = getDb();
  const link = await findShareLinkByHash(db, hashToken(token));
  if (!link) throw unknown();
  if (link.revokedAt)
    throw new AppError('link-gone', 'This link has been revoked. Ask the QA manager who sent it for a new one.');
  if (link.expiresAt.getTime() <= Date.now())
    throw new AppError('link-gone', 'This link has expired. Ask the QA manager who sent it for a new one.');
  await inTransaction(async (tx) => {
    await touchShareLink(tx, link.id);
    await audit(tx, {
      actor: `share link #${link.id}${link.email ? ` (${link.email})` : ''}`,
      action: 'share-link-used',
      testId: link.testId,
      details: { shareLinkId: link.id, what },
    });
  });
  return link;
}
