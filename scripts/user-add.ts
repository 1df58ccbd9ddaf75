// npm run user:add -- EMAIL "Full Name" ROLE — create an account (the first administrator of a
// production install, for instance). The password comes from HOOPLINE_NEW_PASSWORD, or a random
// one is generated and printed once. Roles: technician, engineer, qa, admin.
import { randomBytes } from 'node:crypto';
import { closeDb, getDb, inTransaction } from '../src/db/client.server';
import { createUser, findUserByEmail } from '../src/db/queries/users';
import { roles, type Role } from '../src/db/schema';
import { hashPassword } from '../src/server/auth/passwords.server';
import { passwordProblem } from '../src/server/auth/password-policy.server';
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
const weak = given === undefined ? null : passwordProblem(given, [email, name]);
if (weak) fail(`HOOPLINE_NEW_PASSWORD: ${weak}`);
const password = given ?? randomBytes(18).toString('base64url');

try {
  const db = getDb();
  if (await findUserByEmail(db, email)) fail(`${email}: an account with that e-mail exists already`);
  const passwordHash = await hashPassword(password);
  const id = await inTransaction(async (tx) => {
    const userId = await createUser(tx, { email, name, role: role as Role, passwordHash });
    await audit(tx, { userId: null, actor: 'command line', action: 'user-created', details: { userId, email, role } });
    return userId;
  });
  console.log(`created ${role} ${email} (id ${id})`);
  if (given === undefined) console.log(`password (shown once): ${password}`);
} catch (err) {
  console.error(`could not create the account: ${err instanceof Error ? err.message : String(err)}`);
  process.exitCode = 1;
} finally {
  await closeDb();
}
