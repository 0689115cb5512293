/**
 * "Copy to my team": a study of one team copied into another the caller may write in, so that a
 * viewer can try something without changing the original. The team maps its plans use are copied
 * with it (a team's studies may only use its own maps and the built-in ones); the copy starts a
 * new history at revision 1, and both teams' records say who copied what.
 */
import { and, eq, inArray } from 'drizzle-orm';
import type { Request } from 'express';
import type { User } from 'lucia';
import { studyMapIds } from '#shared/study/document';
import type { StudyDocument } from '#shared/schemas/study';
import type { TeamAccess } from '../auth/access';
import { newId } from '../auth/tokens';
import type { Db } from '../db/client';
import { maps, studies, studyRevisions } from '../db/schema';
import { HttpError } from '../http/errors';
import { audit } from './audit';
import { BUILTIN_PREFIX } from './builtin-maps';
import { loadStudy, studyDetail } from './studies';
import { validDocument } from './study-documents';

/** The document with its plans' map ids replaced by `newIds` (old id → new id); other ids kept. */
function withMapIds(doc: StudyDocument, newIds: ReadonlyMap<string, string>): StudyDocument {
  const swap = (id: string | null | undefined) => (id ? (newIds.get(id) ?? id) : id);
  return {
    ...doc,
    plans: doc.plans.map((p) => ({
      ...p,
      compressorMapId: swap(p.compressorMapId) ?? null,
      ...(p.turbineMapId !== undefined ? { turbineMapId: swap(p.turbineMapId) ?? null } : {}),
    })),
  };
}

/**
 * Copies the current revision of `studyId` (in `from`, which the caller may read) into `to` (which
 * they may write in), with the team maps it uses, in one transaction. Answers the new study.
 */
export async function copyStudyToTeam(db: Db, input: { from: TeamAccess; to: TeamAccess; user: User; studyId: string; title?: string; req: Request }) {
  const { from, to, user, req } = input;
  if (from.teamId === to.teamId)
    throw new HttpError(400, 'invalid_input', 'teamId: the study is already in this team (Duplicate makes a copy beside it)', {
      issues: [{ path: 'teamId', message: 'the study is already in this team' }],
    });
  const source = await loadStudy(db, from.teamId, input.studyId);
  const original = validDocument(source.study.document);
  const title = input.title ?? source.study.title;
  const teamMapIds = studyMapIds(original.plans).filter((id) => !id.startsWith(BUILTIN_PREFIX));
  const id = newId();
  await db.transaction(async (tx) => {
    const mapRows = teamMapIds.length
      ? await tx
          .select()
          .from(maps)
          .where(and(eq(maps.teamId, from.teamId), inArray(maps.id, teamMapIds)))
      : [];
    const newIds = new Map(mapRows.map((m) => [m.id, newId()] as const));
    for (const m of mapRows) {
      await tx.insert(maps).values({
        id: newIds.get(m.id)!,
        teamId: to.teamId,
        kind: m.kind,
        name: m.name,
        notes: m.notes,
        parsed: m.parsed,
        fileText: m.fileText,
        fileName: m.fileName,
        createdBy: user.id,
      });
    }
    const document = withMapIds(original, newIds);
    const message = `Copied from "${source.study.title}" revision ${source.study.revision} of ${from.teamName}`;
    await tx.insert(studies).values({ id, teamId: to.teamId, title, engineLabel: document.engineLabel, document, createdBy: user.id, updatedBy: user.id });
    await tx.insert(studyRevisions).values({ studyId: id, revision: 1, document, title, message, authorId: user.id });
    const details = { title, fromTeam: from.teamName, toTeam: to.teamName, maps: mapRows.length };
    await audit(tx, { action: 'study.copied-out', teamId: from.teamId, actor: user, targetType: 'study', targetId: source.study.id, details, req });
    await audit(tx, { action: 'study.copied-in', teamId: to.teamId, actor: user, targetType: 'study', targetId: id, details, req });
  });
  return studyDetail(db, to, user, id);
}
