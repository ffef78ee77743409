/**
 * Runs benchmark scripts one after another and hands every flag to each:
 * `tsx tests/bench/sequence.ts a.ts b.ts --json` runs `a.ts --json`, then `b.ts --json`
 * (npm appends `npm run x -- --json` to the last command only, so a chain with && would give it to one).
 */
import { spawnSync } from 'node:child_process';

const args = process.argv.slice(2);
const scripts = args.filter((a) => !a.startsWith('--'));
const flags = args.filter((a) => a.startsWith('--'));
for (const script of scripts) {
  const r = spawnSync(process.execPath, ['--import', 'tsx', script, ...flags], { stdio: 'inherit' });
  if (r.status !== 0) process.exit(r.status ?? 1);
}
