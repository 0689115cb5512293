// Plain JavaScript: runs before any dependency is installed.
import { spawnSync } from 'node:child_process';
import { existsSync, statSync } from 'node:fs';
import path from 'node:path';

/** Installs npm dependencies when node_modules is missing or older than the lockfile. */
export function ensureDependencies(root) {
  const marker = path.join(root, 'node_modules', '.package-lock.json');
  const lock = path.join(root, 'package-lock.json');
  const stale = !existsSync(marker) || (existsSync(lock) && statSync(lock).mtimeMs > statSync(marker).mtimeMs + 1000);
  if (!stale) return;
  console.log('[setup] installing npm dependencies (npm ci)…');
  const result = spawnSync('npm', ['ci', '--no-audit', '--no-fund', '--include=optional'], { cwd: root, stdio: 'inherit' });
  if (result.status !== 0) {
    console.error('[setup] npm ci failed; see the output above.');
    process.exit(result.status ?? 1);
  }
}

/** Runs a TypeScript entry with tsx, forwarding signals and the exit code. */
export function runTs(root, file, args = []) {
  const tsx = path.join(root, 'node_modules', '.bin', 'tsx');
  const result = spawnSync(tsx, [path.join(root, file), ...args], { cwd: root, stdio: 'inherit' });
  process.exit(result.status ?? 1);
}
