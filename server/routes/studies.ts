import { Router } from 'express';
import {
  createShareLinkSchema,
  copyStudySchema,
  createStudySchema,
  keepShareLinkSchema,
  duplicateStudySchema,
  restoreRevisionSchema,
  saveStudySchema,
  studyListQuerySchema,
  updateStudyMetaSchema,
} from '#shared/schemas/study';
import type { AppDeps } from '../app-deps';
import { requireTeamPermission } from '../auth/access';
import { requireUser } from '../auth/session';
import { resultsFileName, sendCsv, sendXlsx } from '../http/csv';
import { parseOr400 } from '../http/errors';
import { copyStudyToTeam } from '../services/study-copies';
import { studyDriveCsv } from '../services/drive';
import { createShareLink, keepShareLink, listShareLinks, revokeShareLink } from '../services/share-links';
import { listRevisions, restoreRevision, revisionDetail } from '../services/study-revisions';
import {
  createStudy,
  deleteStudy,
  duplicateStudy,
  listStudies,
  saveStudy,
  studyAnswerJson,
  studyResultsCsv,
  studyResultsWorkbook,
  updateStudyMeta,
} from '../services/studies';

function params(req: { params: unknown }) {
  return req.params as { teamId: string; studyId: string; revision: string; linkId: string };
}

