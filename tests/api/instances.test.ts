/**
 * Two server processes (server/index.ts run by tsx) over one database, as behind a load balancer:
 * a session made on one is known to the other, a sign-out on one ends it on both, sign-in
 * throttling counts the failures made on both together, and a stale save is refused whichever
 * instance took the newer one. Nothing that matters is kept in a process's memory.
 */
import { spawn, type ChildProcess } from 'node:child_process';
import { randomInt } from 'node:crypto';
import { readFileSync } from 'node:fs';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { ORIGIN, PASSWORD, uniqueEmail } from './helpers';
import { freePort } from './private-cluster';

const root = path.resolve(import.meta.dirname, '..', '..');
const demo = JSON.parse(readFileSync(path.join(root, 'data', 'demo', 'hillclimb-study.json'), 'utf8'));
const children: ChildProcess[] = [];
let a = '';
let b = '';
// Client addresses come from X-Forwarded-For (TRUST_PROXY=loopback): one of our own per run, so
// other test files' servers on this database never count with ours.
const address = `198.51.100.${randomInt(1, 250)}`;

async function startInstance(): Promise<string> {
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
      LOG_LEVEL: 'warn',
      NODE_ENV: 'test',
      AUTH_RATE_LIMIT: '3',
      TRUST_PROXY: 'loopback',
    },
    stdio: ['ignore', 'inherit', 'inherit'],
  });
  children.push(child);
  const base = `http://127.0.0.1:${port}`;
  for (let i = 0; i < 240; i++) {
    if (child.exitCode !== null) throw new Error(`instance exited with ${child.exitCode}`);
    try {
      if ((await fetch(`${base}/api/health`)).ok) return base;
    } catch {
      // not up yet
    }
    await new Promise((r) => setTimeout(r, 250));
  }
  throw new Error('instance did not answer within 60 s');
}

beforeAll(async () => {
  if (!process.env.DATABASE_URL) throw new Error('DATABASE_URL is not set: run the API tests through `npm test`.');
  [a, b] = await Promise.all([startInstance(), startInstance()]);
}, 90_000);

afterAll(async () => {
  await Promise.all(
    children.map(
      (c) =>
        new Promise<void>((resolve) => {
          if (c.exitCode !== null) return resolve();
          c.once('exit', () => resolve());
          c.kill('SIGTERM');
          setTimeout(() => c.kill('SIGKILL'), 12_000).unref();
        }),
    ),
  );
});

async function call(base: string, method: string, url: string, body?: unknown, cookie?: string) {
  const res = await fetch(`${base}${url}`, {
    method,
    headers: {
      Origin: ORIGIN,
      'X-Forwarded-For': address,
      ...(body === undefined ? {} : { 'Content-Type': 'application/json' }),
      ...(cookie ? { Cookie: cookie } : {}),
    },
    body: body === undefined ? undefined : JSON.stringify(body),
  });
  const text = await res.text();
  const setCookie = res.headers
    .getSetCookie()
    .map((c) => c.split(';')[0])
    .find((c) => c.startsWith('spoolbook_session=') && c !== 'spoolbook_session=');
  return { status: res.status, body: text ? JSON.parse(text) : null, cookie: setCookie };
}

describe('two instances over one database', () => {
  it('share sessions: made on one, known on the other, ended on both', async () => {
    const email = uniqueEmail('twice');
    const up = await call(a, 'POST', '/api/auth/sign-up', { email, password: PASSWORD, name: 'Two Servers' });
    expect(up.status).toBe(201);
    expect((await call(b, 'GET', '/api/auth/me', undefined, up.cookie)).body.user.email).toBe(email);
    expect((await call(b, 'POST', '/api/auth/sign-out', {}, up.cookie)).status).toBe(204);
    expect((await call(a, 'GET', '/api/auth/me', undefined, up.cookie)).status).toBe(401);
  });

  it('count sign-in failures together: two on each, and the next waits on either', async () => {
    const email = uniqueEmail('throttled');
    await call(a, 'POST', '/api/auth/sign-up', { email, password: PASSWORD, name: 'Throttled' });
    const statuses: number[] = [];
    for (const base of [a, b, a, b]) statuses.push((await call(base, 'POST', '/api/auth/sign-in', { email, password: 'wrong password' })).status);
    expect(statuses).toEqual([401, 401, 401, 401]);
    // AUTH_RATE_LIMIT=3 free failures per account: the 4th (made on B) started a delay that A honours.
    const next = await call(a, 'POST', '/api/auth/sign-in', { email, password: PASSWORD });
    expect(next.status).toBe(429);
  });

  it('keep saves consistent: a stale save on the other instance is refused', async () => {
    const email = uniqueEmail('saver');
    const up = await call(a, 'POST', '/api/auth/sign-up', { email, password: PASSWORD, name: 'Saver' });
    const teamId = up.body.teams[0].id;
    const made = await call(a, 'POST', `/api/teams/${teamId}/studies`, { title: 'On two servers', document: demo }, up.cookie);
    const studyId = made.body.study.id;
    const first = await call(a, 'PUT', `/api/teams/${teamId}/studies/${studyId}`, { baseRevision: 1, document: demo, message: 'on A' }, up.cookie);
    expect(first.body.study.revision).toBe(2);
    const stale = await call(b, 'PUT', `/api/teams/${teamId}/studies/${studyId}`, { baseRevision: 1, document: demo, message: 'on B' }, up.cookie);
    expect(stale.status).toBe(409);
    expect(stale.body.error.code).toBe('stale_revision');
    expect((await call(b, 'GET', `/api/teams/${teamId}/studies/${studyId}`, undefined, up.cookie)).body.study.revision).toBe(2);
  });
});
