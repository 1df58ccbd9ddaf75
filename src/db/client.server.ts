// The one database connection pool. Server-only: islands never import this.
import type { MySqlDatabase } from 'drizzle-orm/mysql-core';
import {
  drizzle,
  type MySql2Database,
  type MySql2PreparedQueryHKT,
  type MySql2QueryResultHKT,
} from 'drizzle-orm/mysql2';
import mysql from 'mysql2/promise';
import { getConfig } from '../config.server';
import { transaction } from './queries/transaction';
import { onShutdown } from '../lifecycle.server';
import * as schema from './schema';

export type Db = MySql2Database<typeof schema>;
/** A transaction on the app's database. */
export type Tx = Parameters<Parameters<Db['transaction']>[0]>[0];
/** The pool-backed database or a transaction on it: every query function takes either. */
export type Conn = MySqlDatabase<MySql2QueryResultHKT, MySql2PreparedQueryHKT, typeof schema>;

let handle: { pool: mysql.Pool; db: Db } | null = null;

/** Create a pool for a URL (times stored as UTC; numbers stay numbers). */
export function createPool(url: string): mysql.Pool {
  return mysql.createPool({
    uri: url,
    connectionLimit: 10,
    timezone: 'Z',
    dateStrings: false,
    supportBigNumbers: true,
    decimalNumbers: true,
    connectTimeout: 5_000,
  });
}

/** The app's Drizzle handle, created on first use from DATABASE_URL. */
function open(): { pool: mysql.Pool; db: Db } {
  if (!handle) {
    const pool = createPool(getConfig().DATABASE_URL);
    handle = { pool, db: drizzle(pool, { schema, mode: 'default' }) };
    onShutdown('database pool', closeDb);
  }
  return handle;
}

export function getDb(): Db {
  return open().db;
}

/**
 * Run `fn` in one transaction (REPEATABLE READ): it commits when `fn` resolves and rolls back
 * when it throws. When MariaDB picks it as a deadlock victim it runs again (queries/transaction.ts),
 * so `fn` must only touch the database.
 */
export async function inTransaction<T>(fn: (tx: Tx) => Promise<T>, db: Db = getDb()): Promise<T> {
  // given the pool, `transaction` hands `fn` the transaction it opened
  return transaction(db, (tx) => fn(tx as Tx));
}

/** The raw pool (health checks, FOR UPDATE SKIP LOCKED claims). */
export function getPool(): mysql.Pool {
  return open().pool;
}

/** Close the pool (worker shutdown, tests). */
export async function closeDb(): Promise<void> {
  const h = handle;
  handle = null;
  if (h) await h.pool.end();
}

/** Whether MariaDB answers a trivial query within `timeoutMs` (health checks). */
export async function databaseAnswers(timeoutMs = 2000): Promise<boolean> {
  let timer: NodeJS.Timeout | undefined;
  try {
    await Promise.race([
      getPool().query('SELECT 1'),
      new Promise((_, reject) => {
        timer = setTimeout(() => reject(new Error('timeout')), timeoutMs);
      }),
    ]);
    return true;
  } catch {
    return false;
  } finally {
    clearTimeout(timer);
  }
}
