import { and, count, desc, eq, ilike, or, sql } from 'drizzle-orm';
import { alias } from 'drizzle-orm/pg-core';
import type { Request } from 'express';
import type { User } from 'lucia';
import type { z } from 'zod';
import { STUDY_SCHEMA_VERSION, type StudyDocument, type StudyStart, type studyListQuerySchema, type updateStudyMetaSchema } from '#shared/schemas/study';
import { can, decideTeamAccess, type TeamAccess } from '../auth/access';
import { newId } from '../auth/tokens';
import type { Db } from '../db/client';
import { studies, studyRevisions, teamMembers, teams, users } from '../db/schema';
import { HttpError, notFound } from '../http/errors';
import { audit } from './audit';
import { resultsWorkbook } from './results-workbook';
import { likePattern } from './text-search';
import { assertMapsUsable, mapsOfStudy, resultsCsv, startDocument, storedDocument, validDocument } from './study-documents';

/** A team's studies: list, read, create, save a revision (refusing a stale one), rename, duplicate, delete. */

const creator = alias(users, 'creator');
const updater = alias(users, 'updater');

async function studyAuthors(db: Db, teamId: string) {
  const rows = await db
    .selectDistinct({ id: users.id, name: users.name })
    .from(studies)
    .innerJoin(users, eq(users.id, studies.createdBy))
    .where(eq(studies.teamId, teamId));
  return rows.sort((a, b) => a.name.localeCompare(b.name));
}

/** One page of a team's studies, newest change first, with the authors to filter by. */
export async function listStudies(db: Db, teamId: string, q: z.output<typeof studyListQuerySchema>) {
  const filters = [eq(studies.teamId, teamId)];
  if (q.archived !== 'all') filters.push(eq(studies.archived, q.archived === 'true'));
  if (q.author) filters.push(eq(studies.createdBy, q.author));
  if (q.q) filters.push(or(ilike(studies.title, likePattern(q.q)), ilike(studies.engineLabel, likePattern(q.q)))!);
  const where = and(...filters);
  const [{ n }] = await db.select({ n: count() }).from(studies).where(where);
  const rows = await db
    .select({
      id: studies.id,
      title: studies.title,
      engineLabel: studies.engineLabel,
      revision: studies.revision,
      archived: studies.archived,
      createdBy: creator.name,
      updatedBy: updater.name,
      updatedAt: studies.updatedAt,
    })
    .from(studies)
    .leftJoin(creator, eq(creator.id, studies.createdBy))
    .leftJoin(updater, eq(updater.id, studies.updatedBy))
    .where(where)
    .orderBy(desc(studies.updatedAt), desc(studies.id))
    .limit(q.pageSize)
    .offset((q.page - 1) * q.pageSize);
  return {
    studies: rows.map((r) => ({ ...r, updatedAt: r.updatedAt.toISOString() })),
    total: n,
    page: q.page,
    pageSize: q.pageSize,
    authors: await studyAuthors(db, teamId),
  };
}

/** A study of the team with the names of who made it and who last changed it; 404 for any other. */
export async function loadStudy(db: Db, teamId: string, studyId: string) {
  const [row] = await db
    .select({ study: studies, createdBy: creator.name, updatedBy: updater.name })
    .from(studies)
    .leftJoin(creator, eq(creator.id, studies.createdBy))
    .leftJoin(updater, eq(updater.id, studies.updatedBy))
    .where(and(eq(studies.id, studyId), eq(studies.teamId, teamId)));
  if (!row) throw notFound('No such study in this team.');
  return row;
}

/** A study as the API answers it, with whether `user` may change it. */
export async function studyDetail(db: Db, access: TeamAccess, user: User, studyId: string) {
  const row = await loadStudy(db, access.teamId, studyId);
  const s = row.study;
  return {
    id: s.id,
    teamId: s.teamId,
    title: s.title,
    engineLabel: s.engineLabel,
    revision: s.revision,
    archived: s.archived,
    createdBy: row.createdBy,
    updatedBy: row.updatedBy,
    createdAt: s.createdAt.toISOString(),
    updatedAt: s.updatedAt.toISOString(),
    document: storedDocument(s.document),
    canEdit: can(access.role, 'content:write', user.isAdmin),
  };
}

/**
 * The study read in one round trip: the team, the user's membership, the study and the names of
 * its authors in one prepared statement; the document leaves PostgreSQL as text and goes into the
 * answer as it is (no parse and re-serialise) when it is already of the current version with every
 * scenario and boost row carrying its id; otherwise it is read as storedDocument reads it.
 */
