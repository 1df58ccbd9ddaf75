// A whole Hoopline of its own for the fault drills: a private MariaDB, the S3 and SMTP fakes and
// the built app server, each of which a drill can stop and start again while the app keeps
// running; reduction workers on demand; and direct SQL to check what was stored.
import { spawn, type ChildProcess } from 'node:child_process';
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import mysql from 'mysql2/promise';
import { runRootSql, startMariaDB, stopMariaDB } from '../../fake-services/mariadb.mjs';
import { startS3 } from '../../fake-services/s3.mjs';
import { startSmtp } from '../../fake-services/smtp.mjs';
import { freePort } from '../global-setup';
import { Client } from '../support/http';
import { serverEnv, stopProcess, TEST_PASSWORD, testCredentials, waitForHttp } from '../support/processes';

export interface Stack {
  baseUrl: string;
  env: Record<string, string>;
  mailDir: string;
  app: ChildProcess;
  /** run SQL on the stack's database (a fresh connection each time, so it works after a restart) */
  sql<T = Record<string, unknown>>(statement: string, params?: unknown[]): Promise<T[]>;
  /** run SQL as root over the socket (what the app's user may not read, such as lock waits) */
  rootSql(statement: string): string;
  /** a connection of the drill's own, e.g. to hold a row lock */
  connection(): Promise<mysql.Connection>;
  stopDb(): Promise<void>;
  startDb(): Promise<void>;
  stopS3(): Promise<void>;
  startS3(): Promise<void>;
  stopSmtp(): Promise<void>;
  startSmtp(): Promise<void>;
  /** a reduction worker; its stderr is collected in `log()` */
  worker(id: string, extra?: Record<string, string>): { child: ChildProcess; log: () => string };
  signedIn(email: string): Promise<Client>;
  client(): Client;
  close(): Promise<void>;
}

