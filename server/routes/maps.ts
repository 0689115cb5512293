import { and, asc, eq } from 'drizzle-orm';
import { Router, type RequestHandler } from 'express';
import multer from 'multer';
import { MAX_MAP_FILE_BYTES } from '#shared/maps/format';
import { parseMapFile, writeMapFile } from '#shared/maps';
import type { SpoolbookMap } from '#shared/maps/types';
import { mapKindQuerySchema, updateMapSchema, uploadMapFieldsSchema } from '#shared/schemas/map-library';
import { requireTeamPermission } from '../auth/access';
import { requireUser } from '../auth/session';
import { newId } from '../auth/tokens';
import { maps, users } from '../db/schema';
import { HttpError, notFound, parseOr400 } from '../http/errors';
import { builtinMap, builtinMaps, BUILTIN_PREFIX } from '../services/builtin-maps';
import { studiesUsingMap } from '../services/map-usage';
import type { AppDeps } from '../app-deps';
import { audit } from '../services/audit';
import { countUpload } from '../services/limits';

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

function summary(map: SpoolbookMap) {
  if (map.kind === 'compressor') {
    const speeds = map.curves.filter((c) => c.kind === 'speed').map((c) => c.points[0]?.speed ?? 0);
    return {
      curves: map.curves.length,
      topSpeed: speeds.length ? Math.max(...speeds) : null,
      maxSpeed: map.maxSpeed,
      housing: null,
      areaRatio: null,
      efficiencyKind: null,
    };
  }
  return {
    curves: map.curves.length,
    topSpeed: null,
    maxSpeed: null,
    housing: map.housing,
    areaRatio: map.areaRatio,
    efficiencyKind: map.efficiencyKind ?? null,
  };
}

function safeFileName(name: string) {
  const base =
    name
      .replace(/[^A-Za-z0-9._ -]+/g, '')
      .trim()
      .replace(/\s+/g, '-')
      .slice(0, 80) || 'map';
  return `${base}.csv`;
}

