import { spawn, type ChildProcess } from 'node:child_process';
import { createServer } from 'node:net';
import path from 'node:path';
import type { TestProject } from 'vitest/node';

const root = path.resolve(import.meta.dirname, '..', '..');

function freePort(): Promise<number> {
  return new Promise((resolve, reject) => {
    const srv = createServer();
    srv.once('error', reject);
    srv.listen(0, '127.0.0.1', () => {
      const address = srv.address();
      const port = typeof address === 'object' && address ? address.port : 0;
      srv.close(() => resolve(port));
    });
  });
}

let server: ChildProcess | null = null;

/** Starts the real server (production client build, test database) on a free loopback port. */
export async function setup(project: TestProject) {
  if (!process.env.DATABASE_URL) throw new Error('DATABASE_URL is not set: run browser tests through `npm test`.');
  const port = await freePort();
  const baseUrl = `http://127.0.0.1:${port}`;
  server = spawn(path.join(root, 'node_modules', '.bin', 'tsx'), [path.join(root, 'server', 'index.ts')], {
    cwd: root,
    env: { ...process.env, PORT: String(port), HOST: '127.0.0.1', FAKE_SMTP_PORT: '0', NODE_ENV: 'production', LOG_LEVEL: 'warn', AUTH_RATE_LIMIT: '200' },
    stdio: ['ignore', 'inherit', 'inherit'],
  });
  const deadline = Date.now() + 60_000;
  for (;;) {
    if (server.exitCode !== null) throw new Error(`the server exited with ${server.exitCode}`);
    try {
      const res = await fetch(`${baseUrl}/api/health`);
      if (res.ok) break;
    } catch {
      // not up yet
    }
    if (Date.now() > deadline) throw new Error('the server did not answer within 60 s');
    await new Promise((r) => setTimeout(r, 250));
  }
  project.provide('baseUrl', baseUrl);
}

export async function teardown() {
  if (!server || server.exitCode !== null) return;
  const exited = new Promise((r) => server!.once('exit', r));
  server.kill('SIGTERM');
  const stopped = await Promise.race([exited.then(() => true), new Promise((r) => setTimeout(() => r(false), 12_000))]);
  if (!stopped) server.kill('SIGKILL');
}

declare module 'vitest' {
  export interface ProvidedContext {
    baseUrl: string;
  }
}
