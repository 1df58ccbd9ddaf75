// The fault drills start their own services per file (tests/drills/stack.ts); here we only build
// the app once (unless HOOPLINE_SKIP_BUILD=1).
import { spawnSync } from 'node:child_process';

export default function setup() {
  if (process.env.HOOPLINE_SKIP_BUILD === '1') return;
  const r = spawnSync(process.execPath, ['node_modules/astro/astro.js', 'build'], {
    env: { ...process.env, ASTRO_TELEMETRY_DISABLED: '1' },
    encoding: 'utf8',
  });
  if (r.status !== 0) throw new Error(`astro build failed:\n${(r.stdout + r.stderr).slice(-3000)}`);
}
