import { and, eq } from 'drizzle-orm';
import type { User } from 'lucia';
import { can, permittedWithoutSecondFactor, type Permission } from '#shared/permissions';
import type { Role } from '#shared/schemas/account';
import type { Db } from '../db/client';
import { teamMembers, teams } from '../db/schema';
import { forbidden, HttpError, notFound } from '../http/errors';

// The rule itself (who may do what) is shared with the client: shared/permissions.ts.
export { can, type Permission };

export interface TeamAccess {
  teamId: string;
  teamName: string;
  personal: boolean;
  /** The user's role; null for a site admin who is not a member. */
  role: Role | null;
  /** Members must have the second factor on to open the team's data. */
  requireTwoFactor: boolean;
}

/**
 * The one place that decides access to a team's data. A team the user cannot see answers 404
 * (its existence does not leak); a team they can see but not change answers 403.
 */
export async function requireTeamPermission(db: Db, user: User, teamId: string, permission: Permission): Promise<TeamAccess> {
  const rows = await db
    .select({ teamId: teams.id, teamName: teams.name, personal: teams.personal, requireTwoFactor: teams.requireTwoFactor, role: teamMembers.role })
    .from(teams)
    .leftJoin(teamMembers, and(eq(teamMembers.teamId, teams.id), eq(teamMembers.userId, user.id)))
    .where(eq(teams.id, teamId))
    .limit(1);
  return decideTeamAccess(rows[0], user, permission);
}

/**
 * The rule of requireTeamPermission on a row already read (a query that reads the team, the
 * user's membership and what they asked for in one round trip): 404, 403 or the access.
 */
export function decideTeamAccess(row: TeamAccess | undefined, user: User, permission: Permission): TeamAccess {
  if (!row || (!row.role && !user.isAdmin)) throw notFound('No such team.');
  const access: TeamAccess = { teamId: row.teamId, teamName: row.teamName, personal: row.personal, role: row.role, requireTwoFactor: row.requireTwoFactor };
  if (!can(access.role, permission, user.isAdmin)) throw forbidden();
  if (access.requireTwoFactor && access.role && !user.twoFactor && !permittedWithoutSecondFactor.has(permission)) {
    throw new HttpError(
      403,
      'two_factor_required',
      `The team "${access.teamName}" asks its members to use a second factor. Turn it on under Account → Second factor, then come back.`,
    );
  }
  return access;
}
