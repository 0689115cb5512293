import { sql } from 'drizzle-orm';
import {
  bigint,
  boolean,
  customType,
  date,
  doublePrecision,
  index,
  integer,
  jsonb,
  pgTable,
  primaryKey,
  text,
  timestamp,
  uniqueIndex,
  varchar,
} from 'drizzle-orm/pg-core';

const bytea = customType<{ data: Buffer; driverData: Buffer }>({ dataType: () => 'bytea' });

const createdAt = () => timestamp('created_at', { withTimezone: true, mode: 'date' }).notNull().defaultNow();

export const users = pgTable(
  'users',
  {
    id: text('id').primaryKey(),
    /** Stored lower-cased; unique. */
    email: text('email').notNull(),
    name: text('name').notNull(),
    passwordHash: text('password_hash').notNull(),
    isAdmin: boolean('is_admin').notNull().default(false),
    unitSystem: text('unit_system', { enum: ['si', 'us'] })
      .notNull()
      .default('si'),
    createdAt: createdAt(),
    passwordChangedAt: timestamp('password_changed_at', { withTimezone: true, mode: 'date' }).notNull().defaultNow(),
    /** When the owner of the address opened the confirmation link; null until then (no joining or creating teams). */
    emailConfirmedAt: timestamp('email_confirmed_at', { withTimezone: true, mode: 'date' }),
    /** Base32 TOTP secret (RFC 6238), set while setting up the second factor and kept once it is on. */
    totpSecret: text('totp_secret'),
    /** When the second factor was turned on; null while it is off. */
    totpEnabledAt: timestamp('totp_enabled_at', { withTimezone: true, mode: 'date' }),
    /** The last time step a code was accepted for: a code is never accepted twice. */
    totpLastStep: integer('totp_last_step'),
  },
  (t) => [uniqueIndex('users_email_unique').on(t.email)],
);

/** One-time recovery codes for the second factor, stored as SHA-256 hashes. */
export const recoveryCodes = pgTable(
  'recovery_codes',
  {
    id: text('id').primaryKey(),
    userId: text('user_id')
      .notNull()
      .references(() => users.id, { onDelete: 'cascade' }),
    codeHash: text('code_hash').notNull(),
    usedAt: timestamp('used_at', { withTimezone: true, mode: 'date' }),
    createdAt: createdAt(),
  },
  (t) => [index('recovery_codes_user_idx').on(t.userId)],
);

/** A sign-in that passed the password and waits for the second factor (token hashed, minutes long). */
export const signInChallenges = pgTable(
  'sign_in_challenges',
  {
    id: text('id').primaryKey(),
    userId: text('user_id')
      .notNull()
      .references(() => users.id, { onDelete: 'cascade' }),
    tokenHash: text('token_hash').notNull(),
    attempts: integer('attempts').notNull().default(0),
    expiresAt: timestamp('expires_at', { withTimezone: true, mode: 'date' }).notNull(),
    createdAt: createdAt(),
  },
  (t) => [uniqueIndex('sign_in_challenges_token_unique').on(t.tokenHash)],
);

/** Links that confirm a new account's e-mail address (token hashed). */
export const emailConfirmations = pgTable(
  'email_confirmations',
  {
    id: text('id').primaryKey(),
    userId: text('user_id')
      .notNull()
      .references(() => users.id, { onDelete: 'cascade' }),
    tokenHash: text('token_hash').notNull(),
    expiresAt: timestamp('expires_at', { withTimezone: true, mode: 'date' }).notNull(),
    usedAt: timestamp('used_at', { withTimezone: true, mode: 'date' }),
    createdAt: createdAt(),
  },
  (t) => [uniqueIndex('email_confirmations_token_unique').on(t.tokenHash), index('email_confirmations_user_idx').on(t.userId)],
);

/**
 * lucia sessions. `id` is the SHA-256 (hex) of the id in the cookie, never the id itself
 * (server/auth/lucia.ts); `createdAt` caps a session's absolute lifetime beside lucia's sliding expiry.
 */
export const sessions = pgTable(
  'sessions',
  {
    id: text('id').primaryKey(),
    userId: text('user_id')
      .notNull()
      .references(() => users.id, { onDelete: 'cascade' }),
    expiresAt: timestamp('expires_at', { withTimezone: true, mode: 'date' }).notNull(),
    createdAt: createdAt(),
    /** Updated at most once a minute, for the Sessions page. */
    lastSeenAt: timestamp('last_seen_at', { withTimezone: true, mode: 'date' }).notNull().defaultNow(),
    /** The client address last seen using the session. */
    ip: text('ip'),
    /** The browser's User-Agent at sign-in (shortened). */
    userAgent: text('user_agent'),
  },
  (t) => [index('sessions_user_idx').on(t.userId)],
);

