// Accounts and credentials: invitations with a one-time link (no administrator knows anyone's
// password), resets by e-mail, the password rule, disabling, sign-out ending every session,
// API tokens with scopes and an expiry, throttling per e-mail and per client address with the
// counters in MariaDB, and the password a signature asks for.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { inject } from 'vitest';
import { eq } from 'drizzle-orm';
import { inviteAndActivate, linksMailedTo, newLinkMailedTo, setPassword } from './support/accounts';
import { Client, signedIn } from './support/http';
import { startAppServer } from './support/processes';

let admin: Client;
const GOOD = 'copper-kettle-rain-8261';

async function db() {
  const { getDb } = await import('../src/db/client.server');
  return getDb();
}

beforeAll(async () => {
  admin = await signedIn('admin@example.com');
});

describe('invitations and password links', () => {
  it('invites by e-mail; the person chooses a password the administrator never sees, once', async () => {
    const known = await linksMailedTo('new-hire@example.com');
    const made = await admin.json('/api/admin/users', {
      method: 'POST',
      json: {
        email: 'new-hire@example.com',
        name: 'New Hire',
        role: 'technician',
        password: 'admin-chosen-password-1',
      },
    });
    expect(made.status).toBe(201);
    expect(JSON.stringify(made.body)).not.toMatch(/password/i);
    // invited, not yet active: no password works
    expect(await new Client().signIn('new-hire@example.com', 'admin-chosen-password-1')).toBe(false);
    const token = await newLinkMailedTo('new-hire@example.com', known);
    // the link is stored only as a hash; the e-mail carrying it is encrypted in the outbox
    const { outbox, accountLinks } = await import('../src/db/schema');
    const stored = JSON.stringify([
      ...(await (await db()).select().from(outbox)),
      ...(await (await db()).select().from(accountLinks)),
    ]);
    expect(stored).not.toContain(token);
    const rows = await (await db()).select().from(outbox).where(eq(outbox.toAddress, 'new-hire@example.com'));
    expect(rows[0]!.textBody.startsWith('v1.')).toBe(true);

    const page = await new Client().fetch(`/set-password/${token}`);
    expect(page.status).toBe(200);
    expect(await page.text()).toContain('new-hire@example.com');
    const weak = await setPassword(token, 'password1234');
    expect(weak.status).toBe(422);
    expect(weak.body.error.code).toBe('weak-password');
    expect((await setPassword(token, 'short')).body.error.message).toContain('at least 12 characters');
    expect((await setPassword(token, 'hoopline2026!')).status).toBe(422);
    expect((await setPassword(token, 'qwertyuiop12')).status).toBe(422);
    const ok = await setPassword(token, GOOD);
    expect(ok.status).toBe(200);
    expect(ok.body.email).toBe('new-hire@example.com');
    expect((await setPassword(token, 'another-copper-kettle-77')).status).toBe(410);
    expect((await new Client().fetch(`/set-password/${token}`)).status).toBe(410);
    expect(await new Client().signIn('new-hire@example.com', GOOD)).toBe(true);
    const audit = await admin.json('/admin/audit?action=account-activated');
    expect(audit.status).toBe(200);
  });

  it('resets a password by e-mail link, ending every session; an unknown address gets the same answer and no mail', async () => {
    await inviteAndActivate(admin, 'forgetful@example.com', 'engineer', GOOD);
    const session = await signedIn('forgetful@example.com', GOOD);
    expect((await session.json('/api/tests')).status).toBe(200);
    const known = await linksMailedTo('forgetful@example.com');
    const asked = await new Client().json('/api/password/forgot', {
      method: 'POST',
      json: { email: 'forgetful@example.com' },
    });
    expect(asked.status).toBe(202);
    const nobody = await new Client().json('/api/password/forgot', {
      method: 'POST',
      json: { email: 'no-such-person@example.com' },
    });
    expect(nobody).toEqual(asked);
    const token = await newLinkMailedTo('forgetful@example.com', known);
    expect((await setPassword(token, 'fresh-lantern-orchard-52')).status).toBe(200);
    expect((await session.json('/api/tests')).status).toBe(401);
    expect(await new Client().signIn('forgetful@example.com', GOOD)).toBe(false);
    expect(await new Client().signIn('forgetful@example.com', 'fresh-lantern-orchard-52')).toBe(true);
    expect(await linksMailedTo('no-such-person@example.com')).toEqual([]);
  });
});

