/**
 * A workshop's worth of load on loopback: 50 simulated users (50 connections, each signed in with
 * its own session, each with its own team and study) for 30 s (BENCH_SECONDS), mixing reads
 * (study, study list, map list), saves (each user saves its own study on the revision its last
 * save answered) and computes (POST /api/compute, 20 points). Prints throughput and p50/p99
 * overall and per kind beside the bare endpoint of api.bench.ts, the errors (there should be
 * none), whether every answered save is in the revision history with no gaps or doubles (SQL),
 * and memory of the server's process sampled before, during and after. Prints only; asserts nothing.
 *
 *   npm run bench load          BENCH_SECONDS=10 npm run bench load
 */
import type autocannon from 'autocannon';
import { readFileSync } from 'node:fs';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { bareEndpoint, CONNECTIONS, cookieOf, line, postJson, runAutocannon, startServerProcess, type RunSummary } from './lib';
import { connectDatabase } from '#server/db/client';

const SECONDS = Number(process.env.BENCH_SECONDS ?? 30);
const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '..', '..');
const demo = JSON.parse(readFileSync(path.join(root, 'data', 'demo', 'hillclimb-study.json'), 'utf8'));

type Kind = 'read study' | 'list studies' | 'list maps' | 'save study' | 'compute';
/** One user's cycle of requests: mostly reads, two saves and two computes in ten. */
const CYCLE: Kind[] = ['read study', 'save study', 'list studies', 'compute', 'read study', 'list maps', 'save study', 'read study', 'compute', 'list studies'];

interface User {
  cookie: string;
  teamId: string;
  studyId: string;
  /** The revision the last answered save gave, so the next save starts from it. */
  revision: number;
  savesAnswered: number;
  /** A save was sent and no answer came yet: the run may end with it committed but unanswered. */
  saveInFlight: boolean;
}

interface KindStats {
  latencies: number[];
  statuses: Map<number, number>;
}

/** Documents the users save in turn: the demo with a slightly different displacement each time. */
const documents = Array.from({ length: 8 }, (_, i) => {
  const d = structuredClone(demo);
  d.engine.displacement = 0.001998 + i * 1e-5;
  return d;
});

const computeBody = JSON.stringify({
  engine: { displacement: 0.002, cylinders: 4, strokes: 4 },
  ambient: { altitude: 300, temperature: 298.15 },
  losses: { inlet: 2500, chargeCooler: 12000 },
  fuel: { kind: 'ethanol-blend', ethanolPercent: 85, lambda: 0.8, brakeThermalEfficiency: 0.33, drivetrainLoss: 0.15 },
  points: Array.from({ length: 20 }, (_, i) => ({
    rpm: 2500 + i * 300,
    volumetricEfficiency: 0.95,
    boost: 60_000 + i * 4_000,
    manifoldTemperature: 318,
    compressorEfficiency: 0.72,
  })),
});

function percentile(sorted: number[], p: number) {
  if (sorted.length === 0) return NaN;
  return sorted[Math.min(sorted.length - 1, Math.floor((p / 100) * sorted.length))];
}

const mb = (bytes: number) => `${(bytes / 1024 / 1024).toFixed(0)} MB`;

async function createUsers(base: string, origin: string): Promise<User[]> {
  const users: User[] = [];
  // Ten at a time: sign-up hashes a password (argon2id), which is slow on purpose.
  for (let batch = 0; batch < CONNECTIONS; batch += 10) {
    const made = await Promise.all(
      Array.from({ length: Math.min(10, CONNECTIONS - batch) }, async (_, j) => {
        const n = batch + j;
        const email = `load-${Date.now().toString(36)}-${n}@example.test`;
        const signUp = await postJson(base, origin, '/api/auth/sign-up', { email, password: 'quiet harbour turbine passphrase', name: `Load user ${n}` });
        if (signUp.status !== 201) throw new Error(`sign-up ${n}: ${signUp.status} ${JSON.stringify(signUp.body)}`);
        const cookie = cookieOf(signUp.headers);
        const teamId = (signUp.body as { teams: { id: string }[] }).teams[0].id;
        const created = await postJson(base, origin, `/api/teams/${teamId}/studies`, { title: `Load study ${n}`, document: demo }, cookie);
        if (created.status !== 201) throw new Error(`create study ${n}: ${created.status} ${JSON.stringify(created.body)}`);
        const study = (created.body as { study: { id: string; revision: number } }).study;
        return { cookie, teamId, studyId: study.id, revision: study.revision, savesAnswered: 0, saveInFlight: false };
      }),
    );
    users.push(...made);
  }
  return users;
}

