import { and, count, desc, eq, ilike, isNull, or, sql } from 'drizzle-orm';
import { Router, type Response } from 'express';
import { alias } from 'drizzle-orm/pg-core';
import {
  createShareLinkSchema,
  createStudySchema,
  keepShareLinkSchema,
  duplicateStudySchema,
  restoreRevisionSchema,
  saveStudySchema,
  STUDY_SCHEMA_VERSION,
  studyListQuerySchema,
  updateStudyMetaSchema,
} from '#shared/schemas/study';
import { can, requireTeamPermission, type TeamAccess } from '../auth/access';
import { requireUser } from '../auth/session';
import { newId, newToken } from '../auth/tokens';
import { shareLinks, studies, studyRevisions, users } from '../db/schema';
import { HttpError, notFound, parseOr400 } from '../http/errors';
import { assertMapsUsable, demoStudyDocument, mapsOfStudy, resultsCsv, studyAuthors, validDocument } from '../services/studies';
import type { AppDeps } from '../app-deps';
import { audit } from '../services/audit';

const creator = alias(users, 'creator');
/** A member's name, or an imported author's name kept as plain text. */
const revisionAuthor = sql<string | null>`coalesce(${users.name}, ${studyRevisions.authorName})`;
const updater = alias(users, 'updater');

/** Escapes LIKE wildcards so a search for "50%" finds "50%" and not everything. */
function likePattern(q: string) {
  return `%${q.replace(/[\\%_]/g, (c) => `\\${c}`)}%`;
}