/** A team's studies, their history, results and share links. */
export function studiesRouter({ db, config }: AppDeps): Router {
  const router = Router({ mergeParams: true });

  router.get('/', async (req, res) => {
    const user = requireUser(res);
    const access = await requireTeamPermission(db, user, params(req).teamId, 'content:read');
    const query = parseOr400(studyListQuerySchema, { ...req.query }, 'query');
    res.json(await listStudies(db, access.teamId, query));
  });

  router.post('/', async (req, res) => {
    const user = requireUser(res);
    const access = await requireTeamPermission(db, user, params(req).teamId, 'content:write');
    const input = parseOr400(createStudySchema, req.body);
    res.status(201).json({ study: await createStudy(db, { access, user, title: input.title, document: input.document, start: input.start }) });
  });

  router.get('/:studyId', async (req, res) => {
    const user = requireUser(res);
    const { teamId, studyId } = params(req);
    // Browsers ask again with the ETag (Express's, over the answer) and get 304 while nothing changed.
    res.set('Cache-Control', 'private, no-cache');
    res.type('json').send(await studyAnswerJson(db, user, teamId, studyId));
  });

  router.put('/:studyId', async (req, res) => {
    const user = requireUser(res);
    const access = await requireTeamPermission(db, user, params(req).teamId, 'content:write');
    const input = parseOr400(saveStudySchema, req.body);
    const { studyId } = params(req);
    res.json({
      study: await saveStudy(db, { access, user, studyId, baseRevision: input.baseRevision, document: input.document, message: input.message ?? '' }),
    });
  });

  router.patch('/:studyId', async (req, res) => {
    const user = requireUser(res);
    const access = await requireTeamPermission(db, user, params(req).teamId, 'content:write');
    const changes = parseOr400(updateStudyMetaSchema, req.body);
    res.json({ study: await updateStudyMeta(db, { access, user, studyId: params(req).studyId, changes }) });
  });

  router.delete('/:studyId', async (req, res) => {
    const user = requireUser(res);
    const access = await requireTeamPermission(db, user, params(req).teamId, 'content:write');
    await deleteStudy(db, { teamId: access.teamId, studyId: params(req).studyId, actor: user, req });
    res.status(204).end();
  });

  router.post('/:studyId/duplicate', async (req, res) => {
    const user = requireUser(res);
    const access = await requireTeamPermission(db, user, params(req).teamId, 'content:write');
    const input = parseOr400(duplicateStudySchema, req.body ?? {});
    res.status(201).json({ study: await duplicateStudy(db, { access, user, studyId: params(req).studyId, title: input.title }) });
  });

  router.post('/:studyId/copy', async (req, res) => {
    const user = requireUser(res);
    const from = await requireTeamPermission(db, user, params(req).teamId, 'content:read');
    const input = parseOr400(copyStudySchema, req.body);
    const to = await requireTeamPermission(db, user, input.teamId, 'content:write');
    res.status(201).json({ study: await copyStudyToTeam(db, { from, to, user, studyId: params(req).studyId, title: input.title, req }) });
  });

  router.get('/:studyId/revisions', async (req, res) => {
    const user = requireUser(res);
    const access = await requireTeamPermission(db, user, params(req).teamId, 'content:read');
    res.json({ revisions: await listRevisions(db, access.teamId, params(req).studyId) });
  });

  router.get('/:studyId/revisions/:revision', async (req, res) => {
    const user = requireUser(res);
    const access = await requireTeamPermission(db, user, params(req).teamId, 'content:read');
    res.json({ revision: await revisionDetail(db, access.teamId, params(req).studyId, params(req).revision) });
  });

  router.post('/:studyId/revisions/:revision/restore', async (req, res) => {
    const user = requireUser(res);
    const access = await requireTeamPermission(db, user, params(req).teamId, 'content:write');
    const input = parseOr400(restoreRevisionSchema, req.body);
    const { studyId, revision } = params(req);
    res.json({ study: await restoreRevision(db, { access, user, studyId, revisionText: revision, baseRevision: input.baseRevision }) });
  });

  router.get('/:studyId/results.csv', async (req, res) => {
    const user = requireUser(res);
    const access = await requireTeamPermission(db, user, params(req).teamId, 'content:read');
    const { csv, revision } = await studyResultsCsv(db, access.teamId, params(req).studyId);
    sendCsv(res, resultsFileName(revision), csv);
  });

  router.get('/:studyId/results.xlsx', async (req, res) => {
    const user = requireUser(res);
    const access = await requireTeamPermission(db, user, params(req).teamId, 'content:read');
    const { workbook, revision } = await studyResultsWorkbook(db, access.teamId, params(req).studyId);
    sendXlsx(res, resultsFileName(revision).replace(/\.csv$/, '.xlsx'), workbook);
  });
  for (const which of ['drive', 'spool'] as const)
    router.get(`/:studyId/${which}.csv`, async (req, res) => {
      const user = requireUser(res);
      const access = await requireTeamPermission(db, user, params(req).teamId, 'content:read');
      const { csv, revision } = await studyDriveCsv(db, access.teamId, params(req).studyId, which);
      sendCsv(res, `study-${which}-r${revision}.csv`, csv);
    });

  router.get('/:studyId/share-links', async (req, res) => {
    const user = requireUser(res);
    const access = await requireTeamPermission(db, user, params(req).teamId, 'content:write');
    res.json({ shareLinks: await listShareLinks(db, access.teamId, params(req).studyId) });
  });

  router.post('/:studyId/share-links', async (req, res) => {
    const user = requireUser(res);
    const access = await requireTeamPermission(db, user, params(req).teamId, 'content:write');
    const input = parseOr400(createShareLinkSchema, req.body ?? {});
    const shareLink = await createShareLink(db, {
      teamId: access.teamId,
      studyId: params(req).studyId,
      expiresInDays: input.expiresInDays,
      publicUrl: config.publicUrl,
      actor: user,
      req,
    });
    res.status(201).json({ shareLink });
  });

  /** An owner keeps a link working after its maker leaves the team (or stops keeping it). */
  router.put('/:studyId/share-links/:linkId/kept', async (req, res) => {
    const user = requireUser(res);
    const access = await requireTeamPermission(db, user, params(req).teamId, 'share-links:keep');
    const input = parseOr400(keepShareLinkSchema, req.body);
    const { studyId, linkId } = params(req);
    await keepShareLink(db, { teamId: access.teamId, studyId, linkId, kept: input.kept, actor: user, req });
    res.json({ kept: input.kept });
  });

  router.delete('/:studyId/share-links/:linkId', async (req, res) => {
    const user = requireUser(res);
    const access = await requireTeamPermission(db, user, params(req).teamId, 'content:write');
    const { studyId, linkId } = params(req);
    await revokeShareLink(db, { teamId: access.teamId, studyId, linkId, actor: user, req });
    res.status(204).end();
  });

  return router;
}
