/**
 * `npm test` after dependencies: a fresh test database on the local cluster (or on DATABASE_URL's
 * server), type check, lint, unit and API tests, the production client build, then browser tests.
 * Ends with the totals over every suite on a line of their own: "N passed, N failed".
 */
import { spawnSync } from 'node:child_process';
import { existsSync, mkdirSync, readFileSync, rmSync } from 'node:fs';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { prepareDatabase } from './lib/database';
import { SetupError } from './lib/postgres';

const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '..');
const results = path.join(root, 'test-results');
const bin = (name: string) => path.join(root, 'node_modules', '.bin', name);

interface Totals {
  passed: number;
  failed: number;
  skipped: number;
}
const totals: Totals = { passed: 0, failed: 0, skipped: 0 };
const problems: string[] = [];

function step(title: string) {
  console.log(`\n=== ${title} ===`);
}

function run(cmd: string, args: string[], env: NodeJS.ProcessEnv = {}): number {
  const r = spawnSync(cmd, args, { cwd: root, stdio: 'inherit', env: { ...process.env, ...env } });
  return r.status ?? 1;
}

/** Adds a vitest JSON report to the totals; a missing report counts as a failed suite. */
function count(report: string, suite: string) {
  if (!existsSync(report)) {
    problems.push(`${suite}: no report was written`);
    totals.failed += 1;
    return;
  }
  const json = JSON.parse(readFileSync(report, 'utf8')) as {
    numPassedTests: number;
    numFailedTests: number;
    numPendingTests: number;
    numTodoTests: number;
    numFailedTestSuites: number;
    numTotalTests: number;
  };
  totals.passed += json.numPassedTests;
  totals.failed += json.numFailedTests + (json.numFailedTests === 0 ? json.numFailedTestSuites : 0);
  totals.skipped += json.numPendingTests + json.numTodoTests;
  if (json.numTotalTests === 0) problems.push(`${suite}: no test ran`);
  if (json.numFailedTests > 0 || json.numFailedTestSuites > 0)
    problems.push(`${suite}: ${json.numFailedTests} failed tests, ${json.numFailedTestSuites} failed files`);
}

function ensureChromium() {
  if (existsSync('/usr/bin/chromium')) return;
  if (process.getuid?.() !== 0) throw new SetupError("Browser tests need Debian's chromium: sudo apt-get install -y chromium");
  console.log("[setup] installing Debian's chromium with apt-get (once)…");
  const env = { DEBIAN_FRONTEND: 'noninteractive' };
  if (run('apt-get', ['update', '-qq'], env) !== 0 || run('apt-get', ['install', '-y', '-qq', 'chromium'], env) !== 0) {
    throw new SetupError('apt-get could not install chromium.');
  }
}

async function main() {
  rmSync(results, { recursive: true, force: true });
  mkdirSync(results, { recursive: true });

  step('test database');
  const databaseUrl = await prepareDatabase(root, { database: 'spoolbook_test', fresh: true, demo: true });
  const env = { DATABASE_URL: databaseUrl, LOG_LEVEL: 'silent', NODE_ENV: 'test' };
  console.log('fresh database spoolbook_test, migrated and seeded with the demo (test only)');

  step('type check');
  if (run(bin('tsc'), ['--noEmit', '-p', 'tsconfig.json']) !== 0) {
    problems.push('type check failed');
    totals.failed += 1;
  } else {
    console.log('no type errors');
  }

  step('lint (ESLint with the architecture rules, Prettier, import cycles, knip)');
  if (run('npm', ['run', '--silent', 'lint']) !== 0) {
    problems.push('lint failed: run `npm run lint` and fix what it names');
    totals.failed += 1;
  } else {
    console.log('lint clean');
  }

  step('unit and API tests (vitest)');
  const unitReport = path.join(results, 'unit.json');
  run(bin('vitest'), ['run', '--reporter=default', '--reporter=json', `--outputFile.json=${unitReport}`], env);
  count(unitReport, 'unit and API tests');

  step('client production build');
  if (run(bin('vite'), ['build', '--logLevel', 'warn']) !== 0) {
    problems.push('client build failed');
    totals.failed += 1;
  } else {
    step('browser tests (playwright-core + Debian chromium)');
    ensureChromium();
    const e2eReport = path.join(results, 'e2e.json');
    run(bin('vitest'), ['run', '-c', 'vitest.e2e.config.ts', '--reporter=default', '--reporter=json', `--outputFile.json=${e2eReport}`], env);
    count(e2eReport, 'browser tests');
  }

  console.log('');
  for (const p of problems) console.log(`problem: ${p}`);
  console.log(`screenshots and reports: ${path.relative(root, results)}/`);
  const skipped = totals.skipped ? `, ${totals.skipped} skipped` : '';
  console.log(`${totals.passed} passed, ${totals.failed} failed${skipped}`);
  process.exit(totals.failed === 0 && problems.length === 0 && totals.passed > 0 ? 0 : 1);
}

main().catch((err) => {
  console.error(err instanceof SetupError ? `[setup] ${err.message}` : err);
  console.log('0 passed, 1 failed');
  process.exit(1);
});