async function main() {
  const server = await startServerProcess({ computeRateLimitPerMinute: 10_000_000, poolMax: 20 });
  const { base } = server;
  const origin = server.publicUrl;
  // The bench's own connection, for checking the history afterwards.
  const database = connectDatabase(process.env.DATABASE_URL!, { max: 1 });

  console.log(`setting up ${CONNECTIONS} users, each with a team and a study…`);
  const setupStarted = performance.now();
  const users = await createUsers(base, origin);
  console.log(`users ready in ${((performance.now() - setupStarted) / 1000).toFixed(0)} s`);

  const baselineSeconds = Math.min(10, SECONDS);
  const bare = await bareEndpoint(base, baselineSeconds);

  const stats = new Map<Kind, KindStats>(CYCLE.map((k) => [k, { latencies: [], statuses: new Map() }]));
  const saveProblems: string[] = [];

  /** The request of kind `kind` for the user this connection simulates. */
  function requestOf(kind: Kind): autocannon.Request {
    return {
      setupRequest: (req, context) => {
        const ctx = context as { user?: number; sentAt?: number; n?: number };
        // Before setupClient has given this connection its user (autocannon builds the first request early).
        if (ctx.user === undefined) return { ...req, method: 'GET', path: '/api/health' };
        const u = users[ctx.user];
        ctx.sentAt = performance.now();
        const headers = { cookie: u.cookie, origin, 'content-type': 'application/json' };
        if (kind === 'read study') return { ...req, method: 'GET', path: `/api/teams/${u.teamId}/studies/${u.studyId}`, headers };
        if (kind === 'list studies') return { ...req, method: 'GET', path: `/api/teams/${u.teamId}/studies`, headers };
        if (kind === 'list maps') return { ...req, method: 'GET', path: `/api/teams/${u.teamId}/maps`, headers };
        if (kind === 'compute') return { ...req, method: 'POST', path: '/api/compute', headers, body: computeBody };
        const document = documents[(u.savesAnswered + ctx.user) % documents.length];
        u.saveInFlight = true;
        return {
          ...req,
          method: 'PUT',
          path: `/api/teams/${u.teamId}/studies/${u.studyId}`,
          headers,
          body: JSON.stringify({ baseRevision: u.revision, document, message: 'load bench' }),
        };
      },
      onResponse: (status, body, context) => {
        const ctx = context as { user?: number; sentAt?: number };
        if (ctx.user === undefined || ctx.sentAt === undefined) return;
        const s = stats.get(kind)!;
        s.latencies.push(performance.now() - ctx.sentAt);
        s.statuses.set(status, (s.statuses.get(status) ?? 0) + 1);
        if (kind !== 'save study') return;
        const u = users[ctx.user];
        u.saveInFlight = false;
        if (status === 200) {
          const revision = (JSON.parse(body) as { study: { revision: number } }).study.revision;
          if (revision !== u.revision + 1) saveProblems.push(`user ${ctx.user}: saved on ${u.revision}, answered revision ${revision}`);
          u.revision = revision;
          u.savesAnswered++;
        } else {
          saveProblems.push(`user ${ctx.user}: save answered ${status}: ${body.slice(0, 200)}`);
          if (status === 409) u.revision = (JSON.parse(body) as { error: { details: { current: { revision: number } } } }).error.details.current.revision;
        }
      },
    };
  }

  let nextUser = 0;
  const memoryBefore = await server.memory();
  const samples: { rss: number; heapUsed: number }[] = [];
  const sampler = setInterval(() => void server.memory().then((m) => samples.push(m)), 1000);
  const load = await runAutocannon({
    url: base,
    duration: SECONDS,
    initialContext: {},
    requests: CYCLE.map(requestOf),
    // Each connection is one user for the whole run: its context carries the user's index, and
    // autocannon starts every cycle of requests from a copy of that context.
    setupClient: (client) => {
      const iterator = (client as unknown as { requestIterator: { initialContext: object; resetContext: () => void } }).requestIterator;
      iterator.initialContext = { user: nextUser++ };
      iterator.resetContext();
      client.setRequests(CYCLE.map(requestOf));
    },
  });
  clearInterval(sampler);
  await new Promise((r) => setTimeout(r, 2000));
  const memoryAfter = await server.memory();

  // Every save answered 200 must be in the history: revisions 1..n, none missing, none twice.
  const { rows } = await database.pool.query<{ id: string; revision: number; n: number; distinct_n: number; lowest: number; highest: number }>(
    `SELECT s.id, s.revision, count(r.revision)::int AS n, count(DISTINCT r.revision)::int AS distinct_n,
            min(r.revision)::int AS lowest, max(r.revision)::int AS highest
       FROM studies s JOIN study_revisions r ON r.study_id = s.id
      WHERE s.id = ANY($1) GROUP BY s.id, s.revision`,
    [users.map((u) => u.studyId)],
  );
  let lost = 0;
  let doubled = 0;
  let unexplained = 0;
  let cutOff = 0;
  let cutOffCommitted = 0;
  for (const u of users) {
    const row = rows.find((r) => r.id === u.studyId);
    const expected = 1 + u.savesAnswered; // the first revision from creating it, then one per answered save
    if (!row) {
      lost += expected;
      continue;
    }
    doubled += row.n - row.distinct_n;
    if (row.distinct_n < expected) lost += expected - row.distinct_n;
    // A save still in flight when the run stopped may have committed without its answer being read.
    const allowed = expected + (u.saveInFlight ? 1 : 0);
    if (u.saveInFlight) {
      cutOff++;
      if (row.revision === expected + 1) cutOffCommitted++;
    }
    const contiguous = row.lowest === 1 && row.highest === row.revision && row.distinct_n === row.revision;
    if (!contiguous || row.revision < expected || row.revision > allowed) unexplained++;
  }

  const summary = (name: Kind): RunSummary => {
    const s = stats.get(name)!;
    const sorted = [...s.latencies].sort((a, b) => a - b);
    const ok = [...s.statuses].filter(([st]) => st >= 200 && st < 300).reduce((a, [, n]) => a + n, 0);
    return {
      rps: s.latencies.length / SECONDS,
      p50: percentile(sorted, 50),
      p99: percentile(sorted, 99),
      errors: s.latencies.length - ok,
      total: s.latencies.length,
    };
  };

  console.log(`\nautocannon, ${CONNECTIONS} connections (one signed-in user each), loopback; baseline ${baselineSeconds} s, mixed load ${SECONDS} s`);
  line('bare endpoint (SELECT 1)', bare);
  line('mixed load, all requests', load);
  for (const kind of ['read study', 'list studies', 'list maps', 'save study', 'compute'] as Kind[]) line(`  ${kind}`, summary(kind));
  console.log(`mixed load / bare endpoint throughput: ${(load.rps / bare.rps).toFixed(2)}`);
  const statuses = Object.entries(load.result.statusCodeStats ?? {})
    .map(([k, v]) => `${k}: ${(v as { count: number }).count}`)
    .join(', ');
  console.log(
    `errors: ${load.errors} (connection errors ${load.result.errors}, timeouts ${load.result.timeouts}, non-2xx ${load.result.non2xx}); statuses ${statuses}`,
  );
  for (const p of saveProblems.slice(0, 5)) console.log(`  save problem: ${p}`);
  const answered = users.reduce((a, u) => a + u.savesAnswered, 0);
  console.log(
    `saves answered 200: ${answered}; in the revision history: lost ${lost}, doubled ${doubled}, ` +
      `studies whose history does not match ${unexplained} of ${users.length} ` +
      `(${cutOff} saves were in flight when the run stopped; ${cutOffCommitted} of them committed, as they may)`,
  );
  const rss = samples.map((s) => s.rss);
  const heap = samples.map((s) => s.heapUsed);
  const third = Math.max(1, Math.floor(samples.length / 3));
  const mean = (xs: number[]) => xs.reduce((a, b) => a + b, 0) / Math.max(1, xs.length);
  console.log(
    `memory of the server process: before rss ${mb(memoryBefore.rss)} heap ${mb(memoryBefore.heapUsed)}; ` +
      `during rss ${mb(Math.min(...rss))}–${mb(Math.max(...rss))} heap ${mb(Math.min(...heap))}–${mb(Math.max(...heap))}; ` +
      `after rss ${mb(memoryAfter.rss)} heap ${mb(memoryAfter.heapUsed)}`,
  );
  console.log(
    `heap, mean of the first and last third of the run: ${mb(mean(heap.slice(0, third)))} → ${mb(mean(heap.slice(-third)))} (steady when these are close)`,
  );
  await server.close();
  await database.pool.end();
}

main().catch((err) => {
  console.error(err);
  process.exit(1);
});
