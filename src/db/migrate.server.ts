// Applies migrations/ with drizzle's migrator (drizzle-kit push does not work on MariaDB), then
// gives audit rows written before the hash chain existed their place in it.
import { drizzle } from 'drizzle-orm/mysql2';
import { migrate } from 'drizzle-orm/mysql2/migrator';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { createPool } from './client.server';
import { sealUnchainedAuditRows } from './queries/audit';
import * as schema from './schema';

export const migrationsFolder = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '../../migrations');

/** Migrate the database at `url` to the newest schema. */
export async function migrateDatabase(url: string, folder = migrationsFolder): Promise<void> {
  const pool = createPool(url);
  try {
    const db = drizzle(pool, { schema, mode: 'default' });
    await migrate(db, { migrationsFolder: folder });
    // (a folder that stops before the chain columns exist has nothing to seal)
    const [cols] = await pool.query(
      "SELECT 1 FROM information_schema.columns WHERE table_schema = DATABASE() AND table_name = 'audit_events' AND column_name = 'hash'",
    );
    if ((cols as unknown[]).length) await sealUnchainedAuditRows(db);
  } finally {
    await pool.end();
  }
}
