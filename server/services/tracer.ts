import { and, count, desc, eq, sql } from 'drizzle-orm';
import type { User } from 'lucia';
import type { Request } from 'express';
import { parseMapFile } from '#shared/maps';
import type { MapProblem } from '#shared/maps/types';
import { buildTrace, traceFileName } from '#shared/tracer/build';
import type { ImageContentType } from '#shared/tracer/image-header';
import { newTraceState, type TraceState } from '#shared/tracer/state';
import type { DraftDetail, DraftSummary, MapImage } from '#shared/tracer/api';
import { newId } from '../auth/tokens';
import type { Db } from '../db/client';
import { mapImages, maps, traceDrafts, users } from '../db/schema';
import { HttpError, notFound } from '../http/errors';
import { audit } from './audit';

/** A draft's name: the map name typed in the trace, else the name it was created with. */
const UNTITLED = 'Untitled trace';
const MAX_DRAFT_NAME = 120;

function draftName(state: TraceState, fallback: string): string {
  const name = state.name.replace(/[\u0000-\u001f\u007f]+/g, ' ').trim() || fallback.trim() || UNTITLED;
  return name.slice(0, MAX_DRAFT_NAME);
}

const imageColumns = {
  id: mapImages.id,
  contentType: mapImages.contentType,
  byteSize: mapImages.byteSize,
  width: mapImages.width,
  height: mapImages.height,
  mapId: mapImages.mapId,
  mapName: maps.name,
  createdAt: mapImages.createdAt,
};

type ImageRow = {
  id: string;
  contentType: ImageContentType;
  byteSize: number;
  width: number;
  height: number;
  mapId: string | null;
  mapName: string | null;
  createdAt: Date;
};

function imageView(row: ImageRow): MapImage {
  return { ...row, createdAt: row.createdAt.toISOString() };
}

/** Stores a checked picture; the bytes are already known to be a PNG or JPEG of this size. */
export async function storeImage(
  db: Db,
  input: { teamId: string; userId: string; bytes: Buffer; contentType: ImageContentType; width: number; height: number },
): Promise<MapImage> {
  const [row] = await db
    .insert(mapImages)
    .values({
      id: newId(),
      teamId: input.teamId,
      contentType: input.contentType,
      bytes: input.bytes,
      byteSize: input.bytes.length,
      width: input.width,
      height: input.height,
      createdBy: input.userId,
    })
    .returning();
  return imageView({ ...row, mapName: null });
}

/** A team's pictures, newest first; those of one map when `mapId` is given. */
export async function listImages(db: Db, teamId: string, mapId?: string): Promise<MapImage[]> {
  const rows = await db
    .select(imageColumns)
    .from(mapImages)
    .leftJoin(maps, eq(maps.id, mapImages.mapId))
    .where(mapId ? and(eq(mapImages.teamId, teamId), eq(mapImages.mapId, mapId)) : eq(mapImages.teamId, teamId))
    .orderBy(desc(mapImages.createdAt))
    .limit(200);
  return rows.map(imageView);
}

export async function teamImage(db: Db, teamId: string, imageId: string): Promise<MapImage> {
  const [row] = await db
    .select(imageColumns)
    .from(mapImages)
    .leftJoin(maps, eq(maps.id, mapImages.mapId))
    .where(and(eq(mapImages.id, imageId), eq(mapImages.teamId, teamId)));
  if (!row) throw notFound('No such picture in this team.');
  return imageView(row);
}

/** The stored bytes and the content type found when they were checked (never one a client gave). */
export async function imageBytes(db: Db, teamId: string, imageId: string): Promise<{ id: string; contentType: ImageContentType; bytes: Buffer }> {
  const [row] = await db
    .select({ id: mapImages.id, contentType: mapImages.contentType, bytes: mapImages.bytes })
    .from(mapImages)
    .where(and(eq(mapImages.id, imageId), eq(mapImages.teamId, teamId)));
  if (!row) throw notFound('No such picture in this team.');
  return row;
}

function counts(state: TraceState) {
  return { curveCount: state.curves.length, pointCount: state.curves.reduce((n, c) => n + c.points.length, 0) };
}