function studyReadStatement(db: Db) {
  return db
    .select({
      teamId: teams.id,
      teamName: teams.name,
      personal: teams.personal,
      requireTwoFactor: teams.requireTwoFactor,
      role: teamMembers.role,
      id: studies.id,
      title: studies.title,
      engineLabel: studies.engineLabel,
      revision: studies.revision,
      archived: studies.archived,
      createdBy: creator.name,
      updatedBy: updater.name,
      createdAt: studies.createdAt,
      updatedAt: studies.updatedAt,
      documentVersion: sql<string | null>`(${studies.document} ->> 'schemaVersion')`,
      documentText: sql<string | null>`${studies.document}::text`,
      /** Scenarios or boost rows saved before they had ids: the reader fills them in. */
      documentLacksIds: sql<
        boolean | null
      >`(jsonb_path_exists(${studies.document}, '$.scenarios[*] ? (!exists(@.id))') or jsonb_path_exists(${studies.document}, '$.scenarios[*].boostSchedule[*] ? (!exists(@.id))'))`,
    })
    .from(teams)
    .leftJoin(teamMembers, and(eq(teamMembers.teamId, teams.id), eq(teamMembers.userId, sql.placeholder('userId'))))
    .leftJoin(studies, and(eq(studies.id, sql.placeholder('studyId')), eq(studies.teamId, teams.id)))
    .leftJoin(creator, eq(creator.id, studies.createdBy))
    .leftJoin(updater, eq(updater.id, studies.updatedBy))
    .where(eq(teams.id, sql.placeholder('teamId')))
    .limit(1)
    .prepare('study_read');
}
const studyReads = new WeakMap<Db, ReturnType<typeof studyReadStatement>>();

/** `{ "study": … }` as studyDetail answers it, as JSON text, for a user allowed to read the team's content. */
export async function studyAnswerJson(db: Db, user: User, teamId: string, studyId: string): Promise<string> {
  let statement = studyReads.get(db);
  if (!statement) studyReads.set(db, (statement = studyReadStatement(db)));
  const [row] = await statement.execute({ userId: user.id, studyId, teamId });
  const access = decideTeamAccess(row, user, 'content:read');
  if (!row.id || row.documentText === null || !row.createdAt || !row.updatedAt) throw notFound('No such study in this team.');
  const head = {
    id: row.id,
    teamId: row.teamId,
    title: row.title,
    engineLabel: row.engineLabel,
    revision: row.revision,
    archived: row.archived,
    createdBy: row.createdBy,
    updatedBy: row.updatedBy,
    createdAt: row.createdAt.toISOString(),
    updatedAt: row.updatedAt.toISOString(),
  };
  const asStored = row.documentVersion === String(STUDY_SCHEMA_VERSION) && row.documentLacksIds === false;
  const document = asStored ? row.documentText : JSON.stringify(storedDocument(JSON.parse(row.documentText)));
  const canEdit = can(access.role, 'content:write', user.isAdmin);
  return `{"study":${JSON.stringify(head).slice(0, -1)},"document":${document},"canEdit":${canEdit}}}`;
}

/** A new study at revision 1 with its first revision row, in one transaction. */
export async function insertStudy(db: Db, input: { teamId: string; userId: string; title: string; document: StudyDocument; message: string }) {
  const { teamId, userId, title, document, message } = input;
  const id = newId();
  await db.transaction(async (tx) => {
    await tx.insert(studies).values({ id, teamId, title, engineLabel: document.engineLabel, document, createdBy: userId, updatedBy: userId });
    await tx.insert(studyRevisions).values({ studyId: id, revision: 1, document, title, message, authorId: userId });
  });
  return id;
}

/** The first revision's message of a study started from a template. */
const STARTED: Record<StudyStart, string> = {
  'demo-hillclimb': 'Started from the demo study',
  'demo-exhaust': 'Started from the demo exhaust-side study',
  blank: 'Started blank',
};

/** A new study from the given document, or from a template (the demo hill-climb study when none is named). */
export async function createStudy(db: Db, input: { access: TeamAccess; user: User; title: string; document?: unknown; start?: StudyStart }) {
  const { access, user } = input;
  const start = input.start ?? 'demo-hillclimb';
  const document = input.document === undefined ? startDocument(start) : validDocument(input.document);
  await assertMapsUsable(db, access.teamId, document);
  const message = input.document !== undefined ? 'Created' : STARTED[start];
  const id = await insertStudy(db, { teamId: access.teamId, userId: user.id, title: input.title, document, message });
  return studyDetail(db, access, user, id);
}

