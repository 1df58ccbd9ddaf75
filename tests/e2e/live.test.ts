// Live test mode in a real browser (DESIGN 8): the push script on the "acquisition PC" follows a
// log that grows at 20× the speed of the test; the engineer's review page grows hold by hold and
// shows the warning for the low gauge before the vessel reaches its top hold, and the inspector's
// page follows the same test through the share link. Every screen is saved under
// tests/e2e/screenshots/; any console error, failed request or server error fails the journey.
import { afterAll, describe, expect, inject, it } from 'vitest';
import { spawn, type ChildProcess } from 'node:child_process';
import { createHash } from 'node:crypto';
import { appendFileSync, mkdtempSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { gotoHydrated, openBrowser, signIn, type Session } from './browser';
import { makeHydrotestCsv } from '../support/hydrotest-log';
import { signedIn } from '../support/http';

const SPEED = 20;
const TEST_PRESSURE = 2;
const files = mkdtempSync(path.join(tmpdir(), 'hoopline-live-'));
const plan = {
  units: 'SI',
  vessel: {
    name: 'LIVE-3',
    shape: 'cylinder',
    ends: 'closed',
    insideDiameter: 1000,
    wallThickness: 10,
    length: 4000,
    features: [{ kind: 'nozzle', axialPosition: 2000, clockDeg: 0, size: 120 }],
  },
  material: { name: 'Carbon steel, live journey', elasticModulus: 200000, poissonRatio: 0.3, yieldStrength: 260 },
  model: 'lame',
  testPressure: TEST_PRESSURE,
  columns: { time: 'time_s', pressure: 'P [MPa]' },
  gauges: [
    { id: 'H1', kind: 'uniaxial', channels: ['SG1'], angleDeg: 90, axialPosition: 1000, clockDeg: 90 },
    { id: 'A1', kind: 'uniaxial', channels: ['SG2'], angleDeg: 0, axialPosition: 1000, clockDeg: 120 },
    // reads 15 % low: outside the ±10 % band from the second loading hold on
    { id: 'A2', kind: 'uniaxial', channels: ['SG3'], angleDeg: 0, axialPosition: 3000, clockDeg: 240 },
  ],
};
const wholeLog = makeHydrotestCsv({
  insideDiameter: 1000,
  wallThickness: 10,
  E: 200000,
  nu: 0.3,
  testPressure: TEST_PRESSURE,
  channels: [
    { name: 'SG1', angleDeg: 90 },
    { name: 'SG2', angleDeg: 0 },
    { name: 'SG3', angleDeg: 0, scale: 0.85 },
  ],
});
const logFile = path.join(files, 'live-hydrotest.csv');

const sessions: Session[] = [];
let push: ChildProcess | null = null;
afterAll(async () => {
  push?.kill('SIGTERM');
  await Promise.all(sessions.map((s) => s.close()));
});

/** Appends the log's lines as the acquisition unit would, SPEED times faster than the test ran. */
async function writeAsTheTestRuns(): Promise<void> {
  const lines = wholeLog.split('\n');
  writeFileSync(logFile, lines[0] + '\n');
  const start = Date.now();
  let i = 1;
  while (i < lines.length) {
    const elapsed = ((Date.now() - start) / 1000) * SPEED;
    let batch = '';
    for (; i < lines.length && lines[i] !== ''; i++) {
      const t = Number(lines[i]!.split(',')[0]);
      if (t > elapsed) break;
      batch += lines[i] + '\n';
    }
    if (lines[i] === '') i++;
    if (batch) appendFileSync(logFile, batch);
    await new Promise((r) => setTimeout(r, 100));
  }
}

describe('a live hydrotest followed in the browser', () => {
  it('grows hold by hold on the review page, warns before the top hold, and the inspector follows', async () => {
    const base = inject('baseUrl');
    const engineer = await signedIn('engineer@example.com');
    const made = await engineer.json('/api/tests', { method: 'POST', json: { name: 'Live journey LIVE-3', plan } });
    expect(made.status).toBe(201);
    const testId: number = made.body.id;
    const qa = await signedIn('qa@example.com');
    const link = await qa.json(`/api/tests/${testId}/share-links`, { method: 'POST', json: {} });
    expect(link.status).toBe(201);
    const technician = await signedIn('technician@example.com');
    const token = await technician.json('/api/account/tokens', {
      method: 'POST',
      json: { name: 'acquisition PC', scopes: ['upload'] },
    });
    expect(token.status).toBe(201);

    const eng = await openBrowser('6-live-engineer', base);
    sessions.push(eng);
    await signIn(eng.page, 'engineer@example.com', inject('testPassword'));
    await gotoHydrated(eng.page, `/tests/${testId}/review`);
    const insp = await openBrowser('7-live-inspector', base);
    sessions.push(insp);
    await gotoHydrated(insp.page, link.body.url);
    // note, in the engineer's page, what it showed at the moment the warning for A2 arrived
    await eng.page.evaluate(() => {
      const w = window as unknown as { atWarning: { holds: string; pressure: string } | null };
      w.atWarning = null;
      new MutationObserver(() => {
        if (w.atWarning || !document.querySelector('[data-live-warning="A2:trend-outside-band"]')) return;
        w.atWarning = {
          holds: document.querySelector('[data-live-holds]')?.textContent ?? '',
          pressure: document.querySelector('[data-live-pressure]')?.textContent ?? '',
        };
      }).observe(document.body, { childList: true, subtree: true, characterData: true });
    });

    const writing = writeAsTheTestRuns();
    push = spawn(
      process.execPath,
      [
        'scripts/hoopline-push.mjs',
        '--url',
        base,
        '--test',
        String(testId),
        '--file',
        logFile,
        '--interval',
        '0.3',
        '--idle',
        '3',
      ],
      { env: { ...process.env, HOOPLINE_TOKEN: token.body.token }, stdio: ['ignore', 'pipe', 'pipe'] },
    );
    let pushOutput = '';
    push.stdout?.on('data', (d) => (pushOutput += d));
    push.stderr?.on('data', (d) => (pushOutput += d));

    await eng.page.locator('[data-live-panel] [data-live-state="live"]').waitFor({ timeout: 30_000 });
    await eng.page.locator('[data-live-grid="A2"] circle').first().waitFor({ timeout: 30_000 });
    await eng.shoot('live-first-holds');
    await eng.page.locator('[data-live-warning="A2:trend-outside-band"]').waitFor({ timeout: 60_000 });
    await eng.shoot('live-warning');
    const atWarning = await eng.page.evaluate(
      () => (window as unknown as { atWarning: { holds: string; pressure: string } | null }).atWarning,
    );
    expect(atWarning).not.toBeNull();
    // the warning came while the pressure was still below the top hold (test pressure 2 MPa)
    const pressureThen = Number(/([\d.]+)/.exec(atWarning!.pressure)?.[1]);
    expect(pressureThen).toBeLessThan(TEST_PRESSURE * 0.95);
    const warning = eng.page.locator('[data-live-warning="A2:trend-outside-band"]');
    expect(await warning.textContent()).toMatch(/What to check/);
    // no warning for the healthy gauges
    expect(await eng.page.locator('[data-live-warning^="H1:"], [data-live-warning^="A1:"]').count()).toBe(0);

    await insp.page.locator('[data-live-warning="A2:trend-outside-band"]').waitFor({ timeout: 30_000 });
    await insp.shoot('live-inspector-warning');

    await writing;
    const exit = await new Promise<number | null>((resolve) => push!.on('exit', resolve));
    push = null;
    expect(exit, pushOutput).toBe(0);
    await eng.page.locator('[data-live-state="finished"]').waitFor({ timeout: 30_000 });
    await eng.shoot('live-finished');
    await insp.page.locator('[data-live-state="finished"]').waitFor({ timeout: 30_000 });
    expect(
      Number(
        await insp.page
          .locator('[data-live-holds]')
          .first()
          .innerText()
          .then((t) => t.split(/\s/)[0]),
      ),
    ).toBe(
      Number(
        await eng.page
          .locator('[data-live-holds]')
          .first()
          .innerText()
          .then((t) => t.split(/\s/)[0]),
      ),
    );
    await insp.shoot('live-inspector-finished');

    // the stored log is the whole file, byte for byte
    const logs = await engineer.json(`/api/tests/${testId}/logs`);
    const sha = createHash('sha256').update(readFileSync(logFile)).digest('hex');
    expect(logs.body.items.map((l: { sha256: string }) => l.sha256)).toContain(sha);

    expect(eng.problems, 'console errors, failed requests or server errors').toEqual([]);
    expect(insp.problems, 'console errors, failed requests or server errors').toEqual([]);
  });
});
