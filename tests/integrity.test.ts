// The database keeps the promise on its own: triggers refuse changes to audit rows and to a
// released record (while the app's own writes still work), the audit trail is a hash chain that
// shows any row changed or removed behind the triggers' back, and the migrations — triggers
// included — apply to an empty database and seal audit rows written before the chain existed.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { inject } from 'vitest';
import type { ChildProcess } from 'node:child_process';
import { copyFileSync, mkdirSync, mkdtempSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { runRootSql } from '../fake-services/mariadb.mjs';
import { signedIn, type Client } from './support/http';
import { releasedTest, reducedTest, uploadLog, journeyLog, type Crew } from './support/journey';
import { startWorker, stopProcess } from './support/processes';

let crew: Crew;
let admin: Client;
let worker: ChildProcess;
const rootDir = () => path.join(inject('dataDir'), 'mariadb');

async function pool() {
  const { getPool } = await import('../src/db/client.server');
  return getPool();
}

/** Run raw SQL as the app's own database user; resolves to the error message, or null when it worked. */
async function rawSql(statement: string, params: unknown[] = []): Promise<string | null> {
  try {
    await (await pool()).query(statement, params);
    return null;
  } catch (err) {
    return (err as Error).message;
  }
}

/** A database of its own, migrated, with a Drizzle handle; for tests that drop triggers. */
async function scratchDatabase(name: string, migrationsFolder?: string) {
  runRootSql(
    { dataDir: rootDir() },
    `DROP DATABASE IF EXISTS ${name}; CREATE DATABASE ${name}; GRANT ALL ON ${name}.* TO 'hoopline'@'127.0.0.1';`,
  );
  const url = String(inject('env').DATABASE_URL).replace(/\/hoopline$/, `/${name}`);
  const { migrateDatabase } = await import('../src/db/migrate.server');
  await migrateDatabase(url, migrationsFolder);
  const { createPool } = await import('../src/db/client.server');
  const { drizzle } = await import('drizzle-orm/mysql2');
  const schema = await import('../src/db/schema');
  const p = createPool(url);
  return { url, pool: p, db: drizzle(p, { schema, mode: 'default' }), migrate: migrateDatabase };
}

beforeAll(async () => {
  worker = startWorker(inject('env'), 'w-integrity');
  const [engineer, technician, qa, a] = await Promise.all([
    signedIn('engineer@example.com'),
    signedIn('technician@example.com'),
    signedIn('qa@example.com'),
    signedIn('admin@example.com'),
  ]);
  crew = { engineer, technician, qa };
  admin = a;
});
afterAll(async () => {
  await stopProcess(worker);
});

describe('migrations', () => {
  it('create every trigger on an empty database, and applying them again changes nothing', async () => {
    const s = await scratchDatabase('triggers_check');
    try {
      const names = runRootSql(
        { dataDir: rootDir() },
        "SELECT trigger_name FROM information_schema.triggers WHERE trigger_schema = 'triggers_check' ORDER BY 1;",
      )
        .trim()
        .split('\n');
      for (const t of [
        'audit_events_append_only_update',
        'audit_events_append_only_delete',
        'tests_released_update',
        'release_snapshots_update',
        'reductions_released_update',
        'signatures_no_update',
        'dispositions_no_delete',
        'log_files_released_insert',
      ])
        expect(names).toContain(t);
      expect(names.length).toBeGreaterThanOrEqual(28);
      await s.migrate(s.url);
    } finally {
      await s.pool.end();
    }
  });

  it('seal audit rows written before the chain existed, oldest first, into a chain that checks out', async () => {
    // a database at the first migration only, with audit rows as the old code wrote them
    const folder = mkdtempSync(path.join(tmpdir(), 'hoopline-migrations-'));
    mkdirSync(path.join(folder, 'meta'));
    copyFileSync('migrations/0000_init.sql', path.join(folder, '0000_init.sql'));
    const journal = JSON.parse(readFileSync('migrations/meta/_journal.json', 'utf8'));
    journal.entries = journal.entries.slice(0, 1);
    writeFileSync(path.join(folder, 'meta/_journal.json'), JSON.stringify(journal));
    const s = await scratchDatabase('legacy_audit', folder);
    try {
      await s.pool.query(
        "INSERT INTO audit_events (at, actor, action, details) VALUES (NOW(3), 'old@example.com', 'sign-in', '{}'), (NOW(3), 'old@example.com', 'role-changed', '{\"to\":\"qa\"}')",
      );
      await s.migrate(s.url); // the rest of the migrations, then the sealing
      const { verifyAuditChain } = await import('../src/db/queries/audit');
      const check = await verifyAuditChain(s.db, 0);
      expect(check).toEqual({ ok: true, rows: 2, firstBadRow: null, problem: null });
      // sealed once: now the rows are as immutable as any other
      expect(await s.pool.query("UPDATE audit_events SET hash = REPEAT('0', 64)").catch((e) => e.message)).toMatch(
        /append-only/,
      );
    } finally {
      await s.pool.end();
    }
  });
});

describe('triggers', () => {
  it('refuse a raw SQL UPDATE or DELETE of an audit row, and a row without its chain place', async () => {
    expect(await rawSql("UPDATE audit_events SET actor = 'someone else' ORDER BY id LIMIT 1")).toMatch(
      /audit_events is append-only: a row cannot be changed/,
    );
    expect(await rawSql('DELETE FROM audit_events ORDER BY id DESC LIMIT 1')).toMatch(
      /audit_events is append-only: a row cannot be deleted/,
    );
    expect(
      await rawSql("INSERT INTO audit_events (at, actor, action, details) VALUES (NOW(3), 'x', 'forged', '{}')"),
    ).toMatch(/must carry its place in the hash chain/);
  });

  it('refuse any change to a released test, its frozen record, reduction, results, signatures and dispositions', async () => {
    const { testId, reductionId } = await releasedTest(crew, 'Trigger check');
    const refusals: [string, unknown[]][] = [
      ["UPDATE tests SET name = 'edited by hand' WHERE id = ?", [testId]],
      ["UPDATE tests SET status = 'reviewed' WHERE id = ?", [testId]],
      ['DELETE FROM tests WHERE id = ?', [testId]],
      ["UPDATE release_snapshots SET sha256 = REPEAT('a', 64) WHERE test_id = ?", [testId]],
      ['DELETE FROM release_snapshots WHERE test_id = ?', [testId]],
      ['UPDATE reductions SET superseded = true WHERE id = ?', [reductionId]],
      ['DELETE FROM gauge_results WHERE reduction_id = ?', [reductionId]],
      ['UPDATE gauge_results SET measured_slope = 0 WHERE reduction_id = ?', [reductionId]],
      ["UPDATE signatures SET statement = 'something else' WHERE test_id = ?", [testId]],
      ['DELETE FROM signatures WHERE test_id = ?', [testId]],
      [
        "INSERT INTO dispositions (test_id, reduction_id, gauge_id, outcome, reason, user_id, created_at) VALUES (?, ?, 'H1', 'excluded', 'late', 1, NOW(3))",
        [testId, reductionId],
      ],
      [
        "INSERT INTO log_files (test_id, object_key, filename, sha256, size_bytes, column_map, created_at) VALUES (?, 'x', 'late.csv', REPEAT('b', 64), 1, '{}', NOW(3))",
        [testId],
      ],
      [
        "INSERT INTO notes (test_id, user_id, kind, body, created_at) VALUES (?, 1, 'general', 'late', NOW(3))",
        [testId],
      ],
      ['DELETE FROM gauges WHERE test_id = ?', [testId]],
    ];
    for (const [statement, params] of refusals) expect(await rawSql(statement, params), statement).toMatch(/\w+: /);
    const [[row]] = (await (
      await pool()
    ).query('SELECT name, status FROM tests WHERE id = ?', [testId])) as unknown as [
      { name: string; status: string }[],
    ];
    expect(row).toEqual({ name: 'Trigger check', status: 'released' });
    // the app's writes that are still allowed on a released test go through: share links, audit rows
    const link = await crew.qa.json(`/api/tests/${testId}/share-links`, { method: 'POST', json: {} });
    expect(link.status).toBe(201);
    expect((await admin.json(`/api/tests/${testId}/audit/verify`)).body.ok).toBe(true);
  });

  it('refuse to mark a test released without its frozen record, and a disposition ever changed', async () => {
    const { testId } = await reducedTest(crew, 'Not released by hand');
    expect(await rawSql("UPDATE tests SET status = 'released' WHERE id = ?", [testId])).toMatch(
      /released only together with its frozen record/,
    );
    const d = await crew.engineer.json(`/api/tests/${testId}/dispositions`, {
      method: 'POST',
      json: { gaugeId: 'H1', outcome: 'accepted', reason: 'checked on site' },
    });
    expect(d.status).toBe(201);
    expect(await rawSql("UPDATE dispositions SET reason = 'rewritten' WHERE test_id = ?", [testId])).toMatch(
      /a disposition cannot change/,
    );
    // and the record keeps working through the app: a new log returns it to logging
    expect((await uploadLog(crew.technician, testId, journeyLog(2))).status).toBe(201);
  });
});

describe('the audit hash chain', () => {
  it('checks out end to end for a test, through the API and on the audit page', async () => {
    const { testId } = await releasedTest(crew, 'Chain check');
    const check = await admin.json(`/api/tests/${testId}/audit/verify`);
    expect(check.status).toBe(200);
    const trail = await admin.json(`/api/tests/${testId}/audit?limit=200`);
    expect(check.body).toMatchObject({ ok: true, rows: trail.body.items.length, firstBadRow: null });
    expect(check.body.snapshot.ok).toBe(true);
    expect((await crew.qa.json(`/api/tests/${testId}/audit/verify`)).status).toBe(200);
    expect((await crew.engineer.json(`/api/tests/${testId}/audit/verify`)).status).toBe(403);
    const page = await (await admin.fetch(`/admin/audit?test=${testId}`)).text();
    expect(page).toContain(`Intact: the ${check.body.rows} events of test #${testId} form an unbroken hash chain`);
    const whole = await (await admin.fetch('/admin/audit?verify=all')).text();
    expect(whole).toMatch(/Intact: \d+ events in \d+ chains/);
  });

  it('finds a row changed, and a row removed, behind the triggers\u2019 back', async () => {
    const s = await scratchDatabase('chain_tamper');
    try {
      const { appendAuditEvent, verifyAuditChain } = await import('../src/db/queries/audit');
      const { auditEvents } = await import('../src/db/schema');
      const { eq } = await import('drizzle-orm');
      for (let i = 1; i <= 5; i++)
        await appendAuditEvent(s.db, { actor: 'qa@example.com', action: `step-${i}`, testId: null, details: { i } });
      expect((await verifyAuditChain(s.db, 0)).ok).toBe(true);
      const rows = await s.db.select().from(auditEvents).orderBy(auditEvents.id);
      // someone with root drops the triggers and edits history
      runRootSql(
        { dataDir: rootDir() },
        'USE chain_tamper; DROP TRIGGER audit_events_append_only_update; DROP TRIGGER audit_events_append_only_delete;',
      );
      await s.db
        .update(auditEvents)
        .set({ details: { i: 99 } })
        .where(eq(auditEvents.id, rows[2]!.id));
      const changed = await verifyAuditChain(s.db, 0);
      expect(changed).toMatchObject({
        ok: false,
        firstBadRow: rows[2]!.id,
        problem: 'the row was changed after it was written',
      });
      await s.db
        .update(auditEvents)
        .set({ details: { i: 3 } })
        .where(eq(auditEvents.id, rows[2]!.id));
      expect((await verifyAuditChain(s.db, 0)).ok).toBe(true);
      await s.db.delete(auditEvents).where(eq(auditEvents.id, rows[1]!.id));
      const removed = await verifyAuditChain(s.db, 0);
      expect(removed).toMatchObject({ ok: false, firstBadRow: rows[2]!.id, problem: 'row 2 of the chain is missing' });
      // the newest row removed: the chain's recorded head no longer matches
      await s.db.delete(auditEvents).where(eq(auditEvents.id, rows[4]!.id));
      await s.db.delete(auditEvents).where(eq(auditEvents.id, rows[2]!.id));
      await s.db.delete(auditEvents).where(eq(auditEvents.id, rows[3]!.id));
      const cut = await verifyAuditChain(s.db, 0);
      expect(cut.ok).toBe(false);
      expect(cut.problem).toMatch(/should hold 5 rows; 1 are there/);
    } finally {
      await s.pool.end();
    }
  });
});

describe('a deadlock inside an audited change', () => {
  it('is retried as a whole, never turned into a "SAVEPOINT does not exist" error', async () => {
    // Two changes take the same two locks in opposite order: a material row, then the audit chain
    // head (appending inside the change's transaction), and the chain head, then the material
    // row. MariaDB rolls one of them back as a deadlock victim; that one must run again.
    const s = await scratchDatabase('deadlock_retry');
    try {
      const { transaction } = await import('../src/db/queries/transaction');
      const { appendAuditEvent } = await import('../src/db/queries/audit');
      const { materials, auditEvents } = await import('../src/db/schema');
      const { eq } = await import('drizzle-orm');
      await s.db
        .insert(materials)
        .values({ name: 'deadlock steel', elasticModulusMPa: 200000, poissonRatio: 0.3, yieldStrengthMPa: 260 });
      const [m] = await s.db.select().from(materials).where(eq(materials.name, 'deadlock steel'));
      const pause = () => new Promise((r) => setTimeout(r, 150));
      const runs = { a: 0, b: 0 };
      const a = transaction(s.db, async (tx) => {
        runs.a++;
        await tx.select().from(materials).where(eq(materials.id, m!.id)).for('update');
        await pause();
        await appendAuditEvent(tx, { actor: 'a', action: 'deadlock-a' });
      });
      const b = transaction(s.db, async (tx) => {
        runs.b++;
        await appendAuditEvent(tx, { actor: 'b', action: 'deadlock-b' });
        await pause();
        await tx.select().from(materials).where(eq(materials.id, m!.id)).for('update');
      });
      await Promise.all([a, b]);
      // one of them was the victim and ran twice; both committed, each audit row once, in one chain
      expect(runs.a + runs.b).toBeGreaterThanOrEqual(3);
      const rows = await s.db.select().from(auditEvents).orderBy(auditEvents.chainSeq);
      expect(rows.map((r) => r.action).sort()).toEqual(['deadlock-a', 'deadlock-b']);
      expect(rows.map((r) => r.chainSeq)).toEqual([1, 2]);
      expect(rows[1]!.prevHash).toBe(rows[0]!.hash);
    } finally {
      await s.pool.end();
    }
  });
});
