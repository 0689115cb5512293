import { z } from 'zod';
import { IMAGE_CONTENT_TYPES } from './image-header';
import { MAX_TRACE_NAME_LENGTH, traceStateSchema } from './state';

// Requests and answers of the Tracer API (docs/api.md, "Tracer"). Requests are strict objects:
// an unknown key is refused by name. The client parses every answer with these.

const id = z.string().min(1).max(64);

export const createDraftSchema = z.strictObject({
  /** A picture of this team, uploaded first (POST …/tracer/images). */
  imageId: id,
  /** The draft's name; the state's map name wins once one is typed. */
  name: z.string().trim().max(MAX_TRACE_NAME_LENGTH).optional(),
  /** A state to start from; a new trace when absent. */
  state: traceStateSchema.optional(),
});

/** Saving a draft, and saving it to the library (which also stores the state), take the same body. */
export const saveDraftSchema = z.strictObject({
  /** The revision the client started from: a newer one on the server means someone else saved (409). */
  baseRevision: z.number().int().min(1),
  state: traceStateSchema,
});

export const imageListQuerySchema = z.strictObject({ mapId: id.optional() });

export const mapImageSchema = z.object({
  id: z.string(),
  contentType: z.enum(IMAGE_CONTENT_TYPES),
  byteSize: z.number().int(),
  width: z.number().int(),
  height: z.number().int(),
  /** The map traced from this picture, once saved; null before. */
  mapId: z.string().nullable(),
  mapName: z.string().nullable(),
  createdAt: z.string(),
});
export type MapImage = z.infer<typeof mapImageSchema>;

export const draftSummarySchema = z.object({
  id: z.string(),
  name: z.string(),
  kind: z.enum(['compressor', 'turbine']),
  revision: z.number().int(),
  image: mapImageSchema,
  /** Lines traced and their points, for the list. */
  curveCount: z.number().int(),
  pointCount: z.number().int(),
  createdBy: z.string().nullable(),
  createdAt: z.string(),
  updatedAt: z.string(),
});
export type DraftSummary = z.infer<typeof draftSummarySchema>;

export const draftDetailSchema = draftSummarySchema.extend({ state: traceStateSchema });
export type DraftDetail = z.infer<typeof draftDetailSchema>;

export const imageResponseSchema = z.object({ image: mapImageSchema });
export const imagesResponseSchema = z.object({ images: z.array(mapImageSchema) });
export const draftResponseSchema = z.object({ draft: draftDetailSchema });
export const draftsResponseSchema = z.object({ drafts: z.array(draftSummarySchema) });

export const savedToLibraryResponseSchema = z.object({
  map: z.object({ id: z.string(), name: z.string(), kind: z.enum(['compressor', 'turbine']) }),
  draft: draftDetailSchema,
  /** Advisories of the file check (none for a file the Tracer built, which closes its islands). */
  notes: z.array(z.object({ code: z.string(), line: z.number().nullable(), column: z.number().nullable(), message: z.string() })),
});
export type SavedToLibrary = z.infer<typeof savedToLibraryResponseSchema>;
