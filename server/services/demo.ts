import { and, eq } from 'drizzle-orm';
import { newId } from '../auth/tokens';
import type { Db } from '../db/client';
import { studies, teamMembers, teams } from '../db/schema';
import { createAccount, findUserByEmail } from './accounts';
import { seedDemoLog } from './demo-logs';
import { addDemoVehicles } from './demo-drive';
import { insertStudy } from './studies';
import { DEMO_STUDY_FILES, demoStudyDocument } from './study-documents';

/**
 * The demo sign-ins, printed by `npm start` in development and given in the README. Invented
 * people with published passwords: they exist only in development databases (`npm start` on its
 * own local cluster) and in the test and bench databases, never anywhere else.
 */
export const DEMO_USER = { email: 'demo@spoolbook.test', password: 'spoolbook-demo', name: 'Dana Whitlock' };
export const ADMIN_USER = { email: 'admin@spoolbook.test', password: 'spoolbook-admin', name: 'Site Admin' };
export const DEMO_TEAM_NAME = 'Harrow Hill Motorsport';
export const DEMO_STUDY_TITLE = 'Hill-climb 2.0: which compressor?';
const DEMO_EXHAUST_STUDY_TITLE = 'Hill-climb 2.0: single or divided turbine housing?';
const DEMO_STUDIES = [
  { title: DEMO_STUDY_TITLE, file: DEMO_STUDY_FILES.compressor },
  { title: DEMO_EXHAUST_STUDY_TITLE, file: DEMO_STUDY_FILES.turbineHousing },
];
const DEMO_MEMBERS = [
  { email: 'rafael@spoolbook.test', password: 'spoolbook-demo', name: 'Rafael Okonkwo-Lind', role: 'editor' as const },
  { email: 'mei@spoolbook.test', password: 'spoolbook-demo', name: 'Mei Sato-Brennan', role: 'viewer' as const },
];

async function ensureUser(db: Db, u: { email: string; password: string; name: string }, isAdmin = false): Promise<string> {
  const existing = await findUserByEmail(db, u.email);
  if (existing) return existing.id;
  // Demo passwords are known on purpose: they skip the strength check that sign-up applies.
  return (await createAccount(db, { ...u, isAdmin, confirmed: true })).userId;
}

/** Idempotent: a second run finds everything in place and changes nothing. Development and test databases only. */
export async function seedDemo(db: Db) {
  await ensureUser(db, ADMIN_USER, true);
  const demoId = await ensureUser(db, DEMO_USER);
  let [team] = await db
    .select({ id: teams.id })
    .from(teams)
    .where(and(eq(teams.name, DEMO_TEAM_NAME), eq(teams.personal, false)));
  if (!team) {
    team = { id: newId() };
    await db.insert(teams).values({ id: team.id, name: DEMO_TEAM_NAME, personal: false });
  }
  await db.insert(teamMembers).values({ teamId: team.id, userId: demoId, role: 'owner' }).onConflictDoNothing();
  for (const m of DEMO_MEMBERS) {
    const id = await ensureUser(db, m);
    await db.insert(teamMembers).values({ teamId: team.id, userId: id, role: m.role }).onConflictDoNothing();
  }
  for (const demo of DEMO_STUDIES) {
    const [study] = await db
      .select({ id: studies.id })
      .from(studies)
      .where(and(eq(studies.teamId, team.id), eq(studies.title, demo.title)));
    if (study) continue;
    const document = demoStudyDocument(demo.file);
    await insertStudy(db, { teamId: team.id, userId: demoId, title: demo.title, document, message: 'Demo study' });
  }
  await seedDemoLog(db, team.id, demoId, DEMO_STUDY_TITLE);
  await addDemoVehicles(db, team.id, DEMO_STUDIES, demoId);
  return { demoTeamId: team.id };
}
