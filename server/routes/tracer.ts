import { Router, type RequestHandler } from 'express';
import multer from 'multer';
import { createDraftSchema, imageListQuerySchema, saveDraftSchema } from '#shared/tracer/api';
import { checkImage, MAX_IMAGE_BYTES, type ImageProblemCode } from '#shared/tracer/image-header';
import { idSchema } from '#shared/schemas/common';
import type { AppDeps } from '../app-deps';
import { countUpload } from '../services/limits';
import { requireTeamPermission, type TeamAccess } from '../auth/access';
import { requireUser } from '../auth/session';
import { teamWriteGate } from '../auth/write-gate';
import { HttpError, notFound, parseOr400 } from '../http/errors';
import {
  createDraft,
  deleteDraft,
  draftDetail,
  imageBytes,
  listDrafts,
  listImages,
  saveTraceToLibrary,
  storeImage,
  teamImage,
  updateDraft,
} from '../services/tracer';

const MEGABYTES = MAX_IMAGE_BYTES / 1024 / 1024;

// One picture per request and nothing else: no text fields, one part. Memory storage is bounded
// by the byte limit; the picture is checked by its bytes before anything is stored.
const upload = multer({
  storage: multer.memoryStorage(),
  limits: { fileSize: MAX_IMAGE_BYTES, files: 1, fields: 0, parts: 1, fieldSize: 1024, headerPairs: 100 },
});

/** multer in one place: its errors become our 413/400 answers with plain words. */
const singlePicture: RequestHandler = (req, res, next) => {
  upload.single('file')(req, res, (err: unknown) => {
    if (!err) return next();
    if (err instanceof multer.MulterError) {
      if (err.code === 'LIMIT_FILE_SIZE') {
        return next(
          new HttpError(413, 'too_large', `The picture is larger than ${MEGABYTES} MB. Save it at a smaller size or as a JPEG and choose it again.`, {
            field: 'file',
          }),
        );
      }
      return next(
        new HttpError(400, 'invalid_upload', `The upload could not be read: ${err.message}. Send one picture, alone, in the form field "file".`, {
          field: err.field ?? 'file',
        }),
      );
    }
    next(
      new HttpError(400, 'invalid_upload', 'The upload could not be read. Send one picture as multipart/form-data in the form field "file".', {
        field: 'file',
      }),
    );
  });
};

const IMAGE_PROBLEM_STATUS: Record<ImageProblemCode, [number, string]> = {
  empty: [400, 'empty_file'],
  'too-large': [413, 'too_large'],
  'too-many-pixels': [413, 'too_many_pixels'],
  'not-an-image': [400, 'not_an_image'],
  'unsupported-image': [400, 'not_an_image'],
  'unreadable-header': [400, 'unreadable_image'],
};

function params(req: { params: unknown }) {
  return req.params as { teamId: string; imageId?: string; draftId?: string };
}

/** An id from the path; anything that cannot be an id is simply not found. */
function pathId(value: string | undefined, what: string): string {
  const parsed = idSchema.safeParse(value);
  if (!parsed.success) throw notFound(`No such ${what} in this team.`);
  return parsed.data;
}

