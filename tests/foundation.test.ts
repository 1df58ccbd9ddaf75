// Foundation: schema, sign-in, roles, API tokens, object storage, mail, health.
import { describe, expect, it } from 'vitest';
import { inject } from 'vitest';
import path from 'node:path';
import { spawn } from 'node:child_process';
import { runRootSql, startMariaDB, stopMariaDB } from '../fake-services/mariadb.mjs';
import { freePort } from './global-setup';
import { inviteAndActivate } from './support/accounts';
import { Client, signedIn } from './support/http';
import { waitForHttp } from './support/processes';

describe('schema', () => {
  it('migrations apply to an empty database', async () => {
    const dataDir = path.join(inject('dataDir'), 'mariadb');
    runRootSql({ dataDir }, "CREATE DATABASE empty_check; GRANT ALL ON empty_check.* TO 'hoopline'@'127.0.0.1';");
    const url = String(inject('env').DATABASE_URL).replace(/\/hoopline$/, '/empty_check');
    const { migrateDatabase } = await import('../src/db/migrate.server');
    await migrateDatabase(url);
    const tables = runRootSql(
      { dataDir },
      "SELECT table_name FROM information_schema.tables WHERE table_schema = 'empty_check' ORDER BY 1;",
    )
      .trim()
      .split('\n');
    for (const t of [
      'users',
      'api_tokens',
      'materials',
      'vessels',
      'tests',
      'gauges',
      'log_files',
      'reductions',
      'gauge_results',
      'rosette_results',
      'dispositions',
      'signatures',
      'share_links',
      'notes',
      'audit_events',
      'outbox',
    ]) {
      expect(tables).toContain(t);
    }
    // applying again is a no-op, not an error
    await migrateDatabase(url);
  });
});

describe('sign-in', () => {
  it('succeeds with the right password and shows the role', async () => {
    const c = new Client();
    expect(await c.signIn('engineer@example.com')).toBe(true);
    const page = await c.fetch('/account');
    expect(page.status).toBe(200);
    expect(await page.text()).toContain('engineer');
  });

  it('fails with a wrong password and with an unknown e-mail, saying nothing about which', async () => {
    expect(await new Client().signIn('qa@example.com', 'not-the-password')).toBe(false);
    expect(await new Client().signIn('nobody@example.com', 'whatever-password')).toBe(false);
  });

  it('slows down repeated failures for one e-mail: after five, even the right password waits', async () => {
    // a throwaway account, so the other test files' sign-ins are not throttled
    const admin = await signedIn('admin@example.com');
    await inviteAndActivate(admin, 'throttle-check@example.com', 'technician', 'a-long-password-1');
    expect(await new Client().signIn('throttle-check@example.com', 'a-long-password-1')).toBe(true);
    for (let i = 0; i < 5; i++)
      expect(await new Client().signIn('throttle-check@example.com', `wrong-${i}`)).toBe(false);
    expect(await new Client().signIn('throttle-check@example.com', 'a-long-password-1')).toBe(false);
    // another account is not affected
    expect(await new Client().signIn('admin@example.com')).toBe(true);
  });
});

describe('access control', () => {
  it('answers 401 JSON to an anonymous API call and redirects an anonymous page view', async () => {
    const r = await new Client().json('/api/account/tokens');
    expect(r.status).toBe(401);
    expect(r.body.error.code).toBe('unauthenticated');
    const page = await new Client().fetch('/account');
    expect(page.status).toBe(302);
    expect(page.headers.get('location')).toContain('/signin?next=%2Faccount');
  });

  it('answers 403 when a role may not call an endpoint', async () => {
    const eng = await signedIn('engineer@example.com');
    const r = await eng.json('/api/admin/users');
    expect(r.status).toBe(403);
    expect(r.body.error.code).toBe('forbidden');
  });

  it('refuses a cookie-authenticated write from another origin', async () => {
    const admin = await signedIn('admin@example.com');
    const r = await admin.json('/api/account/tokens', {
      method: 'POST',
      json: { name: 'x' },
      headers: { origin: 'http://evil.example' },
    });
    expect(r.status).toBe(403);
    expect(r.body.error.code).toBe('cross-origin');
  });

  it('lets an admin change a role, effective at once', async () => {
    const admin = await signedIn('admin@example.com');
    const list = await admin.json('/api/admin/users');
    const qa = list.body.items.find((u: { email: string }) => u.email === 'qa@example.com');
    expect(
      (await admin.json(`/api/admin/users/${qa.id}`, { method: 'PATCH', json: { role: 'engineer' } })).status,
    ).toBe(200);
    const q = await signedIn('qa@example.com');
    expect(await q.fetch('/account').then((r) => r.text())).toContain('role <strong>engineer</strong>');
    expect((await admin.json(`/api/admin/users/${qa.id}`, { method: 'PATCH', json: { role: 'qa' } })).status).toBe(200);
  });
});

