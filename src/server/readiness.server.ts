// Readiness (GET /api/ready): whether this server should get traffic. MariaDB and object storage
// answer, the database has every migration this build ships, and the server is not draining
// for a shutdown. Liveness stays GET /api/health.
import journal from '../../migrations/meta/_journal.json';
import { databaseAnswers, getDb } from '../db/client.server';
import { newestAppliedMigrationMillis } from '../db/queries/operations';
import { isDraining } from '../lifecycle.server';
import { storageAnswers } from './storage.server';

/** The `when` of the newest migration in migrations/ (drizzle stores it as `created_at`). */
export const NEWEST_MIGRATION_MILLIS = Math.max(...journal.entries.map((e) => e.when));

export interface Readiness {
  ready: boolean;
  db: boolean;
  storage: boolean;
  migrations: 'current' | 'pending' | 'unknown';
  draining: boolean;
}

async function migrationState(): Promise<Readiness['migrations']> {
  try {
    const applied = await newestAppliedMigrationMillis(getDb());
    return applied !== null && applied >= NEWEST_MIGRATION_MILLIS ? 'current' : 'pending';
  } catch {
    return 'unknown';
  }
}

export async function checkReadiness(): Promise<Readiness> {
  const draining = isDraining();
  const [db, storage] = await Promise.all([databaseAnswers(), storageAnswers()]);
  const migrations = db ? await migrationState() : 'unknown';
  return { ready: !draining && db && storage && migrations === 'current', db, storage, migrations, draining };
}
