// E-mail goes through the outbox table: a message is stored first and sent after, so an SMTP
// outage delays it instead of losing it. Bodies are stored encrypted (secret-box.server.ts):
// they carry share and invitation links. Senders (the app right after a change commits, and
// the worker process on every poll) claim a due message, try it, and back off on failure.
import { getDb, type Conn } from '../db/client.server';
import { claimMail, enqueueMail, listDueMail, markMailRetry, markMailSent } from '../db/queries/review';
import { getConfig } from '../config.server';
import { sendMail } from './mail.server';
import { openText, sealText } from './secret-box.server';

const MAX_ATTEMPTS = 12;
const backoffMs = (attempt: number) =>
  Math.min(getConfig().MAIL_RETRY_SECONDS * 1000 * 2 ** Math.max(0, attempt - 1), 60 * 60_000);

export interface OutgoingMail {
  to: string;
  subject: string;
  text: string;
  testId?: number | null;
}

/** Store a message inside the caller's transaction (it is sent once that commits: call kickOutbox). */
export async function enqueueMailIn(db: Conn, m: OutgoingMail): Promise<number> {
  return enqueueMail(db, { toAddress: m.to, subject: m.subject, textBody: sealText(m.text), testId: m.testId ?? null });
}

/** Try the due messages now, without waiting for the answer. */
export function kickOutbox(): void {
  void deliverDueMail().catch(() => undefined);
}

/** Store a message and try to send it at once (without waiting for the answer). */
export async function queueMail(
  toAddress: string,
  subject: string,
  textBody: string,
  testId: number | null = null,
): Promise<number> {
  const id = await enqueueMailIn(getDb(), { to: toAddress, subject, text: textBody, testId });
  kickOutbox();
  return id;
}

/** Try every due message once. Resolves to how many were sent. */
export async function deliverDueMail(): Promise<number> {
  const db = getDb();
  let sent = 0;
  for (const m of await listDueMail(db)) {
    if (!(await claimMail(db, m.id, 60_000))) continue;
    let text: string;
    try {
      text = openText(m.textBody);
    } catch {
      await markMailRetry(
        db,
        m.id,
        'the body cannot be decrypted: AUTH_SECRET changed since it was queued',
        new Date(),
        true,
      );
      continue;
    }
    try {
      await sendMail(m.toAddress, m.subject, text);
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
