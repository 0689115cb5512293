import { eq } from 'drizzle-orm';
import type { Request } from 'express';
import type { User } from 'lucia';
import type { TeamSummary } from '#shared/schemas/account';
import type { TeamAccess } from '../auth/access';
import { newId } from '../auth/tokens';
import type { Db } from '../db/client';
import { teamMembers, teams } from '../db/schema';
import { HttpError } from '../http/errors';
import { teamsOf } from './accounts';
import { audit } from './audit';
import { pendingInvitationsOf } from './invitations';
import { membersOf } from './members';

/** Teams: the ones a user sees, creating, renaming, the second-factor rule, deleting. */

/** A team as the API answers it, from the access just checked. */
function teamView(access: TeamAccess, changes: Partial<Pick<TeamSummary, 'name' | 'requireTwoFactor'>> = {}) {
  return { id: access.teamId, name: access.teamName, personal: access.personal, role: access.role, requireTwoFactor: access.requireTwoFactor, ...changes };
}

/** The user's teams; a site admin sees every team, with their role where they are a member. */
export async function visibleTeams(db: Db, user: User) {
  const mine = await teamsOf(db, user.id);
  if (!user.isAdmin) return mine;
  const all = await db
    .select({ id: teams.id, name: teams.name, personal: teams.personal, requireTwoFactor: teams.requireTwoFactor })
    .from(teams)
    .orderBy(teams.name);
  const roles = new Map(mine.map((t) => [t.id, t.role]));
  return all.map((t) => ({ ...t, role: roles.get(t.id) ?? null }));
}

/** A new team with its maker as the owner. */
export async function createTeam(db: Db, input: { name: string; owner: User; req: Request }): Promise<TeamSummary> {
  const { name, owner, req } = input;
  const id = newId();
  await db.transaction(async (tx) => {
    await tx.insert(teams).values({ id, name, personal: false });
    await tx.insert(teamMembers).values({ teamId: id, userId: owner.id, role: 'owner' });
    await audit(tx, { action: 'team.created', teamId: id, actor: owner, targetType: 'team', targetId: id, details: { name }, req });
  });
  return { id, name, personal: false, role: 'owner', requireTwoFactor: false };
}

/** The team page: the team, its members, and (for owners) its pending invitations. */
export async function teamDetail(db: Db, access: TeamAccess) {
  return {
    team: teamView(access),
    members: await membersOf(db, access.teamId),
    invitations: access.role === 'owner' ? await pendingInvitationsOf(db, access.teamId) : [],
  };
}

export async function renameTeam(db: Db, input: { access: TeamAccess; name: string; actor: User; req: Request }) {
  const { access, name, actor, req } = input;
  await db.update(teams).set({ name }).where(eq(teams.id, access.teamId));
  await audit(db, {
    action: 'team.renamed',
    teamId: access.teamId,
    actor,
    targetType: 'team',
    targetId: access.teamId,
    details: { from: access.teamName, to: name },
    req,
  });
  return teamView(access, { name });
}

/** An owner asks every member to use a second factor (or stops asking); only with one of their own. */
export async function setTwoFactorRule(db: Db, input: { access: TeamAccess; required: boolean; actor: User; req: Request }) {
  const { access, required, actor, req } = input;
  if (required && !actor.twoFactor) {
    throw new HttpError(
      400,
      'two_factor_needed',
      'Turn on your own second factor first (Account → Second factor), or you would lock yourself out of this team.',
    );
  }
  await db.update(teams).set({ requireTwoFactor: required }).where(eq(teams.id, access.teamId));
  await audit(db, { action: 'team.two-factor-rule', teamId: access.teamId, actor, targetType: 'team', targetId: access.teamId, details: { required }, req });
  return teamView(access, { requireTwoFactor: required });
}

/** Deletes a team with everything in it (never a personal team). */
export async function deleteTeam(db: Db, input: { access: TeamAccess; actor: User; req: Request }) {
  const { access, actor, req } = input;
  if (access.personal) throw new HttpError(400, 'personal_team', 'A personal team cannot be deleted.');
  await db.transaction(async (tx) => {
    await tx.delete(teams).where(eq(teams.id, access.teamId));
    await audit(tx, {
      action: 'team.deleted',
      teamId: access.teamId,
      actor,
      targetType: 'team',
      targetId: access.teamId,
      details: { name: access.teamName },
      req,
    });
  });
}
