/**
 * Shared pieces of the HTTP benchmarks: the app on a loopback port over DATABASE_URL (the fresh
 * bench database `npm run bench` makes), sign-in, an autocannon run summarised, and one line of
 * figures per run.
 */
import autocannon from 'autocannon';
import { spawn } from 'node:child_process';
import { createInterface } from 'node:readline';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import type { AddressInfo } from 'node:net';
import pino from 'pino';
import { createApp } from '#server/app';
import { loadConfig, type Config } from '#server/config';
import { connectDatabase, type Database } from '#server/db/client';
import { createMailer } from '#server/mail/mailer';

/** Simulated users (connections) of every HTTP benchmark. */
export const CONNECTIONS = 50;

export interface BenchServer {
  base: string;
  config: Config;
  database: Database;
  close: () => Promise<void>;
}

/** The whole app on 127.0.0.1 with a free port; mail goes nowhere, logs are off. */
export async function startBenchServer({
  computeRateLimitPerMinute,
  poolMax = 20,
}: { computeRateLimitPerMinute?: number; poolMax?: number } = {}): Promise<BenchServer> {
  // Sign-ups are rate limited per address; every simulated user comes from 127.0.0.1 here.
  const config: Config = { ...loadConfig({ ...process.env, PORT: '0' }), logLevel: 'silent', authRateLimit: 1_000_000 };
  const database = connectDatabase(config.databaseUrl, { max: poolMax });
  const { app } = createApp({
    database,
    config,
    mailer: createMailer('smtp://127.0.0.1:9', config.mailFrom),
    logger: pino({ level: 'silent' }),
    computeRateLimitPerMinute,
  });
  const server = app.listen(0, '127.0.0.1');
  await new Promise((r) => server.once('listening', r));
  const base = `http://127.0.0.1:${(server.address() as AddressInfo).port}`;
  return {
    base,
    config,
    database,
    close: async () => {
      server.closeAllConnections();
      await new Promise((r) => server.close(r));
      await database.pool.end();
    },
  };
}

export interface ServerProcess {
  base: string;
  publicUrl: string;
  /** The server process's memory (it answers SIGUSR2 with a line). */
  memory: () => Promise<{ rss: number; heapUsed: number }>;
  close: () => Promise<void>;
}

/** The app in a child process (tests/bench/serve.ts), so the load generator does not slow it down. */
export async function startServerProcess({
  poolMax = 10,
  computeRateLimitPerMinute,
}: { poolMax?: number; computeRateLimitPerMinute?: number } = {}): Promise<ServerProcess> {
  const here = path.dirname(fileURLToPath(import.meta.url));
  // Node itself with tsx's loader (not the tsx command, which would sit between us and the signals).
  const child = spawn(process.execPath, ['--import', 'tsx', path.join(here, 'serve.ts')], {
    cwd: path.join(here, '..', '..'),
    env: {
      ...process.env,
      BENCH_POOL_MAX: String(poolMax),
      ...(computeRateLimitPerMinute ? { BENCH_COMPUTE_PER_MINUTE: String(computeRateLimitPerMinute) } : {}),
    },
    stdio: ['ignore', 'pipe', 'inherit'],
  });
  // Never leave a server behind when the bench itself stops, however it stops.
  process.once('exit', () => child.kill('SIGKILL'));
  const lines = createInterface({ input: child.stdout! });
  const first = await new Promise<string>((resolve, reject) => {
    lines.once('line', resolve);
    child.once('exit', (code) => reject(new Error(`the bench server stopped (exit ${code}) before listening`)));
  });
  const { base, publicUrl } = JSON.parse(first) as { base: string; publicUrl: string };
  return {
    base,
    publicUrl,
    memory: () =>
      new Promise((resolve) => {
        lines.once('line', (l) => resolve((JSON.parse(l) as { memory: { rss: number; heapUsed: number } }).memory));
        child.kill('SIGUSR2');
      }),
    close: () =>
      new Promise<void>((resolve) => {
        child.once('exit', () => resolve());
        child.kill('SIGTERM');
      }),
  };
}

/** Sends JSON with our Origin (and a session cookie when given); answers status, headers and parsed body. */
export async function postJson(base: string, origin: string, url: string, body: unknown, cookie?: string, method = 'POST') {
  const headers: Record<string, string> = { Origin: origin, 'Content-Type': 'application/json' };
  if (cookie) headers.Cookie = cookie;
  const res = await fetch(base + url, { method, headers, body: JSON.stringify(body) });
  const text = await res.text();
  return { status: res.status, headers: res.headers, body: text ? (JSON.parse(text) as any) : null }; // eslint-disable-line @typescript-eslint/no-explicit-any
}

export function cookieOf(headers: Headers): string {
  return headers
    .getSetCookie()
    .map((c) => c.split(';')[0])
    .join('; ');
}

export interface RunSummary {
  rps: number;
  p50: number;
  p99: number;
  errors: number;
  total: number;
}

/** One autocannon run, summarised. `errors` counts connection errors, timeouts and non-2xx answers. */
export async function runAutocannon(options: autocannon.Options): Promise<RunSummary & { result: autocannon.Result }> {
  const result = await autocannon({ connections: CONNECTIONS, ...options });
  return {
    rps: result.requests.average,
    p50: result.latency.p50,
    p99: result.latency.p99,
    errors: result.errors + result.timeouts + result.non2xx,
    total: result.requests.total,
    result,
  };
}

/** One line of figures: throughput, median and 99th percentile latency, errors. */
export function line(name: string, r: RunSummary) {
  console.log(
    `${name.padEnd(28)} ${r.rps.toFixed(0).padStart(7)} req/s   p50 ${String(Math.round(r.p50)).padStart(4)} ms   p99 ${String(Math.round(r.p99)).padStart(4)} ms   errors ${r.errors}   (${r.total} requests)`,
  );
}

/** The bare endpoint: GET /api/health, one trivial query (`SELECT 1`), as the baseline of every HTTP figure. */
export function bareEndpoint(base: string, seconds: number) {
  return runAutocannon({ url: `${base}/api/health`, duration: seconds });
}
