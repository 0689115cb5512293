import type { Role } from '#shared/schemas/account';
import { useMe } from '#src/lib/session';

/**
 * The signed-in user's place in a team, from `me`: its name and their role (null when they are
 * not a member, as a site admin looking in). Editors and owners change maps; viewers only read.
 * The server decides in the end; this only keeps controls off screens that would be refused.
 */
export function useTeamAccess(teamId: string): { teamName: string | null; role: Role | null; canEdit: boolean } {
  const me = useMe();
  const team = me.data?.teams.find((t) => t.id === teamId) ?? null;
  const role = team?.role ?? null;
  return { teamName: team?.name ?? null, role, canEdit: role === 'owner' || role === 'editor' };
}
