/** Requests and answers of the logged-run API (docs/api.md, "Logged runs"). */
import { z } from 'zod';
import { logMappingSchema } from '../logs/mapping';
import { LOG_QUANTITIES } from '../logs/quantities';

/** Largest log file accepted, bytes. */
export const MAX_LOG_BYTES = 100 * 1024 * 1024;
/** Most rows a log may have. */
export const MAX_LOG_ROWS = 2_000_000;

const logName = z.string().trim().min(1, 'is required').max(120, 'must be at most 120 characters');
const notes = z.string().max(5000, 'must be at most 5000 characters');
const isoDate = z.iso.date({ message: 'must be a date as YYYY-MM-DD' });

/** The text fields beside the file of an upload; `mapping` is JSON text (multipart fields are text). */
export const uploadLogFieldsSchema = z.strictObject({
  mapping: z.string({ error: 'is required: the column mapping as JSON' }).max(100_000),
  name: logName.optional(),
  loggedOn: isoDate.optional(),
  notes: notes.optional(),
});

/** The chosen segments: row ranges of the stored log, inclusive. */
const logSelectionSchema = z
  .array(z.strictObject({ start: z.number().int().min(0), end: z.number().int().min(0) }).refine((r) => r.end >= r.start, 'end must not be before start'))
  .max(500);

export const updateLogSchema = z.strictObject({
  name: logName.optional(),
  notes: notes.optional(),
  loggedOn: isoDate.nullable().optional(),
  /** Null: back to the detected pulls. */
  selection: logSelectionSchema.nullable().optional(),
});

/** Which plan and scenario points.csv places the samples for (plan id; scenario by position). */
export const logPointsQuerySchema = z.strictObject({
  plan: z.string().max(80).optional(),
  scenario: z.coerce.number().int().min(0).max(50).optional(),
});

export const logSummarySchema = z.object({
  id: z.string(),
  studyId: z.string(),
  name: z.string(),
  loggedOn: z.string().nullable(),
  notes: z.string(),
  sourceName: z.string(),
  sourceChecksum: z.string(),
  sourceBytes: z.number(),
  storedBytes: z.number(),
  rows: z.number(),
  /** Seconds. */
  duration: z.number(),
  channels: z.array(z.enum(LOG_QUANTITIES)),
  skipped: z.array(z.object({ reason: z.string(), rows: z.number() })),
  mapping: logMappingSchema,
  selection: logSelectionSchema.nullable(),
  createdBy: z.string().nullable(),
  createdAt: z.string(),
});
export type LogSummary = z.infer<typeof logSummarySchema>;

export const logListSchema = z.object({ logs: z.array(logSummarySchema) });

const presetNameSchema = z.string().trim().min(1, 'is required').max(80, 'must be at most 80 characters');
export const savePresetSchema = z.strictObject({ name: presetNameSchema, mapping: logMappingSchema });
export const mappingPresetSchema = z.object({ id: z.string(), name: z.string(), mapping: logMappingSchema, updatedAt: z.string() });
export type MappingPreset = z.infer<typeof mappingPresetSchema>;
export const presetListSchema = z.object({ presets: z.array(mappingPresetSchema) });
