// npm run db:seed — demo accounts, materials and scenario (only with DEMO on).
import { closeDb, getDb } from '../src/db/client.server';
import { seedDemoAccounts, seedDemoScenario } from '../src/server/demo-seed.server';
import { getConfig } from '../src/config.server';

const config = getConfig();
if (!config.DEMO) {
  console.log(
    'DEMO is off: nothing seeded. Create the first administrator with `npm run user:add -- EMAIL "Name" admin`.',
  );
  process.exit(0);
}
try {
  const r = await seedDemoAccounts(getDb(), config.DEMO_PASSWORD);
  const scenario = await seedDemoScenario();
  console.log(
    `demo data seeded: ${r.users} accounts, ${r.materials} materials${scenario.length ? `, tests: ${scenario.join('; ')}` : ''}`,
  );
} catch (err) {
  console.error(`seeding failed: ${err instanceof Error ? err.message : String(err)}`);
  process.exitCode = 1;
} finally {
  await closeDb();
}