export async function duplicateStudy(db: Db, input: { access: TeamAccess; user: User; studyId: string; title?: string }) {
  const { access, user } = input;
  const source = await loadStudy(db, access.teamId, input.studyId);
  const document = validDocument(source.study.document);
  const title = input.title ?? `${source.study.title} (copy)`.slice(0, 120);
  const message = `Copied from "${source.study.title}" revision ${source.study.revision}`;
  const id = await insertStudy(db, { teamId: access.teamId, userId: user.id, title, document, message });
  return studyDetail(db, access, user, id);
}

/**
 * Saves `document` as the next revision if nobody saved since `baseRevision`; otherwise 409 with
 * the newer study, so that two people saving the same revision never lose work silently.
 */
export async function saveRevision(
  db: Db,
  input: { access: TeamAccess; user: User; studyId: string; baseRevision: number; document: StudyDocument; message: string },
) {
  const { access, user, studyId, baseRevision, document, message } = input;
  const saved = await db.transaction(async (tx) => {
    const [row] = await tx
      .update(studies)
      .set({ document, engineLabel: document.engineLabel, revision: sql`${studies.revision} + 1`, updatedBy: user.id, updatedAt: new Date() })
      .where(and(eq(studies.id, studyId), eq(studies.teamId, access.teamId), eq(studies.revision, baseRevision)))
      .returning({ revision: studies.revision, title: studies.title });
    if (!row) return false;
    await tx.insert(studyRevisions).values({ studyId, revision: row.revision, document, title: row.title, message, authorId: user.id });
    return true;
  });
  if (!saved) {
    const current = await studyDetail(db, access, user, studyId); // 404 when it does not exist
    throw new HttpError(
      409,
      'stale_revision',
      `Someone saved this study since you opened it (revision ${current.revision} by ${current.updatedBy ?? 'someone'}; you started from ${baseRevision}). Reload to see their work, or keep yours as a copy.`,
      { current },
    );
  }
  return studyDetail(db, access, user, studyId);
}

/** A document from the client, checked, saved as the next revision of the study. */
export async function saveStudy(db: Db, input: { access: TeamAccess; user: User; studyId: string; baseRevision: number; document: unknown; message: string }) {
  const document = validDocument(input.document);
  await assertMapsUsable(db, input.access.teamId, document);
  return saveRevision(db, { ...input, document });
}

/** Renames or archives a study (no new revision: the document is unchanged). */
export async function updateStudyMeta(db: Db, input: { access: TeamAccess; user: User; studyId: string; changes: z.output<typeof updateStudyMetaSchema> }) {
  const { access, user, studyId } = input;
  const rows = await db
    .update(studies)
    .set({ ...input.changes, updatedAt: new Date(), updatedBy: user.id })
    .where(and(eq(studies.id, studyId), eq(studies.teamId, access.teamId)))
    .returning({ id: studies.id });
  if (rows.length === 0) throw notFound('No such study in this team.');
  return studyDetail(db, access, user, studyId);
}

export async function deleteStudy(db: Db, input: { teamId: string; studyId: string; actor: User; req: Request }) {
  const { teamId, studyId, actor, req } = input;
  const rows = await db.transaction(async (tx) => {
    const deleted = await tx
      .delete(studies)
      .where(and(eq(studies.id, studyId), eq(studies.teamId, teamId)))
      .returning({ id: studies.id, title: studies.title });
    if (deleted.length)
      await audit(tx, { action: 'study.deleted', teamId, actor, targetType: 'study', targetId: deleted[0].id, details: { title: deleted[0].title }, req });
    return deleted;
  });
  if (rows.length === 0) throw notFound('No such study in this team.');
}

/** The results of a team's study as CSV, with the revision they were computed from. */
/** The results of a team's study as a workbook (one sheet per plan, the CSV's columns), with the revision. */
export async function studyResultsWorkbook(db: Db, teamId: string, studyId: string) {
  const { study } = await loadStudy(db, teamId, studyId);
  const document = validDocument(study.document);
  return { workbook: await resultsWorkbook(document, await mapsOfStudy(db, teamId, document)), revision: study.revision };
}

export async function studyResultsCsv(db: Db, teamId: string, studyId: string) {
  const { study } = await loadStudy(db, teamId, studyId);
  const document = validDocument(study.document);
  return { csv: resultsCsv(document, await mapsOfStudy(db, teamId, document)), revision: study.revision };
}