describe('accounts from the command line', () => {
  it('npm run user:add creates an account that can sign in, and refuses a duplicate', async () => {
    const { spawnSync } = await import('node:child_process');
    const run = (pw?: string) =>
      spawnSync(
        process.execPath,
        ['--import', 'tsx', 'scripts/user-add.ts', 'first-admin@example.org', 'First Admin', 'admin'],
        { env: { ...process.env, ...(pw ? { HOOPLINE_NEW_PASSWORD: pw } : {}) }, encoding: 'utf8' },
      );
    const made = run();
    expect(made.status).toBe(0);
    const password = /password \(shown once\): (\S+)/.exec(made.stdout)?.[1];
    expect(password).toBeTruthy();
    expect(await new Client().signIn('first-admin@example.org', password)).toBe(true);
    const again = run('another-quiet-harbour-41');
    expect(again.status).toBe(2);
    expect(again.stderr).toContain('exists already');
  });
});

describe('API tokens', () => {
  it('authenticates with a token, and not with a revoked or wrong one', async () => {
    const tech = await signedIn('engineer@example.com');
    const created = await tech.json('/api/account/tokens', { method: 'POST', json: { name: 'daq pc' } });
    expect(created.status).toBe(201);
    const token: string = created.body.token;
    expect(token).toMatch(/^hpl_/);

    const viaToken = Client.withToken(token);
    const list = await viaToken.json('/api/account/tokens');
    expect(list.status).toBe(200);
    expect(list.body.items.some((t: { name: string }) => t.name === 'daq pc')).toBe(true);
    // the token value itself is never listed
    expect(JSON.stringify(list.body)).not.toContain(token);

    expect((await Client.withToken(token + 'x').json('/api/account/tokens')).status).toBe(401);
    expect((await tech.json(`/api/account/tokens/${created.body.id}`, { method: 'DELETE' })).status).toBe(200);
    const after = await viaToken.json('/api/account/tokens');
    expect(after.status).toBe(401);
    expect(after.body.error.code).toBe('invalid-token');
  });
});

describe('local services', () => {
  it('round-trips an object through the S3 fake, streamed', async () => {
    const { putObjectStream, getObjectText, deleteObject } = await import('../src/server/storage.server');
    const { Readable } = await import('node:stream');
    const text = 'time_s,P [MPa]\n' + Array.from({ length: 5000 }, (_, i) => `${i},${(i % 7) / 3}`).join('\n');
    await putObjectStream(
      'roundtrip/test.csv',
      Readable.from([Buffer.from(text.slice(0, 1000)), Buffer.from(text.slice(1000))]),
      'text/csv',
    );
    expect(await getObjectText('roundtrip/test.csv')).toBe(text);
    await deleteObject('roundtrip/test.csv');
  });

  it('delivers a message sent through nodemailer as an .eml file', async () => {
    const { sendMail } = await import('../src/server/mail.server');
    const subject = `Hoopline check ${Date.now()}`;
    await sendMail('inspector@example.com', subject, 'Hello from the tests.');
    const { waitForMail } = await import('./support/mail');
    const found = await waitForMail(inject('mailDir'), (m) => m.subject === subject, 5000);
    expect(found.to).toContain('inspector@example.com');
    expect(found.text).toContain('Hello from the tests.');
  });

  it('health answers 200 when all is up and 503 when the database is stopped; readiness also wants migrations', async () => {
    const healthy = await new Client().json('/api/health');
    expect(healthy.status).toBe(200);
    expect(healthy.body).toEqual({ ok: true, db: true, storage: true });

    // A second app server on its own MariaDB, which we then stop.
    const dataDir = path.join(inject('dataDir'), 'mariadb-health');
    const db = await startMariaDB({
      dataDir,
      port: await freePort(),
      password: 'health-check-only-pw',
      log: () => undefined,
    });
    const port = await freePort();
    const env = { ...inject('env'), DATABASE_URL: db.url, HOST: '127.0.0.1', PORT: String(port) };
    const server = spawn(process.execPath, ['scripts/serve.mjs'], {
      env: { ...process.env, ...env },
      stdio: 'ignore',
    });
    try {
      await waitForHttp(`http://127.0.0.1:${port}/api/health`, 20_000);
      expect((await fetch(`http://127.0.0.1:${port}/api/health`)).status).toBe(200);
      // alive, but not ready: this database has none of the migrations
      const unmigrated = await fetch(`http://127.0.0.1:${port}/api/ready`);
      expect(unmigrated.status).toBe(503);
      expect(await unmigrated.json()).toMatchObject({ ready: false, db: true, storage: true, migrations: 'pending' });
      await stopMariaDB({ dataDir });
      const down = await fetch(`http://127.0.0.1:${port}/api/health`);
      expect(down.status).toBe(503);
      expect(await down.json()).toEqual({ ok: false, db: false, storage: true });
      expect(await (await fetch(`http://127.0.0.1:${port}/api/ready`)).json()).toMatchObject({
        ready: false,
        db: false,
      });
      // a page says so in words, with the request id a user can quote
      const cookie = (await signedIn('engineer@example.com')).cookieHeader(); // same AUTH_SECRET
      const page = await fetch(`http://127.0.0.1:${port}/`, { headers: { cookie } });
      expect(page.status).toBe(503);
      const id = page.headers.get('x-request-id');
      expect(id).toMatch(/^[\w-]{8,}$/);
      expect(await page.text()).toContain(`Reference: ${id}`);
    } finally {
      server.kill('SIGTERM');
      await stopMariaDB({ dataDir });
    }
  });
});
