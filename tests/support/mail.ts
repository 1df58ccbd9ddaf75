// Reading what the SMTP fake wrote, with mailparser (headers decoded, bodies unquoted).
import { readdirSync, readFileSync, existsSync } from 'node:fs';
import path from 'node:path';
import { simpleParser } from 'mailparser';

export interface Mail {
  to: string;
  subject: string;
  text: string;
}

/** Every .eml in a folder, parsed. */
export async function readMails(dir: string): Promise<Mail[]> {
  if (!existsSync(dir)) return [];
  const files = readdirSync(dir).filter((f) => f.endsWith('.eml'));
  return Promise.all(
    files.map(async (f) => {
      const m = await simpleParser(readFileSync(path.join(dir, f)));
      const to = Array.isArray(m.to) ? m.to.map((a) => a.text).join(', ') : (m.to?.text ?? '');
      return { to, subject: m.subject ?? '', text: m.text ?? '' };
    }),
  );
}

/** Wait until a message matching `pred` lands (mail is sent after the request answers). */
export async function waitForMail(dir: string, pred: (m: Mail) => boolean, timeoutMs = 15_000): Promise<Mail> {
  const deadline = Date.now() + timeoutMs;
  for (;;) {
    const all = await readMails(dir);
    const hit = all.find(pred);
    if (hit) return hit;
    if (Date.now() > deadline)
      throw new Error(
        `no matching e-mail arrived; the fake has: ${all.map((m) => `${m.subject} → ${m.to}`).join(' | ')}`,
      );
    await new Promise((r) => setTimeout(r, 100));
  }
}
