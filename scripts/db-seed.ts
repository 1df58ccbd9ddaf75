// npm run db:seed — demo accounts, materials and scenario (only with DEMO on). Existing accounts
// are never reset unless DEMO_RESET=true.
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
  const r = await seedDemoAccounts(getDb(), config.DEMO_PASSWORD, { reset: config.DEMO_RESET });
  const scenario = await seedDemoScenario();
  const kept = r.users - r.created - r.reset;
  console.log(
    `demo data seeded: ${r.created} accounts created${r.reset ? `, ${r.reset} reset (DEMO_RESET)` : ''}${kept ? `, ${kept} kept as they were (DEMO_RESET=true puts them back)` : ''}; ${r.materials} materials${scenario.length ? `; tests: ${scenario.join('; ')}` : ''}`,
  );
} catch (err) {
  console.error(`seeding failed: ${err instanceof Error ? err.message : String(err)}`);
  process.exitCode = 1;
} finally {
  await closeDb();
}
