// `pretest`: installs npm packages on a fresh clone (node_modules missing or older than the
// lock file), so `npm test` works with nothing done by hand first. Debian's mariadb-server is
// installed by the tests' global setup when mariadbd is missing.
import { existsSync, statSync } from 'node:fs';
import { spawnSync } from 'node:child_process';

const stamp = 'node_modules/.package-lock.json';
const stale = !existsSync(stamp) || statSync('package-lock.json').mtimeMs > statSync(stamp).mtimeMs + 1000;
if (stale) {
  console.log('Installing npm packages (npm ci)…');
  const r = spawnSync('npm', ['ci', '--no-audit', '--no-fund'], { stdio: 'inherit' });
  if (r.status !== 0) process.exit(r.status ?? 1);
}
