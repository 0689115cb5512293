import { and, desc, eq, sql } from 'drizzle-orm';
import type { User } from 'lucia';
import type { TeamAccess } from '../auth/access';
import type { Db } from '../db/client';
import { studyRevisions, users } from '../db/schema';
import { notFound } from '../http/errors';
import { loadStudy, saveRevision } from './studies';
import { assertMapsUsable, storedDocument, validDocument } from './study-documents';

/** A study's history: every saved revision, one old revision, and restoring one as the newest. */

/** A member's name, or an imported author's name kept as plain text. */
const revisionAuthor = sql<string | null>`coalesce(${users.name}, ${studyRevisions.authorName})`;

export async function listRevisions(db: Db, teamId: string, studyId: string) {
  await loadStudy(db, teamId, studyId);
  const rows = await db
    .select({ revision: studyRevisions.revision, message: studyRevisions.message, author: revisionAuthor, createdAt: studyRevisions.createdAt })
    .from(studyRevisions)
    .leftJoin(users, eq(users.id, studyRevisions.authorId))
    .where(eq(studyRevisions.studyId, studyId))
    .orderBy(desc(studyRevisions.revision));
  return rows.map((r) => ({ ...r, createdAt: r.createdAt.toISOString() }));
}

/** One revision of a team's study; `revisionText` is the path segment (anything but a revision number is not found). */
async function loadRevision(db: Db, teamId: string, studyId: string, revisionText: string) {
  await loadStudy(db, teamId, studyId);
  const revision = Number(revisionText);
  if (!Number.isInteger(revision) || revision < 1) throw notFound('No such revision.');
  const [row] = await db
    .select({
      revision: studyRevisions.revision,
      message: studyRevisions.message,
      author: revisionAuthor,
      createdAt: studyRevisions.createdAt,
      document: studyRevisions.document,
    })
    .from(studyRevisions)
    .leftJoin(users, eq(users.id, studyRevisions.authorId))
    .where(and(eq(studyRevisions.studyId, studyId), eq(studyRevisions.revision, revision)));
  if (!row) throw notFound('No such revision.');
  return row;
}

export async function revisionDetail(db: Db, teamId: string, studyId: string, revisionText: string) {
  const row = await loadRevision(db, teamId, studyId, revisionText);
  return { ...row, createdAt: row.createdAt.toISOString(), document: storedDocument(row.document) };
}

/** Saves an old revision's document as the next revision (refused like any save when `baseRevision` is stale). */
export async function restoreRevision(db: Db, input: { access: TeamAccess; user: User; studyId: string; revisionText: string; baseRevision: number }) {
  const { access, user, studyId, baseRevision } = input;
  const row = await loadRevision(db, access.teamId, studyId, input.revisionText);
  const document = validDocument(row.document);
  await assertMapsUsable(db, access.teamId, document);
  return saveRevision(db, { access, user, studyId, baseRevision, document, message: `Restored revision ${row.revision}` });
}