export const teams = pgTable('teams', {
  id: text('id').primaryKey(),
  name: text('name').notNull(),
  /** Every account has one personal team, made at sign-up; it cannot be deleted. */
  personal: boolean('personal').notNull().default(false),
  /** Members must have the second factor on to open the team's data. */
  requireTwoFactor: boolean('require_two_factor').notNull().default(false),
  createdAt: createdAt(),
});

export const teamMembers = pgTable(
  'team_members',
  {
    teamId: text('team_id')
      .notNull()
      .references(() => teams.id, { onDelete: 'cascade' }),
    userId: text('user_id')
      .notNull()
      .references(() => users.id, { onDelete: 'cascade' }),
    role: text('role', { enum: ['owner', 'editor', 'viewer'] }).notNull(),
    createdAt: createdAt(),
  },
  (t) => [primaryKey({ columns: [t.teamId, t.userId] }), index('team_members_user_idx').on(t.userId)],
);

export const invitations = pgTable(
  'invitations',
  {
    id: text('id').primaryKey(),
    teamId: text('team_id')
      .notNull()
      .references(() => teams.id, { onDelete: 'cascade' }),
    email: text('email').notNull(),
    role: text('role', { enum: ['owner', 'editor', 'viewer'] }).notNull(),
    /** SHA-256 of the token in the e-mailed link; the token itself is never stored. */
    tokenHash: text('token_hash').notNull(),
    invitedBy: text('invited_by')
      .notNull()
      .references(() => users.id, { onDelete: 'cascade' }),
    createdAt: createdAt(),
    expiresAt: timestamp('expires_at', { withTimezone: true, mode: 'date' }).notNull(),
    acceptedAt: timestamp('accepted_at', { withTimezone: true, mode: 'date' }),
    cancelledAt: timestamp('cancelled_at', { withTimezone: true, mode: 'date' }),
  },
  (t) => [
    uniqueIndex('invitations_token_unique').on(t.tokenHash),
    uniqueIndex('invitations_pending_unique')
      .on(t.teamId, t.email)
      .where(sql`accepted_at IS NULL AND cancelled_at IS NULL`),
  ],
);

export const passwordResets = pgTable(
  'password_resets',
  {
    id: text('id').primaryKey(),
    userId: text('user_id')
      .notNull()
      .references(() => users.id, { onDelete: 'cascade' }),
    tokenHash: text('token_hash').notNull(),
    createdAt: createdAt(),
    expiresAt: timestamp('expires_at', { withTimezone: true, mode: 'date' }).notNull(),
    usedAt: timestamp('used_at', { withTimezone: true, mode: 'date' }),
  },
  (t) => [
    uniqueIndex('password_resets_token_unique').on(t.tokenHash),
    // One live link per user: a new request ends the earlier one first.
    uniqueIndex('password_resets_live_unique')
      .on(t.userId)
      .where(sql`used_at IS NULL`),
  ],
);

/**
 * Mail waiting to be sent. Requests put a message here and answer at once; a worker in every
 * server process sends it (rows claimed with SKIP LOCKED, so instances never send one twice).
 */
export const mailQueue = pgTable(
  'mail_queue',
  {
    id: text('id').primaryKey(),
    to: text('to').notNull(),
    subject: text('subject').notNull(),
    text: text('text').notNull(),
    html: text('html'),
    attempts: integer('attempts').notNull().default(0),
    nextAttemptAt: timestamp('next_attempt_at', { withTimezone: true, mode: 'date' }).notNull().defaultNow(),
    sentAt: timestamp('sent_at', { withTimezone: true, mode: 'date' }),
    lastError: text('last_error'),
    createdAt: createdAt(),
  },
  (t) => [
    index('mail_queue_due_idx')
      .on(t.nextAttemptAt)
      .where(sql`sent_at IS NULL`),
  ],
);

/**
 * Counters of every rate limit (sign-in failures, sign-ups, resets, compute, invitations,
 * uploads), shared by all server instances. The layout is rate-limiter-flexible's PostgreSQL store.
 */
export const rateLimits = pgTable('rate_limits', {
  key: varchar('key', { length: 255 }).primaryKey(),
  points: integer('points').notNull().default(0),
  /** Epoch milliseconds when the counter resets. */
  expire: bigint('expire', { mode: 'number' }),
});