/** The team's map library: upload, list, read, rename and annotate, download, delete. */
export function mapsRouter({ db, limits }: AppDeps): Router {
  const router = Router({ mergeParams: true });

  async function teamMap(teamId: string, mapId: string) {
    const [row] = await db
      .select()
      .from(maps)
      .where(and(eq(maps.id, mapId), eq(maps.teamId, teamId)));
    if (!row) throw notFound('No such map in this team.');
    return row;
  }

  function detail(row: typeof maps.$inferSelect, createdByName: string | null) {
    const parsed = row.parsed as SpoolbookMap;
    return {
      id: row.id,
      kind: row.kind,
      name: row.name,
      notes: row.notes,
      builtin: false,
      fileName: row.fileName,
      revision: row.revision,
      createdBy: createdByName,
      createdAt: row.createdAt.toISOString(),
      updatedAt: row.updatedAt.toISOString(),
      summary: summary(parsed),
      map: parsed,
    };
  }

  function builtinDetail(id: string) {
    const b = builtinMap(id);
    if (!b) throw notFound('No such built-in map.');
    return {
      id: b.id,
      kind: b.map.kind,
      name: b.map.name,
      notes: b.map.notes.join('\n'),
      builtin: true,
      fileName: b.fileName,
      revision: 1,
      createdBy: null,
      createdAt: null,
      updatedAt: null,
      summary: summary(b.map),
      map: b.map,
    };
  }

  router.get('/', async (req, res) => {
    const user = requireUser(res);
    const access = await requireTeamPermission(db, user, (req.params as { teamId: string }).teamId, 'content:read');
    const { kind } = parseOr400(mapKindQuerySchema, { ...req.query }, 'query');
    const rows = await db
      .select({ id: maps.id, kind: maps.kind, name: maps.name, notes: maps.notes, parsed: maps.parsed, updatedAt: maps.updatedAt, createdBy: users.name })
      .from(maps)
      .leftJoin(users, eq(users.id, maps.createdBy))
      .where(kind ? and(eq(maps.teamId, access.teamId), eq(maps.kind, kind)) : eq(maps.teamId, access.teamId))
      .orderBy(asc(maps.kind), asc(maps.name));
    const own = rows.map((r) => ({
      id: r.id,
      kind: r.kind,
      name: r.name,
      notes: r.notes,
      builtin: false,
      createdBy: r.createdBy,
      updatedAt: r.updatedAt.toISOString(),
      summary: summary(r.parsed as SpoolbookMap),
    }));
    const demo = builtinMaps()
      .filter((b) => !kind || b.map.kind === kind)
      .map((b) => ({
        id: b.id,
        kind: b.map.kind,
        name: b.map.name,
        notes: b.map.notes.join('\n'),
        builtin: true,
        createdBy: null,
        updatedAt: null,
        summary: summary(b.map),
      }));
    res.json({ maps: [...own, ...demo] });
  });

  router.post('/', countUpload(limits), singleFile, async (req, res) => {
    const user = requireUser(res);
    const access = await requireTeamPermission(db, user, (req.params as { teamId: string }).teamId, 'content:write');
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
    const id = newId();
    const [row] = await db
      .insert(maps)
      .values({
        id,
        teamId: access.teamId,
        kind: map.kind,
        name: map.name,
        notes: fields.notes ?? map.notes.join('\n'),
        parsed: map,
        fileText: req.file.buffer.toString('utf8'),
        fileName: safeFileName(req.file.originalname.replace(/\.csv$/i, '')),
        createdBy: user.id,
      })
      .returning();
    await audit(db, {
      action: 'map.uploaded',
      teamId: access.teamId,
      actor: user,
      targetType: 'map',
      targetId: id,
      details: { name: map.name, kind: map.kind },
      req,
    });
    res.status(201).json({ map: detail(row, user.name), notes: result.notes });
  });

  router.get('/:mapId', async (req, res) => {
    const user = requireUser(res);
    const { teamId, mapId } = req.params as { teamId: string; mapId: string };
    const access = await requireTeamPermission(db, user, teamId, 'content:read');
    if (mapId.startsWith(BUILTIN_PREFIX)) return void res.json({ map: builtinDetail(mapId) });
    const row = await teamMap(access.teamId, mapId);
    const [creator] = row.createdBy ? await db.select({ name: users.name }).from(users).where(eq(users.id, row.createdBy)) : [];
    res.json({ map: detail(row, creator?.name ?? null) });
  });

  router.get('/:mapId/file', async (req, res) => {
    const user = requireUser(res);
    const { teamId, mapId } = req.params as { teamId: string; mapId: string };
    const access = await requireTeamPermission(db, user, teamId, 'content:read');
    let text: string;
    let name: string;
    if (mapId.startsWith(BUILTIN_PREFIX)) {
      const b = builtinMap(mapId);
      if (!b) throw notFound('No such built-in map.');
      text = writeMapFile(b.map);
      name = b.fileName;
    } else {
      const row = await teamMap(access.teamId, mapId);
      const parsed = row.parsed as SpoolbookMap;
      const notes = row.notes ? row.notes.split('\n') : [];
      text = writeMapFile({ ...parsed, name: row.name, notes });
      name = safeFileName(row.name);
    }
    res.set('Content-Type', 'text/csv; charset=utf-8');
    res.set('Content-Disposition', `attachment; filename="${name}"`);
    res.send(text);
  });

  router.patch('/:mapId', async (req, res) => {
    const user = requireUser(res);
    const { teamId, mapId } = req.params as { teamId: string; mapId: string };
    const access = await requireTeamPermission(db, user, teamId, 'content:write');
    if (mapId.startsWith(BUILTIN_PREFIX))
      throw new HttpError(403, 'builtin', 'Built-in demo maps cannot be changed. Download one and upload it as your own to edit it.');
    const input = parseOr400(updateMapSchema, req.body);
    const row = await teamMap(access.teamId, mapId);
    const [updated] = await db
      .update(maps)
      .set({ ...input, revision: row.revision + 1, updatedAt: new Date() })
      .where(eq(maps.id, row.id))
      .returning();
    const [creator] = updated.createdBy ? await db.select({ name: users.name }).from(users).where(eq(users.id, updated.createdBy)) : [];
    res.json({ map: detail(updated, creator?.name ?? null) });
  });

  router.delete('/:mapId', async (req, res) => {
    const user = requireUser(res);
    const { teamId, mapId } = req.params as { teamId: string; mapId: string };
    const access = await requireTeamPermission(db, user, teamId, 'content:write');
    if (mapId.startsWith(BUILTIN_PREFIX)) throw new HttpError(403, 'builtin', 'Built-in demo maps cannot be deleted.');
    const row = await teamMap(access.teamId, mapId);
    const using = await studiesUsingMap(db, access.teamId, row.id);
    if (using.length > 0) {
      throw new HttpError(409, 'map_in_use', `This map is used by ${using.length} ${using.length === 1 ? 'study' : 'studies'}; change their plans first.`, {
        studies: using,
      });
    }
    await db.transaction(async (tx) => {
      await tx.delete(maps).where(eq(maps.id, row.id));
      await audit(tx, {
        action: 'map.deleted',
        teamId: access.teamId,
        actor: user,
        targetType: 'map',
        targetId: row.id,
        details: { name: row.name, kind: row.kind },
        req,
      });
    });
    res.status(204).end();
  });

  return router;
}
