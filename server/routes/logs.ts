import { Router, type RequestHandler } from 'express';
import multer from 'multer';
import { logPointsQuerySchema, MAX_LOG_BYTES, savePresetSchema, updateLogSchema, uploadLogFieldsSchema } from '#shared/schemas/logs';
import type { AppDeps } from '../app-deps';
import { requireTeamPermission, type TeamAccess } from '../auth/access';
import { requireUser } from '../auth/session';
import { teamWriteGate } from '../auth/write-gate';
import { sendCsv } from '../http/csv';
import { HttpError, parseOr400 } from '../http/errors';
import { countUpload } from '../services/limits';
import {
  createLog,
  deleteLog,
  deletePreset,
  listLogs,
  listPresets,
  logFileName,
  logFitCsv,
  logPointsCsv,
  logSamples,
  savePreset,
  updateLog,
} from '../services/logs';

// One log and its few text fields. Memory storage is bounded by the byte limit.
const upload = multer({
  storage: multer.memoryStorage(),
  limits: { fileSize: MAX_LOG_BYTES, files: 1, fields: 4, parts: 5, fieldSize: 100_000, headerPairs: 100 },
});

/** multer in one place: its errors become our 413/400 answers with plain words. */
const singleLog: RequestHandler = (req, res, next) => {
  upload.single('file')(req, res, (err: unknown) => {
    if (!err) return next();
    if (err instanceof multer.MulterError && err.code === 'LIMIT_FILE_SIZE')
      return next(
        new HttpError(
          413,
          'too_large',
          `The log is larger than ${MAX_LOG_BYTES / 1024 / 1024} MB. Export fewer channels or a shorter stretch and upload again.`,
          {
            field: 'file',
          },
        ),
      );
    const detail = err instanceof multer.MulterError ? `: ${err.message}` : '';
    next(
      new HttpError(
        400,
        'invalid_upload',
        `The upload could not be read${detail}. Send the log in the form field "file" and the mapping as JSON in "mapping".`,
        {
          field: err instanceof multer.MulterError ? (err.field ?? 'file') : 'file',
        },
      ),
    );
  });
};

function params(req: { params: unknown }) {
  return req.params as { teamId: string; studyId: string; logId: string };
}

/** A study's logged runs: upload with a mapping, list, choose segments, download points and fit, delete. */
export function logsRouter({ db, limits }: AppDeps): Router {
  const router = Router({ mergeParams: true });

  const canWrite = teamWriteGate(db);

  router.post('/', canWrite, countUpload(limits), singleLog, async (req, res) => {
    const access = res.locals.access as TeamAccess;
    const fields = parseOr400(uploadLogFieldsSchema, { ...(req.body ?? {}) }, 'upload fields');
    if (!req.file)
      throw new HttpError(400, 'invalid_upload', 'Choose a log to upload (the form field "file" was empty).', {
        issues: [{ path: 'file', message: 'is required' }],
      });
    const log = await createLog(db, { teamId: access.teamId, studyId: params(req).studyId, actor: requireUser(res), file: req.file, fields, req });
    res.status(201).json({ log });
  });

  router.get('/', async (req, res) => {
    const access = await requireTeamPermission(db, requireUser(res), params(req).teamId, 'content:read');
    res.json({ logs: await listLogs(db, access.teamId, params(req).studyId) });
  });

  router.get('/:logId/samples', async (req, res) => {
    const access = await requireTeamPermission(db, requireUser(res), params(req).teamId, 'content:read');
    const { studyId, logId } = params(req);
    res.set('Content-Type', 'application/octet-stream');
    res.set('Content-Disposition', `attachment; filename="log-${logId}.bin"`);
    res.send(await logSamples(db, access.teamId, studyId, logId));
  });

  router.get('/:logId/points.csv', async (req, res) => {
    const access = await requireTeamPermission(db, requireUser(res), params(req).teamId, 'content:read');
    const query = parseOr400(logPointsQuerySchema, { ...req.query }, 'query');
    const { studyId, logId } = params(req);
    sendCsv(res, logFileName(logId, 'points'), await logPointsCsv(db, access.teamId, studyId, logId, query));
  });

  router.get('/:logId/fit.csv', async (req, res) => {
    const access = await requireTeamPermission(db, requireUser(res), params(req).teamId, 'content:read');
    const { studyId, logId } = params(req);
    sendCsv(res, logFileName(logId, 'fit'), await logFitCsv(db, access.teamId, studyId, logId));
  });

  router.patch('/:logId', async (req, res) => {
    const access = await requireTeamPermission(db, requireUser(res), params(req).teamId, 'content:write');
    const changes = parseOr400(updateLogSchema, req.body);
    const { studyId, logId } = params(req);
    res.json({ log: await updateLog(db, access.teamId, studyId, logId, changes) });
  });

  router.delete('/:logId', async (req, res) => {
    const user = requireUser(res);
    const access = await requireTeamPermission(db, user, params(req).teamId, 'content:write');
    const { studyId, logId } = params(req);
    await deleteLog(db, { teamId: access.teamId, studyId, logId, actor: user, req });
    res.status(204).end();
  });

  return router;
}

/** A team's named column mappings for logs. */
export function logPresetsRouter({ db }: AppDeps): Router {
  const router = Router({ mergeParams: true });
  const teamOf = (req: { params: unknown }) => req.params as { teamId: string; presetId: string };

  router.get('/', async (req, res) => {
    const access = await requireTeamPermission(db, requireUser(res), teamOf(req).teamId, 'content:read');
    res.json({ presets: await listPresets(db, access.teamId) });
  });

  router.put('/', async (req, res) => {
    const user = requireUser(res);
    const access = await requireTeamPermission(db, user, teamOf(req).teamId, 'content:write');
    const input = parseOr400(savePresetSchema, req.body);
    res.json({ preset: await savePreset(db, { teamId: access.teamId, userId: user.id, name: input.name, mapping: input.mapping }) });
  });

  router.delete('/:presetId', async (req, res) => {
    const access = await requireTeamPermission(db, requireUser(res), teamOf(req).teamId, 'content:write');
    await deletePreset(db, access.teamId, teamOf(req).presetId);
    res.status(204).end();
  });

  return router;
}
