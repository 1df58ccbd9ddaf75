// Review and release as the four roles over HTTP: dispositions, signatures, the lock, exports,
// inspector share links with e-mail, the audit trail, and mail that survives an SMTP outage.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { inject } from 'vitest';
import { eq } from 'drizzle-orm';
import type { ChildProcess } from 'node:child_process';
import path from 'node:path';
import { Client, signedIn } from './support/http';
import { makeHydrotestCsv } from './support/hydrotest-log';
import { readMails, waitForMail } from './support/mail';
import { startWorker, stopProcess } from './support/processes';

const plan = {
  units: 'SI',
  vessel: { shape: 'cylinder', ends: 'closed', insideDiameter: 1000, wallThickness: 10, length: 4000 },
  material: { name: 'review-test steel', elasticModulus: 200_000, poissonRatio: 0.3, yieldStrength: 260 },
  testPressure: 2,
  columns: { time: 'time_s', pressure: 'P [MPa]' },
  procedure: { reference: 'RV-HT-2 rev C', testMedium: 'water', testTemperature: 18, witness: 'K. Demo, inspector' },
  gauges: [
    { id: 'H1', kind: 'uniaxial', channels: ['SG1'], angleDeg: 90, distanceToDiscontinuity: 1500 },
    { id: 'A1', kind: 'uniaxial', channels: ['SG2'], angleDeg: 0, distanceToDiscontinuity: 1500 },
    { id: 'H2', kind: 'uniaxial', channels: ['SG3'], angleDeg: 90, distanceToDiscontinuity: 1500 },
  ],
};
const log = makeHydrotestCsv({
  insideDiameter: 1000,
  wallThickness: 10,
  E: 200_000,
  nu: 0.3,
  testPressure: 2,
  channels: [
    { name: 'SG1', angleDeg: 90 },
    { name: 'SG2', angleDeg: 0 },
    { name: 'SG3', angleDeg: 90, scale: 0.85 },
  ],
});

let technician: Client, engineer: Client, qa: Client, admin: Client;
let worker: ChildProcess;
let testId: number;
const mailDir = () => inject('mailDir');

async function db() {
  const { getDb } = await import('../src/db/client.server');
  return getDb();
}

function upload(c: Client, id: number, body: string) {
  const form = new FormData();
  form.append('file', new Blob([body], { type: 'text/csv' }), 'hold-log.csv');
  return c.json(`/api/tests/${id}/logs`, { method: 'POST', body: form });
}

/** The current reduction of the test, as the signer saw it. */
async function currentReductionId(id: number): Promise<number> {
  return (await engineer.json(`/api/tests/${id}`)).body.currentReduction.id;
}

/** Sign (review or release) with the reduction shown and the signer's password. */
async function sign(c: Client, kind: 'review' | 'release', extra: Record<string, unknown> = {}) {
  return c.json(`/api/tests/${testId}/${kind}`, {
    method: 'POST',
    json: { reductionId: await currentReductionId(testId), password: inject('testPassword'), ...extra },
  });
}

async function waitDone(id: number) {
  for (let i = 0; i < 600; i++) {
    const r = await engineer.json(`/api/reductions/${id}`);
    if (r.body.status === 'done' || r.body.status === 'failed') return r.body;
    await new Promise((res) => setTimeout(res, 100));
  }
  throw new Error('reduction did not finish');
}

beforeAll(async () => {
  worker = startWorker(inject('env'), 'w-review');
  [technician, engineer, qa, admin] = await Promise.all([
    signedIn('technician@example.com'),
    signedIn('engineer@example.com'),
    signedIn('qa@example.com'),
    signedIn('admin@example.com'),
  ]);
});
afterAll(async () => {
  await stopProcess(worker);
});

