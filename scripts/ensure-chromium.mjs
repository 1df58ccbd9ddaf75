// Before the browser journeys: Debian's Chromium must be at /usr/bin/chromium (no browser
// download from a test tool). Installs it with apt-get when missing.
import { existsSync } from 'node:fs';
import { spawnSync } from 'node:child_process';

if (!existsSync('/usr/bin/chromium')) {
  console.log('Installing Debian package chromium (about 25 s)…');
  const env = { ...process.env, DEBIAN_FRONTEND: 'noninteractive' };
  for (const args of [
    ['update', '-qq'],
    ['install', '-y', '-qq', '--no-install-recommends', 'chromium'],
  ]) {
    const r = spawnSync('apt-get', args, { stdio: 'inherit', env });
    if (r.status !== 0) {
      console.error(`apt-get ${args.join(' ')} failed; install chromium by hand`);
      process.exit(1);
    }
  }
}