describe('sessions and disabling', () => {
  it('ends every session of the account at once when it signs out anywhere', async () => {
    await inviteAndActivate(admin, 'two-laptops@example.com', 'qa', GOOD);
    const a = await signedIn('two-laptops@example.com', GOOD);
    const b = await signedIn('two-laptops@example.com', GOOD);
    expect((await b.json('/api/tests')).status).toBe(200);
    await a.signOut();
    expect((await b.json('/api/tests')).status).toBe(401);
    expect((await b.fetch('/')).status).toBe(302);
    const again = await signedIn('two-laptops@example.com', GOOD);
    expect((await again.json('/api/tests')).status).toBe(200);
  });

  it('disabling ends the sessions and tokens of an account; enabling lets it sign in again', async () => {
    const id = await inviteAndActivate(admin, 'leaver@example.com', 'technician', GOOD);
    const s = await signedIn('leaver@example.com', GOOD);
    const t = await s.json('/api/account/tokens', { method: 'POST', json: { name: 'daq' } });
    const viaToken = Client.withToken(t.body.token);
    expect((await viaToken.json('/api/tests')).status).toBe(200);
    const off = await admin.json(`/api/admin/users/${id}`, { method: 'PATCH', json: { disabled: true } });
    expect(off.body).toMatchObject({ id, disabled: true });
    expect((await s.json('/api/tests')).status).toBe(401);
    expect((await viaToken.json('/api/tests')).status).toBe(401);
    expect(await new Client().signIn('leaver@example.com', GOOD)).toBe(false);
    expect((await admin.json(`/api/admin/users/${id}`, { method: 'PATCH', json: { disabled: false } })).status).toBe(
      200,
    );
    expect(await new Client().signIn('leaver@example.com', GOOD)).toBe(true);
    const me = (await admin.json('/api/admin/users')).body.items.find(
      (u: { email: string }) => u.email === 'admin@example.com',
    );
    const self = await admin.json(`/api/admin/users/${me.id}`, { method: 'PATCH', json: { disabled: true } });
    expect(self.status).toBe(409);
    expect(self.body.error.code).toBe('own-account');
  });
});

