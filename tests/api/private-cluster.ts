/**
 * A private, throw-away PostgreSQL cluster for tests that stop and start the database: the shared
 * test cluster stays untouched, since other test files run against it at the same time.
 * Made with scripts/lib/postgres.ts (initdb and pg_ctl as the `postgres` user when root).
 */
import { spawn } from 'node:child_process';
import { mkdtempSync, rmSync } from 'node:fs';
import net from 'node:net';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { connectDatabase } from '#server/db/client';
import { runMigrations } from '#server/db/migrate';
import { clusterIsRunning, createClusterAt, ensureDatabase, ensurePostgresInstalled, stopLocalCluster, type ClusterAt } from '#scripts/lib/postgres';

/** Ports other people's servers use here: never hand one of them out. */
const RESERVED_PORTS = new Set([3000, 5173, 54329]);

/** A TCP port nothing listens on right now (the kernel's choice), on 127.0.0.1. */
export async function freePort(): Promise<number> {
  for (;;) {
    const port = await new Promise<number>((resolve, reject) => {
      const s = net.createServer();
      s.once('error', reject);
      s.listen(0, '127.0.0.1', () => {
        const p = (s.address() as net.AddressInfo).port;
        s.close(() => resolve(p));
      });
    });
    if (!RESERVED_PORTS.has(port)) return port;
  }
}

export interface PrivateCluster {
  cluster: ClusterAt;
  /** URL of the migrated `spoolbook` database on it. */
  url: string;
  /** pg_ctl stop in the given mode, without blocking this process (requests keep being served meanwhile). */
  stop: (mode: 'fast' | 'immediate') => Promise<void>;
  /** pg_ctl start, waiting until it accepts connections, without blocking this process. */
  start: () => Promise<void>;
  running: () => boolean;
  /** Stops it (immediate) and deletes its folder; safe to call twice. */
  destroy: () => void;
}

function pgCtl(args: string[]): Promise<void> {
  const bin = ensurePostgresInstalled();
  const cmd = path.join(bin, 'pg_ctl');
  const [file, argv] = process.getuid?.() === 0 ? ['runuser', ['-u', 'postgres', '--', cmd, ...args]] : [cmd, args];
  return new Promise((resolve, reject) => {
    const child = spawn(file, argv, { stdio: ['ignore', 'ignore', 'pipe'] });
    let stderr = '';
    child.stderr.on('data', (d: Buffer) => (stderr += d.toString()));
    child.once('error', reject);
    child.once('exit', (code) => (code === 0 ? resolve() : reject(new Error(`pg_ctl ${args.join(' ')} exited ${code}: ${stderr}`))));
  });
}

/** initdb into a fresh temp folder, start on a free port, create and migrate the `spoolbook` database. */
export async function createPrivateCluster(): Promise<PrivateCluster> {
  const parentDir = mkdtempSync(path.join(tmpdir(), 'spoolbook-private-pg-'));
  let destroyed = false;
  let cluster: ClusterAt | null = null;
  const destroy = () => {
    if (destroyed) return;
    destroyed = true;
    process.removeListener('exit', destroy);
    if (cluster && clusterIsRunning(cluster)) stopLocalCluster(cluster, 'immediate');
    rmSync(parentDir, { recursive: true, force: true });
  };
  // Even if the test run dies before its afterAll, do not leave a postmaster behind.
  process.once('exit', destroy);
  try {
    cluster = createClusterAt(parentDir, await freePort());
    await ensureDatabase(cluster.url('postgres'), 'spoolbook');
    const url = cluster.url('spoolbook');
    const database = connectDatabase(url, { max: 2 });
    try {
      await runMigrations(database);
    } finally {
      await database.pool.end();
    }
    const c = cluster;
    return {
      cluster: c,
      url,
      stop: (mode) => pgCtl(['-D', c.dataDir, '-m', mode, '-w', '-t', '60', 'stop']),
      start: () => pgCtl(['-D', c.dataDir, '-l', c.logFile, '-w', '-t', '60', 'start']),
      running: () => clusterIsRunning(c),
      destroy,
    };
  } catch (err) {
    destroy();
    throw err;
  }
}
