import { and, asc, count, desc, eq, inArray, type SQL } from 'drizzle-orm';
import type { Conn } from '../client.server';
import { gauges, materials, notes, tests, users, vessels, type NewGauge, type TestStatus } from '../schema';
import { insertedId } from './inserted-id';

export interface TestFilter {
  status?: TestStatus[];
  vesselId?: number;
  limit: number;
  offset: number;
}

export async function listTests(db: Conn, f: TestFilter) {
  const where: SQL[] = [];
  if (f.status?.length) where.push(inArray(tests.status, f.status));
  if (f.vesselId) where.push(eq(tests.vesselId, f.vesselId));
  const cond = where.length ? and(...where) : undefined;
  const [items, [total]] = await Promise.all([
    db
      .select({
        id: tests.id,
        name: tests.name,
        status: tests.status,
        verdict: tests.verdict,
        flaggedCount: tests.flaggedCount,
        vesselId: tests.vesselId,
        vesselTag: vessels.tag,
        vesselName: vessels.name,
        currentReductionId: tests.currentReductionId,
        createdAt: tests.createdAt,
        lastActivityAt: tests.lastActivityAt,
      })
      .from(tests)
      .innerJoin(vessels, eq(vessels.id, tests.vesselId))
      .where(cond)
      .orderBy(desc(tests.lastActivityAt), desc(tests.id))
      .limit(f.limit)
      .offset(f.offset),
    db.select({ n: count() }).from(tests).where(cond),
  ]);
  return { items, total: total?.n ?? 0 };
}

export const findTest = (db: Conn, id: number) => db.query.tests.findFirst({ where: eq(tests.id, id) });

/**
 * The test row, locked until the transaction ends (SELECT … FOR UPDATE): every change of a
 * test's state takes this lock first and re-checks the status under it.
 */
export async function lockTest(tx: Conn, id: number) {
  const [row] = await tx.select().from(tests).where(eq(tests.id, id)).for('update');
  return row;
}

/** The test with its vessel, material and owner, for pages and exports. */
export async function findTestWithVessel(db: Conn, id: number) {
  const [row] = await db
    .select({
      test: tests,
      vessel: vessels,
      material: materials,
      owner: { id: users.id, name: users.name, email: users.email },
    })
    .from(tests)
    .innerJoin(vessels, eq(vessels.id, tests.vesselId))
    .leftJoin(materials, eq(materials.id, vessels.materialId))
    .leftJoin(users, eq(users.id, tests.ownerId))
    .where(eq(tests.id, id));
  return row;
}

export async function insertTest(
  db: Conn,
  t: { name: string; vesselId: number; plan: unknown; ownerId: number; status?: TestStatus },
) {
  return insertedId(
    await db
      .insert(tests)
      .values({ status: 'draft', ...t })
      .$returningId(),
  );
}

export const findTestByName = (db: Conn, name: string) => db.query.tests.findFirst({ where: eq(tests.name, name) });

export async function updateTest(db: Conn, id: number, set: Partial<typeof tests.$inferInsert>) {
  await db
    .update(tests)
    .set({ ...set, updatedAt: new Date(), lastActivityAt: new Date() })
    .where(eq(tests.id, id));
}

/** Rewrite the test's gauge rows from its plan (the installation as planned); call it inside a transaction. */
export async function replaceGauges(db: Conn, testId: number, rows: Omit<NewGauge, 'testId'>[]) {
  await db.delete(gauges).where(eq(gauges.testId, testId));
  if (rows.length) await db.insert(gauges).values(rows.map((r) => ({ ...r, testId })));
}

export const listGauges = (db: Conn, testId: number) =>
  db.select().from(gauges).where(eq(gauges.testId, testId)).orderBy(asc(gauges.id));

export async function insertNote(
  db: Conn,
  n: { testId: number; userId: number; kind: (typeof notes.$inferInsert)['kind']; body: string },
) {
  return insertedId(await db.insert(notes).values(n).$returningId());
}

export const listNotes = (db: Conn, testId: number) =>
  db
    .select({ id: notes.id, kind: notes.kind, body: notes.body, createdAt: notes.createdAt, author: users.name })
    .from(notes)
    .innerJoin(users, eq(users.id, notes.userId))
    .where(eq(notes.testId, testId))
    .orderBy(desc(notes.createdAt));
