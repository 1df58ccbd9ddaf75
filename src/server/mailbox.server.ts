// Demo mode: read the messages the local SMTP fake wrote under MAIL_DIR.
import { existsSync, readdirSync, readFileSync, statSync } from 'node:fs';
import path from 'node:path';
import { simpleParser } from 'mailparser';
import { getConfig } from '../config.server';

export interface ReceivedMail {
  file: string;
  at: Date;
  to: string;
  subject: string;
  text: string;
}

/** The newest `limit` messages the SMTP fake received. */
export async function readReceivedMail(limit = 50): Promise<ReceivedMail[]> {
  const dir = path.resolve(getConfig().MAIL_DIR);
  if (!existsSync(dir)) return [];
  const files = readdirSync(dir)
    .filter((f) => f.endsWith('.eml'))
    .map((f) => ({ f, t: statSync(path.join(dir, f)).mtimeMs }))
    .sort((a, b) => b.t - a.t)
    .slice(0, limit);
  return Promise.all(
    files.map(async ({ f, t }) => {
      const m = await simpleParser(readFileSync(path.join(dir, f)));
      const to = Array.isArray(m.to) ? m.to.map((a) => a.text).join(', ') : (m.to?.text ?? '');
      return { file: f, at: new Date(t), to, subject: m.subject ?? '', text: m.text ?? '' };
    }),
  );
}
