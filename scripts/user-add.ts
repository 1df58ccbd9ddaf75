// npm run user:add -- EMAIL "Full Name" ROLE — create an account (the first administrator of a
// production install, for instance). The password comes from HOOPLINE_NEW_PASSWORD, or a random
// one is generated and printed once. Roles: technician, engineer, qa, admin.
import { randomBytes } from 'node:crypto';
import { closeDb, getDb } from '../src/db/client.server';
import { createUser, findUserByEmail } from '../src/db/queries/users';
import { roles, type Role } from '../src/db/schema';
import { hashPassword } from '../src/server/auth/passwords.server';
import { audit } from '../src/server/audit.server';

const [email, name, role] = process.argv.slice(2);
function fail(message: string): never {
  console.error(message);
  process.exit(2);
}
if (!email || !name || !role)
  fail('usage: npm run user:add -- EMAIL "Full Name" ROLE   (ROLE: technician, engineer, qa or admin)');
if (!/^[^@\s]+@[^@\s]+\.[^@\s]+$/.test(email)) fail(`${email}: not an e-mail address`);
if (!roles.includes(role as Role)) fail(`${role}: not a role (technician, engineer, qa or admin)`);
const given = process.env.HOOPLINE_NEW_PASSWORD;
if (given !== undefined && given.length < 10) fail('HOOPLINE_NEW_PASSWORD must be at least 10 characters');
const password = given ?? randomBytes(12).toString('base64url');

try {
  const db = getDb();
  if (await findUserByEmail(db, email)) fail(`${email}: an account with that e-mail exists already`);
  const id = await createUser(db, { email, name, role: role as Role, passwordHash: await hashPassword(password) });
  await audit({ userId: null, actor: 'command line', action: 'user-created', details: { userId: id, email, role } });
  console.log(`created ${role} ${email} (id ${id})`);
  if (given === undefined) console.log(`password (shown once): ${password}`);
} catch (err) {
  console.error(`could not create the account: ${err instanceof Error ? err.message : String(err)}`);
  process.exitCode = 1;
} finally {
  await closeDb();
}
