/**
 * HTTP throughput on loopback with autocannon, 50 connections: reading one study against a bare
 * endpoint of the same server that does one trivial query (GET /api/health, `SELECT 1`).
 * Targets (printed, not asserted): study reads at least half the bare endpoint's throughput;
 * p99 under 50 ms at 50 connections.
 *
 *   npm run bench api
 */
import { DEMO_USER, DEMO_TEAM_NAME, DEMO_STUDY_TITLE } from '#server/services/demo';
import { bareEndpoint, CONNECTIONS, cookieOf, line, postJson, runAutocannon, startBenchServer } from './lib';

const SECONDS = Number(process.env.BENCH_SECONDS ?? 10);

async function main() {
  const server = await startBenchServer();
  const { base, config } = server;

  const signIn = await postJson(base, config.publicUrl, '/api/auth/sign-in', { email: DEMO_USER.email, password: DEMO_USER.password });
  const cookie = cookieOf(signIn.headers);
  const me = signIn.body as { teams: { id: string; name: string }[] };
  const teamId = me.teams.find((t) => t.name === DEMO_TEAM_NAME)!.id;
  const list = await fetch(`${base}/api/teams/${teamId}/studies?q=${encodeURIComponent(DEMO_STUDY_TITLE)}`, { headers: { Cookie: cookie } });
  const studyId = ((await list.json()) as { studies: { id: string }[] }).studies[0].id;

  const bare = await bareEndpoint(base, SECONDS);
  const study = await runAutocannon({ url: `${base}/api/teams/${teamId}/studies/${studyId}`, duration: SECONDS, headers: { cookie } });
  console.log(`autocannon, ${CONNECTIONS} connections, ${SECONDS} s each, loopback`);
  line('bare endpoint (SELECT 1)', bare);
  line('read one study', study);
  console.log(`study reads / bare endpoint: ${(study.rps / bare.rps).toFixed(2)} (target at least 0.50); study p99 ${study.p99} ms (target under 50 ms)`);
  await server.close();
}

main().catch((err) => {
  console.error(err);
  process.exit(1);
});
