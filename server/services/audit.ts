import { and, desc, eq, lt, type SQL } from 'drizzle-orm';
import type { Request } from 'express';
import type { User } from 'lucia';
import type { z } from 'zod';
import type { auditQuerySchema } from '#shared/schemas/account';
import type { Db } from '../db/client';
import { auditEvents } from '../db/schema';
import { newId } from '../auth/tokens';

type AuditAction =
  | 'auth.sign-up'
  | 'auth.sign-in'
  | 'auth.sign-in-failed'
  | 'auth.sign-out'
  | 'auth.password-changed'
  | 'auth.password-reset-requested'
  | 'auth.password-reset'
  | 'auth.email-confirmed'
  | 'auth.second-factor-failed'
  | 'auth.recovery-code-used'
  | 'auth.recovery-codes-renewed'
  | 'auth.two-factor-on'
  | 'auth.two-factor-off'
  | 'auth.sessions-ended'
  | 'admin.sessions-ended'
  | 'team.two-factor-rule'
  | 'team.created'
  | 'team.renamed'
  | 'team.deleted'
  | 'team.exported'
  | 'team.imported'
  | 'member.role-changed'
  | 'member.removed'
  | 'member.left'
  | 'invitation.created'
  | 'invitation.resent'
  | 'invitation.cancelled'
  | 'invitation.accepted'
  | 'map.uploaded'
  | 'map.deleted'
  | 'study.deleted'
  | 'log.uploaded'
  | 'log.deleted'
  | 'study.copied-out'
  | 'study.copied-in'
  | 'share-link.created'
  | 'share-link.revoked'
  | 'share-link.kept'
  | 'share-link.unkept';

export interface AuditEvent {
  action: AuditAction;
  teamId?: string | null;
  actor?: Pick<User, 'id' | 'email'> | null;
  /** For events without a signed-in actor (a failed sign-in): the address tried, never the password. */
  actorEmail?: string | null;
  targetType?: string;
  targetId?: string;
  /** Plain facts only: names, roles, counts. Never tokens, passwords or hashes. */
  details?: Record<string, unknown>;
  req?: Request;
}

type Writer = Pick<Db, 'insert'>;

/** Records one event; runs inside the caller's transaction when given one, so it lands with the change. */
export async function audit(db: Writer, event: AuditEvent) {
  await db.insert(auditEvents).values({
    id: newId(),
    teamId: event.teamId ?? null,
    actorId: event.actor?.id ?? null,
    actorEmail: event.actor?.email ?? event.actorEmail ?? null,
    action: event.action,
    targetType: event.targetType ?? null,
    targetId: event.targetId ?? null,
    details: event.details ?? {},
    ip: event.req?.ip ?? null,
  });
}

/** The newest entries of a team's record, or of the whole site's when `teamId` is null. */
export async function readAudit(db: Db, teamId: string | null, query: z.output<typeof auditQuerySchema>) {
  const filters: SQL[] = [];
  if (teamId) filters.push(eq(auditEvents.teamId, teamId));
  if (query.before) filters.push(lt(auditEvents.at, new Date(query.before)));
  const rows = await db
    .select()
    .from(auditEvents)
    .where(filters.length ? and(...filters) : undefined)
    .orderBy(desc(auditEvents.at))
    .limit(query.limit);
  return rows.map((r) => ({ ...r, at: r.at.toISOString() }));
}
