// The whole test in a real browser, as the four people do it: the engineer sets up the plan
// (with a validation error shown and fixed), the technician uploads and reduces, the engineer
// reviews, dispositions and signs, QA releases, exports and shares, and the inspector reads the
// record through the link with no account. Every screen is saved under tests/e2e/screenshots/;
// any console error, failed request or server error fails the journey.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { inject } from 'vitest';
import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import type { ChildProcess } from 'node:child_process';
import { gotoHydrated, islandsHydrated, openBrowser, signIn, type Session } from './browser';
import { makeHydrotestCsv } from '../support/hydrotest-log';
import { startWorker, stopProcess } from '../support/processes';

const password = () => inject('testPassword');
const files = mkdtempSync(path.join(tmpdir(), 'hoopline-e2e-'));
const plan = {
  units: 'SI',
  vessel: {
    name: 'E2E-7',
    shape: 'cylinder',
    ends: 'closed',
    insideDiameter: 1000,
    wallThickness: 10,
    length: 4000,
    features: [{ kind: 'nozzle', axialPosition: 2000, clockDeg: 0, size: 120 }],
  },
  material: { name: 'Carbon steel, e2e', elasticModulus: 200000, poissonRatio: 0.3, yieldStrength: 260 },
  model: 'lame',
  testPressure: 2,
  columns: { time: 'time_s', pressure: 'P [MPa]' },
  gauges: [
    { id: 'H1', kind: 'uniaxial', channels: ['SG1'], angleDeg: 90, axialPosition: 1000, clockDeg: 90 },
    { id: 'A1', kind: 'uniaxial', channels: ['SG2'], angleDeg: 0, axialPosition: 1000, clockDeg: 120 },
    { id: 'A2', kind: 'uniaxial', channels: ['SG3'], angleDeg: 0, axialPosition: 3000, clockDeg: 240 },
  ],
};
const planFile = path.join(files, 'e2e-plan.json');
writeFileSync(planFile, JSON.stringify(plan, null, 2));
// the same plan with a uniaxial gauge that lists two channels: the editor must name the gauge
const badPlanFile = path.join(files, 'e2e-plan-two-channels.json');
writeFileSync(
  badPlanFile,
  JSON.stringify({ ...plan, gauges: plan.gauges.map((g) => (g.id === 'A1' ? { ...g, channels: ['SG2', 'SG4'] } : g)) }),
);
const logFile = path.join(files, 'e2e-hydrotest.csv');
writeFileSync(
  logFile,
  makeHydrotestCsv({
    insideDiameter: 1000,
    wallThickness: 10,
    E: 200000,
    nu: 0.3,
    testPressure: 2,
    channels: [
      { name: 'SG1', angleDeg: 90 },
      { name: 'SG2', angleDeg: 0 },
      { name: 'SG3', angleDeg: 0, scale: 0.88 },
    ],
  }),
);

let worker: ChildProcess;
let testId = 0;
let shareUrl = '';
const sessions: Session[] = [];

async function session(journey: string): Promise<Session> {
  const s = await openBrowser(journey, inject('baseUrl'));
  sessions.push(s);
  return s;
}

function noProblems(s: Session) {
  expect(s.problems, 'console errors, failed requests or server errors').toEqual([]);
}

beforeAll(() => {
  worker = startWorker(inject('env'), 'w-e2e');
});
afterAll(async () => {
  await Promise.all(sessions.map((s) => s.close()));
  await stopProcess(worker);
});