async function draftRows(db: Db, teamId: string, draftId?: string) {
  return db
    .select({
      id: traceDrafts.id,
      name: traceDrafts.name,
      state: traceDrafts.state,
      revision: traceDrafts.revision,
      createdAt: traceDrafts.createdAt,
      updatedAt: traceDrafts.updatedAt,
      createdBy: users.name,
      image: imageColumns,
    })
    .from(traceDrafts)
    .innerJoin(mapImages, eq(mapImages.id, traceDrafts.imageId))
    .leftJoin(maps, eq(maps.id, mapImages.mapId))
    .leftJoin(users, eq(users.id, traceDrafts.createdBy))
    .where(draftId ? and(eq(traceDrafts.teamId, teamId), eq(traceDrafts.id, draftId)) : eq(traceDrafts.teamId, teamId))
    .orderBy(desc(traceDrafts.updatedAt))
    .limit(200);
}

type DraftRow = Awaited<ReturnType<typeof draftRows>>[number];

function detailOf(row: DraftRow): DraftDetail {
  const state = row.state as TraceState;
  return {
    id: row.id,
    name: row.name,
    kind: state.kind,
    revision: row.revision,
    image: imageView(row.image),
    ...counts(state),
    createdBy: row.createdBy,
    createdAt: row.createdAt.toISOString(),
    updatedAt: row.updatedAt.toISOString(),
    state,
  };
}

export async function listDrafts(db: Db, teamId: string): Promise<DraftSummary[]> {
  return (await draftRows(db, teamId)).map((row) => {
    const { state: _state, ...summary } = detailOf(row);
    return summary;
  });
}

export async function draftDetail(db: Db, teamId: string, draftId: string): Promise<DraftDetail> {
  const [row] = await draftRows(db, teamId, draftId);
  if (!row) throw notFound('No such trace in this team.');
  return detailOf(row);
}

export async function createDraft(db: Db, input: { teamId: string; userId: string; imageId: string; name?: string; state?: TraceState }): Promise<DraftDetail> {
  await teamImage(db, input.teamId, input.imageId); // 404 for a picture of another team
  const state = input.state ?? newTraceState(input.name ?? '');
  const id = newId();
  await db
    .insert(traceDrafts)
    .values({ id, teamId: input.teamId, imageId: input.imageId, name: draftName(state, input.name ?? ''), state, createdBy: input.userId });
  return draftDetail(db, input.teamId, id);
}

async function stale(db: Db, teamId: string, draftId: string, baseRevision: number): Promise<never> {
  const current = await draftDetail(db, teamId, draftId); // 404 when it is gone
  throw new HttpError(
    409,
    'stale_revision',
    `This trace was saved elsewhere since you opened it (revision ${current.revision}; you started from ${baseRevision}). Load the newer one, or keep yours over it.`,
    { current },
  );
}

/** Saves the state as the next revision if nobody saved since `baseRevision`; else 409 with the newer draft. */
export async function updateDraft(db: Db, input: { teamId: string; draftId: string; baseRevision: number; state: TraceState }): Promise<DraftDetail> {
  const [current] = await db
    .select({ name: traceDrafts.name })
    .from(traceDrafts)
    .where(and(eq(traceDrafts.id, input.draftId), eq(traceDrafts.teamId, input.teamId)));
  if (!current) throw notFound('No such trace in this team.');
  const [row] = await db
    .update(traceDrafts)
    .set({ state: input.state, name: draftName(input.state, current.name), revision: sql`${traceDrafts.revision} + 1`, updatedAt: new Date() })
    .where(and(eq(traceDrafts.id, input.draftId), eq(traceDrafts.teamId, input.teamId), eq(traceDrafts.revision, input.baseRevision)))
    .returning({ id: traceDrafts.id });
  if (!row) return stale(db, input.teamId, input.draftId, input.baseRevision);
  return draftDetail(db, input.teamId, input.draftId);
}

