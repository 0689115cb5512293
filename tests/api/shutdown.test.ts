/**
 * Graceful shutdown of the real server process (server/index.ts run by tsx): on SIGTERM it stops
 * accepting connections, finishes the request in flight, closes the database pool and exits 0;
 * a request that does not finish is cut off after SHUTDOWN_GRACE_MS and the process still exits 0.
 * The request in flight is a study save whose body the test holds back: no test-only route needed.
 */
import { spawn, type ChildProcess } from 'node:child_process';
import { readFileSync } from 'node:fs';
import net from 'node:net';
import path from 'node:path';
import pg from 'pg';
import { afterEach, describe, expect, it } from 'vitest';
import { ORIGIN, PASSWORD, uniqueEmail } from './helpers';
import { freePort } from './private-cluster';

const root = path.resolve(import.meta.dirname, '..', '..');
const demo = JSON.parse(readFileSync(path.join(root, 'data', 'demo', 'hillclimb-study.json'), 'utf8'));

interface ServerProcess {
  child: ChildProcess;
  port: number;
  exited: Promise<{ code: number | null; signal: NodeJS.Signals | null; at: number }>;
  messages: () => string[];
  output: () => string;
}

const children: ChildProcess[] = [];
afterEach(() => {
  for (const c of children.splice(0)) if (c.exitCode === null && c.signalCode === null) c.kill('SIGKILL');
});

async function until(boundMs: number, check: () => boolean, what: string, output: () => string) {
  const t0 = Date.now();
  while (!check()) {
    if (Date.now() - t0 > boundMs) throw new Error(`${what}: not within ${boundMs} ms\nserver output:\n${output()}`);
    await new Promise((r) => setTimeout(r, 50));
  }
}

/**
 * The server in a child process on a free port. The port is free when picked but only taken when
 * the server listens; if something else took it meanwhile (the server's own mail catcher, on an
 * ephemeral port, can), start again on another.
 */
async function startServerProcess(env: Record<string, string> = {}, attempts = 3): Promise<ServerProcess> {
  try {
    return await startServerProcessOnce(env);
  } catch (err) {
    if (attempts > 1 && /EADDRINUSE/.test(String(err))) return startServerProcess(env, attempts - 1);
    throw err;
  }
}

async function startServerProcessOnce(env: Record<string, string>): Promise<ServerProcess> {
  if (!process.env.DATABASE_URL) throw new Error('DATABASE_URL is not set: run the API tests through `npm test`.');
  const port = await freePort();
  const { SMTP_URL: _smtp, ...inherited } = process.env;
  const child = spawn(path.join(root, 'node_modules', '.bin', 'tsx'), [path.join(root, 'server', 'index.ts')], {
    cwd: root,
    env: {
      ...inherited,
      PORT: String(port),
      HOST: '127.0.0.1',
      PUBLIC_URL: ORIGIN,
      FAKE_SMTP_PORT: '0',
      LOG_LEVEL: 'info',
      NODE_ENV: 'test',
      AUTH_RATE_LIMIT: '1000',
      ...env,
    },
    stdio: ['ignore', 'pipe', 'pipe'],
  });
  children.push(child);
  const lines: string[] = [];
  let partial = '';
  const onOutput = (d: Buffer) => {
    partial += d.toString();
    const parts = partial.split('\n');
    partial = parts.pop() ?? '';
    lines.push(...parts);
  };
  child.stdout!.on('data', onOutput);
  child.stderr!.on('data', onOutput);
  const exited = new Promise<{ code: number | null; signal: NodeJS.Signals | null; at: number }>((resolve) =>
    child.once('exit', (code, signal) => resolve({ code, signal, at: Date.now() })),
  );
  const messages = () =>
    lines.map((l) => {
      try {
        return String(JSON.parse(l).msg);
      } catch {
        return l;
      }
    });
  const output = () => lines.join('\n');
  await until(60_000, () => messages().some((m) => m.includes('Spoolbook is serving')) || child.exitCode !== null, 'server start', output);
  if (child.exitCode !== null) throw new Error(`the server exited at start-up:\n${output()}`);
  return { child, port, exited, messages, output };
}

async function signedUpWithStudy(base: string) {
  const signUp = await fetch(`${base}/api/auth/sign-up`, {
    method: 'POST',
    headers: { Origin: ORIGIN, 'Content-Type': 'application/json' },
    body: JSON.stringify({ email: uniqueEmail('shutdown'), password: PASSWORD, name: 'Shut Down' }),
  });
  if (signUp.status !== 201) throw new Error(`sign-up: ${signUp.status} ${await signUp.text()}`);
  const cookie = signUp.headers
    .getSetCookie()
    .map((c) => c.split(';')[0])
    .join('; ');
  const teamId = ((await signUp.json()) as { teams: { id: string }[] }).teams[0].id;
  const created = await fetch(`${base}/api/teams/${teamId}/studies`, {
    method: 'POST',
    headers: { Origin: ORIGIN, 'Content-Type': 'application/json', Cookie: cookie },
    body: JSON.stringify({ title: 'Saved while stopping', document: demo }),
  });
  if (created.status !== 201) throw new Error(`create study: ${created.status} ${await created.text()}`);
  const study = ((await created.json()) as { study: { id: string; revision: number } }).study;
  return { cookie, teamId, study };
}