export function studiesRouter({ db, config }: AppDeps): Router {
  const router = Router({ mergeParams: true });
  const teamIdOf = (params: unknown) => (params as { teamId: string }).teamId;
  const studyIdOf = (params: unknown) => (params as { studyId: string }).studyId;

  async function loadStudy(access: TeamAccess, studyId: string) {
    const [row] = await db
      .select({ study: studies, createdBy: creator.name, updatedBy: updater.name })
      .from(studies)
      .leftJoin(creator, eq(creator.id, studies.createdBy))
      .leftJoin(updater, eq(updater.id, studies.updatedBy))
      .where(and(eq(studies.id, studyId), eq(studies.teamId, access.teamId)));
    if (!row) throw notFound('No such study in this team.');
    return row;
  }

  async function detail(access: TeamAccess, studyId: string, res: Response) {
    const row = await loadStudy(access, studyId);
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
      document: validDocumentOrRaw(s.document),
      canEdit: can(access.role, 'content:write', res.locals.user?.isAdmin ?? false),
    };
  }

  /** Stored documents were valid when saved; only an older version needs bringing up to date on read. */
  function validDocumentOrRaw(raw: unknown) {
    if ((raw as { schemaVersion?: unknown } | null)?.schemaVersion === STUDY_SCHEMA_VERSION) return raw;
    try {
      return validDocument(raw);
    } catch {
      return raw;
    }
  }

  router.get('/', async (req, res) => {
    const user = requireUser(res);
    const access = await requireTeamPermission(db, user, teamIdOf(req.params), 'content:read');
    const q = parseOr400(studyListQuerySchema, { ...req.query }, 'query');
    const filters = [eq(studies.teamId, access.teamId)];
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
    res.json({
      studies: rows.map((r) => ({ ...r, updatedAt: r.updatedAt.toISOString() })),
      total: n,
      page: q.page,
      pageSize: q.pageSize,
      authors: await studyAuthors(db, access.teamId),
    });
  });

  async function insertStudy(access: TeamAccess, userId: string, title: string, document: ReturnType<typeof validDocument>, message: string) {
    const id = newId();
    await db.transaction(async (tx) => {
      await tx.insert(studies).values({ id, teamId: access.teamId, title, engineLabel: document.engineLabel, document, createdBy: userId, updatedBy: userId });
      await tx.insert(studyRevisions).values({ studyId: id, revision: 1, document, title, message, authorId: userId });
    });
    return id;
  }

  router.post('/', async (req, res) => {
    const user = requireUser(res);
    const access = await requireTeamPermission(db, user, teamIdOf(req.params), 'content:write');
    const input = parseOr400(createStudySchema, req.body);
    const document = input.document === undefined ? demoStudyDocument() : validDocument(input.document);
    await assertMapsUsable(db, access.teamId, document);
    const id = await insertStudy(access, user.id, input.title, document, input.document === undefined ? 'Started from the demo study' : 'Created');
    res.status(201).json({ study: await detail(access, id, res) });
  });

  router.get('/:studyId', async (req, res) => {
    const user = requireUser(res);
    const access = await requireTeamPermission(db, user, teamIdOf(req.params), 'content:read');
    res.json({ study: await detail(access, studyIdOf(req.params), res) });
  });

  /** Saves `document` as the next revision if nobody saved since `baseRevision`; else 409 with the newer one. */
  async function saveRevision(
    access: TeamAccess,
    res: Response,
    studyId: string,
    baseRevision: number,
    document: ReturnType<typeof validDocument>,
    message: string,
    userId: string,
  ) {
    const saved = await db.transaction(async (tx) => {
      const [row] = await tx
        .update(studies)
        .set({ document, engineLabel: document.engineLabel, revision: sql`${studies.revision} + 1`, updatedBy: userId, updatedAt: new Date() })
        .where(and(eq(studies.id, studyId), eq(studies.teamId, access.teamId), eq(studies.revision, baseRevision)))
        .returning({ revision: studies.revision, title: studies.title });
      if (!row) return false;
      await tx.insert(studyRevisions).values({ studyId, revision: row.revision, document, title: row.title, message, authorId: userId });
      return true;
    });
    if (!saved) {
      const current = await detail(access, studyId, res); // 404 when it does not exist
      throw new HttpError(
        409,
        'stale_revision',
        `Someone saved this study since you opened it (revision ${current.revision} by ${current.updatedBy ?? 'someone'}; you started from ${baseRevision}). Reload to see their work, or keep yours as a copy.`,
        { current },
      );
    }
    return detail(access, studyId, res);
  }

  router.put('/:studyId', async (req, res) => {
    const user = requireUser(res);
    const access = await requireTeamPermission(db, user, teamIdOf(req.params), 'content:write');
    const input = parseOr400(saveStudySchema, req.body);
    const document = validDocument(input.document);
    await assertMapsUsable(db, access.teamId, document);
    res.json({ study: await saveRevision(access, res, studyIdOf(req.params), input.baseRevision, document, input.message ?? '', user.id) });
  });

  router.patch('/:studyId', async (req, res) => {
    const user = requireUser(res);
    const access = await requireTeamPermission(db, user, teamIdOf(req.params), 'content:write');
    const input = parseOr400(updateStudyMetaSchema, req.body);
    const rows = await db
      .update(studies)
      .set({ ...input, updatedAt: new Date(), updatedBy: user.id })
      .where(and(eq(studies.id, studyIdOf(req.params)), eq(studies.teamId, access.teamId)))
      .returning({ id: studies.id });
    if (rows.length === 0) throw notFound('No such study in this team.');
    res.json({ study: await detail(access, studyIdOf(req.params), res) });
  });

  router.delete('/:studyId', async (req, res) => {
    const user = requireUser(res);
    const access = await requireTeamPermission(db, user, teamIdOf(req.params), 'content:write');
    const rows = await db.transaction(async (tx) => {
      const deleted = await tx
        .delete(studies)
        .where(and(eq(studies.id, studyIdOf(req.params)), eq(studies.teamId, access.teamId)))
        .returning({ id: studies.id, title: studies.title });
      if (deleted.length)
        await audit(tx, {
          action: 'study.deleted',
          teamId: access.teamId,
          actor: user,
          targetType: 'study',
          targetId: deleted[0].id,
          details: { title: deleted[0].title },
          req,
        });
      return deleted;
    });
    if (rows.length === 0) throw notFound('No such study in this team.');
    res.status(204).end();
  });

  router.post('/:studyId/duplicate', async (req, res) => {
    const user = requireUser(res);
    const access = await requireTeamPermission(db, user, teamIdOf(req.params), 'content:write');
    const input = parseOr400(duplicateStudySchema, req.body ?? {});
    const source = await loadStudy(access, studyIdOf(req.params));
    const document = validDocument(source.study.document);
    const title = input.title ?? `${source.study.title} (copy)`.slice(0, 120);
    const id = await insertStudy(access, user.id, title, document, `Copied from "${source.study.title}" revision ${source.study.revision}`);
    res.status(201).json({ study: await detail(access, id, res) });
  });

  router.get('/:studyId/revisions', async (req, res) => {
    const user = requireUser(res);
    const access = await requireTeamPermission(db, user, teamIdOf(req.params), 'content:read');
    await loadStudy(access, studyIdOf(req.params));
    const rows = await db
      .select({ revision: studyRevisions.revision, message: studyRevisions.message, author: revisionAuthor, createdAt: studyRevisions.createdAt })
      .from(studyRevisions)
      .leftJoin(users, eq(users.id, studyRevisions.authorId))
      .where(eq(studyRevisions.studyId, studyIdOf(req.params)))
      .orderBy(desc(studyRevisions.revision));
    res.json({ revisions: rows.map((r) => ({ ...r, createdAt: r.createdAt.toISOString() })) });
  });

  async function loadRevision(access: TeamAccess, studyId: string, revisionText: string) {
    await loadStudy(access, studyId);
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

  router.get('/:studyId/revisions/:revision', async (req, res) => {
    const user = requireUser(res);
    const access = await requireTeamPermission(db, user, teamIdOf(req.params), 'content:read');
    const row = await loadRevision(access, studyIdOf(req.params), (req.params as { revision: string }).revision);
    res.json({ revision: { ...row, createdAt: row.createdAt.toISOString(), document: validDocumentOrRaw(row.document) } });
  });

  router.post('/:studyId/revisions/:revision/restore', async (req, res) => {
    const user = requireUser(res);
    const access = await requireTeamPermission(db, user, teamIdOf(req.params), 'content:write');
    const input = parseOr400(restoreRevisionSchema, req.body);
    const row = await loadRevision(access, studyIdOf(req.params), (req.params as { revision: string }).revision);
    const document = validDocument(row.document);
    await assertMapsUsable(db, access.teamId, document);
    res.json({ study: await saveRevision(access, res, studyIdOf(req.params), input.baseRevision, document, `Restored revision ${row.revision}`, user.id) });
  });

  router.get('/:studyId/results.csv', async (req, res) => {
    const user = requireUser(res);
    const access = await requireTeamPermission(db, user, teamIdOf(req.params), 'content:read');
    const row = await loadStudy(access, studyIdOf(req.params));
    const document = validDocument(row.study.document);
    const csv = resultsCsv(document, await mapsOfStudy(db, access.teamId, document));
    res.set('Content-Type', 'text/csv; charset=utf-8');
    res.set('Content-Disposition', `attachment; filename="study-results-r${row.study.revision}.csv"`);
    res.send(csv);
  });

  router.get('/:studyId/share-links', async (req, res) => {
    const user = requireUser(res);
    const access = await requireTeamPermission(db, user, teamIdOf(req.params), 'content:write');
    await loadStudy(access, studyIdOf(req.params));
    const rows = await db
      .select({
        id: shareLinks.id,
        createdAt: shareLinks.createdAt,
        createdBy: users.name,
        expiresAt: shareLinks.expiresAt,
        revokedAt: shareLinks.revokedAt,
        kept: sql<boolean>`${shareLinks.keptBy} IS NOT NULL`,
      })
      .from(shareLinks)
      .leftJoin(users, eq(users.id, shareLinks.createdBy))
      .where(eq(shareLinks.studyId, studyIdOf(req.params)))
      .orderBy(desc(shareLinks.createdAt));
    res.json({
      shareLinks: rows.map((r) => ({
        ...r,
        createdAt: r.createdAt.toISOString(),
        expiresAt: r.expiresAt?.toISOString() ?? null,
        revokedAt: r.revokedAt?.toISOString() ?? null,
      })),
    });
  });

  router.post('/:studyId/share-links', async (req, res) => {
    const user = requireUser(res);
    const access = await requireTeamPermission(db, user, teamIdOf(req.params), 'content:write');
    const input = parseOr400(createShareLinkSchema, req.body ?? {});
    await loadStudy(access, studyIdOf(req.params));
    const { token, tokenHash } = newToken();
    const id = newId();
    // 30 days unless the maker chose otherwise; null ("never") only when asked for by name.
    const expiresAt = input.expiresInDays === null ? null : new Date(Date.now() + input.expiresInDays * 86_400_000);
    const [row] = await db
      .insert(shareLinks)
      .values({ id, studyId: studyIdOf(req.params), tokenHash, createdBy: user.id, expiresAt })
      .returning();
    await audit(db, {
      action: 'share-link.created',
      teamId: access.teamId,
      actor: user,
      targetType: 'share-link',
      targetId: id,
      details: { studyId: studyIdOf(req.params), expiresAt: expiresAt?.toISOString() ?? null },
      req,
    });
    res.status(201).json({
      shareLink: {
        id,
        createdAt: row.createdAt.toISOString(),
        createdBy: user.name,
        expiresAt: expiresAt?.toISOString() ?? null,
        revokedAt: null,
        kept: false,
        url: `${config.publicUrl}/share/${token}`,
      },
    });
  });

  /** An owner keeps a link working after its maker leaves the team (or stops keeping it). */
  router.put('/:studyId/share-links/:linkId/kept', async (req, res) => {
    const user = requireUser(res);
    const access = await requireTeamPermission(db, user, teamIdOf(req.params), 'members:remove');
    const input = parseOr400(keepShareLinkSchema, req.body);
    await loadStudy(access, studyIdOf(req.params));
    const rows = await db
      .update(shareLinks)
      .set({ keptBy: input.kept ? user.id : null })
      .where(and(eq(shareLinks.id, (req.params as { linkId: string }).linkId), eq(shareLinks.studyId, studyIdOf(req.params)), isNull(shareLinks.revokedAt)))
      .returning({ id: shareLinks.id });
    if (rows.length === 0) throw notFound('No such active share link.');
    await audit(db, {
      action: input.kept ? 'share-link.kept' : 'share-link.unkept',
      teamId: access.teamId,
      actor: user,
      targetType: 'share-link',
      targetId: rows[0].id,
      details: { studyId: studyIdOf(req.params) },
      req,
    });
    res.json({ kept: input.kept });
  });

  router.delete('/:studyId/share-links/:linkId', async (req, res) => {
    const user = requireUser(res);
    const access = await requireTeamPermission(db, user, teamIdOf(req.params), 'content:write');
    await loadStudy(access, studyIdOf(req.params));
    const rows = await db
      .update(shareLinks)
      .set({ revokedAt: new Date() })
      .where(and(eq(shareLinks.id, (req.params as { linkId: string }).linkId), eq(shareLinks.studyId, studyIdOf(req.params)), isNull(shareLinks.revokedAt)))
      .returning({ id: shareLinks.id });
    if (rows.length === 0) throw notFound('No such active share link.');
    await audit(db, {
      action: 'share-link.revoked',
      teamId: access.teamId,
      actor: user,
      targetType: 'share-link',
      targetId: rows[0].id,
      details: { studyId: studyIdOf(req.params) },
      req,
    });
    res.status(204).end();
  });

  return router;
}
