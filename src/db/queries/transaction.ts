// One rule for every transaction of the query layer. Given the pool, open a transaction and run
// it again when MariaDB picks it as a deadlock victim (InnoDB has then rolled all of it back, so
// a retry is safe). Given a transaction already, run inside it: no savepoint. A savepoint does not
// survive a deadlock (the whole transaction is gone), and Drizzle's ROLLBACK TO SAVEPOINT would
// then fail with "SAVEPOINT … does not exist", hiding the deadlock from the outer retry.
import { MySqlTransaction } from 'drizzle-orm/mysql-core';
import type { Conn } from '../client.server';
import { isDeadlock } from '../errors';

/** How many times a deadlocked transaction is tried in all. */
export const DEADLOCK_ATTEMPTS = 4;

export function isTransaction(db: Conn): boolean {
  return db instanceof MySqlTransaction;
}

export async function transaction<T>(db: Conn, fn: (tx: Conn) => Promise<T>): Promise<T> {
  if (isTransaction(db)) return fn(db);
  for (let attempt = 1; ; attempt++) {
    try {
      return await db.transaction((tx) => fn(tx));
    } catch (err) {
      if (attempt >= DEADLOCK_ATTEMPTS || !isDeadlock(err)) throw err;
      await new Promise((r) => setTimeout(r, 20 * attempt + Math.random() * 30));
    }
  }
}
