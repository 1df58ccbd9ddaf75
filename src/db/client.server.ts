// The one database connection pool. Server-only: islands never import this.
import { drizzle, type MySql2Database } from 'drizzle-orm/mysql2';
import mysql from 'mysql2/promise';
import { getConfig } from '../server/config';
import * as schema from './schema';

export type Db = MySql2Database<typeof schema>;

let pool: mysql.Pool | null = null;
let db: Db | null = null;

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
export function getDb(): Db {
  if (!db) {
    pool = createPool(getConfig().DATABASE_URL);
    db = drizzle(pool, { schema, mode: 'default' });
  }
  return db;
}

/** The raw pool (health checks, FOR UPDATE SKIP LOCKED claims). */
export function getPool(): mysql.Pool {
  getDb();
  return pool!;
}

/** Close the pool (worker shutdown, tests). */
export async function closeDb(): Promise<void> {
  if (pool) await pool.end();
  pool = null;
  db = null;
}