/** Deletes a draft, and its picture too when nothing else keeps it (no saved map, no other draft). */
export async function deleteDraft(db: Db, teamId: string, draftId: string): Promise<void> {
  await db.transaction(async (tx) => {
    const [draft] = await tx
      .delete(traceDrafts)
      .where(and(eq(traceDrafts.id, draftId), eq(traceDrafts.teamId, teamId)))
      .returning({ imageId: traceDrafts.imageId });
    if (!draft) throw notFound('No such trace in this team.');
    const [others] = await tx.select({ n: count() }).from(traceDrafts).where(eq(traceDrafts.imageId, draft.imageId));
    if (others.n === 0) {
      await tx.delete(mapImages).where(and(eq(mapImages.id, draft.imageId), sql`${mapImages.mapId} IS NULL`));
    }
  });
}

class InvalidTracedFile extends HttpError {
  constructor(problems: MapProblem[]) {
    const n = problems.length;
    super(400, 'invalid_map_file', `The traced map file has ${n} problem${n === 1 ? '' : 's'}; nothing was saved.`, { problems });
  }
}

/**
 * Saves a trace to the map library: the file is built from the state on the server and read with
 * `parseMapFile`, the check every upload gets; the picture is linked to the new map (a copy of it
 * when an earlier save from this draft already took it). All or nothing, in one transaction.
 */
export async function saveTraceToLibrary(
  db: Db,
  input: { teamId: string; draftId: string; baseRevision: number; state: TraceState; user: User; req?: Request },
): Promise<{ map: { id: string; name: string; kind: 'compressor' | 'turbine' }; draft: DraftDetail; notes: MapProblem[] }> {
  const outcome = await db.transaction(async (tx) => {
    const [draft] = await tx
      .select({ id: traceDrafts.id, name: traceDrafts.name, revision: traceDrafts.revision, imageId: traceDrafts.imageId })
      .from(traceDrafts)
      .where(and(eq(traceDrafts.id, input.draftId), eq(traceDrafts.teamId, input.teamId)))
      .for('update');
    if (!draft) throw notFound('No such trace in this team.');
    if (draft.revision !== input.baseRevision) return { stale: true as const };

    const text = buildTrace(input.state).text;
    const result = parseMapFile(new TextEncoder().encode(text));
    if (!result.ok) throw new InvalidTracedFile(result.problems);
    const map = result.map;
    const mapId = newId();
    await tx.insert(maps).values({
      id: mapId,
      teamId: input.teamId,
      kind: map.kind,
      name: map.name,
      notes: map.notes.join('\n'),
      parsed: map,
      fileText: text,
      fileName: traceFileName(map.name),
      createdBy: input.user.id,
    });

    const [image] = await tx.select({ mapId: mapImages.mapId }).from(mapImages).where(eq(mapImages.id, draft.imageId)).for('update');
    let imageId = draft.imageId;
    if (image.mapId === null) {
      await tx.update(mapImages).set({ mapId }).where(eq(mapImages.id, imageId));
    } else {
      // The picture already belongs to a map saved earlier: that map keeps it; this one gets a copy.
      imageId = newId();
      await tx.execute(sql`
        INSERT INTO map_images (id, team_id, map_id, content_type, bytes, byte_size, width, height, created_by)
        SELECT ${imageId}, team_id, ${mapId}, content_type, bytes, byte_size, width, height, ${input.user.id}
        FROM map_images WHERE id = ${draft.imageId}`);
    }
    await tx
      .update(traceDrafts)
      .set({ state: input.state, imageId, name: draftName(input.state, draft.name), revision: draft.revision + 1, updatedAt: new Date() })
      .where(eq(traceDrafts.id, draft.id));
    await audit(tx, {
      action: 'map.uploaded',
      teamId: input.teamId,
      actor: input.user,
      targetType: 'map',
      targetId: mapId,
      details: { name: map.name, kind: map.kind, source: 'tracer', imageId },
      req: input.req,
    });
    return { stale: false as const, map: { id: mapId, name: map.name, kind: map.kind }, notes: result.notes };
  });
  if (outcome.stale) return stale(db, input.teamId, input.draftId, input.baseRevision);
  return { map: outcome.map, notes: outcome.notes, draft: await draftDetail(db, input.teamId, input.draftId) };
}
