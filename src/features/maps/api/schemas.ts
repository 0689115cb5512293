import { z } from 'zod';
import { MAP_KINDS } from '#shared/maps/format';
import { spoolbookMapSchema } from '#shared/schemas/map';

// Answers of the map library API (docs/api.md, "Map library"). The parsed map inside a detail is
// checked with the shared map schema, so the plot never draws a map that drifted from the model.

export const mapKindSchema = z.enum(MAP_KINDS);
export type MapKind = z.infer<typeof mapKindSchema>;

export const mapListSummarySchema = z.object({
  curves: z.number(),
  /** Top speed line, rpm (compressor maps). */
  topSpeed: z.number().nullable(),
  /** Rated speed limit, rpm (compressor maps that give one). */
  maxSpeed: z.number().nullable(),
  /** Compressor maps made from another by a family rule: the parent and the rule (absent from older servers). */
  estimate: z.object({ parentId: z.string(), parentName: z.string(), rule: z.string() }).nullable().optional(),
  housing: z.enum(['single', 'divided']).nullable(),
  areaRatio: z.number().nullable(),
  /** Turbine maps: what the efficiency counts; null when the file does not say (absent from older servers). */
  efficiencyKind: z.enum(['with-bearing-losses', 'aerodynamic']).nullable().optional(),
});

export const mapSummarySchema = z.object({
  id: z.string(),
  kind: mapKindSchema,
  name: z.string(),
  notes: z.string(),
  /** Built-in demo maps are read-only and belong to no team. */
  builtin: z.boolean(),
  createdBy: z.string().nullable(),
  updatedAt: z.string().nullable(),
  summary: mapListSummarySchema,
});
export type MapSummary = z.infer<typeof mapSummarySchema>;

export const mapDetailSchema = mapSummarySchema.extend({
  fileName: z.string(),
  revision: z.number(),
  createdAt: z.string().nullable(),
  map: spoolbookMapSchema,
});
export type MapDetail = z.infer<typeof mapDetailSchema>;

/** One problem of a refused map file, as `parseMapFile` and the server word it. */
export const mapProblemSchema = z.object({
  code: z.string(),
  line: z.number().int().nullable(),
  column: z.number().int().nullable(),
  message: z.string(),
});
export type MapFileProblem = z.infer<typeof mapProblemSchema>;

/** GET /api/teams/:teamId/maps (with or without `?kind=`). */
export const mapListResponseSchema = z.object({ maps: z.array(mapSummarySchema) });

/** GET and PATCH /api/teams/:teamId/maps/:mapId. */
export const mapResponseSchema = z.object({ map: mapDetailSchema });

/** POST /api/teams/:teamId/maps: the saved map and advisories about what was adjusted (an island closed automatically). */
export const uploadMapResponseSchema = z.object({ map: mapDetailSchema, notes: z.array(mapProblemSchema) });

/** `details` of a 400 `invalid_map_file` answer. */
export const invalidMapFileDetailsSchema = z.object({ problems: z.array(mapProblemSchema) });

/** `details` of a 409 `map_in_use` answer: the studies whose plans use the map. */
export const mapInUseDetailsSchema = z.object({ studies: z.array(z.object({ id: z.string(), title: z.string() })) });
