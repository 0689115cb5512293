import { useMe } from '#src/lib/session';

/**
 * The signed-in user's place in a team, from `me`: editors and owners trace, viewers look. The
 * server decides in the end; this only keeps controls off screens that would be refused.
 */
export function useTracerAccess(teamId: string): { teamName: string | null; canEdit: boolean } {
  const me = useMe();
  const team = me.data?.teams.find((t) => t.id === teamId) ?? null;
  return { teamName: team?.name ?? null, canEdit: team?.role === 'owner' || team?.role === 'editor' };
}