/** A raw HTTP/1.1 request whose body is sent in two parts, so the test decides when it ends. */
function heldRequest(port: number, method: string, url: string, headers: Record<string, string>, body: string) {
  const socket = net.connect(port, '127.0.0.1');
  const bytes = Buffer.from(body, 'utf8');
  const head = [
    `${method} ${url} HTTP/1.1`,
    `Host: 127.0.0.1:${port}`,
    ...Object.entries(headers).map(([k, v]) => `${k}: ${v}`),
    `Content-Length: ${bytes.length}`,
    '',
    '',
  ].join('\r\n');
  const half = Math.floor(bytes.length / 2);
  let received = '';
  socket.on('data', (d: Buffer) => (received += d.toString('utf8')));
  const closed = new Promise<{ at: number }>((resolve) => socket.once('close', () => resolve({ at: Date.now() })));
  socket.on('error', () => undefined); // the bound test sees the server cut the connection
  const connected = new Promise<void>((resolve, reject) => {
    socket.once('connect', () => {
      socket.write(head);
      socket.write(bytes.subarray(0, half), () => resolve());
    });
    socket.once('error', reject);
  });
  return {
    connected,
    closed,
    finish: () => socket.write(bytes.subarray(half)),
    response: () => {
      const [headText, ...rest] = received.split('\r\n\r\n');
      const status = Number(/^HTTP\/1\.1 (\d{3})/.exec(headText)?.[1] ?? 0);
      return { status, head: headText, body: rest.join('\r\n\r\n') };
    },
  };
}

function refusesConnections(port: number): Promise<boolean> {
  return new Promise((resolve) => {
    const s = net.connect(port, '127.0.0.1');
    s.once('connect', () => {
      s.destroy();
      resolve(false);
    });
    s.once('error', (err: NodeJS.ErrnoException) => resolve(err.code === 'ECONNREFUSED'));
  });
}

describe('SIGTERM', () => {
  it('stops accepting, finishes the save in flight, closes the pool and exits 0', async () => {
    const server = await startServerProcess();
    const base = `http://127.0.0.1:${server.port}`;
    const { cookie, teamId, study } = await signedUpWithStudy(base);
    // An idle keep-alive connection, as a browser leaves behind: it must not hold the shutdown open.
    const idle = net.connect(server.port, '127.0.0.1');
    idle.on('error', () => undefined);
    await new Promise((r) => idle.once('connect', r));

    const document = structuredClone(demo);
    document.engine.displacement = 0.0021;
    const save = heldRequest(
      server.port,
      'PUT',
      `/api/teams/${teamId}/studies/${study.id}`,
      { Origin: ORIGIN, Cookie: cookie, 'Content-Type': 'application/json' },
      JSON.stringify({ baseRevision: study.revision, document, message: 'saved while the server stops' }),
    );
    await save.connected;
    await new Promise((r) => setTimeout(r, 300)); // the server has read the headers: the request is in flight

    server.child.kill('SIGTERM');
    await until(30_000, () => server.messages().some((m) => m.includes('stopping: no new connections')), 'stop begins', server.output);
    expect(await refusesConnections(server.port)).toBe(true);
    expect(server.child.exitCode).toBeNull(); // still finishing the save

    save.finish();
    const { at: answeredAt } = await save.closed;
    const answer = save.response();
    expect(answer.status, server.output()).toBe(200);
    expect(answer.head.toLowerCase()).toContain('connection: close');
    expect(JSON.parse(answer.body).study.revision).toBe(study.revision + 1);

    const { code, at: exitedAt } = await server.exited;
    expect(code, server.output()).toBe(0);
    // Well inside the 10 s bound (server/config.ts SHUTDOWN_GRACE_MS default): nothing held it open.
    expect(exitedAt - answeredAt).toBeLessThan(5_000);
    const messages = server.messages();
    const poolClosed = messages.findIndex((m) => m.includes('database pool closed'));
    expect(poolClosed, server.output()).toBeGreaterThan(messages.findIndex((m) => m.includes('HTTP server closed')));

    // The save the server finished while stopping is in the database, whole.
    const check = new pg.Client({ connectionString: process.env.DATABASE_URL });
    await check.connect();
    try {
      const { rows } = await check.query(
        'SELECT s.revision, (SELECT max(revision) FROM study_revisions r WHERE r.study_id = s.id) AS newest FROM studies s WHERE s.id = $1',
        [study.id],
      );
      expect(rows[0]).toEqual({ revision: study.revision + 1, newest: study.revision + 1 });
    } finally {
      await check.end();
    }
  }, 90_000);

  it('cuts off a request that does not finish after SHUTDOWN_GRACE_MS, and still exits 0', async () => {
    const graceMs = 1_500;
    const server = await startServerProcess({ SHUTDOWN_GRACE_MS: String(graceMs) });
    const held = heldRequest(
      server.port,
      'POST',
      '/api/compute',
      { Origin: ORIGIN, 'Content-Type': 'application/json' },
      JSON.stringify({
        engine: { displacement: 0.002, cylinders: 4, strokes: 4 },
        ambient: { altitude: 0 },
        points: [{ rpm: 5000, volumetricEfficiency: 0.9, boost: 80000, manifoldTemperature: 320 }],
      }),
    );
    await held.connected;
    await new Promise((r) => setTimeout(r, 300));
    const signalledAt = Date.now();
    server.child.kill('SIGTERM');

    const { at: cutAt } = await held.closed; // the body never comes: the server must close it
    const { code } = await server.exited;
    expect(code, server.output()).toBe(0);
    expect(cutAt - signalledAt).toBeGreaterThanOrEqual(graceMs - 100); // not before the grace ran out (100 ms timer slack, from memory)
    expect(cutAt - signalledAt).toBeLessThan(graceMs + 4_000); // and soon after it (common practice, no source)
    expect(server.messages().some((m) => m.includes(`requests still in flight after ${graceMs} ms`))).toBe(true);
  }, 90_000);
});
