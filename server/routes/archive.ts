import { Router, type RequestHandler } from 'express';
import multer from 'multer';
import { MAX_ARCHIVE_BYTES } from '#shared/schemas/archive';
import type { AppDeps } from '../app-deps';
import { requireTeamPermission } from '../auth/access';
import { requireUser } from '../auth/session';
import { HttpError } from '../http/errors';
import { archiveFileName, exportTeam, importTeam } from '../services/archive';
import { countUpload } from '../services/limits';

const upload = multer({ storage: multer.memoryStorage(), limits: { fileSize: MAX_ARCHIVE_BYTES, files: 1, fields: 0, parts: 1 } });

const archiveFile: RequestHandler = (req, res, next) => {
  upload.single('archive')(req, res, (err: unknown) => {
    if (!err) return next();
    if (err instanceof multer.MulterError && err.code === 'LIMIT_FILE_SIZE') {
      return next(new HttpError(413, 'too_large', `The archive is larger than ${MAX_ARCHIVE_BYTES / 1024 / 1024} MB.`));
    }
    next(new HttpError(400, 'invalid_upload', 'Send one archive file as multipart/form-data in the field "archive".'));
  });
};

/** A team's data leaving as one archive, and coming back into any team (owners only). */
export function archiveRouter({ db, limits }: AppDeps): Router {
  const router = Router({ mergeParams: true });

  router.get('/export', async (req, res) => {
    const user = requireUser(res);
    const access = await requireTeamPermission(db, user, (req.params as { teamId: string }).teamId, 'team:export');
    const archive = await exportTeam(db, { teamId: access.teamId, teamName: access.teamName, actor: user, req });
    res.set('Content-Disposition', `attachment; filename="${archiveFileName(access.teamName, archive.exportedAt)}"`);
    res.json(archive);
  });

  router.post('/import', countUpload(limits), archiveFile, async (req, res) => {
    const user = requireUser(res);
    const access = await requireTeamPermission(db, user, (req.params as { teamId: string }).teamId, 'team:import');
    if (!req.file)
      throw new HttpError(400, 'invalid_upload', 'Choose an archive file to import (the form field "archive" was empty).', {
        issues: [{ path: 'archive', message: 'is required' }],
      });
    let raw: unknown;
    try {
      raw = JSON.parse(req.file.buffer.toString('utf8'));
    } catch (err) {
      throw new HttpError(400, 'invalid_archive', `The archive is not valid JSON (${(err as Error).message}). Nothing was imported.`, {
        problems: [{ item: 'archive', message: 'not valid JSON' }],
      });
    }
    res.status(201).json({ imported: await importTeam(db, { teamId: access.teamId, importer: user, raw, req }) });
  });

  return router;
}
