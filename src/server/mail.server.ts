// Outgoing e-mail through nodemailer to the configured SMTP server (locally the fake).
import nodemailer, { type Transporter } from 'nodemailer';
import { getConfig } from '../config.server';

let transport: Transporter | null = null;

export function getMailer(): Transporter {
  if (transport) return transport;
  const c = getConfig();
  transport = nodemailer.createTransport({
    host: c.SMTP_HOST,
    port: c.SMTP_PORT,
    secure: c.SMTP_SECURE,
    ignoreTLS: !c.SMTP_SECURE && c.SMTP_HOST === '127.0.0.1',
    auth: c.SMTP_USER ? { user: c.SMTP_USER, pass: c.SMTP_PASSWORD ?? '' } : undefined,
    connectionTimeout: 5_000,
    greetingTimeout: 5_000,
    socketTimeout: 10_000,
  });
  return transport;
}

/** Send one plain-text message now; throws when the SMTP server does not take it. */
export async function sendMail(to: string, subject: string, text: string): Promise<void> {
  await getMailer().sendMail({ from: getConfig().MAIL_FROM, to, subject, text });
}

/** Forget the transport (tests point the mailer at another SMTP server). */
export function resetMailerForTests(): void {
  transport?.close();
  transport = null;
}
