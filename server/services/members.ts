import { and, asc, eq } from 'drizzle-orm';
import type { Request } from 'express';
import type { User } from 'lucia';
import type { Member, Role } from '#shared/schemas/account';
import type { TeamAccess } from '../auth/access';
import type { Db, Tx } from '../db/client';
import { teamMembers, teams, users } from '../db/schema';
import { HttpError } from '../http/errors';
import { audit } from './audit';
import { revokeShareLinksOfLeaver } from './share-links';

/** A team's members: their roles, removing them, leaving; a team always keeps one owner. */

export async function membersOf(db: Db, teamId: string): Promise<Member[]> {
  const rows = await db
    .select({ userId: users.id, email: users.email, name: users.name, role: teamMembers.role, joinedAt: teamMembers.createdAt })
    .from(teamMembers)
    .innerJoin(users, eq(users.id, teamMembers.userId))
    .where(eq(teamMembers.teamId, teamId))
    .orderBy(asc(users.name));
  return rows.map((r) => ({ ...r, joinedAt: r.joinedAt.toISOString() }));
}

/**
 * Refuses a change that would leave a team without an owner. Runs inside the transaction that
 * makes the change. It first locks the team's row: every change of membership in a team takes
 * that one lock first, so such changes run one after the other. (Locking member rows alone let
 * two owners demoting each other lock them in opposite orders: a deadlock, answered 500.)
 */
async function assertOwnerRemains(tx: Tx, teamId: string, userId: string, newRole: Role | null, actingOwnerId: string | null = null) {
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

/** An owner acting is checked again under the team's lock; a site admin (no role) is not. */
const actingOwner = (access: TeamAccess, actor: User) => (access.role === 'owner' ? actor.id : null);

export async function changeMemberRole(
  db: Db,
  input: { access: TeamAccess; userId: string; role: Role; actor: User; req: Request },
): Promise<Member | undefined> {
  const { access, userId, role, actor, req } = input;
  await db.transaction(async (tx) => {
    await assertOwnerRemains(tx, access.teamId, userId, role, actingOwner(access, actor));
    await tx
      .update(teamMembers)
      .set({ role })
      .where(and(eq(teamMembers.teamId, access.teamId), eq(teamMembers.userId, userId)));
    await audit(tx, { action: 'member.role-changed', teamId: access.teamId, actor, targetType: 'user', targetId: userId, details: { role }, req });
  });
  return (await membersOf(db, access.teamId)).find((m) => m.userId === userId);
}

/** Takes someone out of the team; the share links they made stop (unless kept). */
export async function removeMember(db: Db, input: { access: TeamAccess; userId: string; actor: User; req: Request }) {
  const { access, userId, actor, req } = input;
  await db.transaction(async (tx) => {
    await assertOwnerRemains(tx, access.teamId, userId, null, actingOwner(access, actor));
    await tx.delete(teamMembers).where(and(eq(teamMembers.teamId, access.teamId), eq(teamMembers.userId, userId)));
    const shareLinksRevoked = await revokeShareLinksOfLeaver(tx, access.teamId, userId);
    await audit(tx, { action: 'member.removed', teamId: access.teamId, actor, targetType: 'user', targetId: userId, details: { shareLinksRevoked }, req });
  });
}

/** The user leaves a team (never their personal one); the share links they made stop (unless kept). */
export async function leaveTeam(db: Db, input: { access: TeamAccess; user: User; req: Request }) {
  const { access, user, req } = input;
  if (access.personal) throw new HttpError(400, 'personal_team', 'You cannot leave your personal team.');
  await db.transaction(async (tx) => {
    await assertOwnerRemains(tx, access.teamId, user.id, null);
    await tx.delete(teamMembers).where(and(eq(teamMembers.teamId, access.teamId), eq(teamMembers.userId, user.id)));
    const shareLinksRevoked = await revokeShareLinksOfLeaver(tx, access.teamId, user.id);
    await audit(tx, { action: 'member.left', teamId: access.teamId, actor: user, targetType: 'user', targetId: user.id, details: { shareLinksRevoked }, req });
  });
}
