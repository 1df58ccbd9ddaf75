// Headless Debian Chromium through playwright-core, with the launch flags this machine needs,
// a screenshot of every screen a journey visits, and a record of console errors and failed requests.
import { chromium, type BrowserContext, type Page } from 'playwright-core';
import { mkdirSync, mkdtempSync, readFileSync, rmSync } from 'node:fs';
import { createRequire } from 'node:module';
import { tmpdir } from 'node:os';
import path from 'node:path';

export const SCREENSHOT_DIR = path.resolve('tests/e2e/screenshots');

/** axe-core's browser build, evaluated in each page (through the DevTools protocol, so the CSP that forbids inline script does not apply to it). */
const AXE_SOURCE = readFileSync(createRequire(import.meta.url).resolve('axe-core/axe.min.js'), 'utf8');

interface AxeViolation {
  id: string;
  impact: string | null;
  help: string;
  nodes: { target: unknown[] }[];
}

/**
 * Run axe-core on the page as it is now (WCAG 2.1 A and AA rules) and describe every serious or
 * critical violation: rule, what it asks, and the first elements it found.
 */
export async function findAccessibilityProblems(page: Page, where: string): Promise<string[]> {
  await page.evaluate(AXE_SOURCE);
  const violations = await page.evaluate(async () => {
    const axe = (window as unknown as { axe: { run: (c: unknown, o: unknown) => Promise<{ violations: unknown[] }> } })
      .axe;
    const r = await axe.run(document, {
      runOnly: { type: 'tag', values: ['wcag2a', 'wcag2aa', 'wcag21a', 'wcag21aa'] },
    });
    return r.violations;
  });
  return (violations as AxeViolation[])
    .filter((v) => v.impact === 'serious' || v.impact === 'critical')
    .map(
      (v) =>
        `axe ${v.impact} on ${where}: ${v.id} — ${v.help} (${v.nodes
          .slice(0, 3)
          .map((n) => JSON.stringify(n.target))
          .join(', ')})`,
    );
}

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
      // every screen a journey shows is also checked for serious and critical accessibility faults
      problems.push(...(await findAccessibilityProblems(page, `${journey} ${name}`)));
    },
    close: async () => {
      await context.close();
      rmSync(profile, { recursive: true, force: true });
    },
  };
}

/**
 * Open a page and wait until every island has hydrated (Astro drops an island's `ssr` attribute
 * once its component runs): a click on server-rendered HTML before then reaches no handler, which
 * on a loaded machine made a journey wait for a dialog that never opened.
 */
export async function gotoHydrated(page: Page, url: string): Promise<void> {
  await page.goto(url);
  await islandsHydrated(page);
}

/** Wait until every island of the current page has hydrated (after a navigation by click). */
export async function islandsHydrated(page: Page): Promise<void> {
  await page.waitForFunction(() => document.querySelectorAll('astro-island[ssr]').length === 0, null, {
    timeout: 30_000,
  });
}

export async function signIn(page: Page, email: string, password: string): Promise<void> {
  await gotoHydrated(page, '/signin');
  await page.getByLabel('E-mail').fill(email);
  await page.getByLabel('Password').fill(password);
  await page.getByRole('button', { name: 'Sign in' }).click();
  await page.waitForURL((u) => !u.pathname.startsWith('/signin'));
}
