import { and, eq } from 'drizzle-orm';
import { createHash } from 'node:crypto';
import { readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { guessMapping } from '#shared/logs/guess';
import { logMappingSchema } from '#shared/logs/mapping';
import { readLogTable } from '#shared/logs/read';
import type { Db } from '../db/client';
import { studies, studyLogs } from '../db/schema';
import { insertLog, readLog, storedSamples } from './logs';

/** The invented demo log (scripts/generate-demo-log.ts made it from the demo study's model). */
const DEMO_LOG_FILE = fileURLToPath(new URL('../../data/demo/logs/hillclimb-pulls.csv', import.meta.url));
const DEMO_LOG_NAME = 'Run 3: three pulls in third and fourth (demo)';

/** The demo log's mapping: the guess, which reads this file right. */
export function demoLogMapping() {
  const read = readLogTable(readFileSync(DEMO_LOG_FILE, 'utf8'));
  if (!read.ok) throw new Error(`demo log does not read: ${read.problems[0].message}`);
  return logMappingSchema.parse({ columns: guessMapping(read.table) });
}

/** Idempotent: stores the demo log on the demo study once, read through the same path as an upload. */
export async function seedDemoLog(db: Db, teamId: string, userId: string, studyTitle: string) {
  const [study] = await db
    .select({ id: studies.id })
    .from(studies)
    .where(and(eq(studies.teamId, teamId), eq(studies.title, studyTitle)));
  if (!study) return;
  const [existing] = await db.select({ id: studyLogs.id }).from(studyLogs).where(eq(studyLogs.studyId, study.id)).limit(1);
  if (existing) return;
  const bytes = readFileSync(DEMO_LOG_FILE);
  const mapping = demoLogMapping();
  const log = readLog(bytes, mapping);
  await insertLog(db, {
    teamId,
    studyId: study.id,
    name: DEMO_LOG_NAME,
    loggedOn: '2026-06-14',
    notes: 'Invented demo log generated from the study’s own model, with noise, turbo lag and a manifold pressure sensor reading 2 kPa high.',
    mapping,
    sourceName: 'hillclimb-pulls.csv',
    sourceChecksum: createHash('sha256').update(bytes).digest('hex'),
    sourceBytes: bytes.length,
    log,
    samples: await storedSamples(log),
    createdBy: userId,
  });
}
