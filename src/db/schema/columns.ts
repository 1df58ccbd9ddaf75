// Column helpers shared by the schema files. MariaDB rejects what Drizzle's serial() emits,
// so ids are unsigned auto-increment BIGINTs in number mode (STACK.md).
import { bigint, customType, datetime } from 'drizzle-orm/mysql-core';

export const id = () => bigint('id', { mode: 'number', unsigned: true }).autoincrement().primaryKey();
export const ref = (name: string) => bigint(name, { mode: 'number', unsigned: true });
export const at = (name: string) => datetime(name, { mode: 'date', fsp: 3 });
export const createdAt = () =>
  at('created_at')
    .notNull()
    .$defaultFn(() => new Date());

/**
 * A JSON column that reads back as a value on MariaDB too: there JSON is LONGTEXT with a
 * CHECK, so mysql2 hands back a string that Drizzle's json() would not parse.
 */
export const json = customType<{ data: unknown; driverData: string }>({
  dataType: () => 'json',
  toDriver: (value) => JSON.stringify(value),
  fromDriver: (value) => (typeof value === 'string' ? JSON.parse(value) : value),
});