/** Messages accepted by the local fake SMTP server (development and tests). */
export const outbox = pgTable(
  'outbox',
  {
    id: text('id').primaryKey(),
    from: text('from').notNull(),
    to: text('to').notNull(),
    subject: text('subject').notNull(),
    text: text('text').notNull(),
    html: text('html'),
    raw: text('raw').notNull(),
    headers: jsonb('headers').$type<Record<string, string>>().notNull().default({}),
    receivedAt: timestamp('received_at', { withTimezone: true, mode: 'date' }).notNull().defaultNow(),
  },
  (t) => [index('outbox_received_idx').on(t.receivedAt)],
);

/** A team's compressor and turbine maps. `parsed` is the SI map model; `fileText` the upload as it came. */
export const maps = pgTable(
  'maps',
  {
    id: text('id').primaryKey(),
    teamId: text('team_id')
      .notNull()
      .references(() => teams.id, { onDelete: 'cascade' }),
    kind: text('kind', { enum: ['compressor', 'turbine'] }).notNull(),
    name: text('name').notNull(),
    notes: text('notes').notNull().default(''),
    parsed: jsonb('parsed').notNull(),
    fileText: text('file_text').notNull(),
    fileName: text('file_name').notNull(),
    revision: integer('revision').notNull().default(1),
    createdBy: text('created_by').references(() => users.id, { onDelete: 'set null' }),
    createdAt: createdAt(),
    updatedAt: timestamp('updated_at', { withTimezone: true, mode: 'date' }).notNull().defaultNow(),
  },
  (t) => [index('maps_team_idx').on(t.teamId, t.kind, t.name)],
);

/** A team's studies. `document` is the current revision's study document (shared/schemas/study.ts). */
export const studies = pgTable(
  'studies',
  {
    id: text('id').primaryKey(),
    teamId: text('team_id')
      .notNull()
      .references(() => teams.id, { onDelete: 'cascade' }),
    title: text('title').notNull(),
    /** Copied from the document on every save, for the list's search. */
    engineLabel: text('engine_label').notNull().default(''),
    document: jsonb('document').notNull(),
    revision: integer('revision').notNull().default(1),
    archived: boolean('archived').notNull().default(false),
    createdBy: text('created_by').references(() => users.id, { onDelete: 'set null' }),
    updatedBy: text('updated_by').references(() => users.id, { onDelete: 'set null' }),
    createdAt: createdAt(),
    updatedAt: timestamp('updated_at', { withTimezone: true, mode: 'date' }).notNull().defaultNow(),
  },
  (t) => [index('studies_team_list_idx').on(t.teamId, t.archived, t.updatedAt), index('studies_team_author_idx').on(t.teamId, t.createdBy)],
);

/** Every saved revision of a study, the first included; never changed after insert. */
export const studyRevisions = pgTable(
  'study_revisions',
  {
    studyId: text('study_id')
      .notNull()
      .references(() => studies.id, { onDelete: 'cascade' }),
    revision: integer('revision').notNull(),
    document: jsonb('document').notNull(),
    title: text('title').notNull(),
    message: text('message').notNull().default(''),
    authorId: text('author_id').references(() => users.id, { onDelete: 'set null' }),
    /** An imported revision's author who is not a member of the team: kept as plain text, never matched to another account. */
    authorName: text('author_name'),
    createdAt: createdAt(),
  },
  (t) => [primaryKey({ columns: [t.studyId, t.revision] })],
);

/** Read-only links to one study; the token is stored hashed. */
export const shareLinks = pgTable(
  'share_links',
  {
    id: text('id').primaryKey(),
    studyId: text('study_id')
      .notNull()
      .references(() => studies.id, { onDelete: 'cascade' }),
    tokenHash: text('token_hash').notNull(),
    createdBy: text('created_by').references(() => users.id, { onDelete: 'set null' }),
    createdAt: createdAt(),
    expiresAt: timestamp('expires_at', { withTimezone: true, mode: 'date' }),
    revokedAt: timestamp('revoked_at', { withTimezone: true, mode: 'date' }),
    /** An owner who chose to keep the link working after its maker leaves the team. */
    keptBy: text('kept_by').references(() => users.id, { onDelete: 'set null' }),
  },
  (t) => [uniqueIndex('share_links_token_unique').on(t.tokenHash), index('share_links_study_idx').on(t.studyId)],
);

/**
 * Who did what and when (UTC), without secrets: sign-ins, role changes, invitations, share links,
 * deletions, imports. Rows outlive the objects they name, so there are no foreign keys.
 */
export const auditEvents = pgTable(
  'audit_events',
  {
    id: text('id').primaryKey(),
    at: timestamp('at', { withTimezone: true, mode: 'date' }).notNull().defaultNow(),
    teamId: text('team_id'),
    actorId: text('actor_id'),
    actorEmail: text('actor_email'),
    action: text('action').notNull(),
    targetType: text('target_type'),
    targetId: text('target_id'),
    details: jsonb('details').$type<Record<string, unknown>>().notNull().default({}),
    ip: text('ip'),
  },
  (t) => [index('audit_team_at_idx').on(t.teamId, t.at), index('audit_at_idx').on(t.at)],
);

