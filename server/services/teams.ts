import { and, asc, count, eq, gt, isNull } from 'drizzle-orm';
import type { Invitation, Member, Role } from '../../shared/schemas/account';
import type { Db } from '../db/client';
import { invitations, teamMembers, users } from '../db/schema';
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
 * makes the change, with the team's owner rows locked, so two owners demoting each other at
 * once cannot both succeed.
 */
export async function assertOwnerRemains(tx: Tx, teamId: string, userId: string, newRole: Role | null) {
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