describe('API tokens', () => {
  it('carry scopes and an expiry (90 days unless given, at most 365) and record their last use', async () => {
    const eng = await signedIn('engineer@example.com');
    const made = await eng.json('/api/account/tokens', { method: 'POST', json: { name: 'default' } });
    expect(made.status).toBe(201);
    expect(made.body.scopes).toEqual(['read', 'upload']);
    const days = (new Date(made.body.expiresAt).getTime() - Date.now()) / 86_400_000;
    expect(days).toBeGreaterThan(89.9);
    expect(days).toBeLessThan(90.1);
    expect(
      (await eng.json('/api/account/tokens', { method: 'POST', json: { name: 'x', expiresInDays: 366 } })).status,
    ).toBe(400);
    expect((await eng.json('/api/account/tokens', { method: 'POST', json: { name: 'x', scopes: [] } })).status).toBe(
      400,
    );
    expect(
      (await eng.json('/api/account/tokens', { method: 'POST', json: { name: 'x', scopes: ['admin'] } })).status,
    ).toBe(400);
    const viaToken = Client.withToken(made.body.token);
    expect((await viaToken.json('/api/tests')).status).toBe(200);
    const listed = (await eng.json('/api/account/tokens')).body.items.find(
      (t: { id: number }) => t.id === made.body.id,
    );
    expect(listed.lastUsedAt).not.toBeNull();
    expect(listed.scopes).toBe('read,upload');
    // a token cannot make another token, so revoking a leaked one cuts access
    const spawned = await viaToken.json('/api/account/tokens', { method: 'POST', json: { name: 'child' } });
    expect(spawned.status).toBe(403);
    expect(spawned.body.error.code).toBe('token-not-allowed');
    // once expired it is refused like a revoked one
    const { apiTokens } = await import('../src/db/schema');
    await (
      await db()
    )
      .update(apiTokens)
      .set({ expiresAt: new Date(Date.now() - 1000) })
      .where(eq(apiTokens.id, made.body.id));
    const expired = await viaToken.json('/api/tests');
    expect(expired.status).toBe(401);
    expect(expired.body.error.code).toBe('invalid-token');
  });

  it('are listed with their owners for the administrator, who can revoke anyone\u2019s', async () => {
    const tech = await signedIn('technician@example.com');
    const made = await tech.json('/api/account/tokens', {
      method: 'POST',
      json: { name: 'bay 3 laptop', scopes: ['upload'] },
    });
    const viaToken = Client.withToken(made.body.token);
    // upload only: no reading
    const read = await viaToken.json('/api/tests');
    expect(read.status).toBe(403);
    expect(read.body.error.code).toBe('token-scope');
    const all = await admin.json('/api/admin/tokens');
    const row = all.body.items.find((t: { id: number }) => t.id === made.body.id);
    expect(row).toMatchObject({ userEmail: 'technician@example.com', name: 'bay 3 laptop', scopes: 'upload' });
    expect(JSON.stringify(all.body)).not.toContain(made.body.token);
    expect((await tech.json(`/api/admin/tokens/${made.body.id}`, { method: 'DELETE' })).status).toBe(403);
    expect((await admin.json(`/api/admin/tokens/${made.body.id}`, { method: 'DELETE' })).status).toBe(200);
    expect((await viaToken.json('/api/tests/1/reductions', { method: 'POST', json: {} })).status).toBe(401);
  });
});