describe('a hydrotest from plan to inspector link, in the browser', () => {
  it('the engineer creates the test from a plan file, meets a validation error and fixes it', async () => {
    const s = await session('1-engineer-plan');
    const { page } = s;
    await signIn(page, 'engineer@example.com', password());
    await s.shoot('dashboard');
    await page.getByRole('link', { name: 'New test' }).click();
    await page.waitForURL('**/tests/new');
    await islandsHydrated(page);
    // a plan problem names the gauge by its id and says what is wrong, with no developer path
    await page.locator('#plan-import').setInputFiles(badPlanFile);
    await page.getByRole('link', { name: 'Gauge A1 is uniaxial and needs one channel; it lists two.' }).waitFor();
    expect(await page.getByText(/gauges\[\d\]/).count()).toBe(0);
    await s.shoot('new-test-plan-error-names-gauge');
    await page.locator('#plan-import').setInputFiles(planFile);
    await page.getByLabel('Test name').fill('E2E hydrotest of vessel E2E-7');
    await s.shoot('new-test-imported');
    await page.getByRole('button', { name: /create test/i }).click();
    await page.waitForURL(/\/tests\/\d+$/);
    testId = Number(/\/tests\/(\d+)$/.exec(page.url())![1]);
    expect(testId).toBeGreaterThan(0);
    await s.shoot('test-overview');
    await page.getByRole('link', { name: 'Plan', exact: true }).click();
    await page.waitForURL(`**/tests/${testId}/plan`);
    await islandsHydrated(page);
    await s.shoot('plan-editor');

    const wall = page.getByLabel(/^Wall thickness/);
    await wall.fill('-3');
    await wall.press('Tab');
    await expect.poll(async () => (await page.getByText(/must be greater than 0/).count()) > 0).toBe(true);
    await expect.poll(async () => wall.getAttribute('aria-invalid')).toBe('true');
    await s.shoot('plan-validation-error');
    await wall.fill('10');
    await wall.press('Tab');
    await expect.poll(async () => wall.getAttribute('aria-invalid')).not.toBe('true');
    // the test conduct the signers attest
    await page.getByLabel('Written test procedure (optional)').fill('E2E-HT-1 rev A');
    await page.getByLabel('Witness (optional)').fill('O. Witness, authorised inspector');
    await page.getByLabel(/^Metal temperature during the test/).fill('17');
    await s.shoot('plan-test-conduct');
    await page.getByRole('button', { name: /save plan/i }).click();
    await expect
      .poll(async () =>
        page
          .getByRole('status')
          .filter({ hasText: /^Saved at/ })
          .count(),
      )
      .toBeGreaterThan(0);
    await s.shoot('plan-fixed-and-saved');
    noProblems(s);
  });

  it('the technician uploads a log, sees the progress bar and the finished reduction', async () => {
    const s = await session('2-technician-upload');
    const { page } = s;
    await signIn(page, 'technician@example.com', password());
    await gotoHydrated(page, `/tests/${testId}/logs`);
    await s.shoot('logs-empty');
    await page.evaluate(() => {
      const w = window as unknown as { sawUploadBar: boolean };
      w.sawUploadBar = false;
      new MutationObserver(() => {
        if (document.querySelector('[role=progressbar][aria-label="Upload progress"]')) w.sawUploadBar = true;
      }).observe(document.body, { childList: true, subtree: true });
    });
    await page.locator('#log-file').setInputFiles(logFile);
    await page.getByText(/Stored e2e-hydrotest\.csv/).waitFor();
    expect(await page.evaluate(() => (window as unknown as { sawUploadBar: boolean }).sawUploadBar)).toBe(true);
    await expect.poll(async () => page.getByRole('cell', { name: 'e2e-hydrotest.csv' }).count()).toBeGreaterThan(0);
    await s.shoot('log-uploaded');
    await page.getByRole('button', { name: 'Reduce all logs' }).click();
    await page.getByRole('progressbar', { name: /Reduction \d+ progress/ }).waitFor();
    await page.getByText(/Reduction \d+: done/).waitFor({ timeout: 60_000 });
    await page.getByText(/Strain comparison before dispositions: Flagged/).waitFor();
    await s.shoot('reduction-done');
    noProblems(s);
  });

  it('the engineer reviews the plots, dispositions the flagged gauge and signs the review', async () => {
    const s = await session('3-engineer-review');
    const { page } = s;
    await signIn(page, 'engineer@example.com', password());
    await gotoHydrated(page, `/tests/${testId}/review`);
    await page.getByText('Measured over predicted slope').waitFor();
    await expect.poll(async () => page.locator('canvas').count()).toBeGreaterThanOrEqual(2);
    // the verdict says what it means and what it does not
    await page
      .getByText('Flagged: gauges outside tolerance, awaiting a disposition, or marked for retest.')
      .first()
      .waitFor();
    await page
      .getByTestId('verdict-scope')
      .getByText(/It is not acceptance of the hydrostatic test/)
      .waitFor();
    await page.getByText(/1 gauge outside tolerance awaits a disposition before the review can be signed/).waitFor();
    await s.shoot('review-flagged');
    await page
      .getByRole('button', { name: 'Sign engineering review' })
      .isDisabled()
      .then((d) => expect(d).toBe(true));
    await page
      .getByRole('button', { name: /Disposition…/ })
      .first()
      .click();
    await page
      .getByLabel(/Reason \(required\)/)
      .fill('Bond of A2 inspected: edge lifted; axial strain taken from A1 and the rosette-free mirror gauge.');
    await page.getByRole('radio', { name: /Exclude/ }).check();
    await page.getByRole('button', { name: /Record disposition/ }).click();
    await page.getByText('Strain comparison verdict: Conforms', { exact: true }).waitFor();
    await page
      .getByText(/^Conforms: the measured strain slopes agree with the elastic prediction/)
      .first()
      .waitFor();
    await s.shoot('review-dispositioned');
    await page.getByRole('button', { name: 'Sign engineering review' }).click();
    // the statement is shown before signing, and the password is asked again
    await page.getByText(/I, Imke Sorensen \(demo\), have reviewed reduction \d+/).waitFor();
    await page
      .getByTestId('signature-statement')
      .getByText(/written test procedure E2E-HT-1 rev A; metal temperature 17 °C; witnessed by O\. Witness/)
      .waitFor();
    await page.getByLabel('Your password').fill('not my password');
    await page.getByRole('button', { name: 'Sign now' }).click();
    await page.getByRole('alert').filter({ hasText: 'not your password' }).waitFor();
    await s.shoot('review-wrong-password');
    await page.getByLabel('Your password').fill(password());
    await page.getByRole('button', { name: 'Sign now' }).click();
    await page
      .getByText(/Reviewed.*by/)
      .first()
      .waitFor();
    await s.shoot('review-signed');
    // the refused attempt answered 401 on purpose; nothing else may have gone wrong
    s.problems.splice(0, s.problems.length, ...s.problems.filter((p) => !/401/.test(p)));
    noProblems(s);
  });

  it('QA releases the record, exports it and creates an e-mailed share link', async () => {
    const s = await session('4-qa-release');
    const { page } = s;
    await signIn(page, 'qa@example.com', password());
    await s.shoot('dashboard-needs-qa');
    // a link made before the release shows the inspector an unmistakable DRAFT banner
    await gotoHydrated(page, `/tests/${testId}/report`);
    await page.getByRole('button', { name: 'Create link' }).click();
    await page.getByLabel('Share link').waitFor();
    const draftUrl = await page.getByLabel('Share link').inputValue();
    const early = await session('4b-inspector-before-release');
    await gotoHydrated(early.page, new URL(draftUrl).pathname);
    await early.page
      .getByTestId('draft-banner')
      .getByText(/DRAFT — NOT RELEASED/)
      .waitFor();
    await early.page.getByText('Strain comparison verdict: Conforms', { exact: true }).waitFor();
    await early.shoot('shared-draft');
    noProblems(early);
    await gotoHydrated(page, `/tests/${testId}/review`);
    await page.getByRole('button', { name: 'Release the strain record' }).click();
    await page.getByText(/I, Quentin Abara \(demo\), release the strain record of reduction \d+/).waitFor();
    // the confirmation restates the verdict and says who returns the vessel to service
    await page
      .getByTestId('signature-verdict')
      .getByText(/You are signing the strain comparison verdict Conforms/)
      .waitFor();
    await page
      .getByTestId('signature-statement')
      .getByText(/Returning the vessel to service is the owner’s and the authorised inspector’s decision/)
      .waitFor();
    // … said once: the lock warning below does not repeat the statement's scope sentence
    await page
      .getByTestId('release-scope')
      .getByText(/It does not return the vessel to service/)
      .waitFor();
    expect(await page.getByText(/Returning the vessel to service is the owner’s/).count()).toBe(1);
    await s.shoot('release-confirm');
    await page.getByLabel('Your password').fill(password());
    await page.getByRole('button', { name: 'Release the record now' }).click();
    await page.getByText(/Strain record released.*the\s+record is locked/).waitFor();
    await s.shoot('released');
    await gotoHydrated(page, `/tests/${testId}/report`);
    await s.shoot('report');
    const pdfHref = await page.getByRole('link', { name: 'Open PDF report' }).getAttribute('href');
    const pdf = await page.request.get(pdfHref!);
    expect(pdf.status()).toBe(200);
    expect((await pdf.body()).subarray(0, 5).toString()).toBe('%PDF-');
    const download = page.waitForEvent('download');
    await page.getByRole('link', { name: 'Download CSV summary' }).click();
    expect((await download).suggestedFilename()).toMatch(/\.csv$/);
    await page.getByLabel("Inspector's e-mail (optional)").fill('inspector@example.com');
    await page.getByRole('button', { name: 'Create link' }).click();
    const link = page.getByLabel('Share link');
    await link.waitFor();
    shareUrl = await link.inputValue();
    expect(shareUrl).toMatch(/\/share\/[A-Za-z0-9_-]{43}$/);
    await s.shoot('share-link-created');
    noProblems(s);
  });

  it('the inspector opens the link with no account, sees the plots and finds no control that writes', async () => {
    const s = await session('5-inspector');
    const { page } = s;
    await gotoHydrated(page, new URL(shareUrl).pathname);
    await page.getByRole('heading', { name: 'E2E hydrotest of vessel E2E-7' }).waitFor();
    await expect.poll(async () => page.locator('canvas').count()).toBeGreaterThanOrEqual(2);
    // the inspector reads the test conduct and what each signer attested
    await page.getByRole('heading', { name: 'Test conduct' }).waitFor();
    await page.getByText('E2E-HT-1 rev A', { exact: true }).waitFor();
    expect(await page.getByText(/^I, Quentin Abara \(demo\), release the strain record/).count()).toBe(1);
    expect(
      await page.getByText(/^I, Imke Sorensen \(demo\), have reviewed.*written test procedure E2E-HT-1 rev A/).count(),
    ).toBe(1);
    await s.shoot('shared-record');
    for (const name of [/sign/i, /release/i, /record disposition/i, /create link/i, /reduce/i, /revoke/i, /save/i]) {
      expect(await page.getByRole('button', { name }).count(), String(name)).toBe(0);
    }
    expect(await page.locator('textarea, input[type=file], input[type=radio]').count()).toBe(0);
    noProblems(s);
    const write = await page.evaluate(
      async (u) => (await fetch(u.replace('/share/', '/api/share/'), { method: 'POST', body: '{}' })).status,
      new URL(shareUrl).pathname,
    );
    expect(write).toBe(405);
    // the account pages stay closed to the link's holder
    await gotoHydrated(page, `/tests/${testId}`);
    expect(new URL(page.url()).pathname).toBe('/signin');
    // (the 405 of the probe above is logged by the browser as a console error, on purpose)
  });
});
