// Helpers shared by the global setup and tests that start their own app or worker processes.
import { randomBytes } from 'node:crypto';

export const TEST_PASSWORD = 'test-password-only';

/**
 * Credentials of the test services: not the defaults, because the app outside demo mode refuses
 * to start with default database or storage credentials (DESIGN 6).
 */
export function testCredentials() {
  return {
    dbPassword: `db-${randomBytes(12).toString('hex')}`,
    s3AccessKeyId: `AK${randomBytes(8).toString('hex').toUpperCase()}`,
    s3SecretAccessKey: randomBytes(20).toString('hex'),
  };
}

/** The environment an app server or worker needs to reach the test services. */
export function serverEnv(o: {
  dbUrl: string;
  s3Endpoint: string;
  bucket: string;
  s3AccessKeyId: string;
  s3SecretAccessKey: string;
  smtpPort: number;
  mailDir: string;
  baseUrl: string;
}): Record<string, string> {
  return {
    DATABASE_URL: o.dbUrl,
    S3_ENDPOINT: o.s3Endpoint,
    S3_BUCKET: o.bucket,
    S3_REGION: 'us-east-1',
    S3_ACCESS_KEY_ID: o.s3AccessKeyId,
    S3_SECRET_ACCESS_KEY: o.s3SecretAccessKey,
    S3_FORCE_PATH_STYLE: 'true',
    SMTP_HOST: '127.0.0.1',
    SMTP_PORT: String(o.smtpPort),
    MAIL_DIR: o.mailDir,
    PUBLIC_BASE_URL: o.baseUrl,
    AUTH_SECRET: randomBytes(32).toString('hex'),
    DEMO: 'false',
    UPLOAD_MAX_BYTES: String(48 * 1024 * 1024),
    WORKER_LEASE_SECONDS: '5',
    WORKER_POLL_MS: '100',
    MAIL_RETRY_SECONDS: '0.5',
    ASTRO_TELEMETRY_DISABLED: '1',
    LOG_LEVEL: 'warn',
    AWS_SDK_JS_NODE_VERSION_SUPPORT_WARNING_DISABLED: 'true',
  };
}

/** Poll a URL until it answers (any status) or the time runs out. */
export async function waitForHttp(url: string, timeoutMs: number): Promise<void> {
  const deadline = Date.now() + timeoutMs;
  for (;;) {
    try {
      await fetch(url, { signal: AbortSignal.timeout(1000) });
      return;
    } catch {
      if (Date.now() > deadline) throw new Error(`${url} did not answer within ${timeoutMs} ms`);
      await new Promise((r) => setTimeout(r, 150));
    }
  }
}

import { spawn, type ChildProcess } from 'node:child_process';

/** Start a reduction worker process (the real `npm run worker` entry) against the test services. */
export function startWorker(env: Record<string, string>, id: string, extra: Record<string, string> = {}): ChildProcess {
  return spawn(process.execPath, ['--import', 'tsx', 'src/server/jobs/worker-main.ts'], {
    env: { ...process.env, ...env, WORKER_ID: id, ...extra },
    stdio: ['ignore', 'ignore', 'inherit'],
  });
}

/** Stop a worker and wait for it to exit. */
export async function stopProcess(child: ChildProcess, signal: NodeJS.Signals = 'SIGTERM'): Promise<void> {
  if (child.exitCode !== null || child.signalCode !== null) return;
  await new Promise<void>((resolve) => {
    child.once('exit', () => resolve());
    child.kill(signal);
  });
}

/** Start another app server (the built dist/) with env overrides, on a free port. */
export async function startAppServer(
  env: Record<string, string>,
  overrides: Record<string, string> = {},
): Promise<{ url: string; child: ChildProcess; stop: () => Promise<void> }> {
  const { freePort } = await import('../global-setup');
  const port = await freePort();
  const child = spawn(process.execPath, ['dist/server/entry.mjs'], {
    env: { ...process.env, ...env, HOST: '127.0.0.1', PORT: String(port), ...overrides },
    stdio: ['ignore', 'ignore', 'inherit'],
  });
  const url = `http://127.0.0.1:${port}`;
  await waitForHttp(`${url}/api/health`, 30_000);
  return { url, child, stop: () => stopProcess(child) };
}
