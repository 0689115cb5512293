/**
 * `npm run bench`: every tests/bench/*.bench.ts in turn (or those whose names contain the
 * arguments), with DATABASE_URL pointing at a fresh `spoolbook_bench` database for the ones that
 * need a server. Benchmarks print figures; none asserts a target.
 */
import { spawnSync } from 'node:child_process';
import { readdirSync } from 'node:fs';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { prepareDatabase } from './lib/database';

const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '..');
const filters = process.argv.slice(2);

async function main() {
  const files = readdirSync(path.join(root, 'tests', 'bench'))
    .filter((f) => f.endsWith('.bench.ts'))
    .filter((f) => filters.length === 0 || filters.some((x) => f.includes(x)))
    .sort();
  const databaseUrl = await prepareDatabase(root, { database: 'spoolbook_bench', fresh: true, demo: true });
  let failed = 0;
  for (const file of files) {
    console.log(`\n=== ${file} ===`);
    const r = spawnSync(path.join(root, 'node_modules', '.bin', 'tsx'), [path.join(root, 'tests', 'bench', file)], {
      cwd: root,
      stdio: 'inherit',
      env: { ...process.env, DATABASE_URL: databaseUrl, LOG_LEVEL: 'silent' },
    });
    if (r.status !== 0) failed++;
  }
  process.exit(failed ? 1 : 0);
}

main().catch((err) => {
  console.error(err);
  process.exit(1);
});
