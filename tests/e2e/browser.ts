// Headless Debian Chromium through playwright-core, with the launch flags this machine needs,
// a screenshot of every screen a journey visits, and a record of console errors and failed requests.
import { chromium, type BrowserContext, type Page } from 'playwright-core';
import { mkdirSync, mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';

export const SCREENSHOT_DIR = path.resolve('tests/e2e/screenshots');

export interface Session {
  context: BrowserContext;
  page: Page;
  problems: string[];
  shoot: (name: string) => Promise<void>;
  close: () => Promise<void>;
}

export async function openBrowser(journey: string, baseUrl: string): Promise<Session> {
  const profile = mkdtempSync(path.join(tmpdir(), 'hoopline-chromium-'));
  const context = await chromium.launchPersistentContext(profile, {
    executablePath: '/usr/bin/chromium',
    headless: true,
    viewport: { width: 1440, height: 900 },
    acceptDownloads: true,
    baseURL: baseUrl,
    args: [
      '--no-sandbox',
      '--disable-gpu',
      '--disable-quic',
      '--no-first-run',
      '--disable-background-networking',
      '--disable-component-update',
      '--disable-sync',
    ],
  });
  const page = context.pages()[0] ?? (await context.newPage());
  const problems: string[] = [];
  page.on('console', (m) => {
    if (m.type() === 'error') problems.push(`console: ${m.text()}`);
  });
  page.on('pageerror', (e) => problems.push(`page error: ${e.message}`));
  page.on('requestfailed', (r) => {
    if (!r.failure()?.errorText.includes('ERR_ABORTED'))
      problems.push(`request failed: ${r.method()} ${r.url()} ${r.failure()?.errorText}`);
  });
  page.on('response', (r) => {
    if (r.status() >= 500) problems.push(`HTTP ${r.status()}: ${r.request().method()} ${r.url()}`);
  });
  mkdirSync(SCREENSHOT_DIR, { recursive: true });
  let n = 0;
  return {
    context,
    page,
    problems,
    shoot: async (name) => {
      n += 1;
      await page.waitForLoadState('networkidle').catch(() => undefined);
      // from the top, so sticky bars sit where a reader first sees them
      await page.evaluate(() => window.scrollTo(0, 0));
      await page.waitForTimeout(150);
      await page.screenshot({
        path: path.join(SCREENSHOT_DIR, `${journey}-${String(n).padStart(2, '0')}-${name}.png`),
        fullPage: true,
      });
    },
    close: async () => {
      await context.close();
      rmSync(profile, { recursive: true, force: true });
    },
  };
}

export async function signIn(page: Page, email: string, password: string): Promise<void> {
  await page.goto('/signin');
  await page.getByLabel('E-mail').fill(email);
  await page.getByLabel('Password').fill(password);
  await page.getByRole('button', { name: 'Sign in' }).click();
  await page.waitForURL((u) => !u.pathname.startsWith('/signin'));
}
