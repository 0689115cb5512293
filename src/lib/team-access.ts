import { can, type Permission } from '#shared/permissions';
import type { Role } from '#shared/schemas/account';
import { useMe } from './session';

export interface TeamAccess {
  teamName: string | null;
  /** The user's role; null when they are not a member (a site admin looking in). */
  role: Role | null;
  /** Whether the server would let the user do this in the team (shared/permissions.ts). */
  can: (permission: Permission) => boolean;
}

/**
 * The signed-in user's place in a team, from `me`. The server decides in the end; this only
 * keeps controls off screens where they would be refused.
 */
export function useTeamAccess(teamId: string): TeamAccess {
  const me = useMe();
  const team = me.data?.teams.find((t) => t.id === teamId) ?? null;
  const role = team?.role ?? null;
  const isAdmin = me.data?.user.isAdmin ?? false;
  return { teamName: team?.name ?? null, role, can: (permission) => can(role, permission, isAdmin) };
}
