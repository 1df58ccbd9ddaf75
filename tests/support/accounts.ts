// Making accounts the way an administrator does: an invitation by e-mail, whose one-time link
// the new person opens to choose their password. Reads the links from the SMTP fake's folder.
import { inject } from 'vitest';
import type { Client } from './http';
import { readMails } from './mail';

const LINK = /\/set-password\/([A-Za-z0-9_-]{43})/;

/** Every set-password token mailed to `email` so far. */
export async function linksMailedTo(email: string): Promise<string[]> {
  return (await readMails(inject('mailDir')))
    .filter((m) => m.to.includes(email))
    .map((m) => LINK.exec(m.text)?.[1])
    .filter((t): t is string => !!t);
}

/** Wait for a set-password token mailed to `email` that is not among `known`. */
export async function newLinkMailedTo(email: string, known: string[] = [], timeoutMs = 15_000): Promise<string> {
  const deadline = Date.now() + timeoutMs;
  for (;;) {
    const fresh = (await linksMailedTo(email)).find((t) => !known.includes(t));
    if (fresh) return fresh;
    if (Date.now() > deadline) throw new Error(`no new password link was mailed to ${email}`);
    await new Promise((r) => setTimeout(r, 100));
  }
}

/** POST /api/password/set as the holder of the link (no account, like the browser page). */
export async function setPassword(token: string, password: string) {
  const res = await fetch(`${inject('baseUrl')}/api/password/set`, {
    method: 'POST',
    headers: { 'content-type': 'application/json', origin: inject('baseUrl') },
    body: JSON.stringify({ token, password }),
  });
  const text = await res.text();
  return { status: res.status, body: text ? JSON.parse(text) : null };
}

/** Invite `email` as `role` (admin client) and choose `password` through the mailed link; resolves to the id. */
export async function inviteAndActivate(admin: Client, email: string, role: string, password: string): Promise<number> {
  const known = await linksMailedTo(email);
  const made = await admin.json('/api/admin/users', {
    method: 'POST',
    json: { email, name: `Test ${role} ${email.split('@')[0]}`, role },
  });
  if (made.status !== 201) throw new Error(`invitation failed: ${made.status} ${JSON.stringify(made.body)}`);
  const set = await setPassword(await newLinkMailedTo(email, known), password);
  if (set.status !== 200) throw new Error(`setting the password failed: ${set.status} ${JSON.stringify(set.body)}`);
  return made.body.id as number;
}