describe('the whole journey', () => {
  it('engineer creates the test; technician uploads and reduces; the owner hears the result', async () => {
    testId = (await engineer.json('/api/tests', { method: 'POST', json: { name: 'Review journey', plan } })).body.id;
    expect((await upload(technician, testId, log)).status).toBe(201);
    const q = await technician.json(`/api/tests/${testId}/reductions`, { method: 'POST', json: {} });
    const done = await waitDone(q.body.id);
    expect(done.status).toBe('done');
    expect(done.result.verdict).toBe('flagged');
    const mail = await waitForMail(
      mailDir(),
      (m) =>
        m.to.includes('engineer@example.com') && m.subject.includes('Review journey') && m.subject.includes('finished'),
    );
    expect(mail.text).toContain(`/tests/${testId}/review`);
  });

  it('a draft export says DRAFT and has one row per gauge', async () => {
    const res = await qa.fetch(`/api/tests/${testId}/export.csv`);
    expect(res.status).toBe(200);
    const csv = await res.text();
    expect(csv).toContain('DRAFT');
    for (const g of ['H1', 'A1', 'H2'])
      expect(csv.split('\n').filter((l) => l.startsWith(`${g},`) || l.startsWith(`"${g}",`))).toHaveLength(1);
  });

  it('refuses a review while a flagged gauge has no disposition, and dispositions from the wrong role', async () => {
    const early = await sign(engineer, 'review');
    expect(early.status).toBe(409);
    expect(early.body.error.details.gaugeIds).toEqual(['H2']);
    expect(
      (
        await technician.json(`/api/tests/${testId}/dispositions`, {
          method: 'POST',
          json: { gaugeId: 'H2', outcome: 'accepted', reason: 'x y z' },
        })
      ).status,
    ).toBe(403);
    expect(
      (
        await engineer.json(`/api/tests/${testId}/dispositions`, {
          method: 'POST',
          json: { gaugeId: 'H2', outcome: 'accepted', reason: '' },
        })
      ).status,
    ).toBe(400);
    expect(
      (
        await engineer.json(`/api/tests/${testId}/dispositions`, {
          method: 'POST',
          json: { gaugeId: 'H9', outcome: 'accepted', reason: 'no such gauge' },
        })
      ).status,
    ).toBe(422);
  });

  it('keeps every disposition and counts the latest; the verdict follows', async () => {
    const retest = await engineer.json(`/api/tests/${testId}/dispositions`, {
      method: 'POST',
      json: { gaugeId: 'H2', outcome: 'retest', reason: 'check the bridge completion first' },
    });
    expect(retest.status).toBe(201);
    expect(retest.body.verdict).toBe('flagged');
    const accepted = await engineer.json(`/api/tests/${testId}/dispositions`, {
      method: 'POST',
      json: {
        gaugeId: 'H2',
        outcome: 'accepted',
        reason: 'gauge sits on a locally thicker plate, measured 11.7 mm by UT',
      },
    });
    expect(accepted.body.verdict).toBe('conforms');
    const list = await qa.json(`/api/tests/${testId}/dispositions`);
    expect(list.body.history).toHaveLength(2);
    expect(list.body.latest).toHaveLength(1);
    expect(list.body.latest[0].outcome).toBe('accepted');
  });

  it("asks for the signer's password: a wrong one is 401 and signs nothing; a missing one is 400", async () => {
    const wrong = await sign(engineer, 'review', { password: 'not-my-password-at-all' });
    expect(wrong.status).toBe(401);
    expect(wrong.body.error.code).toBe('wrong-password');
    const missing = await engineer.json(`/api/tests/${testId}/review`, {
      method: 'POST',
      json: { reductionId: await currentReductionId(testId) },
    });
    expect(missing.status).toBe(400);
    expect((await engineer.json(`/api/tests/${testId}`)).body.status).toBe('reduced');
    const trail = await admin.json(`/api/tests/${testId}/audit?limit=200`);
    expect(trail.body.items.some((e: { action: string }) => e.action === 'review-signed')).toBe(false);
  });

  it('refuses a signature on a reduction other than the current one (409), and any signature by API token', async () => {
    const stale = await sign(engineer, 'review', { reductionId: (await currentReductionId(testId)) + 1000 });
    expect(stale.status).toBe(409);
    expect(stale.body.error.code).toBe('stale-reduction');
    const made = await engineer.json('/api/account/tokens', {
      method: 'POST',
      json: { name: 'cannot sign', scopes: ['read', 'upload'] },
    });
    const viaToken = Client.withToken(made.body.token);
    const r = await sign(viaToken, 'review');
    expect(r.status).toBe(403);
    expect(r.body.error.code).toBe('token-not-allowed');
  });

  it('lets only the engineer sign the review, and only QA release it', async () => {
    expect((await sign(technician, 'review')).status).toBe(403);
    expect((await sign(admin, 'review')).status).toBe(403);
    expect((await sign(qa, 'release')).status).toBe(409);
    // the words the dialog showed must be the words signed: an out-of-date text is refused, nothing signed
    const stale = await sign(engineer, 'review', {
      shownStatement: 'I, Imke Sorensen (demo), have reviewed an older plan.',
    });
    expect(stale.status).toBe(409);
    expect(stale.body.error.code).toBe('statement-changed');
    expect(stale.body.error.message).toMatch(/Read the statement again and sign/);
    const current: string = stale.body.error.details.statement;
    expect((await engineer.json(`/api/tests/${testId}`)).body.status).toBe('reduced');
    const signed = await sign(engineer, 'review', {
      shownStatement: current,
      statement: 'Bridge completion of H2 checked on site.',
    });
    expect(signed.status).toBe(201);
    expect(signed.body.statement.startsWith(current)).toBe(true);
    // the stored signature says who, which reduction, and the statement signed
    expect(signed.body.statement).toContain('I, Imke Sorensen (demo), have reviewed reduction');
    expect(signed.body.statement).toContain('Remark: Bridge completion of H2 checked on site.');
    // … and the test conduct the plan records, which the signer attests
    expect(signed.body.statement).toContain(
      'The test is recorded as conducted under: written test procedure RV-HT-2 rev C; test medium water; metal temperature 18 °C; witnessed by K. Demo, inspector.',
    );
    const rec = await qa.json(`/api/tests/${testId}/record`);
    const sig = rec.body.signatures.find((x: { kind: string }) => x.kind === 'review');
    expect(sig.reductionId).toBe(signed.body.reductionId);
    expect(sig.statement).toBe(signed.body.statement);
    expect((await engineer.json(`/api/tests/${testId}`)).body.status).toBe('reviewed');
    const notice = await waitForMail(
      mailDir(),
      (m) =>
        m.to.includes('qa@example.com') &&
        m.subject.includes('waits for release') &&
        m.subject.includes('Review journey'),
    );
    expect(notice.text).toContain(`/tests/${testId}/review`);
    expect((await sign(engineer, 'release')).status).toBe(403);
    expect((await sign(admin, 'release')).status).toBe(403);
  });

  it('does not let the signer of the review release it, even with the QA role', async () => {
    const users = (await admin.json('/api/admin/users')).body.items;
    const eng = users.find((u: { email: string }) => u.email === 'engineer@example.com');
    expect((await admin.json(`/api/admin/users/${eng.id}`, { method: 'PATCH', json: { role: 'qa' } })).status).toBe(
      200,
    );
    const own = await sign(engineer, 'release');
    expect(own.status).toBe(403);
    expect(own.body.error.code).toBe('own-review');
    expect(
      (await admin.json(`/api/admin/users/${eng.id}`, { method: 'PATCH', json: { role: 'engineer' } })).status,
    ).toBe(200);
  });

  it('releases, after which every write answers 409', async () => {
    const rel = await sign(qa, 'release');
    expect(rel.status).toBe(201);
    expect(rel.body.snapshotSha256).toMatch(/^[0-9a-f]{64}$/);
    expect(rel.body.statement).toContain('written test procedure RV-HT-2 rev C');
    expect((await qa.json(`/api/tests/${testId}`)).body.status).toBe('released');
    expect(
      (
        await engineer.json(`/api/tests/${testId}/dispositions`, {
          method: 'POST',
          json: { gaugeId: 'H1', outcome: 'excluded', reason: 'too late' },
        })
      ).status,
    ).toBe(409);
    expect((await upload(technician, testId, log + '\n')).status).toBe(409);
    expect((await engineer.json(`/api/tests/${testId}/plan`, { method: 'PUT', json: plan })).status).toBe(409);
    expect((await technician.json(`/api/tests/${testId}/reductions`, { method: 'POST', json: {} })).status).toBe(409);
    expect(
      (await technician.json(`/api/tests/${testId}/notes`, { method: 'POST', json: { body: 'late note' } })).status,
    ).toBe(409);
    expect((await sign(qa, 'release')).status).toBe(409);
    expect((await engineer.json(`/api/tests/${testId}`, { method: 'PATCH', json: { name: 'renamed' } })).status).toBe(
      409,
    );
  });

  it('exports the released record: CSV without DRAFT, a real PDF with its font embedded and text inside', async () => {
    const csv = await (await technician.fetch(`/api/tests/${testId}/export.csv`)).text();
    expect(csv).not.toContain('DRAFT');
    expect(csv).toContain('gauge sits on a locally thicker plate');
    expect(csv).toContain('procedure_reference,RV-HT-2 rev C');
    const res = await qa.fetch(`/api/tests/${testId}/export.pdf`);
    expect(res.status).toBe(200);
    expect(res.headers.get('content-type')).toBe('application/pdf');
    const bytes = Buffer.from(await res.arrayBuffer());
    expect(bytes.subarray(0, 5).toString()).toBe('%PDF-');
    expect(bytes.toString('latin1')).toMatch(/\/FontFile[23]?\b/);
    const { extractPdfText } = await import('./support/pdf-text');
    const text = await extractPdfText(bytes);
    expect(text).toContain('Review journey');
    expect(text).toContain('RV-HT-2 rev C');
    expect(text).toContain('H2');
    expect(text).not.toContain('DRAFT');
  });

  it('keeps the released record frozen when its vessel and material are edited afterwards', async () => {
    const before = await (await qa.fetch(`/api/tests/${testId}/export.csv`)).text();
    const t = (await engineer.json(`/api/tests/${testId}`)).body;
    const vessel = await engineer.json(`/api/vessels/${t.vessel.id}`, {
      method: 'PATCH',
      json: { name: 'Renamed after release', wallThicknessMm: 12 },
    });
    expect(vessel.status).toBe(200);
    const material = await engineer.json(`/api/materials/${t.material.id}`, {
      method: 'PATCH',
      json: { name: 'renamed steel', yieldStrengthMPa: 999 },
    });
    expect(material.status).toBe(200);
    const after = await (await qa.fetch(`/api/tests/${testId}/export.csv`)).text();
    const strip = (csv: string) => csv.replace(/^# generated_at,.*$/m, '');
    expect(strip(after)).toBe(strip(before));
    expect(after).not.toContain('Renamed after release');
    const rec = (await qa.json(`/api/tests/${testId}/record`)).body;
    expect(rec.vessel.name).not.toBe('Renamed after release');
    expect(rec.vessel.wallThicknessMm).toBe(10);
    expect(rec.material.name).toBe('review-test steel');
    const report = await (await qa.fetch(`/tests/${testId}/report`)).text();
    expect(report).not.toContain('Renamed after release');
    const check = await qa.json(`/api/tests/${testId}/audit/verify`);
    expect(check.status).toBe(200);
    expect(check.body.ok).toBe(true);
    expect(check.body.snapshot.ok).toBe(true);
  });

  it('shares the record by e-mail with an inspector who needs no account', async () => {
    expect(
      (
        await engineer.json(`/api/tests/${testId}/share-links`, {
          method: 'POST',
          json: { email: 'inspector@example.com' },
        })
      ).status,
    ).toBe(403);
    const made = await qa.json(`/api/tests/${testId}/share-links`, {
      method: 'POST',
      json: { email: 'inspector@example.com', expiresInDays: 7 },
    });
    expect(made.status).toBe(201);
    const url: string = made.body.url;
    expect(url).toMatch(/\/share\/[A-Za-z0-9_-]{43}$/);
    const mail = await waitForMail(
      mailDir(),
      (m) => m.to.includes('inspector@example.com') && m.subject.includes('Review journey'),
    );
    expect(mail.text).toContain(url);
    const token = url.split('/share/')[1]!;
    const inspector = new Client();
    const page = await inspector.fetch(`/share/${token}`);
    expect(page.status).toBe(200);
    expect(await page.text()).toContain('Review journey');
    // the share link's token is never stored: not in the database's outbox, not in the audit trail
    const { outbox, auditEvents } = await import('../src/db/schema');
    const stored = JSON.stringify([
      ...(await (await db()).select().from(outbox)),
      ...(await (await db()).select().from(auditEvents)),
    ]);
    expect(stored).not.toContain(token);
    const rec = await inspector.json(`/api/share/${token}`);
    expect(rec.status).toBe(200);
    expect(rec.body.result.gauges).toHaveLength(3);
    // the inspector sees names and statements, never staff e-mail addresses
    expect(rec.body.signatures.map((x: { name: string }) => x.name)).toContain('Imke Sorensen (demo)');
    for (const staff of ['engineer@example.com', 'qa@example.com', 'technician@example.com'])
      expect(JSON.stringify(rec.body)).not.toContain(staff);
    const shared = await (await inspector.fetch(`/share/${token}`)).text();
    for (const staff of ['engineer@example.com', 'qa@example.com']) expect(shared).not.toContain(staff);
    expect(await (await inspector.fetch(`/api/share/${token}/export.csv`)).text()).not.toContain('qa@example.com');
    expect((await inspector.fetch(`/api/share/${token}/export.csv`)).status).toBe(200);
    expect((await inspector.fetch(`/api/share/${token}/export.pdf`)).status).toBe(200);
    expect((await inspector.json(`/api/share/${token}/series?points=100`)).status).toBe(200);
    // the link reads one test only and writes nothing
    expect((await inspector.json(`/api/share/${token}`, { method: 'POST', json: {} })).status).toBe(405);
    expect((await inspector.json(`/api/share/${token}/export.csv`, { method: 'DELETE' })).status).toBe(405);
    expect((await inspector.fetch(`/share/${token}`, { method: 'POST', body: 'x' })).status).toBe(405);
    expect((await inspector.json(`/api/tests/${testId}`)).status).toBe(401);
    const links = await qa.json(`/api/tests/${testId}/share-links`);
    const mine = links.body.items.find((l: { id: number }) => l.id === made.body.id);
    expect(mine.useCount).toBeGreaterThanOrEqual(5);
    expect(mine.lastUsedAt).not.toBeNull();
  });

  it('answers 410 once a link is revoked or expired', async () => {
    const a = await qa.json(`/api/tests/${testId}/share-links`, { method: 'POST', json: {} });
    const tokenA = a.body.url.split('/share/')[1];
    expect((await new Client().json(`/api/share/${tokenA}`)).status).toBe(200);
    expect((await qa.json(`/api/share-links/${a.body.id}`, { method: 'DELETE' })).status).toBe(200);
    expect((await new Client().json(`/api/share/${tokenA}`)).status).toBe(410);
    expect((await new Client().fetch(`/share/${tokenA}`)).status).toBe(410);

    const b = await qa.json(`/api/tests/${testId}/share-links`, { method: 'POST', json: { expiresInDays: 1 } });
    const { shareLinks } = await import('../src/db/schema');
    await (
      await db()
    )
      .update(shareLinks)
      .set({ expiresAt: new Date(Date.now() - 1000) })
      .where(eq(shareLinks.id, b.body.id));
    expect((await new Client().json(`/api/share/${b.body.url.split('/share/')[1]}`)).status).toBe(410);
    expect((await new Client().json('/api/share/not-a-real-token-at-all-000000000')).status).toBe(404);
    expect(
      (await qa.json(`/api/tests/${testId}/share-links`, { method: 'POST', json: { expiresInDays: 91 } })).status,
    ).toBe(400);
  });

  it('shows QA and admin the audit trail, newest first, and nobody else', async () => {
    const trail = await qa.json(`/api/tests/${testId}/audit?limit=200`);
    expect(trail.status).toBe(200);
    const actions = trail.body.items.map((e: { action: string }) => e.action);
    for (const a of [
      'test-created',
      'log-uploaded',
      'reduction-queued',
      'reduction-done',
      'gauge-dispositioned',
      'review-signed',
      'test-released',
      'share-link-created',
      'share-link-used',
      'share-link-revoked',
    ])
      expect(actions).toContain(a);
    const times = trail.body.items.map((e: { at: string }) => new Date(e.at).getTime());
    expect([...times].sort((x, y) => y - x)).toEqual(times);
    expect((await admin.json(`/api/tests/${testId}/audit`)).status).toBe(200);
    expect((await engineer.json(`/api/tests/${testId}/audit`)).status).toBe(403);
    expect((await technician.json(`/api/tests/${testId}/audit`)).status).toBe(403);
  });
});

describe('the outbox', () => {
  it('keeps a message while the SMTP server is down and delivers it when it is back', async () => {
    await stopProcess(worker); // it drains the outbox too, to the test's own SMTP fake
    const { freePort } = await import('./global-setup');
    const { startSmtp } = await import('../fake-services/smtp.mjs');
    const { resetConfigForTests } = await import('../src/config.server');
    const { resetMailerForTests } = await import('../src/server/mail.server');
    const { queueMail, deliverDueMail } = await import('../src/server/outbox.server');
    const { outbox } = await import('../src/db/schema');
    const port = await freePort();
    const saved = process.env.SMTP_PORT;
    process.env.SMTP_PORT = String(port);
    resetConfigForTests();
    resetMailerForTests();
    try {
      const id = await queueMail('someone@example.com', 'Outage check', 'This must not be lost.');
      await new Promise((r) => setTimeout(r, 300));
      await deliverDueMail();
      const [pending] = await (await db()).select().from(outbox).where(eq(outbox.id, id));
      expect(pending!.status).toBe('pending');
      expect(pending!.attempts).toBeGreaterThanOrEqual(1);
      expect(pending!.lastError).toBeTruthy();

      const dir = path.join(inject('dataDir'), 'mail-after-outage');
      const smtp = await startSmtp({ directory: dir, port });
      try {
        const deadline = Date.now() + 10_000;
        let sent = false;
        while (!sent && Date.now() < deadline) {
          await deliverDueMail();
          const [row] = await (await db()).select().from(outbox).where(eq(outbox.id, id));
          sent = row!.status === 'sent';
          if (!sent) await new Promise((r) => setTimeout(r, 200));
        }
        expect(sent).toBe(true);
        expect(
          (await readMails(dir)).some((m) => m.subject === 'Outage check' && m.to.includes('someone@example.com')),
        ).toBe(true);
      } finally {
        await smtp.close();
      }
    } finally {
      process.env.SMTP_PORT = saved;
      resetConfigForTests();
      resetMailerForTests();
    }
  });
});
