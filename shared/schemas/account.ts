import { z } from 'zod';

// Request and response shapes of the account and team API, shared by the client and the server.
// Request objects are strict: an unknown key is refused by name (no mass assignment).

export const emailSchema = z.string().trim().toLowerCase().max(254, 'must be at most 254 characters').pipe(z.email('must be an e-mail address'));

/** Length-based password policy (OWASP ASVS 5.0 6.2.1: at least 8; 6.2.9: allow at least 64). */
export const passwordSchema = z.string().min(8, 'must be at least 8 characters').max(128, 'must be at most 128 characters');

export const displayNameSchema = z.string().trim().min(1, 'is required').max(80, 'must be at most 80 characters');

export const unitSystemSchema = z.enum(['si', 'us']);
export type UnitSystem = z.infer<typeof unitSystemSchema>;

export const roleSchema = z.enum(['owner', 'editor', 'viewer']);
export type Role = z.infer<typeof roleSchema>;

export const signUpSchema = z.strictObject({
  email: emailSchema,
  password: passwordSchema,
  name: displayNameSchema,
});
export const signInSchema = z.strictObject({
  email: emailSchema,
  password: z.string().min(1, 'is required').max(128, 'must be at most 128 characters'),
});
export const resetRequestSchema = z.strictObject({ email: emailSchema });
export const resetConfirmSchema = z.strictObject({
  token: z.string().min(10).max(200),
  password: passwordSchema,
});
export const confirmEmailSchema = z.strictObject({ token: z.string().min(10).max(200) });
/** A 6-digit code from an authenticator app, or a recovery code (`abcde-fghjk`). */
export const secondFactorCodeSchema = z.string().trim().min(6, 'is required').max(20, 'is not a code');
export const secondFactorSignInSchema = z.strictObject({ challenge: z.string().min(10).max(200), code: secondFactorCodeSchema });
export const enableTwoFactorSchema = z.strictObject({
  code: z
    .string()
    .trim()
    .regex(/^\d{6}$/, 'must be the 6 digits your app shows'),
});
/** Turning the second factor off or making new recovery codes asks for the password again. */
export const confirmPasswordSchema = z.strictObject({ password: z.string().min(1, 'is required').max(128) });
export const teamTwoFactorSchema = z.strictObject({ required: z.boolean() });
export const changePasswordSchema = z.strictObject({
  currentPassword: z.string().min(1, 'is required').max(128),
  newPassword: passwordSchema,
});
export const updateProfileSchema = z.strictObject({
  name: displayNameSchema.optional(),
  unitSystem: unitSystemSchema.optional(),
});

export const userSchema = z.object({
  id: z.string(),
  email: z.string(),
  name: z.string(),
  isAdmin: z.boolean(),
  unitSystem: unitSystemSchema,
  /** False until the owner of the address opens the confirmation link. */
  emailConfirmed: z.boolean(),
  /** The second factor (an authenticator app) is on. */
  twoFactor: z.boolean(),
});
export type User = z.infer<typeof userSchema>;

/** The answer to a right password when the account has a second factor: no session yet. */
export const secondFactorNeededSchema = z.object({ secondFactor: z.literal(true), challenge: z.string() });

export const sessionViewSchema = z.object({
  id: z.string(),
  current: z.boolean(),
  createdAt: z.string(),
  lastSeenAt: z.string(),
  ip: z.string().nullable(),
  browser: z.string(),
});
export const sessionListSchema = z.object({ sessions: z.array(sessionViewSchema) });

export const twoFactorSetupSchema = z.object({ secret: z.string(), uri: z.string(), qrCode: z.string() });
export const recoveryCodesSchema = z.object({ recoveryCodes: z.array(z.string()) });
export const twoFactorStatusSchema = z.object({ enabled: z.boolean(), recoveryCodesLeft: z.number() });

export const adminUserSchema = z.object({
  id: z.string(),
  email: z.string(),
  name: z.string(),
  isAdmin: z.boolean(),
  twoFactor: z.boolean(),
  emailConfirmed: z.boolean(),
  /** Sessions that still work (expired ones are not counted). */
  sessions: z.number(),
  /** When the most recently used of those sessions was last used; null without one. */
  lastSeenAt: z.string().nullable(),
});
export type AdminUser = z.infer<typeof adminUserSchema>;