/**
 * Pictures of maps for the Tracer, checked by their bytes (PNG or JPEG) and stored here; served
 * only with the content type found by that check and a generated name.
 */
export const mapImages = pgTable(
  'map_images',
  {
    id: text('id').primaryKey(),
    teamId: text('team_id')
      .notNull()
      .references(() => teams.id, { onDelete: 'cascade' }),
    /** The map traced from this picture, once saved. */
    mapId: text('map_id').references(() => maps.id, { onDelete: 'set null' }),
    contentType: text('content_type', { enum: ['image/png', 'image/jpeg'] }).notNull(),
    bytes: bytea('bytes').notNull(),
    byteSize: integer('byte_size').notNull(),
    width: integer('width').notNull(),
    height: integer('height').notNull(),
    createdBy: text('created_by').references(() => users.id, { onDelete: 'set null' }),
    createdAt: createdAt(),
  },
  (t) => [index('map_images_team_idx').on(t.teamId), index('map_images_map_idx').on(t.mapId)],
);

/** A trace in progress: calibration, curves and points, saved as the user works. */
export const traceDrafts = pgTable(
  'trace_drafts',
  {
    id: text('id').primaryKey(),
    teamId: text('team_id')
      .notNull()
      .references(() => teams.id, { onDelete: 'cascade' }),
    imageId: text('image_id')
      .notNull()
      .references(() => mapImages.id, { onDelete: 'cascade' }),
    name: text('name').notNull(),
    state: jsonb('state').notNull(),
    revision: integer('revision').notNull().default(1),
    createdBy: text('created_by').references(() => users.id, { onDelete: 'set null' }),
    createdAt: createdAt(),
    updatedAt: timestamp('updated_at', { withTimezone: true, mode: 'date' }).notNull().defaultNow(),
  },
  (t) => [index('trace_drafts_team_idx').on(t.teamId, t.updatedAt)],
);

/**
 * Logged runs uploaded to a study: the mapping they were read with, the source file's checksum, and
 * the samples in SI, packed per channel (shared/logs/pack.ts) and deflated with node:zlib.
 */
export const studyLogs = pgTable(
  'study_logs',
  {
    id: text('id').primaryKey(),
    teamId: text('team_id')
      .notNull()
      .references(() => teams.id, { onDelete: 'cascade' }),
    studyId: text('study_id')
      .notNull()
      .references(() => studies.id, { onDelete: 'cascade' }),
    name: text('name').notNull(),
    /** The day the run was logged (ISO date), when given. */
    loggedOn: date('logged_on', { mode: 'string' }),
    notes: text('notes').notNull().default(''),
    /** The column mapping (shared/logs/mapping.ts). */
    mapping: jsonb('mapping').notNull(),
    /** SHA-256 of the uploaded file, hex. */
    sourceChecksum: text('source_checksum').notNull(),
    sourceName: text('source_name').notNull().default(''),
    sourceBytes: integer('source_bytes').notNull(),
    rowCount: integer('row_count').notNull(),
    /** Seconds from first to last sample. */
    duration: doublePrecision('duration').notNull(),
    /** Quantities stored, in shared/logs/quantities.ts order. */
    channels: jsonb('channels').notNull(),
    /** Rows left out on reading, with why. */
    skipped: jsonb('skipped').notNull(),
    /** The segments chosen for comparison and fit, `[{ start, end }]` rows; null: the detected pulls. */
    selection: jsonb('selection'),
    samples: bytea('samples').notNull(),
    createdBy: text('created_by').references(() => users.id, { onDelete: 'set null' }),
    createdAt: createdAt(),
  },
  (t) => [index('study_logs_study_idx').on(t.teamId, t.studyId, t.createdAt)],
);

/** A team's named column mappings, kept for the next log from the same logger. */
export const logMappingPresets = pgTable(
  'log_mapping_presets',
  {
    id: text('id').primaryKey(),
    teamId: text('team_id')
      .notNull()
      .references(() => teams.id, { onDelete: 'cascade' }),
    name: text('name').notNull(),
    mapping: jsonb('mapping').notNull(),
    createdBy: text('created_by').references(() => users.id, { onDelete: 'set null' }),
    createdAt: createdAt(),
    updatedAt: timestamp('updated_at', { withTimezone: true, mode: 'date' }).notNull().defaultNow(),
  },
  (t) => [uniqueIndex('log_mapping_presets_team_name_unique').on(t.teamId, t.name)],
);
