import { bigint, double, index, int, mysqlTable, uniqueIndex, varchar } from 'drizzle-orm/mysql-core';
import { createdAt, id, ref, json } from './columns';
import { tests } from './tests';
import { users } from './users';

export const logFiles = mysqlTable(
  'log_files',
  {
    id: id(),
    testId: ref('test_id')
      .notNull()
      .references(() => tests.id),
    objectKey: varchar('object_key', { length: 400 }).notNull(),
    filename: varchar('filename', { length: 255 }).notNull(),
    sha256: varchar('sha256', { length: 64 }).notNull(),
    sizeBytes: bigint('size_bytes', { mode: 'number', unsigned: true }).notNull(),
    rows: int('rows'),
    timeStart: double('time_start'),
    timeEnd: double('time_end'),
    /** what the header check found: delimiter, header line, columns, mapping to the plan */
    columnMap: json('column_map').$type<Record<string, unknown>>().notNull(),
    uploadedBy: ref('uploaded_by').references(() => users.id),
    createdAt: createdAt(),
  },
  (t) => [uniqueIndex('log_files_test_sha_uq').on(t.testId, t.sha256), index('log_files_test_idx').on(t.testId)],
);

export type LogFile = typeof logFiles.$inferSelect;
export type NewLogFile = typeof logFiles.$inferInsert;
