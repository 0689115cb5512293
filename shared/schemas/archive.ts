import { z } from 'zod';

/**
 * A team's archive: its maps (with their original files) and its studies (with every revision),
 * as one JSON file. Written by export, read by import into any team.
 */
export const ARCHIVE_FORMAT = 'spoolbook-team-archive';
export const ARCHIVE_VERSION = 1;
/** Largest archive an import accepts. */
export const MAX_ARCHIVE_BYTES = 20 * 1024 * 1024;

const iso = z.iso.datetime({ offset: true, message: 'must be an ISO date-time' });

export const archiveMapSchema = z.strictObject({
  id: z.string().min(1).max(80),
  kind: z.enum(['compressor', 'turbine']),
  name: z.string().min(1).max(120),
  notes: z.string().max(5000),
  fileName: z.string().max(200),
  /** The map file as uploaded (the format of docs/map-format.md). */
  fileText: z.string().max(2 * 1024 * 1024),
  createdAt: iso,
});

export const archiveRevisionSchema = z.strictObject({
  revision: z.number().int().min(1),
  title: z.string().min(1).max(120),
  message: z.string().max(200),
  /** The author's e-mail when known; authors are matched to accounts by e-mail on import. */
  author: z.string().max(254).nullable(),
  createdAt: iso,
  document: z.unknown(),
});

/** A logged run of a study: its mapping and its stored samples (packed, deflated, base64). */
export const archiveLogSchema = z.strictObject({
  name: z.string().min(1).max(120),
  loggedOn: z.iso.date().nullable(),
  notes: z.string().max(5000),
  mapping: z.unknown(),
  sourceName: z.string().max(200),
  sourceChecksum: z.string().regex(/^[0-9a-f]{64}$/, 'must be a SHA-256 in hex'),
  sourceBytes: z.number().int().min(0),
  selection: z
    .array(z.strictObject({ start: z.number().int().min(0), end: z.number().int().min(0) }))
    .max(500)
    .nullable(),
  skipped: z.array(z.strictObject({ reason: z.string().max(300), rows: z.number().int().min(0) })).max(20),
  createdAt: iso,
  samples: z.base64({ message: 'must be base64' }),
});

export const archiveStudySchema = z.strictObject({
  id: z.string().min(1).max(80),
  title: z.string().min(1).max(120),
  archived: z.boolean(),
  createdAt: iso,
  revisions: z.array(archiveRevisionSchema).min(1).max(10_000),
  /** Logged runs; absent in archives from before logs were kept. */
  logs: z.array(archiveLogSchema).max(200).optional(),
});

export const teamArchiveSchema = z.strictObject({
  format: z.literal(ARCHIVE_FORMAT, { error: `format must be "${ARCHIVE_FORMAT}"` }),
  version: z.literal(ARCHIVE_VERSION, { error: `version must be ${ARCHIVE_VERSION}` }),
  exportedAt: iso,
  team: z.strictObject({ name: z.string().max(120) }),
  maps: z.array(archiveMapSchema).max(5000),
  studies: z.array(archiveStudySchema).max(5000),
});
export type TeamArchive = z.output<typeof teamArchiveSchema>;

/** Plan fields that name a map of the library. */
export const PLAN_MAP_FIELDS = ['compressorMapId', 'turbineMapId'] as const;