describe('throttling', () => {
  let proxied: Awaited<ReturnType<typeof startAppServer>>;
  beforeAll(async () => {
    // a second server behind a (pretended) proxy: the client address comes from X-Forwarded-For
    proxied = await startAppServer(inject('env'), { TRUST_PROXY: 'true', PUBLIC_BASE_URL: 'http://127.0.0.1:1' });
  });
  afterAll(async () => {
    await proxied.stop();
  });

  /** Sign in on the proxied server as coming from `address`. */
  async function signInFrom(address: string, email: string, password: string): Promise<boolean> {
    const headers = { 'x-forwarded-for': `198.51.100.77, ${address}` };
    const csrfRes = await fetch(`${proxied.url}/api/auth/csrf`, { headers });
    const cookie = csrfRes.headers
      .getSetCookie()
      .map((c) => c.split(';')[0])
      .join('; ');
    const { csrfToken } = (await csrfRes.json()) as { csrfToken: string };
    const res = await fetch(`${proxied.url}/api/auth/callback/credentials`, {
      method: 'POST',
      redirect: 'manual',
      headers: { ...headers, cookie, 'content-type': 'application/x-www-form-urlencoded' },
      body: new URLSearchParams({ csrfToken, email, password, callbackUrl: proxied.url + '/' }),
    });
    return res.headers.getSetCookie().some((c) => c.includes('session-token=') && !c.includes('session-token=;'));
  }

  it('slows one client address guessing across many e-mails, not the others', async () => {
    await inviteAndActivate(admin, 'sprayed@example.com', 'technician', GOOD);
    for (let i = 0; i < 30; i++) await signInFrom('203.0.113.10', `nobody-${i}@example.com`, 'guess-guess-guess');
    // that address now waits even with a right password; another address does not
    expect(await signInFrom('203.0.113.10', 'sprayed@example.com', GOOD)).toBe(false);
    expect(await signInFrom('203.0.113.11', 'sprayed@example.com', GOOD)).toBe(true);
  });

  it('locks an e-mail attacked from many addresses, but not for its owner at their usual address', async () => {
    await inviteAndActivate(admin, 'victim@example.com', 'engineer', GOOD);
    expect(await signInFrom('192.0.2.50', 'victim@example.com', GOOD)).toBe(true); // the office
    for (let i = 0; i < 12; i++) await signInFrom(`198.51.100.${i + 1}`, 'victim@example.com', `wrong-${i}`);
    expect(await signInFrom('198.51.100.200', 'victim@example.com', GOOD)).toBe(false); // a new place waits
    expect(await signInFrom('192.0.2.50', 'victim@example.com', GOOD)).toBe(true); // the office does not
  });

  it('keeps its counters in MariaDB: shared by every server and kept across a restart', async () => {
    await inviteAndActivate(admin, 'restart-check@example.com', 'qa', GOOD);
    for (let i = 0; i < 5; i++) await signInFrom('203.0.113.99', 'restart-check@example.com', `wrong-${i}`);
    await proxied.stop();
    proxied = await startAppServer(inject('env'), { TRUST_PROXY: 'true', PUBLIC_BASE_URL: 'http://127.0.0.1:1' });
    expect(await signInFrom('203.0.113.99', 'restart-check@example.com', GOOD)).toBe(false);
    // without TRUST_PROXY the main server ignores X-Forwarded-For: this is 127.0.0.1, a fresh pair
    expect(await new Client().signIn('restart-check@example.com', GOOD)).toBe(true);
    const { auditEvents } = await import('../src/db/schema');
    const rows = await (
      await db()
    )
      .select()
      .from(auditEvents)
      .where(eq(auditEvents.actor, 'restart-check@example.com'));
    const addresses = new Set(rows.map((r) => (r.details as { address?: string }).address).filter(Boolean));
    expect(addresses).toEqual(new Set(['203.0.113.99', '127.0.0.1']));
  });

  it('counts a wrong signing password like a failed sign-in: 401, then 429 even with the right one', async () => {
    await inviteAndActivate(admin, 'signer@example.com', 'engineer', GOOD);
    const s = await signedIn('signer@example.com', GOOD);
    // the password is checked before anything about the test is looked at
    const path = `/api/tests/999999/review`;
    for (let i = 0; i < 5; i++) {
      const r = await s.json(path, { method: 'POST', json: { reductionId: 1, password: `wrong-${i}` } });
      expect(r.status).toBe(401);
    }
    const blocked = await s.json(path, { method: 'POST', json: { reductionId: 1, password: GOOD } });
    expect(blocked.status).toBe(429);
    expect(blocked.body.error.code).toBe('throttled');
    expect(Number(blocked.body.error.details.retryAfterSeconds)).toBeGreaterThan(0);
  });
});

describe('sign-in redirects', () => {
  it('stay on this site whatever `next` says', async () => {
    for (const next of ['/\\evil.example', '//evil.example/x', 'https://evil.example/', '/\t/evil.example']) {
      const page = await (await new Client().fetch(`/signin?next=${encodeURIComponent(next)}`)).text();
      expect(page).not.toContain('evil.example');
    }
    const eng = await signedIn('engineer@example.com');
    const r = await eng.fetch(`/signin?next=${encodeURIComponent('/\\evil.example')}`);
    expect(r.status).toBe(302);
    expect(r.headers.get('location')).toBe('/');
    const fine = await eng.fetch(`/signin?next=${encodeURIComponent('/vessels?x=1')}`);
    expect(fine.headers.get('location')).toBe('/vessels?x=1');
  });
});