export const teamSummarySchema = z.object({
  id: z.string(),
  name: z.string(),
  personal: z.boolean(),
  /** The signed-in user's role; null when a site admin sees a team they are not in. */
  role: roleSchema.nullable(),
  /** Members must have the second factor on to open the team's data. */
  requireTwoFactor: z.boolean().optional(),
});
export type TeamSummary = z.infer<typeof teamSummarySchema>;

export const meSchema = z.object({ user: userSchema, teams: z.array(teamSummarySchema) });
export type Me = z.infer<typeof meSchema>;
/** `GET /api/auth/session`: who is signed in (null: nobody), and whether the one-click demo sign-in is open. */
export const sessionStateSchema = z.object({ me: meSchema.nullable(), demo: z.boolean() });

export const teamNameSchema = z.string().trim().min(1, 'is required').max(80, 'must be at most 80 characters');
export const createTeamSchema = z.strictObject({ name: teamNameSchema });
export const renameTeamSchema = z.strictObject({ name: teamNameSchema });

export const memberSchema = z.object({
  userId: z.string(),
  email: z.string(),
  name: z.string(),
  role: roleSchema,
  joinedAt: z.string(),
});
export type Member = z.infer<typeof memberSchema>;

export const invitationSchema = z.object({
  id: z.string(),
  email: z.string(),
  role: roleSchema,
  invitedBy: z.string(),
  createdAt: z.string(),
  expiresAt: z.string(),
});
export type Invitation = z.infer<typeof invitationSchema>;

export const createInvitationSchema = z.strictObject({ email: emailSchema, role: roleSchema });
export const changeRoleSchema = z.strictObject({ role: roleSchema });

export const teamDetailSchema = z.object({
  team: teamSummarySchema,
  members: z.array(memberSchema),
  /** Pending invitations; only owners see them (empty otherwise). */
  invitations: z.array(invitationSchema),
});
export type TeamDetail = z.infer<typeof teamDetailSchema>;

/** What the invitation page shows before the invitee joins. */
export const invitationPreviewSchema = z.object({
  teamName: z.string(),
  role: roleSchema,
  email: z.string(),
  invitedBy: z.string(),
  expiresAt: z.string(),
});
export type InvitationPreview = z.infer<typeof invitationPreviewSchema>;

export const outboxSummarySchema = z.object({
  id: z.string(),
  from: z.string(),
  to: z.string(),
  subject: z.string(),
  receivedAt: z.string(),
});
export const outboxMessageSchema = outboxSummarySchema.extend({ text: z.string(), html: z.string().nullable() });
export type OutboxMessage = z.infer<typeof outboxMessageSchema>;

/** One entry of a team's audit record (who did what, when in UTC). */
export const auditEventSchema = z.object({
  id: z.string(),
  at: z.string(),
  teamId: z.string().nullable(),
  actorId: z.string().nullable(),
  actorEmail: z.string().nullable(),
  action: z.string(),
  targetType: z.string().nullable(),
  targetId: z.string().nullable(),
  details: z.record(z.string(), z.unknown()),
  ip: z.string().nullable(),
});
export type AuditEventView = z.infer<typeof auditEventSchema>;
export const auditListSchema = z.object({ events: z.array(auditEventSchema) });
/** `?before=&limit=` of an audit record read: the newest `limit` entries before `before`. */
export const auditQuerySchema = z.strictObject({
  before: z.iso.datetime({ message: 'before must be an ISO date-time (UTC)' }).optional(),
  limit: z.coerce.number().int().min(1).max(500).default(100),
});
/** `?q=` of the site admin's user list: part of a name or e-mail (anything else in the query is ignored). */
export const userSearchQuerySchema = z.object({
  q: z
    .string()
    .catch('')
    .transform((q) => q.trim().slice(0, 100)),
});

/** What an import brought in. */
export const importResultSchema = z.object({ imported: z.object({ maps: z.number(), studies: z.number(), revisions: z.number() }) });
export const importProblemSchema = z.object({ item: z.string(), message: z.string() });
