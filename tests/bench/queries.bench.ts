/**
 * The query plans of every list and read the API answers most, on a library of a busy site:
 * 200 teams of 25 studies (3 revisions each), 8 maps and 100 audit events each, beside the demo.
 * Each service function runs once through a Drizzle logger that keeps its SQL; every kept SELECT
 * is then explained (EXPLAIN ANALYZE, BUFFERS) and its plan's top line, the indexes it uses, any
 * sequential scan of a large table, and its time are printed. Prints only; asserts nothing.
 * Decision record 009 keeps the plans this printed and what they decided.
 *
 *   npm run bench queries
 */
import { drizzle } from 'drizzle-orm/node-postgres';
import type { User } from 'lucia';
import pg from 'pg';
import * as schema from '#server/db/schema';
import { readAudit } from '#server/services/audit';
import { teamsOf } from '#server/services/accounts';
import { builtinMaps } from '#server/services/builtin-maps';
import { DEMO_TEAM_NAME, DEMO_USER } from '#server/services/demo';
import { listMaps } from '#server/services/maps';
import { membersOf } from '#server/services/members';
import { listShareLinks } from '#server/services/share-links';
import { listStudies, studyAnswerJson } from '#server/services/studies';
import { listRevisions } from '#server/services/study-revisions';
import { auditQuerySchema } from '#shared/schemas/account';
import { studyListQuerySchema } from '#shared/schemas/study';

const TEAMS = 200;
const STUDIES_PER_TEAM = 25;

async function seedVolume(pool: pg.Pool, demoTeamId: string) {
  const client = await pool.connect();
  try {
    await client.query('BEGIN');
    await client.query(
      `INSERT INTO users (id, email, name, password_hash)
      SELECT 'qb-user-' || g, 'qb-user-' || g || '@example.test', 'Bench user ' || g, 'x' FROM generate_series(1, $1) g`,
      [TEAMS],
    );
    await client.query(`INSERT INTO teams (id, name) SELECT 'qb-team-' || g, 'Bench team ' || g FROM generate_series(1, $1) g`, [TEAMS]);
    await client.query(`INSERT INTO team_members (team_id, user_id, role) SELECT 'qb-team-' || g, 'qb-user-' || g, 'owner' FROM generate_series(1, $1) g`, [
      TEAMS,
    ]);
    const [demoStudy] = (await client.query(`SELECT document, title FROM studies WHERE team_id = $1 LIMIT 1`, [demoTeamId])).rows;
    await client.query(
      `INSERT INTO studies (id, team_id, title, engine_label, document, revision, created_by, updated_by, updated_at)
       SELECT 'qb-study-' || t || '-' || s, 'qb-team-' || t, 'Bench study ' || s, 'Bench engine ' || (s % 7), $2::jsonb, 3,
              'qb-user-' || t, 'qb-user-' || t, now() - (s || ' hours')::interval
         FROM generate_series(1, $1) t, generate_series(1, $3) s`,
      [TEAMS, JSON.stringify(demoStudy.document), STUDIES_PER_TEAM],
    );
    await client.query(
      `INSERT INTO study_revisions (study_id, revision, document, title, message, author_id)
       SELECT s.id, r, s.document, s.title, 'bench', s.created_by FROM studies s, generate_series(1, 3) r WHERE s.id LIKE 'qb-study-%'`,
    );
    const demoMap = builtinMaps().find((m) => m.map.kind === 'compressor')!;
    await client.query(
      `INSERT INTO maps (id, team_id, kind, name, parsed, file_text, file_name)
       SELECT 'qb-map-' || t || '-' || m, 'qb-team-' || t, 'compressor', 'Bench map ' || m, $2::jsonb, $3, $4
         FROM generate_series(1, $1) t, generate_series(1, 8) m`,
      [TEAMS, JSON.stringify(demoMap.map), demoMap.fileText, demoMap.fileName],
    );
    await client.query(
      `INSERT INTO audit_events (id, at, team_id, actor_id, action)
       SELECT 'qb-audit-' || t || '-' || a, now() - (a || ' minutes')::interval, 'qb-team-' || t, 'qb-user-' || t, 'study.saved'
         FROM generate_series(1, $1) t, generate_series(1, 100) a`,
      [TEAMS],
    );
    await client.query('COMMIT');
  } catch (err) {
    await client.query('ROLLBACK');
    throw err;
  } finally {
    client.release();
  }
  await pool.query('ANALYZE');
}

