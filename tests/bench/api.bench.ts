/**
 * HTTP throughput on loopback with autocannon, 50 connections, the app in a process of its own:
 * reading one study against a bare endpoint of the same server that does one trivial query
 * (GET /api/health, `SELECT 1`); the same read with database pools of 5, 10 and 20 connections;
 * a browser's second read of an unchanged study (If-None-Match, answered 304); and two app
 * processes on the one database, each taking half the connections, to show reads scale past
 * one process. Targets (printed, not asserted): study reads at least half the bare endpoint's
 * throughput; p99 under 50 ms at 50 connections.
 *
 *   npm run bench api          BENCH_SECONDS=5 npm run bench api
 */
import { DEMO_STUDY_TITLE, DEMO_TEAM_NAME, DEMO_USER } from '#server/services/demo';
import { CONNECTIONS, cookieOf, line, postJson, runAutocannon, startServerProcess, type RunSummary } from './lib';

const SECONDS = Number(process.env.BENCH_SECONDS ?? 10);

async function demoStudyUrl(base: string, publicUrl: string) {
  const signIn = await postJson(base, publicUrl, '/api/auth/sign-in', { email: DEMO_USER.email, password: DEMO_USER.password });
  const cookie = cookieOf(signIn.headers);
  const me = signIn.body as { teams: { id: string; name: string }[] };
  const teamId = me.teams.find((t) => t.name === DEMO_TEAM_NAME)!.id;
  const list = await fetch(`${base}/api/teams/${teamId}/studies?q=${encodeURIComponent(DEMO_STUDY_TITLE)}`, { headers: { Cookie: cookie } });
  const studyId = ((await list.json()) as { studies: { id: string }[] }).studies[0].id;
  return { cookie, path: `/api/teams/${teamId}/studies/${studyId}` };
}

async function main() {
  console.log(`autocannon, ${CONNECTIONS} connections, ${SECONDS} s each, loopback, the app in its own process`);
  let ratio = 0;
  let p99 = 0;
  let oneProcess: RunSummary | null = null;
  for (const poolMax of [10, 5, 20]) {
    const server = await startServerProcess({ poolMax });
    const { cookie, path } = await demoStudyUrl(server.base, server.publicUrl);
    const bare = await runAutocannon({ url: `${server.base}/api/health`, duration: SECONDS });
    const study = await runAutocannon({ url: server.base + path, duration: SECONDS, headers: { cookie } });
    line(`bare endpoint, pool ${poolMax}`, bare);
    line(`read one study, pool ${poolMax}`, study);
    if (poolMax === 10) {
      ratio = study.rps / bare.rps;
      p99 = study.p99;
      oneProcess = study;
      const etag = (await fetch(server.base + path, { headers: { cookie } })).headers.get('etag') ?? '';
      const again = await runAutocannon({ url: server.base + path, duration: SECONDS, headers: { cookie, 'if-none-match': etag } });
      const notModified = again.result.statusCodeStats?.['304']?.count ?? 0;
      line('read again, unchanged (304)', { ...again, errors: again.errors - notModified });
    }
    await server.close();
  }

  // Two processes on one database: the bench's own round robin gives each half the connections.
  const servers = await Promise.all([startServerProcess({ poolMax: 10 }), startServerProcess({ poolMax: 10 })]);
  const targets = await Promise.all(servers.map((s) => demoStudyUrl(s.base, s.publicUrl)));
  const halves = await Promise.all(
    servers.map((s, i) =>
      runAutocannon({ url: s.base + targets[i].path, duration: SECONDS, connections: CONNECTIONS / 2, headers: { cookie: targets[i].cookie } }),
    ),
  );
  const both: RunSummary = {
    rps: halves[0].rps + halves[1].rps,
    p50: Math.max(halves[0].p50, halves[1].p50),
    p99: Math.max(halves[0].p99, halves[1].p99),
    errors: halves[0].errors + halves[1].errors,
    total: halves[0].total + halves[1].total,
  };
  line('read one study, 2 processes', both);
  await Promise.all(servers.map((s) => s.close()));

  console.log(`study reads / bare endpoint: ${ratio.toFixed(2)} (target at least 0.50); study p99 ${p99} ms (target under 50 ms)`);
  if (oneProcess) console.log(`two processes / one process: ${(both.rps / oneProcess.rps).toFixed(2)}`);
}

main().catch((err) => {
  console.error(err);
  process.exit(1);
});
