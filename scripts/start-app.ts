/**
 * `npm start` after dependencies: local PostgreSQL (or DATABASE_URL), migrations, demo data,
 * the client build, then the server on PORT (default 3000) at HOST (default 127.0.0.1).
 */
import { existsSync, mkdirSync, readFileSync, readdirSync, statSync, unlinkSync, writeFileSync } from 'node:fs';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { ADMIN_USER, DEMO_USER } from '#server/services/demo';
import { prepareDatabase } from './lib/database';
import { SetupError } from './lib/postgres';

const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '..');
const port = Number(process.env.PORT ?? 3000);
const host = process.env.HOST ?? '127.0.0.1';
const pidFile = path.join(root, '.data', `server-${port}.pid`);

function alive(pid: number) {
  try {
    process.kill(pid, 0);
    return true;
  } catch {
    return false;
  }
}

async function alreadyRunning(): Promise<string | null> {
  if (existsSync(pidFile)) {
    const pid = Number(readFileSync(pidFile, 'utf8'));
    if (pid && alive(pid)) return `pid ${pid}`;
  }
  try {
    const res = await fetch(`http://${host === '0.0.0.0' ? '127.0.0.1' : host}:${port}/api/health`, { signal: AbortSignal.timeout(1500) });
    if (res.ok || res.status === 503) return 'answering on that port';
  } catch {
    // nothing there
  }
  return null;
}

function newestMtime(p: string): number {
  if (!existsSync(p)) return 0;
  const s = statSync(p);
  if (!s.isDirectory()) return s.mtimeMs;
  return Math.max(0, ...readdirSync(p).map((f) => newestMtime(path.join(p, f))));
}

async function buildClientIfStale() {
  const built = path.join(root, 'dist', 'client', 'index.html');
  const sources = ['src', 'shared', 'index.html', 'vite.config.ts', 'tailwind.config.ts', 'package-lock.json'].map((p) => newestMtime(path.join(root, p)));
  if (existsSync(built) && statSync(built).mtimeMs > Math.max(...sources)) return;
  console.log('[setup] building the client…');
  const { build } = await import('vite');
  await build({ root, logLevel: 'warn', configFile: path.join(root, 'vite.config.ts') });
}

async function main() {
  const running = await alreadyRunning();
  if (running) {
    console.error(
      `Spoolbook is already running on port ${port} (${running}). Open http://${host}:${port}, stop it first, or start another one with PORT=<other port> npm start.`,
    );
    process.exit(1);
  }
  // Development is `npm start` on its own local cluster, served on loopback: only there do the demo
  // accounts (with the published passwords below) exist. With DATABASE_URL, or NODE_ENV set to
  // anything else, or a HOST other than loopback, it is a real deployment: no demo, no known password.
  const loopback = ['127.0.0.1', 'localhost', '::1'].includes(host);
  const development = !process.env.DATABASE_URL && (process.env.NODE_ENV ?? 'development') === 'development' && loopback;
  const databaseUrl = await prepareDatabase(root, { demo: development });
  console.log(development ? '[setup] database migrated and demo data in place (development)' : '[setup] database migrated (no demo data outside development)');
  // Read before the build: Vite's build sets NODE_ENV to production in this process when it is unset.
  const nodeEnv = process.env.NODE_ENV ?? (development ? 'development' : 'production');
  await buildClientIfStale();
  process.env.DATABASE_URL = databaseUrl;
  process.env.NODE_ENV = nodeEnv;
  const { startServer } = await import('#server/index');
  const server = await startServer();
  mkdirSync(path.dirname(pidFile), { recursive: true });
  writeFileSync(pidFile, String(process.pid));
  process.on('exit', () => {
    try {
      unlinkSync(pidFile);
    } catch {
      // already gone
    }
  });
  const signIns = development
    ? `  Demo sign-in:  ${DEMO_USER.email}  /  ${DEMO_USER.password}
  Site admin:    ${ADMIN_USER.email}  /  ${ADMIN_USER.password}   (mail outbox under Admin)
  (development only: these accounts exist only in this local database)`
    : `  No demo accounts here. Make the first site admin with
    npm run admin -- <e-mail> "<name>"     (prints a one-time link to choose the password)
  or start with ADMIN_EMAIL=<e-mail> set (the link is mailed there).`;
  console.log(`
  Spoolbook is running at ${server.url}

${signIns}

  Stop with Ctrl-C.
`);
}

main().catch((err) => {
  if (err instanceof SetupError) console.error(`[setup] ${err.message}`);
  else console.error(err);
  process.exit(1);
});