interface Kept {
  name: string;
  sql: string;
  params: unknown[];
}

async function main() {
  const pool = new pg.Pool({ connectionString: process.env.DATABASE_URL, max: 2 });
  const kept: Kept[] = [];
  let current = '';
  const db = drizzle(pool, { schema, logger: { logQuery: (sql, params) => kept.push({ name: current, sql, params }) } });

  const [demoUser] = (await pool.query(`SELECT id FROM users WHERE email = $1`, [DEMO_USER.email])).rows;
  const [demoTeam] = (await pool.query(`SELECT id FROM teams WHERE name = $1`, [DEMO_TEAM_NAME])).rows;
  await seedVolume(pool, demoTeam.id);
  const sizes = (
    await pool.query(`SELECT (SELECT count(*) FROM studies)::int AS studies, (SELECT count(*) FROM study_revisions)::int AS revisions,
      (SELECT count(*) FROM maps)::int AS maps, (SELECT count(*) FROM audit_events)::int AS audit`)
  ).rows[0];
  console.log(`library: ${sizes.studies} studies, ${sizes.revisions} revisions, ${sizes.maps} maps, ${sizes.audit} audit events`);

  const teamId = 'qb-team-17';
  const studyId = 'qb-study-17-5';
  const user = { id: 'qb-user-17', isAdmin: false, twoFactor: false } as unknown as User;
  const calls: [string, () => Promise<unknown>][] = [
    ['study read', () => studyAnswerJson(db, user, teamId, studyId)],
    ['study list, first page', () => listStudies(db, teamId, studyListQuerySchema.parse({}))],
    ['study list, search', () => listStudies(db, teamId, studyListQuerySchema.parse({ q: 'engine 3' }))],
    ['revisions of a study', () => listRevisions(db, teamId, studyId)],
    ['share links of a study', () => listShareLinks(db, teamId, studyId)],
    ['maps of a team', () => listMaps(db, teamId)],
    ['members of a team', () => membersOf(db, teamId)],
    ['teams of a user', () => teamsOf(db, demoUser.id)],
    ["a team's audit record", () => readAudit(db, teamId, auditQuerySchema.parse({}))],
  ];
  for (const [name, call] of calls) {
    current = name;
    await call();
  }

  for (const q of kept) {
    if (!/^\s*select/i.test(q.sql)) continue;
    const started = performance.now();
    const { rows } = await pool.query(`EXPLAIN (ANALYZE, BUFFERS, FORMAT JSON) ${q.sql}`, q.params);
    const plan = (rows[0]['QUERY PLAN'] as { Plan: PlanNode; 'Execution Time': number }[])[0];
    const nodes = flatten(plan.Plan);
    const indexes = [...new Set(nodes.filter((n) => n['Index Name']).map((n) => n['Index Name']))];
    const seqScans = nodes.filter((n) => n['Node Type'] === 'Seq Scan' && (n['Actual Rows'] ?? 0) + (n['Rows Removed by Filter'] ?? 0) > 1000);
    console.log(
      `${q.name.padEnd(26)} ${plan['Execution Time'].toFixed(2).padStart(7)} ms  ${plan.Plan['Node Type']}; indexes: ${indexes.join(', ') || 'none'}` +
        (seqScans.length ? `; SEQUENTIAL SCAN of ${seqScans.map((n) => n['Relation Name']).join(', ')}` : '') +
        `  (explained in ${(performance.now() - started).toFixed(0)} ms)`,
    );
  }

  await pool.query(`DELETE FROM teams WHERE id LIKE 'qb-team-%'`);
  await pool.query(`DELETE FROM users WHERE id LIKE 'qb-user-%'`);
  await pool.query(`DELETE FROM audit_events WHERE id LIKE 'qb-audit-%'`);
  await pool.end();
}

interface PlanNode {
  'Node Type': string;
  'Relation Name'?: string;
  'Index Name'?: string;
  'Actual Rows'?: number;
  'Rows Removed by Filter'?: number;
  Plans?: PlanNode[];
}
function flatten(node: PlanNode): PlanNode[] {
  return [node, ...(node.Plans ?? []).flatMap(flatten)];
}

main().catch((err) => {
  console.error(err);
  process.exit(1);
});
