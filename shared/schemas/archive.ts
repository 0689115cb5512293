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

export const archiveStudySchema = z.strictObject({
  id: z.string().min(1).max(80),
  title: z.string().min(1).max(120),
  archived: z.boolean(),
  createdAt: iso,
  revisions: z.array(archiveRevisionSchema).min(1).max(10_000),
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