export async function startStack(name: string): Promise<Stack> {
  const dir = mkdtempSync(path.join(tmpdir(), `hoopline-drill-${name}-`));
  const dbDir = path.join(dir, 'mariadb');
  const mailDir = path.join(dir, 'mail');
  const creds = testCredentials();
  const [dbPort, s3Port, smtpPort, appPort] = [await freePort(), await freePort(), await freePort(), await freePort()];
  const bucket = 'hoopline-drill';
  const db = await startMariaDB({ dataDir: dbDir, port: dbPort, password: creds.dbPassword, log: () => undefined });
  const s3Options = {
    directory: path.join(dir, 's3'),
    port: s3Port,
    bucket,
    accessKeyId: creds.s3AccessKeyId,
    secretAccessKey: creds.s3SecretAccessKey,
  };
  let s3: { close: () => Promise<void> } | null = await startS3(s3Options);
  let smtp: { close: () => Promise<void> } | null = await startSmtp({ directory: mailDir, port: smtpPort });
  const baseUrl = `http://127.0.0.1:${appPort}`;
  const env = {
    ...serverEnv({
      dbUrl: db.url,
      s3Endpoint: `http://127.0.0.1:${s3Port}`,
      bucket,
      ...creds,
      smtpPort,
      mailDir,
      baseUrl,
    }),
    WORKER_RETRY_BASE_MS: '300',
    WORKER_RETRY_MAX_SECONDS: '2',
  };
  Object.assign(process.env, env);
  const { resetConfigForTests } = await import('../../src/config.server');
  resetConfigForTests();
  const { migrateDatabase } = await import('../../src/db/migrate.server');
  await migrateDatabase(db.url);
  const { createPool, closeDb } = await import('../../src/db/client.server');
  const { drizzle } = await import('drizzle-orm/mysql2');
  const schema = await import('../../src/db/schema');
  const seedPool = createPool(db.url);
  const { seedDemoAccounts } = await import('../../src/server/demo-seed.server');
  await seedDemoAccounts(drizzle(seedPool, { schema, mode: 'default' }), TEST_PASSWORD, { reset: true });
  await seedPool.end();
  await closeDb();

  const app = spawn(process.execPath, ['dist/server/entry.mjs'], {
    env: { ...process.env, ...env, HOST: '127.0.0.1', PORT: String(appPort) },
    stdio: ['ignore', 'ignore', 'ignore'],
  });
  await waitForHttp(`${baseUrl}/api/health`, 30_000);
  const workers: ChildProcess[] = [];

  const connection = () => mysql.createConnection({ uri: db.url, timezone: 'Z' });
  const stack: Stack = {
    baseUrl,
    env,
    mailDir,
    app,
    async sql<T>(statement: string, params: unknown[] = []) {
      const c = await connection();
      try {
        const [rows] = await c.query(statement, params);
        return rows as T[];
      } finally {
        await c.end();
      }
    },
    connection,
    rootSql: (statement) => runRootSql({ dataDir: dbDir }, statement),
    async stopDb() {
      await stopMariaDB({ dataDir: dbDir });
    },
    async startDb() {
      await startMariaDB({ dataDir: dbDir, port: dbPort, password: creds.dbPassword, log: () => undefined });
    },
    async stopS3() {
      await s3?.close();
      s3 = null;
    },
    async startS3() {
      s3 = await startS3(s3Options);
    },
    async stopSmtp() {
      await smtp?.close();
      smtp = null;
    },
    async startSmtp() {
      smtp = await startSmtp({ directory: mailDir, port: smtpPort });
    },
    worker(id, extra = {}) {
      let log = '';
      const child = spawn(process.execPath, ['--import', 'tsx', 'src/server/jobs/worker-main.ts'], {
        env: { ...process.env, ...env, WORKER_ID: id, ...extra },
        stdio: ['ignore', 'pipe', 'pipe'],
      });
      child.stdout.on('data', (d) => (log += d));
      child.stderr.on('data', (d) => (log += d));
      workers.push(child);
      return { child, log: () => log };
    },
    async signedIn(email) {
      const c = new Client(null, baseUrl);
      if (!(await c.signIn(email, TEST_PASSWORD))) throw new Error(`could not sign in as ${email}`);
      return c;
    },
    client: () => new Client(null, baseUrl),
    async close() {
      for (const w of workers) {
        if (w.signalCode === 'SIGSTOP') w.kill('SIGCONT');
        await stopProcess(w);
      }
      await stopProcess(app);
      await Promise.allSettled([s3?.close(), smtp?.close()]);
      await stopMariaDB({ dataDir: dbDir });
      rmSync(dir, { recursive: true, force: true });
    },
  };
  return stack;
}

/** Wait until `check` holds (polling), or fail naming `what`. */
/** A JSON column as the driver hands it over (MariaDB's JSON is text; mysql2 may have parsed it). */
export const jsonOf = <T = Record<string, unknown>>(v: unknown): T => (typeof v === 'string' ? JSON.parse(v) : v) as T;

export async function until(what: string, check: () => Promise<boolean>, timeoutMs = 30_000): Promise<void> {
  const deadline = Date.now() + timeoutMs;
  for (;;) {
    if (await check()) return;
    if (Date.now() > deadline) throw new Error(`timed out waiting for ${what}`);
    await new Promise((r) => setTimeout(r, 50));
  }
}

/**
 * Hold the lock of a test's row from a connection of the drill's own, as a slow transaction of
 * the app would; requests that change the test queue behind it. `waiting()` counts the app's
 * statements waiting for that lock; `release()` commits and lets them go, in the order they came.
 */
export async function holdTestLock(stack: Stack, testId: number) {
  const c = await stack.connection();
  await c.beginTransaction();
  await c.query('SELECT id FROM tests WHERE id = ? FOR UPDATE', [testId]);
  return {
    async waiting(): Promise<number> {
      // statements of the app queued behind the lock (the holder itself sits idle)
      return Number(
        stack
          .rootSql(
            "SELECT COUNT(*) FROM information_schema.processlist WHERE command = 'Query' AND info LIKE 'select %from `tests` where `tests`.`id` = % for update';",
          )
          .trim(),
      );
    },
    async release() {
      await c.commit();
      await c.end();
    },
  };
}