/** The Tracer: pictures of maps, traces in progress (drafts), and saving a trace to the map library. */
export function tracerRouter({ db, limits }: AppDeps): Router {
  const router = Router({ mergeParams: true });

  const canWrite = teamWriteGate(db);

  router.post('/images', canWrite, countUpload(limits), singlePicture, async (req, res) => {
    const user = requireUser(res);
    const access = res.locals.access as TeamAccess;
    if (!req.file)
      throw new HttpError(400, 'invalid_upload', 'Choose a picture to upload (the form field "file" was empty).', {
        issues: [{ path: 'file', message: 'is required' }],
      });
    const bytes = req.file.buffer;
    // The name and type the browser sent are ignored: only the bytes say what this is.
    const check = checkImage(new Uint8Array(bytes.buffer, bytes.byteOffset, bytes.byteLength));
    if (!check.ok) {
      const [status, code] = IMAGE_PROBLEM_STATUS[check.code];
      throw new HttpError(status, code, check.message, { field: 'file', problem: check.code });
    }
    const image = await storeImage(db, {
      teamId: access.teamId,
      userId: user.id,
      bytes,
      contentType: check.contentType,
      width: check.width,
      height: check.height,
    });
    res.status(201).json({ image });
  });

  router.get('/images', async (req, res) => {
    const user = requireUser(res);
    const access = await requireTeamPermission(db, user, params(req).teamId, 'content:read');
    const { mapId } = parseOr400(imageListQuerySchema, { ...req.query }, 'query');
    res.json({ images: await listImages(db, access.teamId, mapId) });
  });

  router.get('/images/:imageId/meta', async (req, res) => {
    const user = requireUser(res);
    const access = await requireTeamPermission(db, user, params(req).teamId, 'content:read');
    res.json({ image: await teamImage(db, access.teamId, pathId(params(req).imageId, 'picture')) });
  });

  router.get('/images/:imageId', async (req, res) => {
    const user = requireUser(res);
    const access = await requireTeamPermission(db, user, params(req).teamId, 'content:read');
    const image = await imageBytes(db, access.teamId, pathId(params(req).imageId, 'picture'));
    const extension = image.contentType === 'image/png' ? 'png' : 'jpg';
    // The type found by the byte check, a generated name, and no sniffing: an upload can never
    // be served as a page or a script, whatever it was called.
    res.set('Content-Type', image.contentType);
    res.set('X-Content-Type-Options', 'nosniff');
    res.set('Content-Disposition', `inline; filename="map-image-${image.id}.${extension}"`);
    res.set('Content-Security-Policy', "default-src 'none'; sandbox; frame-ancestors 'none'");
    // A picture never changes under its id; only its team's members can fetch it.
    res.set('Cache-Control', 'private, max-age=86400');
    res.send(image.bytes);
  });

  router.get('/drafts', async (req, res) => {
    const user = requireUser(res);
    const access = await requireTeamPermission(db, user, params(req).teamId, 'content:read');
    res.json({ drafts: await listDrafts(db, access.teamId) });
  });

  router.post('/drafts', async (req, res) => {
    const user = requireUser(res);
    const access = await requireTeamPermission(db, user, params(req).teamId, 'content:write');
    const input = parseOr400(createDraftSchema, req.body);
    const draft = await createDraft(db, { teamId: access.teamId, userId: user.id, imageId: input.imageId, name: input.name, state: input.state });
    res.status(201).json({ draft });
  });

  router.get('/drafts/:draftId', async (req, res) => {
    const user = requireUser(res);
    const access = await requireTeamPermission(db, user, params(req).teamId, 'content:read');
    res.json({ draft: await draftDetail(db, access.teamId, pathId(params(req).draftId, 'trace')) });
  });

  router.put('/drafts/:draftId', async (req, res) => {
    const user = requireUser(res);
    const access = await requireTeamPermission(db, user, params(req).teamId, 'content:write');
    const draftId = pathId(params(req).draftId, 'trace');
    const input = parseOr400(saveDraftSchema, req.body);
    res.json({ draft: await updateDraft(db, { teamId: access.teamId, draftId, baseRevision: input.baseRevision, state: input.state }) });
  });

  router.delete('/drafts/:draftId', async (req, res) => {
    const user = requireUser(res);
    const access = await requireTeamPermission(db, user, params(req).teamId, 'content:write');
    await deleteDraft(db, access.teamId, pathId(params(req).draftId, 'trace'));
    res.status(204).end();
  });

  router.post('/drafts/:draftId/save', async (req, res) => {
    const user = requireUser(res);
    const access = await requireTeamPermission(db, user, params(req).teamId, 'content:write');
    const draftId = pathId(params(req).draftId, 'trace');
    const input = parseOr400(saveDraftSchema, req.body);
    const saved = await saveTraceToLibrary(db, { teamId: access.teamId, draftId, baseRevision: input.baseRevision, state: input.state, user, req });
    res.status(201).json(saved);
  });

  return router;
}
