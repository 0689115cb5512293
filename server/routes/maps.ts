import { Router, type RequestHandler } from 'express';
import multer from 'multer';
import { MAX_MAP_FILE_BYTES } from '#shared/maps/format';
import { parseMapFile } from '#shared/maps';
import { mapKindQuerySchema, updateMapSchema, uploadMapFieldsSchema } from '#shared/schemas/map-library';
import type { AppDeps } from '../app-deps';
import { requireTeamPermission } from '../auth/access';
import { requireUser } from '../auth/session';
import { sendCsv } from '../http/csv';
import { HttpError, parseOr400 } from '../http/errors';
import { countUpload } from '../services/limits';
import { assertNotBuiltin, createMap, deleteMap, listMaps, mapDetail, mapFile, updateMap } from '../services/maps';

const upload = multer({
  storage: multer.memoryStorage(),
  limits: { fileSize: MAX_MAP_FILE_BYTES, files: 1, fields: 4, parts: 6, fieldSize: 4096 },
});

/** multer in one place: its errors become our 413/400 answers. */
const singleFile: RequestHandler = (req, res, next) => {
  upload.single('file')(req, res, (err: unknown) => {
    if (!err) return next();
    if (err instanceof multer.MulterError) {
      if (err.code === 'LIMIT_FILE_SIZE') {
        return next(
          new HttpError(
            413,
            'too_large',
            `The map file is larger than ${MAX_MAP_FILE_BYTES / 1024 / 1024} MB. Map files are small text files; check that this is the right file.`,
          ),
        );
      }
      return next(new HttpError(400, 'invalid_upload', `The upload could not be read: ${err.message}. Send one file in the field "file".`));
    }
    next(new HttpError(400, 'invalid_upload', 'The upload could not be read. Send one map file as multipart/form-data in the field "file".'));
  });
};

function params(req: { params: unknown }) {
  return req.params as { teamId: string; mapId: string };
}

/** The team's map library: upload, list, read, rename and annotate, download, delete. */
export function mapsRouter({ db, limits }: AppDeps): Router {
  const router = Router({ mergeParams: true });

  router.get('/', async (req, res) => {
    const user = requireUser(res);
    const access = await requireTeamPermission(db, user, params(req).teamId, 'content:read');
    const { kind } = parseOr400(mapKindQuerySchema, { ...req.query }, 'query');
    res.json({ maps: await listMaps(db, access.teamId, kind) });
  });

  router.post('/', countUpload(limits), singleFile, async (req, res) => {
    const user = requireUser(res);
    const access = await requireTeamPermission(db, user, params(req).teamId, 'content:write');
    const fields = parseOr400(uploadMapFieldsSchema, { ...(req.body ?? {}) }, 'upload fields');
    if (!req.file)
      throw new HttpError(400, 'invalid_upload', 'Choose a map file to upload (the form field "file" was empty).', {
        issues: [{ path: 'file', message: 'is required' }],
      });
    const result = parseMapFile(new Uint8Array(req.file.buffer.buffer, req.file.buffer.byteOffset, req.file.buffer.byteLength));
    if (!result.ok) {
      const n = result.problems.length;
      throw new HttpError(400, 'invalid_map_file', `The map file has ${n} problem${n === 1 ? '' : 's'}; nothing was saved.`, { problems: result.problems });
    }
    const map = fields.name ? { ...result.map, name: fields.name } : result.map;
    const created = await createMap(db, {
      teamId: access.teamId,
      map,
      notes: fields.notes,
      fileText: req.file.buffer.toString('utf8'),
      uploadedName: req.file.originalname,
      actor: user,
      req,
    });
    res.status(201).json({ map: created, notes: result.notes });
  });

  router.get('/:mapId', async (req, res) => {
    const user = requireUser(res);
    const access = await requireTeamPermission(db, user, params(req).teamId, 'content:read');
    res.json({ map: await mapDetail(db, access.teamId, params(req).mapId) });
  });

  router.get('/:mapId/file', async (req, res) => {
    const user = requireUser(res);
    const access = await requireTeamPermission(db, user, params(req).teamId, 'content:read');
    const { text, fileName } = await mapFile(db, access.teamId, params(req).mapId);
    sendCsv(res, fileName, text);
  });

  router.patch('/:mapId', async (req, res) => {
    const user = requireUser(res);
    const access = await requireTeamPermission(db, user, params(req).teamId, 'content:write');
    assertNotBuiltin(params(req).mapId);
    const changes = parseOr400(updateMapSchema, req.body);
    res.json({ map: await updateMap(db, access.teamId, params(req).mapId, changes) });
  });

  router.delete('/:mapId', async (req, res) => {
    const user = requireUser(res);
    const access = await requireTeamPermission(db, user, params(req).teamId, 'content:write');
    await deleteMap(db, { teamId: access.teamId, mapId: params(req).mapId, actor: user, req });
    res.status(204).end();
  });

  return router;
}
