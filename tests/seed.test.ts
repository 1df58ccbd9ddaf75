// The demo seed never resets an existing account (its password, role or disabled state) unless
// DEMO_RESET=true, and refuses a demo password that breaks the password rule.
import { describe, expect, it } from 'vitest';
import { inject } from 'vitest';
import path from 'node:path';
import { eq } from 'drizzle-orm';
import { runRootSql } from '../fake-services/mariadb.mjs';

async function scratch() {
  const dataDir = path.join(inject('dataDir'), 'mariadb');
  runRootSql(
    { dataDir },
    "DROP DATABASE IF EXISTS seed_check; CREATE DATABASE seed_check; GRANT ALL ON seed_check.* TO 'hoopline'@'127.0.0.1';",
  );
  const url = String(inject('env').DATABASE_URL).replace(/\/hoopline$/, '/seed_check');
  const { migrateDatabase } = await import('../src/db/migrate.server');
  await migrateDatabase(url);
  const { createPool } = await import('../src/db/client.server');
  const { drizzle } = await import('drizzle-orm/mysql2');
  const schema = await import('../src/db/schema');
  const pool = createPool(url);
  return { pool, db: drizzle(pool, { schema, mode: 'default' }) };
}

describe('the demo seed', () => {
  it('creates missing accounts, and leaves existing ones alone unless told to reset them', async () => {
    const { pool, db } = await scratch();
    try {
      const { seedDemoAccounts } = await import('../src/server/demo-seed.server');
      const { users } = await import('../src/db/schema');
      const { verifyPassword } = await import('../src/server/auth/passwords.server');
      const first = await seedDemoAccounts(db, 'first-demo-password-42', { reset: false });
      expect(first).toMatchObject({ users: 4, created: 4, reset: 0 });
      // the owner of the demo admin changed its password and disabled the demo engineer
      const { hashPassword } = await import('../src/server/auth/passwords.server');
      await db
        .update(users)
        .set({ passwordHash: await hashPassword('chosen-by-the-owner-77') })
        .where(eq(users.email, 'admin@example.com'));
      await db.update(users).set({ disabled: true }).where(eq(users.email, 'engineer@example.com'));
      const again = await seedDemoAccounts(db, 'first-demo-password-42', { reset: false });
      expect(again).toMatchObject({ created: 0, reset: 0 });
      const admin = (await db.select().from(users).where(eq(users.email, 'admin@example.com')))[0]!;
      expect(await verifyPassword('chosen-by-the-owner-77', admin.passwordHash)).toBe(true);
      expect((await db.select().from(users).where(eq(users.email, 'engineer@example.com')))[0]!.disabled).toBe(true);
      const reset = await seedDemoAccounts(db, 'second-demo-password-42', { reset: true });
      expect(reset).toMatchObject({ created: 0, reset: 4 });
      const after = (await db.select().from(users).where(eq(users.email, 'admin@example.com')))[0]!;
      expect(await verifyPassword('second-demo-password-42', after.passwordHash)).toBe(true);
      expect((await db.select().from(users).where(eq(users.email, 'engineer@example.com')))[0]!.disabled).toBe(false);
      // a chosen demo password must be a real one; the contract's published default is taken as it is
      await expect(seedDemoAccounts(db, 'password1234', { reset: true })).rejects.toThrow(/DEMO_PASSWORD/);
      await seedDemoAccounts(db, 'hoopline-demo', { reset: true });
      const demo = (await db.select().from(users).where(eq(users.email, 'qa@example.com')))[0]!;
      expect(await verifyPassword('hoopline-demo', demo.passwordHash)).toBe(true);
    } finally {
      await pool.end();
    }
  });
});
