/**
 * HTTP throughput on loopback with autocannon, 50 connections: reading one study against a bare
 * endpoint of the same server that does one trivial query (GET /api/health, `SELECT 1`).
 * Targets (printed, not asserted): study reads at least half the bare endpoint's throughput;
 * p99 under 50 ms at 50 connections.
 *
 *   npm run bench api
 */
import autocannon from 'autocannon';
import type { AddressInfo } from 'node:net';
import pino from 'pino';
import request from 'supertest';
import { createApp } from '../../server/app';
import { loadConfig } from '../../server/config';
import { connectDatabase } from '../../server/db/client';
import { createMailer } from '../../server/mail/mailer';
import { DEMO_USER, DEMO_TEAM_NAME, DEMO_STUDY_TITLE } from '../../server/db/seed';

const SECONDS = Number(process.env.BENCH_SECONDS ?? 10);
const CONNECTIONS = 50;

async function run(url: string, headers: Record<string, string>) {
  const result = await autocannon({ url, connections: CONNECTIONS, duration: SECONDS, headers });
  return {
    rps: result.requests.average,
    p50: result.latency.p50,
    p99: result.latency.p99,
    errors: result.errors + result.non2xx,
    total: result.requests.total,
  };
}

async function main() {
  const config = { ...loadConfig({ ...process.env, PORT: '0' }), logLevel: 'silent' };
  const database = connectDatabase(config.databaseUrl, { max: 20 });
  const { app } = createApp({ database, config, mailer: createMailer('smtp://127.0.0.1:9', config.mailFrom), logger: pino({ level: 'silent' }) });
  const server = app.listen(0, '127.0.0.1');
  await new Promise((r) => server.once('listening', r));
  const base = `http://127.0.0.1:${(server.address() as AddressInfo).port}`;

  const signIn = await request(base).post('/api/auth/sign-in').set('Origin', config.publicUrl).send({ email: DEMO_USER.email, password: DEMO_USER.password });
  const cookie = (signIn.headers['set-cookie'] as unknown as string[]).map((c) => c.split(';')[0]).join('; ');
  const me = signIn.body as { teams: { id: string; name: string }[] };
  const teamId = me.teams.find((t) => t.name === DEMO_TEAM_NAME)!.id;
  const list = await request(base).get(`/api/teams/${teamId}/studies?q=${encodeURIComponent(DEMO_STUDY_TITLE)}`).set('Cookie', cookie);
  const studyId = list.body.studies[0].id as string;

  const bare = await run(`${base}/api/health`, {});
  const study = await run(`${base}/api/teams/${teamId}/studies/${studyId}`, { cookie });
  const line = (name: string, r: Awaited<ReturnType<typeof run>>) =>
    console.log(`${name.padEnd(28)} ${r.rps.toFixed(0).padStart(7)} req/s   p50 ${String(r.p50).padStart(4)} ms   p99 ${String(r.p99).padStart(4)} ms   errors ${r.errors}   (${r.total} requests)`);
  console.log(`autocannon, ${CONNECTIONS} connections, ${SECONDS} s each, loopback`);
  line('bare endpoint (SELECT 1)', bare);
  line('read one study', study);
  console.log(`study reads / bare endpoint: ${(study.rps / bare.rps).toFixed(2)} (target at least 0.50); study p99 ${study.p99} ms (target under 50 ms)`);
  server.close();
  await database.pool.end();
}

main().catch((err) => {
  console.error(err);
  process.exit(1);
});
