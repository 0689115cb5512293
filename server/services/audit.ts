import type { Request } from 'express';
import type { User } from 'lucia';
import type { Db } from '../db/client';
import { auditEvents } from '../db/schema';
import { newId } from '../auth/tokens';

export type AuditAction =
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
