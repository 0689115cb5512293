import { and, asc, eq, sql } from 'drizzle-orm';
import type { Request } from 'express';
import type { User } from 'lucia';
import type { z } from 'zod';
import { writeMapFile } from '#shared/maps';
import type { SpoolbookMap } from '#shared/maps/types';
import type { updateMapSchema } from '#shared/schemas/map-library';
import { newId } from '../auth/tokens';
import type { Db } from '../db/client';
import { maps, studies, users } from '../db/schema';
import { HttpError, notFound } from '../http/errors';
import { audit } from './audit';
import { builtinMap, builtinMaps, BUILTIN_PREFIX } from './builtin-maps';

/** A team's map library (its own maps beside the built-in demo maps): list, read, upload, rename and annotate, download, delete. */

function summary(map: SpoolbookMap) {
  if (map.kind === 'compressor') {
    const speeds = map.curves.filter((c) => c.kind === 'speed').map((c) => c.points[0]?.speed ?? 0);
    return {
      curves: map.curves.length,
      topSpeed: speeds.length ? Math.max(...speeds) : null,
      maxSpeed: map.maxSpeed,
      estimate: map.estimate ?? null,
      housing: null,
      areaRatio: null,
      efficiencyKind: null,
    };
  }
  return {
    curves: map.curves.length,
    topSpeed: null,
    maxSpeed: null,
    estimate: null,
    housing: map.housing,
    areaRatio: map.areaRatio,
    efficiencyKind: map.efficiencyKind ?? null,
  };
}

/** A download name of our own making from a map's name: letters, digits, dots, dashes. */
function safeFileName(name: string) {
  const base =
    name
      .replace(/[^A-Za-z0-9._ -]+/g, '')
      .trim()
      .replace(/\s+/g, '-')
      .slice(0, 80) || 'map';
  return `${base}.csv`;
}

const isBuiltin = (mapId: string) => mapId.startsWith(BUILTIN_PREFIX);

async function teamMap(db: Db, teamId: string, mapId: string) {
  const [row] = await db
    .select()
    .from(maps)
    .where(and(eq(maps.id, mapId), eq(maps.teamId, teamId)));
  if (!row) throw notFound('No such map in this team.');
  return row;
}

async function creatorName(db: Db, row: typeof maps.$inferSelect) {
  const [creator] = row.createdBy ? await db.select({ name: users.name }).from(users).where(eq(users.id, row.createdBy)) : [];
  return creator?.name ?? null;
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

/** The team's maps by kind and name, then the built-in ones; of one kind when `kind` is given. */
export async function listMaps(db: Db, teamId: string, kind?: SpoolbookMap['kind']) {
  const rows = await db
    .select({ id: maps.id, kind: maps.kind, name: maps.name, notes: maps.notes, parsed: maps.parsed, updatedAt: maps.updatedAt, createdBy: users.name })
    .from(maps)
    .leftJoin(users, eq(users.id, maps.createdBy))
    .where(kind ? and(eq(maps.teamId, teamId), eq(maps.kind, kind)) : eq(maps.teamId, teamId))
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
  return [...own, ...demo];
}

/** Stores a map read from an uploaded file (already checked by the map file reader) with the file's own text. */
export async function createMap(
  db: Db,
  input: { teamId: string; map: SpoolbookMap; notes?: string; fileText: string; uploadedName: string; actor: User; req: Request },
) {
  const { teamId, map, actor, req } = input;
  const id = newId();
  const [row] = await db
    .insert(maps)
    .values({
      id,
      teamId,
      kind: map.kind,
      name: map.name,
      notes: input.notes ?? map.notes.join('\n'),
      parsed: map,
      fileText: input.fileText,
      fileName: safeFileName(input.uploadedName.replace(/\.csv$/i, '')),
      createdBy: actor.id,
    })
    .returning();
  await audit(db, { action: 'map.uploaded', teamId, actor, targetType: 'map', targetId: id, details: { name: map.name, kind: map.kind }, req });
  return detail(row, actor.name);
}

/** One map of the team, or a built-in one. */
export async function mapDetail(db: Db, teamId: string, mapId: string) {
  if (isBuiltin(mapId)) return builtinDetail(mapId);
  const row = await teamMap(db, teamId, mapId);
  return detail(row, await creatorName(db, row));
}

/** A map as a file in the map format, with the name it downloads under. */
export async function mapFile(db: Db, teamId: string, mapId: string): Promise<{ text: string; fileName: string }> {
  if (isBuiltin(mapId)) {
    const b = builtinMap(mapId);
    if (!b) throw notFound('No such built-in map.');
    return { text: writeMapFile(b.map), fileName: b.fileName };
  }
  const row = await teamMap(db, teamId, mapId);
  const parsed = row.parsed as SpoolbookMap;
  const notes = row.notes ? row.notes.split('\n') : [];
  return { text: writeMapFile({ ...parsed, name: row.name, notes }), fileName: safeFileName(row.name) };
}

/** Built-in maps are read-only for everyone: refused before the request is read any further. */
export function assertNotBuiltin(mapId: string) {
  if (isBuiltin(mapId)) throw new HttpError(403, 'builtin', 'Built-in demo maps cannot be changed. Download one and upload it as your own to edit it.');
}

/** Renames or annotates a map of the team: a new revision of it. */
export async function updateMap(db: Db, teamId: string, mapId: string, changes: z.output<typeof updateMapSchema>) {
  const row = await teamMap(db, teamId, mapId);
  const [updated] = await db
    .update(maps)
    .set({ ...changes, revision: row.revision + 1, updatedAt: new Date() })
    .where(eq(maps.id, row.id))
    .returning();
  return detail(updated, await creatorName(db, updated));
}

/** The studies of a team whose plans use a map (archived ones too: they may be restored). */
async function studiesUsingMap(db: Db, teamId: string, mapId: string): Promise<{ id: string; title: string }[]> {
  const probe = JSON.stringify([{ compressorMapId: mapId }]);
  return db
    .select({ id: studies.id, title: studies.title })
    .from(studies)
    .where(and(eq(studies.teamId, teamId), sql`${studies.document} -> 'plans' @> ${probe}::jsonb`))
    .orderBy(studies.title);
}

/** Deletes a map no study of the team uses; otherwise 409 naming the studies. */
export async function deleteMap(db: Db, input: { teamId: string; mapId: string; actor: User; req: Request }) {
  const { teamId, mapId, actor, req } = input;
  if (isBuiltin(mapId)) throw new HttpError(403, 'builtin', 'Built-in demo maps cannot be deleted.');
  const row = await teamMap(db, teamId, mapId);
  const using = await studiesUsingMap(db, teamId, row.id);
  if (using.length > 0) {
    throw new HttpError(409, 'map_in_use', `This map is used by ${using.length} ${using.length === 1 ? 'study' : 'studies'}; change their plans first.`, {
      studies: using,
    });
  }
  await db.transaction(async (tx) => {
    await tx.delete(maps).where(eq(maps.id, row.id));
    await audit(tx, { action: 'map.deleted', teamId, actor, targetType: 'map', targetId: row.id, details: { name: row.name, kind: row.kind }, req });
  });
}
