import { and, asc, count, eq, gt, inArray, isNull } from 'drizzle-orm';
import type { Invitation, Member, Role } from '#shared/schemas/account';
import type { Db } from '../db/client';
import { invitations, shareLinks, studies, teamMembers, teams, users } from '../db/schema';
import { HttpError } from '../http/errors';

export const INVITATION_VALID_DAYS = 7;

export async function membersOf(db: Db, teamId: string): Promise<Member[]> {
  const rows = await db
    .select({ userId: users.id, email: users.email, name: users.name, role: teamMembers.role, joinedAt: teamMembers.createdAt })
    .from(teamMembers)
    .innerJoin(users, eq(users.id, teamMembers.userId))
    .where(eq(teamMembers.teamId, teamId))
    .orderBy(asc(users.name));
  return rows.map((r) => ({ ...r, joinedAt: r.joinedAt.toISOString() }));
}

export async function pendingInvitationsOf(db: Db, teamId: string): Promise<Invitation[]> {
  const rows = await db
    .select({
      id: invitations.id,
      email: invitations.email,
      role: invitations.role,
      invitedBy: users.name,
      createdAt: invitations.createdAt,
      expiresAt: invitations.expiresAt,
    })
    .from(invitations)
    .innerJoin(users, eq(users.id, invitations.invitedBy))
    .where(and(eq(invitations.teamId, teamId), isNull(invitations.acceptedAt), isNull(invitations.cancelledAt), gt(invitations.expiresAt, new Date())))
    .orderBy(asc(invitations.createdAt));
  return rows.map((r) => ({ ...r, createdAt: r.createdAt.toISOString(), expiresAt: r.expiresAt.toISOString() }));
}

type Tx = Parameters<Parameters<Db['transaction']>[0]>[0];

/**
 * Refuses a change that would leave a team without an owner. Runs inside the transaction that
 * makes the change. It first locks the team's row: every change of membership in a team takes
 * that one lock first, so such changes run one after the other. (Locking member rows alone let
 * two owners demoting each other lock them in opposite orders: a deadlock, answered 500.)
 */
export async function assertOwnerRemains(tx: Tx, teamId: string, userId: string, newRole: Role | null, actingOwnerId: string | null = null) {
  await tx.select({ id: teams.id }).from(teams).where(eq(teams.id, teamId)).for('update');
  if (actingOwnerId) {
    // The actor's role was checked before the lock; a change that ran first may have taken it away.
    const [actor] = await tx
      .select({ role: teamMembers.role })
      .from(teamMembers)
      .where(and(eq(teamMembers.teamId, teamId), eq(teamMembers.userId, actingOwnerId)));
    if (actor?.role !== 'owner') throw new HttpError(403, 'forbidden', 'You are no longer an owner of this team.');
  }
  const [member] = await tx
    .select({ role: teamMembers.role })
    .from(teamMembers)
    .where(and(eq(teamMembers.teamId, teamId), eq(teamMembers.userId, userId)))
    .for('update');
  if (!member) throw new HttpError(404, 'not_found', 'No such member in this team.');
  if (member.role !== 'owner' || newRole === 'owner') return;
  const owners = await tx
    .select({ userId: teamMembers.userId })
    .from(teamMembers)
    .where(and(eq(teamMembers.teamId, teamId), eq(teamMembers.role, 'owner')))
    .for('update');
  if (owners.length <= 1) {
    throw new HttpError(409, 'last_owner', 'A team needs at least one owner. Make someone else an owner first.');
  }
}

export async function memberCount(db: Db, teamId: string) {
  const [row] = await db.select({ n: count() }).from(teamMembers).where(eq(teamMembers.teamId, teamId));
  return row.n;
}

/**
 * When someone leaves a team (or is removed), the share links they made for its studies stop,
 * except those an owner chose to keep. Runs in the transaction of the leaving.
 */
export async function revokeShareLinksOfLeaver(tx: Tx, teamId: string, userId: string): Promise<number> {
  const teamStudies = tx.select({ id: studies.id }).from(studies).where(eq(studies.teamId, teamId));
  const rows = await tx
    .update(shareLinks)
    .set({ revokedAt: new Date() })
    .where(and(eq(shareLinks.createdBy, userId), isNull(shareLinks.revokedAt), isNull(shareLinks.keptBy), inArray(shareLinks.studyId, teamStudies)))
    .returning({ id: shareLinks.id });
  return rows.length;
}
