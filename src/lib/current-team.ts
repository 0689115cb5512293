import { useEffect, useSyncExternalStore } from 'react';
import { useParams } from 'react-router';
import type { TeamSummary } from '#shared/schemas/account';
import { useMe } from './session';

/** Where the last team the user worked in is remembered between visits. */
export const CURRENT_TEAM_STORAGE_KEY = 'spoolbook.team';

const listeners = new Set<() => void>();

export function readRememberedTeam(): string | null {
  try {
    return window.localStorage.getItem(CURRENT_TEAM_STORAGE_KEY);
  } catch {
    // Storage can be switched off (private windows, strict settings); the personal team then serves.
    return null;
  }
}

/** Remembers the team and tells every mounted user of the current team. */
export function rememberTeam(teamId: string): void {
  if (readRememberedTeam() === teamId) return;
  try {
    window.localStorage.setItem(CURRENT_TEAM_STORAGE_KEY, teamId);
  } catch {
    // As above: remembering is a convenience, not a need.
  }
  for (const listener of listeners) listener();
}

function subscribe(listener: () => void): () => void {
  listeners.add(listener);
  // Another tab switching team is news here too.
  const onStorage = (event: StorageEvent) => {
    if (event.key === CURRENT_TEAM_STORAGE_KEY) listener();
  };
  window.addEventListener('storage', onStorage);
  return () => {
    listeners.delete(listener);
    window.removeEventListener('storage', onStorage);
  };
}

/**
 * The team a team-scoped area opens in: the one in the address when there is one, else the last
 * one used (if the user still belongs to it), else the user's personal team, else their first.
 */
export function chooseCurrentTeam(routeTeamId: string | undefined, remembered: string | null, teams: readonly TeamSummary[]): string | null {
  if (routeTeamId) return routeTeamId;
  const memberOf = teams.filter((team) => team.role !== null);
  if (remembered && memberOf.some((team) => team.id === remembered)) return remembered;
  return memberOf.find((team) => team.personal)?.id ?? memberOf[0]?.id ?? null;
}

/** The current team's id (see chooseCurrentTeam); null while nobody is signed in or the user has no team. */
export function useCurrentTeamId(): string | null {
  const { teamId } = useParams();
  const me = useMe();
  const remembered = useSyncExternalStore(subscribe, readRememberedTeam, () => null);
  useEffect(() => {
    if (teamId) rememberTeam(teamId);
  }, [teamId]);
  return chooseCurrentTeam(teamId, remembered, me.data?.teams ?? []);
}
