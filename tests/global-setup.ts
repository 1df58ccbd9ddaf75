// Starts what the integration tests need — a private MariaDB in a temporary folder on a free
// port, the S3 fake, the SMTP fake — migrates, seeds test accounts, builds the app (unless
// HOOPLINE_SKIP_BUILD=1) and serves it on a free port. Tears everything down afterwards.
import type { TestProject } from 'vitest/node';
import { spawn, spawnSync, type ChildProcess } from 'node:child_process';
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { startMariaDB, stopMariaDB } from '../fake-services/mariadb.mjs';
import { startS3 } from '../fake-services/s3.mjs';
import { startSmtp } from '../fake-services/smtp.mjs';
import { freePort } from '../fake-services/ports.mjs';
import { serverEnv, TEST_PASSWORD, testCredentials, waitForHttp } from './support/processes';

export { freePort };

declare module 'vitest' {
  export interface ProvidedContext {
    env: Record<string, string>;
    baseUrl: string;
    dataDir: string;
    mailDir: string;
    testPassword: string;
  }
}

export default async function setup(project: TestProject) {
  const dataDir = mkdtempSync(path.join(tmpdir(), 'hoopline-test-'));
  const mailDir = path.join(dataDir, 'mail');
  const [dbPort, s3Port, smtpPort, appPort] = [await freePort(), await freePort(), await freePort(), await freePort()];
  const creds = testCredentials();
  const db = await startMariaDB({
    dataDir: path.join(dataDir, 'mariadb'),
    port: dbPort,
    password: creds.dbPassword,
    log: () => undefined,
  });
  const bucket = 'hoopline-test';
  const s3 = await startS3({
    directory: path.join(dataDir, 's3'),
    port: s3Port,
    bucket,
    accessKeyId: creds.s3AccessKeyId,
    secretAccessKey: creds.s3SecretAccessKey,
  });
  const smtp = await startSmtp({ directory: mailDir, port: smtpPort });
  const baseUrl = `http://127.0.0.1:${appPort}`;
  const env = serverEnv({ dbUrl: db.url, s3Endpoint: s3.endpoint, bucket, ...creds, smtpPort, mailDir, baseUrl });
  Object.assign(process.env, env);

  const { migrateDatabase } = await import('../src/db/migrate.server');
  await migrateDatabase(db.url);
  const { getDb, closeDb } = await import('../src/db/client.server');
  const { seedDemoAccounts } = await import('../src/server/demo-seed.server');
  await seedDemoAccounts(getDb(), TEST_PASSWORD, { reset: true });
  await closeDb();

  if (process.env.HOOPLINE_SKIP_BUILD !== '1') {
    const r = spawnSync(process.execPath, ['node_modules/astro/astro.js', 'build'], {
      env: { ...process.env, ASTRO_TELEMETRY_DISABLED: '1' },
      encoding: 'utf8',
    });
    if (r.status !== 0) throw new Error(`astro build failed:\n${(r.stdout + r.stderr).slice(-3000)}`);
  }
  const server: ChildProcess = spawn(process.execPath, ['scripts/serve.mjs'], {
    env: { ...process.env, ...env, HOST: '127.0.0.1', PORT: String(appPort) },
    stdio: ['ignore', 'inherit', 'inherit'],
  });
  await waitForHttp(`${baseUrl}/api/health`, 30_000);

  project.provide('env', env);
  project.provide('baseUrl', baseUrl);
  project.provide('dataDir', dataDir);
  project.provide('mailDir', mailDir);
  project.provide('testPassword', TEST_PASSWORD);

  return async () => {
    server.kill('SIGTERM');
    await Promise.allSettled([s3.close(), smtp.close()]);
    await stopMariaDB({ dataDir: path.join(dataDir, 'mariadb') });
    rmSync(dataDir, { recursive: true, force: true });
  };
}
