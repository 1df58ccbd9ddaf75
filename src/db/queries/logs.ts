import { and, asc, eq } from 'drizzle-orm';
import type { Conn } from '../client.server';
import { logFiles, type NewLogFile } from '../schema';
import { insertedId } from './inserted-id';

export const listLogs = (db: Conn, testId: number) =>
  db.select().from(logFiles).where(eq(logFiles.testId, testId)).orderBy(asc(logFiles.id));

export const findLogBySha = (db: Conn, testId: number, sha256: string) =>
  db.query.logFiles.findFirst({ where: and(eq(logFiles.testId, testId), eq(logFiles.sha256, sha256)) });

export async function insertLog(db: Conn, l: NewLogFile) {
  return insertedId(await db.insert(logFiles).values(l).$returningId());
}
