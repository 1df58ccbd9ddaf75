// E-mail goes through the outbox table: a message is stored first and sent after, so an SMTP
// outage delays it instead of losing it. Senders (the app right after enqueueing, and the
// worker process on every poll) claim a due message, try it, and back off on failure.
import { getDb } from '../db/client.server';
import { claimMail, enqueueMail, listDueMail, markMailRetry, markMailSent } from '../db/queries/review';
import { getConfig } from '../config.server';
import { sendMail } from './mail.server';

const MAX_ATTEMPTS = 12;
const backoffMs = (attempt: number) =>
  Math.min(getConfig().MAIL_RETRY_SECONDS * 1000 * 2 ** Math.max(0, attempt - 1), 60 * 60_000);

/** Store a message and try to send it at once (without waiting for the answer). */
export async function queueMail(
  toAddress: string,
  subject: string,
  textBody: string,
  testId: number | null = null,
): Promise<number> {
  const id = await enqueueMail(getDb(), { toAddress, subject, textBody, testId });
  void deliverDueMail().catch(() => undefined);
  return id;
}

/** Try every due message once. Resolves to how many were sent. */
export async function deliverDueMail(): Promise<number> {
  const db = getDb();
  let sent = 0;
  for (const m of await listDueMail(db)) {
    if (!(await claimMail(db, m.id, 60_000))) continue;
    try {
      await sendMail(m.toAddress, m.subject, m.textBody);
      await markMailSent(db, m.id);
      sent++;
    } catch (err) {
      const attempt = m.attempts + 1;
      await markMailRetry(
        db,
        m.id,
        err instanceof Error ? err.message : String(err),
        new Date(Date.now() + backoffMs(attempt)),
        attempt >= MAX_ATTEMPTS,
      );
    }
  }
  return sent;
}
